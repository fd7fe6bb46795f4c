/**
 * The fast linear bootstrap (per-episode sums reweighted by episode multiplicities) against a naive
 * refit: the resample materialised as data (episode k copied c_k times) and fitted from scratch by
 * fitLinearFqe, the project's ordinary one-pass fit. Both must agree to 1e-10 relative — the
 * reweighting changes only the order of summation. The Gram matrix of a resample is also checked
 * against ml-matrix (an independent library) on an explicitly built feature matrix.
 */
import { Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { simulateTankLevels, tankDiscount, tankTrimmedPolicy } from '../../../sample-projects/tank-levels/simulate';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { episodeBellmanSums, resampleBellmanStatistics, resampleBellmanStatisticsBlock } from '../../../src/core/bootstrap/episodeBellmanSums';
import { episodeMultiplicities, unitMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes, resampledTransitions } from '../../../src/core/bootstrap/episodeTransitions';
import { linearFqeReplicate, linearFqeReplicateBlock, type LinearReplicateSetup } from '../../../src/core/bootstrap/linearFqeReplicate';
import { startStateFeatures } from '../../../src/core/features/policyFeatures';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { accumulateBellmanStatistics } from '../../../src/core/fqe/bellmanStatistics';
import { fitLinearFqe } from '../../../src/core/fqe/linearFqe';
import { createGaussianPolicy } from '../../../src/core/policy';
import { tankLogTransitions } from '../fqe/simulatedTransitions';

const log = simulateTankLevels({ runs: 24, stepsPerRun: 120, seed: 77 });
const data = tankLogTransitions(log.rows, log.rowCount);
const policy = createGaussianPolicy(tankTrimmedPolicy, 2);
const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
const quadrature = createActionQuadrature(policy, 10);
const index = indexEpisodes(data);
const sums = episodeBellmanSums(data, features, quadrature, undefined, index);
const base: LinearReplicateSetup = {
  sums, startFeatures: startStateFeatures(features, quadrature, data.startStates, 2), startsFollowEpisodes: true,
  ridge: 1e-9, constantIndex: features.constantIndex, discount: tankDiscount, solver: 'fixedPoint',
  tolerance: 1e-13, maxIterations: 20_000, initialWeights: new Float64Array(features.dim),
};
const relative = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
const naiveFit = (counts: ArrayLike<number>, initialWeights?: Float64Array) => fitLinearFqe({
  data: resampledTransitions(data, index, counts), policy, features, discount: tankDiscount, ridge: 1e-9,
  quadratureNodes: 10, tolerance: 1e-13, maxIterations: 20_000, initialWeights,
});

describe('the fast linear bootstrap replicate', () => {
  it('reproduces the full-data fit with every episode once', () => {
    const fast = linearFqeReplicate(base, unitMultiplicities(data.episodeCount));
    const naive = fitLinearFqe({ data, policy, features, discount: tankDiscount, ridge: 1e-9, quadratureNodes: 10, tolerance: 1e-13, maxIterations: 20_000 });
    expect(relative(fast.policyValue!, naive.fixedPoint!.policyValue.value)).toBeLessThan(1e-10);
  });

  it.each([0, 1, 2, 3])('equals a naive refit on resample %i to 1e-10 (statistics, fixed point and iteration)', (b) => {
    const counts = episodeMultiplicities(data.episodeCount, 5, b);
    const naive = naiveFit(counts);
    const fastStats = resampleBellmanStatistics(sums, counts);
    const naiveStats = accumulateBellmanStatistics(resampledTransitions(data, index, counts), features, quadrature);
    for (const key of ['gram', 'crossNext', 'nextGram', 'featureReward', 'nextFeatureReward'] as const) {
      const scale = Math.max(...Array.from(naiveStats[key], Math.abs));
      fastStats[key].forEach((v, k) => expect(Math.abs(v - naiveStats[key][k]) / scale).toBeLessThan(1e-10));
    }
    expect(fastStats.count).toBe(naiveStats.count);
    const fixed = linearFqeReplicate(base, counts);
    expect(relative(fixed.policyValue!, naive.fixedPoint!.policyValue.value)).toBeLessThan(1e-10);
    // The iteration from the same starting weights, to a tolerance far below 1e-10.
    const start = linearFqeReplicate(base, unitMultiplicities(data.episodeCount)).weights!;
    const iterated = linearFqeReplicate({ ...base, solver: 'iteration', initialWeights: start }, counts);
    const naiveIterated = naiveFit(counts, start);
    expect(iterated.status).toBe('converged');
    expect(relative(iterated.policyValue!, naiveIterated.iterative!.policyValue.value)).toBeLessThan(1e-10);
  });

  it('forms the Gram matrix G = ΦᵀΦ/n of a resample as ml-matrix does from the explicit feature matrix', () => {
    const counts = episodeMultiplicities(data.episodeCount, 5, 9);
    const resampled = resampledTransitions(data, index, counts);
    const d = features.dim, phi = new Float64Array(d), rows: number[][] = [];
    for (let i = 0; i < resampled.count; i++) {
      features.evaluate([resampled.states[2 * i], resampled.states[2 * i + 1], resampled.actions[i]], 0, phi, 0);
      rows.push(Array.from(phi));
    }
    const x = new Matrix(rows), gram = x.transpose().mmul(x).div(resampled.count);
    const fast = resampleBellmanStatistics(sums, counts).gram;
    const scale = Math.max(...gram.to1DArray().map(Math.abs));
    fast.forEach((v, k) => expect(Math.abs(v - gram.get(Math.floor(k / d), k % d)) / scale).toBeLessThan(1e-12));
  });

  it('takes a block of resamples in one read of the sums to the same numbers, to the last bit, as one at a time and as the plain weighted sum', () => {
    const block = Array.from({ length: 7 }, (_, b) => episodeMultiplicities(data.episodeCount, 9, b));
    const scratch = Array.from({ length: 8 }, () => new Float64Array(sums.stride));
    const together = resampleBellmanStatisticsBlock(sums, block, scratch);
    block.forEach((c, r) => {
      expect(together[r]).toEqual(resampleBellmanStatistics(sums, c));
      // The definition, Σ_k c_k S_k over every entry of the row, then the averages.
      const plain = new Float64Array(sums.stride);
      for (let k = 0; k < sums.episodes; k++) for (let j = 0; j < sums.stride; j++) plain[j] += c[k] * sums.sums[k * sums.stride + j];
      const d = sums.dim, n = plain[sums.stride - 1];
      expect(together[r].count).toBe(n);
      together[r].gram.forEach((v, k) => expect(v).toBe(plain[Math.min(k, (k % d) * d + Math.floor(k / d))] / n));
      together[r].crossNext.forEach((v, k) => expect(v).toBe(plain[d * d + k] / n));
    });
    const replicates = linearFqeReplicateBlock(base, block, scratch);
    block.forEach((c, r) => expect(replicates[r]).toEqual(linearFqeReplicate(base, c)));
  });

  it('answers "no start states" for a resample without any, before its statistics are formed, alone or in a block (as one at a time did)', () => {
    const none = new Uint32Array(data.episodeCount), drawn = episodeMultiplicities(data.episodeCount, 9, 0);
    expect(linearFqeReplicate(base, none)).toEqual({ policyValue: null, weights: null, status: 'noStartStates' });
    const scratch = [0, 1].map(() => new Float64Array(sums.stride));
    const [first, second] = linearFqeReplicateBlock(base, [none, drawn], scratch);
    expect(first.status).toBe('noStartStates');
    expect(second).toEqual(linearFqeReplicate(base, drawn));
  });
});
