/**
 * The hold-out cooling tower losing fill (coolingTowerFillLossPlant.ts) is what its doc comment says: the
 * warming 0 at the first run and 0.15 K per step at the last, on a straight line; the tower as built is
 * coolingTowerPlant.ts's draw for draw; and with the fan held at half speed the END plant is linear, resting
 * 1.5 K warm (0.15 / (1 − 0.9)), its value from that rest the discrete Lyapunov solution (Bertsekas vol. I
 * §4.1) plus the rest's own cost, 2·1.5² + 4·(½)³ per step summed as 1/(1 − γ), against seeded rollouts
 * with their standard error.
 */
import { describe, expect, it } from 'vitest';
import { feedbackCostToGo, stateCostToGo } from '../../../src/core/lq';
import { createRandom } from '../../../src/core/random';
import { rolloutTruth } from '../rolloutTruth';
import { SETPOINT_C, coolingTowerDynamics, coolingTowerDynamicsWith } from './coolingTowerPlant';
import { FILL_WARMING, coolingTowerFillLossPlant, warmingAtRun } from './coolingTowerFillLossPlant';

describe('hold-out cooling tower losing fill through the log', () => {
  it('warms the water 0 K per step at the first run and 0.15 K at the last, on a straight line', () => {
    expect(warmingAtRun(0, 250)).toBe(0);
    expect(warmingAtRun(249, 250)).toBeCloseTo(0.15, 14);
    expect(warmingAtRun(124.5, 250)).toBeCloseTo(0.075, 14);
  });

  it('is coolingTowerPlant.ts\'s tower, draw for draw, as built', () => {
    const a = createRandom(8), b = createRandom(8), s = Float64Array.of(29, 0.3), u = Float64Array.of(0.7), x = new Float64Array(2), y = new Float64Array(2);
    expect(coolingTowerDynamicsWith(0).step(s, u, a, x)).toBe(coolingTowerDynamics.step(s, u, b, y));
    expect(x).toEqual(y);
  });

  it('with the fan held at half speed, the end plant rests 1.5 K warm and is worth the Lyapunov value plus its rest cost', () => {
    const plant = coolingTowerFillLossPlant(), rest = SETPOINT_C + FILL_WARMING.last / (1 - 0.9);
    const held = feedbackCostToGo({
      stateDim: 2, actionDim: 1, dynamics: Float64Array.of(0.9, 0.15, 0, 0.98), inputGain: Float64Array.of(-0.6, 0),
      processNoiseCovariance: Float64Array.of(0.04, 0, 0, 0.01), stateWeight: Float64Array.of(2, 0, 0, 0), actionWeight: Float64Array.of(0),
    }, { feedbackGain: Float64Array.of(0, 0), bias: Float64Array.of(0), noiseCovariance: Float64Array.of(0) }, plant.discount);
    // From the rest (T*, 0) the deviation has mean 0 at every step, so the cross term 2·2·1.5·E[dev] vanishes.
    const exact = stateCostToGo(held, [0, 0]) + (2 * 1.5 ** 2 + 4 * 0.5 ** 3) / (1 - plant.discount);
    const truth = rolloutTruth(plant.dynamics, { offset: [0.5], gain: [[0, 0]], std: [1e-9] }, plant.discount,
      { name: 'rest', description: 'the held fan\'s rest', states: Float64Array.of(rest, 0), count: 1 }, { rolloutsPerStart: 4000, seed: 9 });
    expect(Math.abs(-truth.value - exact)).toBeLessThan(4 * truth.standardError);
  });

  it('logs the same runs for the same seed, and the control meets the end plant on every run', () => {
    const plant = coolingTowerFillLossPlant(), control = coolingTowerFillLossPlant(true);
    expect(plant.simulate({ transitions: 4_000, seed: 3 }).actions).toEqual(plant.simulate({ transitions: 4_000, seed: 3 }).actions);
    expect(control.name).toBe('holdout-cooling-tower-fill-lost-steady-g0.96');
  });
});
