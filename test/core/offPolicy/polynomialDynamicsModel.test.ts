/**
 * The polynomial one-step model against the plants that made the data: on an invented linear plant
 * its degree-1 fit predicts the true mean next state A x + B u (to within its sampling error) and
 * its noise factor reproduces the true noise covariance; on the saturating pendulum, whose angle
 * increment is the integrated rate, the residual covariance is singular and the model still forms a
 * factor with LLᵀ = W. Rollouts on the fitted linear model reproduce the closed-form J (src/core/lq.ts)
 * within their standard errors.
 */
import { describe, expect, it } from 'vitest';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { modelRolloutValue } from '../../../src/core/offPolicy/modelRollouts';
import { fitPolynomialModel, polynomialModelRegressions } from '../../../src/core/offPolicy/polynomialDynamicsModel';
import { createGaussianPolicy } from '../../../src/core/policy';
import { exactPolicyValue, simulateLog } from '../linearGaussianPlant';
import { pendulumLog, pendulumLogging } from '../saturatingPendulum';
import { cascadeLogging, cascadePlant, startLaws } from '../testPlants';

describe('polynomial one-step model', () => {
  const data = simulateLog(cascadePlant, cascadeLogging, { episodes: 200, steps: 100, seed: 12, start: startLaws(cascadePlant, cascadeLogging)[1][1] });
  const model = fitPolynomialModel(polynomialModelRegressions(data, indexEpisodes(data), { degree: 1, rewardDegree: 2 }));

  it('predicts the true mean next state and noise of a linear plant', () => {
    const phi = new Float64Array(model.regressions.dynamicsFeatures.dim);
    for (const [x, u] of [[[0, 0, 0], 0], [[1, -0.5, 0.3], 0.4], [[-2, 1, 1], -1]] as [number[], number][]) {
      model.regressions.dynamicsFeatures.evaluate([...x, u], 0, phi, 0);
      for (let c = 0; c < 3; c++) {
        let predicted = x[c];
        for (let j = 0; j < phi.length; j++) predicted += model.dynamicsWeights[j * 3 + c] * phi[j];
        const truth = cascadePlant.A.slice(3 * c, 3 * c + 3).reduce((s, a, k) => s + a * x[k], 0) + cascadePlant.B[c] * u;
        expect(Math.abs(predicted - truth)).toBeLessThan(0.02); // 20 000 transitions, noise 0.3: coefficient errors ~0.002
      }
    }
    const l = model.noiseFactor;
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) {
      let w = 0;
      for (let k = 0; k < 3; k++) w += l[i * 3 + k] * l[j * 3 + k];
      expect(w).toBeCloseTo(i === j ? 0.09 : 0, 2);
    }
    expect(model.rewardRSquared).toBeGreaterThan(0.999); // the cost is exactly quadratic
  });

  it('rolls the fitted linear model out to the closed-form value of a candidate', () => {
    const c = { offset: [0.2], gain: [-0.5, -0.6, -0.4], std: [0.4] };
    const policy = createGaussianPolicy({ offset: c.offset, gain: [c.gain], std: c.std }, 3);
    const value = modelRolloutValue(model, policy, 0.97, data.startStates, { rolloutsPerStart: 4, seed: 3 });
    const exact = exactPolicyValue(cascadePlant, c, 0.97, data.startStates);
    expect(Math.abs(value.value - exact)).toBeLessThan(3 * value.monteCarloError + 0.01 * Math.abs(exact)); // 1 % for the fitted model's own error
    expect(value.steps).toBe(Math.ceil(Math.log(1e-3) / Math.log(0.97)));
  });

  it('forms a noise factor when the residual covariance is singular (an integrated rate)', () => {
    const log = pendulumLog(pendulumLogging, 40, 100, 2);
    const fit = fitPolynomialModel(polynomialModelRegressions(log, indexEpisodes(log), { degree: 3, rewardDegree: 2 }));
    const [a, , b, c] = fit.noiseFactor;
    const w11 = a * a, w21 = b * a, w22 = b * b + c * c;
    // θ' = θ + Δt·ω': the angle's noise is Δt times the rate's, so W ≈ σ²[[Δt², Δt], [Δt, 1]].
    expect(w21 / w22).toBeCloseTo(0.05, 3);
    expect(w11 / w22).toBeCloseTo(0.0025, 4);
  });
});
