/**
 * A span's fit by reweighting per-episode sums (runBlockValues.ts) against a naive refit: the span's runs
 * materialised as data and fitted from scratch by fitLinearFqe, the project's ordinary one-pass fit, J over the
 * same (all the log's) start states — equal to 1e-10 relative, as the fast bootstrap is checked
 * (test/core/bootstrap/linearFqeReplicate.test.ts); a span's resample likewise; and the drift forecast
 * (driftForecast.ts) is the weighted line through those span values, the paired differences' too.
 */
import { describe, expect, it } from 'vitest';
import { simulateTankLevels, tankDiscount, tankTrimmedPolicy } from '../../../sample-projects/tank-levels/simulate';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { episodeBellmanSums } from '../../../src/core/bootstrap/episodeBellmanSums';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes, resampledTransitions } from '../../../src/core/bootstrap/episodeTransitions';
import type { LinearReplicateSetup } from '../../../src/core/bootstrap/linearFqeReplicate';
import { driftForecast } from '../../../src/core/drift/driftForecast';
import { blockSeed, spanValues } from '../../../src/core/drift/runBlockValues';
import { weightedTrendForecast } from '../../../src/core/drift/weightedTrendForecast';
import { startStateFeatures } from '../../../src/core/features/policyFeatures';
import { createFeatureMap } from '../../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../../src/core/features/standardiser';
import { fitLinearFqe } from '../../../src/core/fqe/linearFqe';
import { createGaussianPolicy, type GaussianPolicySpec } from '../../../src/core/policy';
import { tankLogTransitions } from '../fqe/simulatedTransitions';

const log = simulateTankLevels({ runs: 24, stepsPerRun: 120, seed: 77 });
const data = tankLogTransitions(log.rows, log.rowCount);
const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
const index = indexEpisodes(data);
const firmer: GaussianPolicySpec = { ...tankTrimmedPolicy, gain: tankTrimmedPolicy.gain.map((row) => row.map((g) => 1.3 * g)) };
const setups = [tankTrimmedPolicy, firmer].map((spec): LinearReplicateSetup & { spec: GaussianPolicySpec } => {
  const quadrature = createActionQuadrature(createGaussianPolicy(spec, 2), 10);
  return {
    spec, sums: episodeBellmanSums(data, features, quadrature, undefined, index), startFeatures: startStateFeatures(features, quadrature, data.startStates, 2),
    startsFollowEpisodes: true, ridge: 1e-9, constantIndex: features.constantIndex, discount: tankDiscount, solver: 'fixedPoint',
    tolerance: 1e-13, maxIterations: 20_000, initialWeights: new Float64Array(features.dim),
  };
});
const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const naiveFit = (spec: GaussianPolicySpec, counts: ArrayLike<number>) => fitLinearFqe({
  data: resampledTransitions(data, index, counts), policy: createGaussianPolicy(spec, 2), features, discount: tankDiscount, ridge: 1e-9,
  quadratureNodes: 10, tolerance: 1e-13, maxIterations: 20_000, startStates: data.startStates,
}).fixedPoint!.policyValue.value;

describe('a span of runs fitted alone, by reweighting the whole log\'s per-episode sums', () => {
  it('equals a naive refit on the span\'s runs, J over every run\'s start, and so does a resample of the span', () => {
    const first = 8, size = 8, span = spanValues(setups, first, size, 3, 11);
    const only = new Uint32Array(data.episodeCount).fill(1, first, first + size);
    setups.forEach((s, i) => {
      expect(relative(span.values[i], naiveFit(s.spec, only))).toBeLessThan(1e-10);
      const drawn = new Uint32Array(data.episodeCount);
      drawn.set(episodeMultiplicities(size, 11, 2), first);
      expect(relative(span.replicates[i][2], naiveFit(s.spec, drawn))).toBeLessThan(1e-10);
    });
  });

  it('gives a forecast that is the weighted line through the blocks\' values, and the paired differences\' line', () => {
    const blocks = { first: Int32Array.of(0, 8, 16), size: Int32Array.of(8, 8, 8), position: Float64Array.of(3.5, 11.5, 19.5), lastRun: 23 };
    const f = driftForecast(setups, blocks, 40, 5, 0.9);
    const spans = [0, 1, 2].map((b) => spanValues(setups, blocks.first[b], 8, 40, blockSeed(5, b)));
    const variance = (xs: Float64Array) => { const m = xs.reduce((a, b) => a + b, 0) / xs.length; return xs.reduce((a, x) => a + (x - m) ** 2, 0) / (xs.length - 1); };
    for (const i of [0, 1]) {
      const values = spans.map((s) => s.values[i]), variances = spans.map((s) => variance(s.replicates[i]));
      expect(f.policies[i].forecast.value).toBeCloseTo(weightedTrendForecast(blocks.position, values, variances, 23, 0.9).value, 12);
    }
    const diffs = spans.map((s) => s.values[1] - s.values[0]), diffVariances = spans.map((s) => variance(s.replicates[1].map((x, r) => x - s.replicates[0][r])));
    expect(f.differences[0]).toBeNull();
    expect(f.differences[1]!.forecast.value).toBeCloseTo(weightedTrendForecast(blocks.position, diffs, diffVariances, 23, 0.9).value, 12);
    expect(f.differences[1]!.forecast.standardError).toBeCloseTo(weightedTrendForecast(blocks.position, diffs, diffVariances, 23, 0.9).standardError, 12);
  });

  it('refuses a span outside the log', () => {
    expect(() => spanValues(setups, 20, 8, 2, 1)).toThrow(/outside 0–23/);
  });
});
