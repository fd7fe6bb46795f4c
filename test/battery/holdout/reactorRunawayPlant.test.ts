/**
 * The hold-out reactor (reactorRunawayPlant.ts) is what its doc comment says: at rest at 350 K with the
 * valve at 0.5 (the feed and jacket balance the heat of reaction); open-loop unstable there (the Jacobian
 * written out by hand from the stated equations has an eigenvalue above 1, and a nudge of 0.5 K with the
 * valve held runs away until the reactant burns out); and at small amplitude under the logging controller
 * its temperature cost is the discrete Lyapunov solution of that linearisation (Bertsekas vol. I §4.1;
 * smallAmplitude.ts).
 */
import { describe, expect, it } from 'vitest';
import { feedbackCostToGo } from '../../../src/core/lq';
import type { RandomSource } from '../../../src/core/random';
import { ACTIVATION_K, REACTION_HEAT_K, REFERENCE_K, REST_CONCENTRATION, reactorDynamics, reactorRunawayPlant } from './reactorRunawayPlant';
import { smallAmplitudeQuadraticValue } from './smallAmplitude';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };
const E = Math.exp(-0.1);
/** ∂r/∂T at rest: c·e^{−k}·k·(E/R)/T² (the derivative of c·(1 − e^{−k(T)}) with the Arrhenius k). */
const DR_DT = REST_CONCENTRATION * E * 0.1 * ACTIVATION_K / REFERENCE_K ** 2;
/** The plant linearised at rest, state (T, c), by hand from the stated equations. */
const A = Float64Array.of(0.9 + REACTION_HEAT_K * DR_DT - 0.15, REACTION_HEAT_K * (1 - E), -DR_DT, 0.9 - (1 - E));
const B = Float64Array.of(-0.3 * (REFERENCE_K - 300), 0);

describe('hold-out reactor near a thermal runaway', () => {
  it('rests at 350 K with the valve at 0.5, where it pays only for the unconverted reactant', () => {
    const next = new Float64Array(2);
    const cost = reactorDynamics.step(Float64Array.of(REFERENCE_K, REST_CONCENTRATION), Float64Array.of(0.5), quiet, next);
    expect(next[0]).toBeCloseTo(REFERENCE_K, 10);
    expect(next[1]).toBeCloseTo(REST_CONCENTRATION, 12);
    expect(cost).toBeCloseTo(30 * (REST_CONCENTRATION - 0.45), 12);
  });

  it('is open-loop unstable there, and a nudge with the valve held runs away until the reactant burns out', () => {
    const trace = A[0] + A[3], det = A[0] * A[3] - A[1] * A[2];
    const largest = (trace + Math.sqrt(trace * trace - 4 * det)) / 2; // real roots: trace² > 4·det here
    expect(largest).toBeGreaterThan(1.1);
    const s = Float64Array.of(REFERENCE_K + 0.5, REST_CONCENTRATION), next = new Float64Array(2);
    let hottest = 0, leanest = 1;
    for (let t = 0; t < 200; t++) {
      reactorDynamics.step(s, Float64Array.of(0.5), quiet, next);
      s.set(next);
      hottest = Math.max(hottest, s[0]);
      leanest = Math.min(leanest, s[1]);
    }
    expect(hottest).toBeGreaterThan(REFERENCE_K + 20);
    expect(leanest).toBeLessThan(REST_CONCENTRATION / 2); // burnt out: the runaway ends with the reactant
  });

  it('at small amplitude, costs what the discrete Lyapunov solution of its linearisation says (logging controller)', () => {
    const plant = reactorRunawayPlant(), gain = 0.05, std = 0.03;
    const closed = feedbackCostToGo({
      stateDim: 2, actionDim: 1, dynamics: A, inputGain: B, processNoiseCovariance: Float64Array.of(0.8 ** 2, 0, 0, 0.005 ** 2),
      stateWeight: Float64Array.of(0.5, 0, 0, 0), actionWeight: Float64Array.of(0),
    }, { feedbackGain: Float64Array.of(-gain, 0), bias: Float64Array.of(0), noiseCovariance: Float64Array.of(std * std) }, plant.discount);
    const run = smallAmplitudeQuadraticValue({
      dynamics: reactorDynamics, rest: [REFERENCE_K, REST_CONCENTRATION], restAction: 0.5, gain: [gain, 0], std,
      weights: [0.5, 0], discount: plant.discount, scale: 0.01, rollouts: 1500, seed: 5,
    });
    expect(Math.abs(run.value - closed.constant)).toBeLessThan(4 * run.standardError + 0.01 * closed.constant);
  });

  it('logs the same runs for the same seed', () => {
    const plant = reactorRunawayPlant();
    expect(plant.simulate({ transitions: 5_000, seed: 3 }).states).toEqual(plant.simulate({ transitions: 5_000, seed: 3 }).states);
  });
});
