/**
 * The network's resamples over the assessment's runs (networkInterval.ts, `runs`): a start state
 * must take the count of ITS run, as the linear bootstrap's start weights do (startMultiplicities.ts,
 * through TransitionSet.startEpisode), or replicate b of the network does not pair with replicate b
 * of any other estimate (Efron & Tibshirani, "An Introduction to the Bootstrap", 1993, §14.1: a
 * paired comparison needs the same resample on both sides).
 *
 * A last-layer system small enough to solve by hand: one feature, G_k = n_k = 1, M_k = 0 and
 * b_k = 1 in every run, so every resample solves v = 1 and J_b is the weighted mean of the start
 * rows with each start's multiplicity — the weighted mean of the draws is the whole check.
 */
import { describe, expect, it } from 'vitest';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { startMultiplicities } from '../../../src/core/bootstrap/startMultiplicities';
import { valueReplicates, type EpisodeSystems } from '../../../src/core/fqe/networkInterval';
import type { LastLayerSums } from '../../../src/core/fqe/networkLastLayerSums';

/** d = 1: stride d(2d + 1) + 1 = 4, per range [G | M | b | n] = [1, 0, 1, 1]. */
function unitSums(ranges: number): LastLayerSums {
  const sums = new Float64Array(4 * ranges);
  for (let k = 0; k < ranges; k++) sums.set([1, 0, 1, 1], 4 * k);
  return { dim: 1, linearDim: 1, ranges, stride: 4, sums };
}

describe('network replicates on the assessment’s runs', () => {
  // Five runs, all trained on; run 0's first row was excluded, so the four start states are runs 1–4's.
  const runs = 5, startEpisode = Int32Array.of(1, 2, 3, 4), startRows = Float64Array.of(10, 20, 40, 80);
  const systems: EpisodeSystems = { joint: unitSums(runs), linear: unitSums(runs), ids: Int32Array.of(0, 1, 2, 3, 4), hiddenRidge: 0 };
  const request = { startRows, linearStartRows: startRows, startsFollowEpisodes: true, level: 0.9, resamples: 40, seed: 17, runs, startEpisode };

  it('weighs each start state by the draw of its own run (startEpisode), as the linear bootstrap does', () => {
    const r = valueReplicates(systems, request, { network: 37.5, linear: 37.5 });
    for (let b = 0; b < request.resamples; b++) {
      const w = startMultiplicities(episodeMultiplicities(runs, request.seed, b), startEpisode);
      const total = Array.from(w).reduce((a, x) => a + x, 0);
      const expected = total === 0 ? null : Array.from(w).reduce((a, x, k) => a + x * startRows[k], 0) / total;
      if (expected === null) expect(r.values[b]).toBeNull();
      else expect(r.values[b]).toBeCloseTo(expected, 12);
      // The linear comparator's value on the same draw pairs with it (the same system here, so the same number).
      expect(r.linearValues[b]).toBe(r.values[b]);
    }
  });

  it('in the fit’s own draws (over its training runs) maps starts the same way; a held-out run’s start keeps weight 1', () => {
    // Runs 0, 1, 3, 4 trained on (run 2 held out); starts are runs 1–4's.
    const trained = Int32Array.of(0, 1, 3, 4), own = { ...systems, joint: unitSums(4), linear: unitSums(4), ids: trained };
    const r = valueReplicates(own, { ...request, runs: undefined }, { network: 37.5, linear: 37.5 });
    for (let b = 0; b < request.resamples; b++) {
      const c = episodeMultiplicities(4, request.seed, b), range = (run: number) => trained.indexOf(run);
      const w = Array.from(startEpisode, (run) => (range(run) < 0 ? 1 : c[range(run)]));
      const total = w.reduce((a, x) => a + x, 0);
      expect(r.values[b]).toBeCloseTo(w.reduce((a, x, k) => a + x * startRows[k], 0) / total, 12);
    }
  });
});
