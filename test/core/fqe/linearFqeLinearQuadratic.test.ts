/**
 * Linear FQE on the invented tank-levels plant against the closed-form linear-quadratic answer
 * (src/core/lq.ts: Lyapunov equation for P, then the linear and constant parts; Bertsekas, "Dynamic
 * Programming and Optimal Control" Vol. I, §4.1). The true Q is quadratic in (s, a), so degree-2
 * features represent it exactly and the only error left is sampling error.
 */
import { describe, expect, it } from 'vitest';
import {
  simulateTankLevels, tankDiscount, tankOperatingPoint, tankPlant, tankTrimmedPolicy, tankTunedPolicy,
} from '../../../sample-projects/tank-levels/simulate';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { fitLinearFqe } from '../../../src/core/fqe/linearFqe';
import { closedFormPolicyCost, lqClosedForm, rewardFromCost } from '../../../src/core/lq';
import { createGaussianPolicy, type GaussianPolicySpec } from '../../../src/core/policy';
import { tankLogTransitions } from './simulatedTransitions';

describe('linear FQE on the linear-quadratic tank plant', () => {
  // 200 runs × 501 logged steps under the tank's logging controller = 100,000 transitions (fixed seed).
  const log = simulateTankLevels({ runs: 200, stepsPerRun: 501, seed: 20_417 });
  const data = tankLogTransitions(log.rows, log.rowCount);
  const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));

  // Tolerance: the brief's 1%. Over seeds 1–20 of this setup, measured during development, the
  // relative error of J had mean 2e-4, sd 4.5e-3 (tuned) and mean 6e-4, sd 3.9e-3 (trimmed), so 1%
  // is 2.2–2.6 standard deviations; at this seed the errors were −3.3e-3 and −2.6e-3.
  it.each([
    ['tuned (centred) candidate', tankTunedPolicy],
    ['trimmed (off-centre) candidate', tankTrimmedPolicy],
  ] as [string, GaussianPolicySpec][])('estimates J of the %s within 1% of the closed form', (_, spec) => {
    expect(data.count).toBe(100_000);
    const policy = createGaussianPolicy(spec, 2);
    const fit = fitLinearFqe({ data, policy, features, discount: tankDiscount, ridge: 0, quadratureNodes: 10, tolerance: 1e-12, maxIterations: 5000 });
    expect(fit.status).toBe('converged');
    // J over the same logged start states; reward = −cost.
    const exact = rewardFromCost(closedFormPolicyCost(lqClosedForm(tankPlant, tankOperatingPoint, policy, tankDiscount), data.startStates, data.episodeCount));
    for (const solution of [fit.iterative!, fit.fixedPoint!]) {
      expect(Math.abs(solution.policyValue.value - exact) / Math.abs(exact)).toBeLessThan(0.01);
    }
  });
});
