/**
 * Coverage of the bootstrap interval against the closed form: on the linear-quadratic tank plant
 * the true J of a candidate is known exactly (src/core/lq.ts: discounted Lyapunov equation;
 * Bertsekas, "Dynamic Programming and Optimal Control", Vol. I, §4.1), so over independent seeded
 * datasets the share of 90 % intervals containing it estimates their coverage. The target is J
 * under the simulator's start distribution N(x_sp, Σ0), because the bootstrap resamples start
 * states with their episodes. Check (issue 6): at least 80 % of 50 datasets.
 * Each dataset: 40 runs × 251 steps (10,000 transitions), 400 resamples, the fast linear path.
 */
import { describe, expect, it } from 'vitest';
import {
  simulateTankLevels, tankDiscount, tankOperatingPoint, tankPlant, tankStartCovariance, tankStartMean, tankTunedPolicy,
} from '../../../sample-projects/tank-levels/simulate';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { bootstrapInterval } from '../../../src/core/bootstrap/bootstrapInterval';
import { episodeBellmanSums } from '../../../src/core/bootstrap/episodeBellmanSums';
import { episodeMultiplicities, unitMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { linearFqeReplicate } from '../../../src/core/bootstrap/linearFqeReplicate';
import { startStateFeatures } from '../../../src/core/features/policyFeatures';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { closedFormGaussianStartCost, lqClosedForm, rewardFromCost } from '../../../src/core/lq';
import { createGaussianPolicy } from '../../../src/core/policy';
import { tankLogTransitions } from '../fqe/simulatedTransitions';

const DATASETS = 50, RESAMPLES = 400;

describe('bootstrap interval coverage on the linear-quadratic tank plant', () => {
  it('covers the closed-form J in at least 80 % of 50 seeded datasets at level 90 %', () => {
    const policy = createGaussianPolicy(tankTunedPolicy, 2);
    const exact = rewardFromCost(closedFormGaussianStartCost(lqClosedForm(tankPlant, tankOperatingPoint, policy, tankDiscount), tankStartMean, tankStartCovariance));
    let percentileHits = 0, basicHits = 0;
    for (let s = 0; s < DATASETS; s++) {
      const log = simulateTankLevels({ runs: 40, stepsPerRun: 251, seed: 1000 + s });
      const data = tankLogTransitions(log.rows, log.rowCount);
      const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
      const quadrature = createActionQuadrature(policy, 10);
      const setup = {
        sums: episodeBellmanSums(data, features, quadrature), startFeatures: startStateFeatures(features, quadrature, data.startStates, 2),
        startsFollowEpisodes: true, ridge: 1e-9, constantIndex: features.constantIndex, discount: tankDiscount,
        solver: 'fixedPoint' as const, tolerance: 1e-10, maxIterations: 5000, initialWeights: new Float64Array(features.dim),
      };
      const estimate = linearFqeReplicate(setup, unitMultiplicities(data.episodeCount)).policyValue!;
      const counts = new Uint32Array(data.episodeCount);
      const replicates = Array.from({ length: RESAMPLES }, (_, b) => linearFqeReplicate(setup, episodeMultiplicities(data.episodeCount, 7, b, counts)).policyValue!);
      const iv = bootstrapInterval(estimate, replicates, 0.9);
      if (exact >= iv.percentile[0] && exact <= iv.percentile[1]) percentileHits++;
      if (exact >= iv.basic[0] && exact <= iv.basic[1]) basicHits++;
    }
    console.info(`bootstrap coverage at 90 %: percentile ${percentileHits}/${DATASETS}, basic ${basicHits}/${DATASETS}`);
    expect(percentileHits / DATASETS).toBeGreaterThanOrEqual(0.8);
    expect(basicHits / DATASETS).toBeGreaterThanOrEqual(0.8);
  });
});
