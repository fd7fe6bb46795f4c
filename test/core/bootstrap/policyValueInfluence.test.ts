/**
 * Per-episode influence values of J against their definition, l_k = (Σ c)·∂J_c/∂c_k (Davison &
 * Hinkley 1997, §2.7.2), taken by central differences of the first-order replicate
 * (linearisedReplicate, which accepts fractional multiplicities), and Σ c_k l_k = 0.
 */
import { describe, expect, it } from 'vitest';
import { linearisedReplicate, type LinearisedReplicates } from '../../../src/core/bootstrap/linearisedReplicate';
import { policyValueInfluence } from '../../../src/core/bootstrap/policyValueInfluence';

function differenced(lin: LinearisedReplicates, c: number[]): number[] {
  const h = 1e-6, drawn = c.reduce((a, b) => a + b, 0);
  return c.map((_, k) => {
    const up = c.slice(), down = c.slice();
    up[k] += h;
    down[k] -= h;
    return drawn * (linearisedReplicate(lin, up)! - linearisedReplicate(lin, down)!) / (2 * h);
  });
}

const base = { influence: Float64Array.from([0.5, -1.25, 2, -0.75]), counts: Float64Array.from([10, 20, 15, 5]) };

describe('policyValueInfluence', () => {
  const cases: [string, LinearisedReplicates][] = [
    ['one start per episode', { ...base, startValues: Float64Array.from([3, 5, 4, 8]), startsFollowEpisodes: true }],
    ['starts mapped to episodes (two in episode 2, none in 3)', { ...base, startValues: Float64Array.from([3, 5, 4, 6]), startsFollowEpisodes: true, startEpisode: Int32Array.from([0, 1, 2, 2]) }],
    ['starts not resampled', { ...base, startValues: Float64Array.from([3, 5, 4]), startsFollowEpisodes: false }],
  ];
  for (const [name, lin] of cases) {
    it(`is e·∂J/∂c_k of the first-order replicate, on the data and on a resample: ${name}`, () => {
      for (const c of [[1, 1, 1, 1], [2, 0, 1, 1]]) {
        const l = policyValueInfluence(lin, c), fd = differenced(lin, c);
        l.forEach((v, k) => expect(v).toBeCloseTo(fd[k], 6));
        expect(l.reduce((s, v, k) => s + c[k] * v, 0)).toBeCloseTo(0, 12);
      }
    });
  }

  it('refuses multiplicities of the wrong length', () => {
    expect(() => policyValueInfluence(cases[0][1], [1, 1])).toThrow(/one per episode/);
  });
});
