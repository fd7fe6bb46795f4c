/**
 * The hold-out cooling tower (coolingTowerPlant.ts) is what its doc comment says: the drive runs the fan
 * at the nearest of five speeds; with the fan held at half speed the plant is linear, and its value is the
 * discrete Lyapunov solution (Bertsekas vol. I §4.1) against seeded rollouts with their standard error;
 * and a dithered command around 0.5 costs the cube law's average over the speeds the dither reaches, from
 * the normal law's table (Abramowitz & Stegun, Table 26.1: Φ(1.25) = 0.89435, Φ(3.75) = 0.999912; values
 * from memory).
 */
import { describe, expect, it } from 'vitest';
import { feedbackCostToGo, stateCostToGo } from '../../../src/core/lq';
import { createRandom } from '../../../src/core/random';
import { rolloutTruth } from '../rolloutTruth';
import { SETPOINT_C, coolingTowerDynamics, coolingTowerPlant, fanSpeed } from './coolingTowerPlant';

describe('hold-out cooling tower with a five-speed fan and cube-law fan power', () => {
  it('runs the fan at the nearest of 0, ¼, ½, ¾ and 1', () => {
    expect([-0.3, 0.1, 0.13, 0.37, 0.38, 0.62, 0.63, 0.87, 0.88, 1.4].map(fanSpeed)).toEqual([0, 0, 0.25, 0.25, 0.5, 0.5, 0.75, 0.75, 1, 1]);
  });

  it('with the fan held at half speed, is worth what the discrete Lyapunov solution says', () => {
    const plant = coolingTowerPlant(), start = Float64Array.of(SETPOINT_C + 1.5, 0.8);
    // Deviation state (T − 28, q): A = [[0.9, 0.15], [0, 0.98]], W = diag(0.2², 0.1²); cost 2·(T − 28)² + 4·(½)³ each step.
    const held = feedbackCostToGo({
      stateDim: 2, actionDim: 1, dynamics: Float64Array.of(0.9, 0.15, 0, 0.98), inputGain: Float64Array.of(-0.6, 0),
      processNoiseCovariance: Float64Array.of(0.04, 0, 0, 0.01), stateWeight: Float64Array.of(2, 0, 0, 0), actionWeight: Float64Array.of(0),
    }, { feedbackGain: Float64Array.of(0, 0), bias: Float64Array.of(0), noiseCovariance: Float64Array.of(0) }, plant.discount);
    const exact = stateCostToGo(held, [1.5, 0.8]) + 0.5 / (1 - plant.discount);
    const truth = rolloutTruth(coolingTowerDynamics, { offset: [0.5], gain: [[0, 0]], std: [1e-9] }, plant.discount,
      { name: 'one', description: 'one start', states: start, count: 1 }, { rolloutsPerStart: 4000, seed: 9 });
    expect(Math.abs(-truth.value - exact)).toBeLessThan(4 * truth.standardError);
  });

  it('charges a dithered command around 0.5 the cube law averaged over the speeds the dither reaches', () => {
    const phi125 = 0.89435, phi375 = 0.999912, outer = 1 - phi375, next = (1 - phi125) - outer; // P(f = 0 or 1), P(f = ¼ or ¾)
    const expected = 4 * (next * (0.25 ** 3 + 0.75 ** 3) + (2 * phi125 - 1) * 0.5 ** 3 + outer * 1);
    const rng = createRandom(13), n = 400_000, s = Float64Array.of(SETPOINT_C, 0), out = new Float64Array(2), a = new Float64Array(1);
    let sum = 0, squares = 0;
    for (let i = 0; i < n; i++) {
      a[0] = 0.5 + 0.1 * rng.normal();
      const cost = coolingTowerDynamics.step(s, a, rng, out); // at the setpoint: fan power only
      sum += cost;
      squares += cost * cost;
    }
    const mean = sum / n, se = Math.sqrt((squares / n - mean * mean) / n);
    expect(Math.abs(mean - expected)).toBeLessThan(4 * se + 1e-4); // 1e-4: the table's rounding
    expect(expected).toBeGreaterThan(4 * 0.5 ** 3); // the cube law's convexity: dithering the fan costs power
  });

  it('logs the same runs for the same seed', () => {
    const plant = coolingTowerPlant();
    expect(plant.simulate({ transitions: 5_000, seed: 3 }).actions).toEqual(plant.simulate({ transitions: 5_000, seed: 3 }).actions);
  });
});
