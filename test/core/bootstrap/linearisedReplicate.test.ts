/**
 * The linearised bootstrap replicate (first order in the resample weights; Efron 1982, §6) against
 * the exact one (per-episode sums reweighted and solved again at each resample's fixed point;
 * linearFqeReplicate.ts, itself checked against a plain refit). With every episode once both give
 * the full-data J; over resamples the first-order values must track the exact ones to a small
 * fraction of the bootstrap spread (the neglected terms are O(1/N)), so their intervals agree.
 */
import { describe, expect, it } from 'vitest';
import { simulateTankLevels, tankDiscount, tankTrimmedPolicy } from '../../../sample-projects/tank-levels/simulate';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { episodeBellmanSums, resampleBellmanStatistics } from '../../../src/core/bootstrap/episodeBellmanSums';
import { episodeMultiplicities, unitMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { linearFqeReplicate, solveReplicate, type LinearReplicateSetup } from '../../../src/core/bootstrap/linearFqeReplicate';
import { linearisedReplicate, linearisedReplicates, linearisedReplicatesFromSums } from '../../../src/core/bootstrap/linearisedReplicate';
import { meanStartFeatures, startStateFeatures } from '../../../src/core/features/policyFeatures';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { createGaussianPolicy } from '../../../src/core/policy';
import { tankLogTransitions } from '../fqe/simulatedTransitions';

const log = simulateTankLevels({ runs: 60, stepsPerRun: 200, seed: 31 });
const data = tankLogTransitions(log.rows, log.rowCount);
const policy = createGaussianPolicy(tankTrimmedPolicy, 2);
const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
const quadrature = createActionQuadrature(policy, 10);
const index = indexEpisodes(data);
const sums = episodeBellmanSums(data, features, quadrature, {}, index);
const startFeatures = startStateFeatures(features, quadrature, data.startStates, 2);
const exact: LinearReplicateSetup = {
  sums, startFeatures, startsFollowEpisodes: true, ridge: 1e-6, constantIndex: features.constantIndex, discount: tankDiscount,
  solver: 'fixedPoint', tolerance: 1e-12, maxIterations: 20_000, initialWeights: new Float64Array(features.dim),
};
const statistics = resampleBellmanStatistics(sums, unitMultiplicities(index.episodes));
const full = solveReplicate(exact, statistics, meanStartFeatures(startFeatures, features.dim));
const linearisation = {
  data, index, features, quadrature, statistics, weights: full.weights!, ridge: exact.ridge, discount: tankDiscount,
  startFeatures, startsFollowEpisodes: true,
};
const linearised = linearisedReplicates(linearisation);

describe('the linearised bootstrap replicate', () => {
  it('gives the full-data J with every episode once', () => {
    const ones = unitMultiplicities(index.episodes);
    expect(linearisedReplicate(linearised, ones)).toBeCloseTo(full.policyValue!, 9);
    // Σ_k u_k = 0 at the fixed point: the influence values sum to zero (up to round-off).
    const total = linearised.influence.reduce((a, b) => a + b, 0);
    expect(Math.abs(total)).toBeLessThan(1e-8 * data.count * Math.abs(full.policyValue!));
  });

  it('tracks the exact replicates to a small fraction of their spread', () => {
    const c = new Uint32Array(index.episodes), exactValues: number[] = [], firstOrder: number[] = [];
    for (let b = 0; b < 200; b++) {
      episodeMultiplicities(index.episodes, 5, b, c);
      exactValues.push(linearFqeReplicate(exact, c).policyValue!);
      firstOrder.push(linearisedReplicate(linearised, c)!);
    }
    const mean = exactValues.reduce((a, b) => a + b, 0) / exactValues.length;
    const spread = Math.sqrt(exactValues.reduce((a, v) => a + (v - mean) ** 2, 0) / (exactValues.length - 1));
    const worst = Math.max(...exactValues.map((v, i) => Math.abs(v - firstOrder[i])));
    expect(spread).toBeGreaterThan(0);
    expect(worst / spread).toBeLessThan(0.1);
  });

  it('has the same influence values from the per-episode sums as from a second pass over the data (distributive law; rounding only)', () => {
    const fromSums = linearisedReplicatesFromSums(linearisation, sums);
    expect(fromSums.counts).toEqual(linearised.counts);
    expect(fromSums.startValues).toEqual(linearised.startValues);
    const scale = Math.max(...linearised.influence.map(Math.abs));
    fromSums.influence.forEach((v, k) => expect(Math.abs(v - linearised.influence[k])).toBeLessThan(1e-10 * scale));
    const c = episodeMultiplicities(index.episodes, 5, 3);
    expect(linearisedReplicate(fromSums, c)).toBeCloseTo(linearisedReplicate(linearised, c)!, 10);
  });
});
