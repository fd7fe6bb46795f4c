/**
 * Importance sampling and doubly robust estimates on the linear-quadratic tank plant against its
 * closed-form J (src/core/lq.ts; Bertsekas, "Dynamic Programming and Optimal Control", Vol. I,
 * §4.1), each within 3 of its own bootstrap standard errors (Efron & Tibshirani 1993, ch. 6) for
 * candidates whose importance weights are not degenerate. The target is J under the simulator's
 * start distribution, because the bootstrap resamples episodes and so their start states. Runs of
 * 151 steps truncate the return at γ^150 ≈ 5e-4 of its weight, far below the standard errors.
 * The behaviour density is the fitted behaviour model (ordinary least squares on the log).
 */
import { describe, expect, it } from 'vitest';
import {
  simulateTankLevels, tankDiscount, tankOperatingPoint, tankPlant, tankStartCovariance, tankStartMean,
} from '../../../sample-projects/tank-levels/simulate';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { fitLinearFqe } from '../../../src/core/fqe/linearFqe';
import { closedFormGaussianStartCost, lqClosedForm, rewardFromCost } from '../../../src/core/lq';
import { fittedBehaviourPolicy } from '../../../src/core/offPolicy/behaviourPolicy';
import { importanceWeightTable } from '../../../src/core/offPolicy/importanceWeights';
import { perDecisionData, perDecisionEstimates } from '../../../src/core/offPolicy/perDecisionEstimators';
import { createGaussianPolicy } from '../../../src/core/policy';
import { stateValues } from '../../../src/core/value';
import { tankLogTransitions } from '../fqe/simulatedTransitions';

const log = simulateTankLevels({ runs: 200, stepsPerRun: 151, seed: 3 });
const data = tankLogTransitions(log.rows, log.rowCount);
const index = indexEpisodes(data);
const behaviour = fittedBehaviourPolicy(data).policy;
const RESAMPLES = 200;

/** A centred candidate a = 45 − K·(s − s_sp) + N(0, std²) in the engine's affine form. */
const centred = (k: [number, number], std: number) => ({ offset: [45 + k[0] * 1.2 + k[1] * 0.8], gain: [[-k[0], -k[1]]], std: [std] });

describe('importance sampling and doubly robust on the tank plant', () => {
  it.each([
    ['gains (36, 28) %/m, dither 4 %', centred([36, 28], 4)],
    ['gains (45, 45) %/m, dither 3 %', centred([45, 45], 3)],
  ])('estimate J of the candidate with %s within 3 bootstrap standard errors of the closed form', (_, spec) => {
    const policy = createGaussianPolicy(spec, 2);
    const exact = rewardFromCost(closedFormGaussianStartCost(lqClosedForm(tankPlant, tankOperatingPoint, policy, tankDiscount), tankStartMean, tankStartCovariance));
    const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
    const fit = fitLinearFqe({ data, policy, features, discount: tankDiscount, ridge: 1e-9, quadratureNodes: 10, tolerance: 1e-10, maxIterations: 5000 });
    const q = fit.iterative!.q, n = data.count;
    const inputs = new Float64Array(n * 3), states = new Float64Array(n * 2);
    for (let p = 0; p < n; p++) {
      const i = index.order[p];
      inputs.set([data.states[2 * i], data.states[2 * i + 1], data.actions[i]], 3 * p);
      states.set([data.states[2 * i], data.states[2 * i + 1]], 2 * p);
    }
    const actionValues = new Float64Array(n);
    q.evaluate(inputs, n, actionValues);
    const prepared = perDecisionData(importanceWeightTable(data, index, policy, behaviour), {
      actionValues, stateValues: stateValues(q, policy, states, n, createActionQuadrature(policy, 10)),
    });
    const point = perDecisionEstimates(prepared, tankDiscount);
    const replicates = Array.from({ length: RESAMPLES }, (_, b) => perDecisionEstimates(prepared, tankDiscount, episodeMultiplicities(data.episodeCount, 17, b)));
    const sd = (values: number[]) => {
      const mean = values.reduce((a, v) => a + v, 0) / values.length;
      return Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / (values.length - 1));
    };
    const seIs = sd(replicates.map((r) => r.importanceSampling)), seDr = sd(replicates.map((r) => r.doublyRobust!));
    console.info(`${spec.gain[0].join(', ')}: exact ${exact.toFixed(3)}, WPDIS ${point.importanceSampling.toFixed(3)} (${((point.importanceSampling - exact) / seIs).toFixed(2)} SE), ` +
      `WDR ${point.doublyRobust!.toFixed(3)} (${((point.doublyRobust! - exact) / seDr).toFixed(2)} SE)`);
    expect(Math.abs(point.importanceSampling - exact)).toBeLessThan(3 * seIs);
    expect(Math.abs(point.doublyRobust! - exact)).toBeLessThan(3 * seDr);
  });
});
