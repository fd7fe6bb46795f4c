/**
 * The hold-out level loop (levelValvePlant.ts) does what it is meant to: held at the setpoint with
 * the valve at its bias and no noise the level stays put (the mass balance 0.05·0.8 = k·√2 m³/s,
 * Torricelli-type outflow k·√h — common practice for a tank drained through a restriction), and
 * the valve is at a limit on a share of the log and on many of the candidate's upsets.
 */
import { describe, expect, it } from 'vitest';
import type { RandomSource } from '../../../src/core/random';
import { levelValveDynamics, levelValvePlant } from './levelValvePlant';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };

describe('hold-out level loop with a saturating valve', () => {
  it('holds the setpoint at the valve bias without noise (mass balance)', () => {
    const next = new Float64Array(2);
    const cost = levelValveDynamics.step(Float64Array.of(2, 0), Float64Array.of(0.8), quiet, next);
    expect(next[0]).toBeCloseTo(2, 12);
    expect(next[1]).toBe(0);
    expect(cost).toBe(0);
  });

  it('clips the valve at 1: a command of 5 fills no faster than a command of 1', () => {
    const a = new Float64Array(2), b = new Float64Array(2);
    levelValveDynamics.step(Float64Array.of(1.5, 0), Float64Array.of(5), quiet, a);
    levelValveDynamics.step(Float64Array.of(1.5, 0), Float64Array.of(1), quiet, b);
    expect(a[0]).toBe(b[0]);
  });

  it('logs the valve at a limit on a share of the rows, and logs the same for the same seed', () => {
    const plant = levelValvePlant(), data = plant.simulate({ transitions: 20_000, seed: 2 });
    const atLimit = data.actions.filter((u) => u <= 0 || u >= 1).length / data.count;
    expect(atLimit).toBeGreaterThan(0.03);
    expect(plant.simulate({ transitions: 20_000, seed: 2 }).states).toEqual(data.states);
  });
});
