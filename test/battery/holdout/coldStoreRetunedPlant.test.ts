/**
 * The hold-out cold store retuned halfway through its log (coldStoreRetunedPlant.ts) is what its doc comment
 * says: at rest at −20 °C with the compressor at half and the nominal load (heat balance); its log holds two
 * controllers, the old tuning on the first half of the runs and the retune on the second, which least squares
 * of the logged action on the temperature recovers half by half (ordinary least squares is unbiased when the
 * dither is independent of the state: common practice); and at small amplitude the retune's cost is the
 * discrete Lyapunov solution of the plant (linear but for the clip and the hinge; Bertsekas vol. I §4.1).
 */
import { describe, expect, it } from 'vitest';
import { feedbackCostToGo } from '../../../src/core/lq';
import type { RandomSource } from '../../../src/core/random';
import { SETPOINT_C, coldStoreDynamics, coldStoreRetunedPlant } from './coldStoreRetunedPlant';
import { loggedLawByRuns } from './loggedLawByRuns';
import { smallAmplitudeQuadraticValue } from './smallAmplitude';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };

describe('hold-out cold store whose temperature loop was retuned halfway through the log', () => {
  it('rests at −20 °C with the compressor at half and the nominal load, paying only for the compressor', () => {
    const next = new Float64Array(2);
    const cost = coldStoreDynamics.step(Float64Array.of(SETPOINT_C, 0), Float64Array.of(0.5), quiet, next);
    expect(next[0]).toBeCloseTo(SETPOINT_C, 12);
    expect(next[1]).toBe(0);
    expect(cost).toBeCloseTo(0.75, 14);
  });

  it('logs the old tuning on the first half of the runs and the retune on the second, as least squares recovers them', () => {
    const data = coldStoreRetunedPlant().simulate({ transitions: 100_000, seed: 4 }), half = data.episodeCount / 2;
    const old = loggedLawByRuns(data, 0, half, SETPOINT_C), today = loggedLawByRuns(data, half, data.episodeCount, SETPOINT_C);
    expect(Math.abs(old.slope - 0.12)).toBeLessThan(0.01);
    expect(Math.abs(today.slope - 0.3)).toBeLessThan(0.01);
    expect(Math.abs(old.residualSd - 0.08)).toBeLessThan(0.004);
    expect(Math.abs(today.residualSd - 0.05)).toBeLessThan(0.003);
  });

  it('at small amplitude, the retune costs what the discrete Lyapunov solution says', () => {
    const plant = coldStoreRetunedPlant();
    // State (T + 20, q): T′ + 20 = 0.98·(T + 20) + 0.5·q − 1.8·(u − 0.5), q′ = 0.95·q; the retune u = 0.5 + 0.3·(T + 20): F = (−0.3, 0).
    const closed = feedbackCostToGo({
      stateDim: 2, actionDim: 1, dynamics: Float64Array.of(0.98, 0.5, 0, 0.95), inputGain: Float64Array.of(-1.8, 0),
      processNoiseCovariance: Float64Array.of(0.1 ** 2, 0, 0, 0.1 ** 2), stateWeight: Float64Array.of(1, 0, 0, 0), actionWeight: Float64Array.of(0),
    }, { feedbackGain: Float64Array.of(-0.3, 0), bias: Float64Array.of(0), noiseCovariance: Float64Array.of(0.05 ** 2) }, plant.discount);
    const run = smallAmplitudeQuadraticValue({
      dynamics: coldStoreDynamics, rest: [SETPOINT_C, 0], restAction: 0.5, gain: [0.3, 0], std: 0.05,
      weights: [1, 0], discount: plant.discount, scale: 0.01, rollouts: 3000, seed: 5,
    });
    expect(Math.abs(run.value - closed.constant)).toBeLessThan(4 * run.standardError + 0.01 * closed.constant);
  });
});
