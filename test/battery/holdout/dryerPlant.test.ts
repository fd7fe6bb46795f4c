/**
 * The hold-out belt dryer (dryerPlant.ts) is what its doc comment says: held at the operating point
 * without noise it stays put (steady-state balance 14 − 10·0.6 = 8 %); the damper moves at most
 * 0.03 per step (a rate limit); a damper step reaches the moisture only after the damper's own step
 * and the one step the heat spends on the belt (first order plus dead time — common practice for a
 * process with transport delay); and the rate limit is active on a share of the log.
 */
import { describe, expect, it } from 'vitest';
import type { RandomSource } from '../../../src/core/random';
import { DAMPER_RATE_LIMIT, dryerDynamics, dryerPlant } from './dryerPlant';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };

describe('hold-out belt dryer with a rate-limited damper and transport delay', () => {
  it('holds 8 % moisture at the damper bias without noise', () => {
    const next = new Float64Array(3);
    const cost = dryerDynamics.step(Float64Array.of(8, 0.6, 0.6), Float64Array.of(0.6), quiet, next);
    expect(Array.from(next)).toEqual([8, 0.6, 0.6].map((v, i) => (i === 0 ? expect.closeTo(v, 12) : v)));
    expect(cost).toBeCloseTo(1.2, 12); // fuel only: 2·0.6
  });

  it('moves the damper by at most the rate limit, and the moisture only two steps after the command', () => {
    let s = Float64Array.of(8, 0.6, 0.6);
    const next = new Float64Array(3), moisture: number[] = [];
    for (let t = 0; t < 4; t++) {
      dryerDynamics.step(s, Float64Array.of(1), quiet, next);
      if (t === 0) expect(next[1]).toBeCloseTo(0.6 + DAMPER_RATE_LIMIT, 12);
      s = Float64Array.from(next);
      moisture.push(s[0]);
    }
    expect(moisture[0]).toBeCloseTo(8, 12);
    expect(moisture[1]).toBeCloseTo(8, 12);
    expect(moisture[2]).toBeCloseTo(8 - 0.1 * 10 * DAMPER_RATE_LIMIT, 12);
  });

  it('logs the damper command beyond the rate limit on a share of the rows, the same for the same seed', () => {
    const plant = dryerPlant(), data = plant.simulate({ transitions: 20_000, seed: 2 });
    let limited = 0;
    for (let i = 0; i < data.count; i++) if (Math.abs(data.actions[i] - data.states[i * 3 + 1]) > DAMPER_RATE_LIMIT) limited++;
    expect(limited / data.count).toBeGreaterThan(0.1);
    expect(plant.simulate({ transitions: 20_000, seed: 2 }).states).toEqual(data.states);
  });
});
