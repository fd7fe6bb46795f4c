/**
 * The hold-out aeration basin read through a noisy probe (aerationNoisyProbePlant.ts) is what its doc comment
 * says: at rest at 2 mg/L with the blower at half and the nominal load (mass balance); its log holds readings
 * with white noise of the stated size on a first-order load (the variance of white noise through a first-order
 * filter, closed form); a law on the reading is the stated law on the true state (the sum of independent
 * normals, and the clipped share from the normal table, Abramowitz & Stegun Table 26.1); and at small
 * amplitude its oxygen cost is the discrete Lyapunov solution of its linearisation (Bertsekas vol. I §4.1).
 */
import { describe, expect, it } from 'vitest';
import { feedbackCostToGo } from '../../../src/core/lq';
import { createGaussianPolicy, sampleAction } from '../../../src/core/policy';
import { createRandom, type RandomSource } from '../../../src/core/random';
import { lawOnTrueState } from './brokenLog';
import { READING_NOISE, SETPOINT_MG_L, aerationDynamics, aerationNoisyProbePlant, blowerLaw } from './aerationNoisyProbePlant';
import { smallAmplitudeQuadraticValue } from './smallAmplitude';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };

describe('hold-out aeration basin whose probe and load signal are read with white noise', () => {
  it('rests at 2 mg/L with the blower at half and the nominal load, paying only for the blower', () => {
    const next = new Float64Array(2);
    const cost = aerationDynamics.step(Float64Array.of(SETPOINT_MG_L, 0), Float64Array.of(0.5), quiet, next);
    expect(next[0]).toBeCloseTo(SETPOINT_MG_L, 14);
    expect(next[1]).toBe(0);
    expect(cost).toBeCloseTo(0.5, 14);
  });

  it('logs readings: the load\'s one-step residual has the variance of its innovation plus the reading noise through (1 − 0.9·B)', () => {
    // L' = 0.9·L + 0.13·ε read as y = L + n (n white, sd 0.03): y' − 0.9·y = 0.13·ε + n' − 0.9·n, variance
    // 0.13² + (1 + 0.9²)·0.03² (closed form; without the reading noise it would be 0.13² = 0.0169, 9.6 % less).
    const data = aerationNoisyProbePlant().simulate({ transitions: 40_000, seed: 2 });
    let sum = 0, squares = 0;
    for (let i = 0; i < data.count; i++) {
      const r = data.nextStates[2 * i + 1] - 0.9 * data.states[2 * i + 1];
      sum += r;
      squares += r * r;
    }
    const variance = squares / data.count - (sum / data.count) ** 2, expected = 0.13 ** 2 + (1 + 0.81) * READING_NOISE[1] ** 2;
    expect(Math.abs(variance / expected - 1)).toBeLessThan(0.03);
    for (let i = 1; i < data.count; i++) if (data.episode[i] === data.episode[i - 1]) expect(data.states[2 * i]).toBe(data.nextStates[2 * (i - 1)]);
  });

  it('acts on a reading as the stated law acts on the true state: dither √(σ² + Σ(G·n)²), clipped share from the normal table', () => {
    // Near the top of the blower's range: the mean 0.5 + 0.3·(2 − 0.4) + 0.2·0.2 = 1.02 sits 0.02 above the limit.
    const law = blowerLaw(0.3, 0.2, 0.05), truth = [0.4, 0.2], onTrue = lawOnTrueState(law, READING_NOISE);
    const policy = createGaussianPolicy(law, 2), rng = createRandom(8), y = new Float64Array(2), a = new Float64Array(1);
    const draws = 200_000;
    let clipped = 0;
    for (let k = 0; k < draws; k++) {
      for (let j = 0; j < 2; j++) y[j] = truth[j] + READING_NOISE[j] * rng.normal();
      sampleAction(policy, y, rng, a);
      if (a[0] >= 1) clipped++;
    }
    const sigma = onTrue.std![0];
    expect(sigma).toBeCloseTo(Math.sqrt(0.05 ** 2 + (0.3 * 0.038) ** 2 + (0.2 * 0.03) ** 2), 12);
    // P(u ≥ 1) = Φ(0.02 / σ) with σ = 0.05163: Φ(0.3874) = 0.6508 by A&S Table 26.1 (interpolated; from memory of the table's form).
    expect(Math.abs(clipped / draws - 0.6508)).toBeLessThan(4 * Math.sqrt(0.65 * 0.35 / draws) + 0.002);
  });

  it('at small amplitude, costs what the discrete Lyapunov solution of its linearisation says (logging law on the reading)', () => {
    const plant = aerationNoisyProbePlant(), gain = 0.3, std = lawOnTrueState(plant.behaviour, READING_NOISE).std![0];
    // State (x, L) at rest (2, 0), u* = 0.5: ∂x′/∂x = 1 − 0.3·0.5 − 1.3125·0.5/2.5² = 0.745, ∂x′/∂L = −1.3125·0.8 = −1.05,
    // ∂L′/∂L = 0.9; ∂x′/∂u = 0.3·(9 − 2) = 2.1. The law u = 0.5 − 0.3·(x − 2): feedback gain 0.3 in u = −F·x.
    const closed = feedbackCostToGo({
      stateDim: 2, actionDim: 1, dynamics: Float64Array.of(0.745, -1.05, 0, 0.9), inputGain: Float64Array.of(2.1, 0),
      processNoiseCovariance: Float64Array.of(0.05 ** 2, 0, 0, 0.13 ** 2), stateWeight: Float64Array.of(4, 0, 0, 0), actionWeight: Float64Array.of(0),
    }, { feedbackGain: Float64Array.of(gain, 0), bias: Float64Array.of(0), noiseCovariance: Float64Array.of(std * std) }, plant.discount);
    const run = smallAmplitudeQuadraticValue({
      dynamics: aerationDynamics, rest: [SETPOINT_MG_L, 0], restAction: 0.5, gain: [-gain, 0], std,
      weights: [4, 0], discount: plant.discount, scale: 0.01, rollouts: 3000, seed: 5,
    });
    expect(Math.abs(run.value - closed.constant)).toBeLessThan(4 * run.standardError + 0.01 * closed.constant);
  });
});
