/**
 * The hold-out rinse bath (rinseBathPlant.ts) is what its doc comment says: at rest at 1 g/L with the
 * valve at 0.5 and the nominal load (mass balance); bilinear — the fresh water's effect on the next
 * contamination is exactly −0.2·c per unit of valve, so it doubles as the bath gets twice as dirty; and at
 * small amplitude under the logging controller its contamination cost is the discrete Lyapunov solution
 * of its linearisation (Bertsekas vol. I §4.1; smallAmplitude.ts).
 */
import { describe, expect, it } from 'vitest';
import { feedbackCostToGo } from '../../../src/core/lq';
import type { RandomSource } from '../../../src/core/random';
import { TARGET_G_L, rinseBathDynamics, rinseBathPlant } from './rinseBathPlant';
import { smallAmplitudeQuadraticValue } from './smallAmplitude';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };

function nextContamination(c: number, valve: number): number {
  const next = new Float64Array(2);
  rinseBathDynamics.step(Float64Array.of(c, 0), Float64Array.of(valve), quiet, next);
  return next[0];
}

describe('hold-out rinse bath whose fresh water acts in proportion to the contamination', () => {
  it('rests at 1 g/L with the valve at 0.5 and the nominal load, paying only for the water', () => {
    const next = new Float64Array(2);
    const cost = rinseBathDynamics.step(Float64Array.of(TARGET_G_L, 0), Float64Array.of(0.5), quiet, next);
    expect(next[0]).toBeCloseTo(TARGET_G_L, 14);
    expect(next[1]).toBe(0);
    expect(cost).toBeCloseTo(0.25, 14);
  });

  it('is bilinear: a full valve takes 0.2·c more off than a closed one, twice as much from a bath twice as dirty', () => {
    for (const c of [0.5, 1, 2]) expect(nextContamination(c, 0) - nextContamination(c, 1)).toBeCloseTo(0.2 * c, 12);
  });

  it('at small amplitude, costs what the discrete Lyapunov solution of its linearisation says (logging controller)', () => {
    const plant = rinseBathPlant(), gain = 0.5, std = 0.05;
    // State (c, d): ∂c′/∂c = 1 − 0.2·u* = 0.9, ∂c′/∂d = 0.1, ∂d′/∂d = 0.95; ∂c′/∂u = −0.2·c* = −0.2.
    const closed = feedbackCostToGo({
      stateDim: 2, actionDim: 1, dynamics: Float64Array.of(0.9, 0.1, 0, 0.95), inputGain: Float64Array.of(-0.2, 0),
      processNoiseCovariance: Float64Array.of(0.02 ** 2, 0, 0, 0.1 ** 2), stateWeight: Float64Array.of(4, 0, 0, 0), actionWeight: Float64Array.of(0),
    }, { feedbackGain: Float64Array.of(-gain, 0), bias: Float64Array.of(0), noiseCovariance: Float64Array.of(std * std) }, plant.discount);
    const run = smallAmplitudeQuadraticValue({
      dynamics: rinseBathDynamics, rest: [TARGET_G_L, 0], restAction: 0.5, gain: [gain, 0], std,
      weights: [4, 0], discount: plant.discount, scale: 0.01, rollouts: 4000, seed: 5,
    });
    expect(Math.abs(run.value - closed.constant)).toBeLessThan(4 * run.standardError + 0.01 * closed.constant);
  });

  it('logs contamination over a wide range (where the bilinear term matters), the same for the same seed', () => {
    const plant = rinseBathPlant(), data = plant.simulate({ transitions: 20_000, seed: 3 });
    let lo = Infinity, hi = -Infinity;
    for (let i = 0; i < data.count; i++) {
      lo = Math.min(lo, data.states[2 * i]);
      hi = Math.max(hi, data.states[2 * i]);
    }
    expect(hi / lo).toBeGreaterThan(2);
    expect(plant.simulate({ transitions: 20_000, seed: 3 }).states).toEqual(data.states);
  });
});
