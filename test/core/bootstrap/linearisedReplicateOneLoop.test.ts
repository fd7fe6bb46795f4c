/**
 * linearisedReplicate's one-loop route (start state k is episode k's) against the plain formula
 * J_c = Σ_k c_k j_k / Σ_k c_k + Σ_k c_k s_k / Σ_k c_k n_k (Efron 1982, §6; linearisedReplicate.ts),
 * summed in two loops as before: the same sums in the same order, so the same bits.
 */
import { describe, expect, it } from 'vitest';
import { linearisedReplicate, type LinearisedReplicates } from '../../../src/core/bootstrap/linearisedReplicate';
import { createRandom } from '../../../src/core/random';

function plain(lin: LinearisedReplicates, c: ArrayLike<number>): number | null {
  let influence = 0, transitions = 0;
  for (let k = 0; k < c.length; k++) { influence += c[k] * lin.influence[k]; transitions += c[k] * lin.counts[k]; }
  let total = 0, weight = 0;
  for (let s = 0; s < lin.startValues.length; s++) {
    const m = lin.startsFollowEpisodes ? c[lin.startEpisode ? lin.startEpisode[s] : s] : 1;
    total += m * lin.startValues[s]; weight += m;
  }
  return weight > 0 ? total / weight + influence / transitions : null;
}

describe('the linearised replicate in one loop', () => {
  it('equals the two-loop sums to the last bit on random multiplicities', () => {
    // Invented influence values, run lengths and start values of widely different sizes.
    const random = createRandom(5), e = 3001, draw = () => random.uniform();
    const lin: LinearisedReplicates = {
      influence: Float64Array.from({ length: e }, () => (draw() - 0.5) * 10 ** Math.floor(draw() * 6 - 3)),
      counts: Float64Array.from({ length: e }, () => 1 + Math.floor(draw() * 90)),
      startValues: Float64Array.from({ length: e }, () => -50 + draw() * 7),
      startsFollowEpisodes: true,
    };
    for (let r = 0; r < 200; r++) {
      const c = Uint32Array.from({ length: e }, () => Math.floor(-Math.log(1 - draw()))); // about Poisson(1)-sized counts
      c[r] += 1;
      expect(linearisedReplicate(lin, c)).toBe(plain(lin, c));
    }
  });
});
