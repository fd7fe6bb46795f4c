/**
 * The hold-out batch kettle (kettlePlant.ts) is what its doc comment says: held at a temperature with
 * the valve at the heat loss it stays put (heat balance); a run ends on the row that reaches 80 °C
 * and only there, every other run is cut by the 60-step time limit, and both kinds are in the log;
 * and the rollout truth treats the end as absorbing: from a batch already past 80 °C, J is minus
 * the cost of the one step it pays, E[1 + 0.8·u²] = 1 + 0.8·(μ² + σ²) for an unclipped normal u
 * (the second moment of a normal law — common practice).
 */
import { describe, expect, it } from 'vitest';
import type { RandomSource } from '../../../src/core/random';
import { rolloutTruth } from '../rolloutTruth';
import { BATCH_TIME_LIMIT, TARGET_C, kettleDynamics, kettlePlant } from './kettlePlant';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };

describe('hold-out batch kettle whose runs end at 80 °C', () => {
  it('holds a temperature with the valve at the heat loss, and ends only where the batch reaches 80 °C', () => {
    const next = new Float64Array(2);
    const cost = kettleDynamics.step(Float64Array.of(50, 0), Float64Array.of(0.1), quiet, next); // loss 0.01·30 = 3·0.1
    expect(next[0]).toBeCloseTo(50, 12);
    expect(cost).toBeCloseTo(1 + 0.8 * 0.01, 12);
    expect(kettleDynamics.ends!(next)).toBe(false);
    kettleDynamics.step(Float64Array.of(78, 0), Float64Array.of(1), quiet, next);
    expect(next[0]).toBeGreaterThanOrEqual(TARGET_C);
    expect(kettleDynamics.ends!(next)).toBe(true);
  });

  it('logs runs that end at 80 °C (terminal on their last row only) and runs cut by the time limit, the same for the same seed', () => {
    const plant = kettlePlant(), data = plant.simulate({ transitions: 30_000, seed: 2 });
    const rows = new Int32Array(data.episodeCount), ended = new Uint8Array(data.episodeCount);
    for (let i = 0; i < data.count; i++) {
      const e = data.episode[i];
      expect(ended[e]).toBe(0); // nothing is logged after a run's end
      rows[e]++;
      if (data.terminal[i] === 1) {
        ended[e] = 1;
        expect(data.nextStates[i * 2]).toBeGreaterThanOrEqual(TARGET_C);
      } else expect(data.nextStates[i * 2]).toBeLessThan(TARGET_C);
    }
    const last = data.episodeCount - 1; // the budget may cut the last run anywhere
    for (let e = 0; e < last; e++) if (!ended[e]) expect(rows[e]).toBe(BATCH_TIME_LIMIT);
    const share = ended.reduce((a, b) => a + b, 0) / data.episodeCount;
    expect(share).toBeGreaterThan(0.5);
    expect(share).toBeLessThan(0.95);
    expect(plant.simulate({ transitions: 30_000, seed: 2 }).terminal).toEqual(data.terminal);
  });

  it('values a batch already past 80 °C at minus one step’s cost (the end is absorbing)', () => {
    const hotter = kettlePlant().candidates.find((c) => c.name === 'hotter')!.spec;
    const start = { name: 'done', description: 'past the target', states: Float64Array.of(100, 0), count: 1 };
    const truth = rolloutTruth(kettleDynamics, hotter, 0.98, start, { rolloutsPerStart: 4000, seed: 7 });
    const mean = 0.5 + 0.006 * (TARGET_C - 100), std = 0.06; // u ~ N(0.38, 0.06²), P(u < 0) ≈ 1e-10: no clipping
    expect(Math.abs(truth.value + (1 + 0.8 * (mean * mean + std * std)))).toBeLessThan(4 * truth.standardError + 1e-12);
    expect(truth.standardError).toBeGreaterThan(0);
  });
});
