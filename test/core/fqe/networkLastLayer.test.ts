/**
 * The network's last-layer solve and its interval against the project's independent linear path:
 *   - on the quadratic part alone, the last-layer LSTD-Q solve (networkLinearPart.ts,
 *     networkLastLayerSums.ts, networkLastLayer.ts) must equal the fixed point of linear FQE with
 *     degree-2 features and the same ridge (bellmanStatistics.ts, ridgeSystem.ts): two separate
 *     implementations of Lagoudakis & Parr (2003, §5);
 *   - an episode resample of the linear part must equal linearFqeReplicate (src/core/bootstrap)
 *     with the same multiplicities, solver 'fixedPoint';
 *   - the per-iteration float32 sums of the hidden blocks must give the same J as the double
 *     precision per-episode sums, to well within the sampling error (here 10⁻⁴ relative).
 * Data: the invented three-zone oven of the battery, 20,000 transitions (40 episodes).
 */
import { describe, expect, it } from 'vitest';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { episodeBellmanSums } from '../../../src/core/bootstrap/episodeBellmanSums';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { linearFqeReplicate } from '../../../src/core/bootstrap/linearFqeReplicate';
import { startStateFeatures } from '../../../src/core/features/policyFeatures';
import { fitLinearFqe } from '../../../src/core/fqe/linearFqe';
import { createFitSession } from '../../../src/core/fqe/networkFitSession';
import { hiddenFeatureRows } from '../../../src/core/fqe/networkHiddenFeatures';
import { valueReplicates } from '../../../src/core/fqe/networkInterval';
import { featureNetwork } from '../../../src/core/fqe/networkIterateValues';
import { combineSums, episodeLastLayerSums, lastLayerTotals } from '../../../src/core/fqe/networkLastLayerSums';
import { LINEAR_PART_RIDGE, solveLastLayer } from '../../../src/core/fqe/networkLastLayer';
import { defaultNetworkMethod } from '../../../src/core/fqe/networkMethod';
import { defaultNetworkSettings } from '../../../src/core/fqe/networkSettings';
import { meanRow, startFeatureRows } from '../../../src/core/fqe/networkValueRows';
import { loadBackend } from '../../../src/core/fqe/tfBackend';
import { createGaussianPolicy } from '../../../src/core/policy';
import { batteryPlant } from '../../battery/catalogue';
import { wasmDirectory } from './networkTestEnvironment';

const plant = batteryPlant('lq3-oven-g0.97');
const data = plant.simulate({ transitions: 20_000, seed: 9 });
const policy = createGaussianPolicy(plant.candidates[1].spec, plant.stateDim);
const settings = { ...defaultNetworkSettings, hiddenLayers: [16, 8] };
const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('network last layer', () => {
  it('on the quadratic part alone equals linear FQE\'s LSTD-Q fixed point with degree-2 features', async () => {
    expect(await loadBackend('cpu')).toBeNull();
    const s = createFitSession({ data, policy, discount: plant.discount, quadratureNodes: 10, seed: 1, settings, method: { ...defaultNetworkMethod, linearPartDegree: 2 } });
    try {
      const solved = solveLastLayer(s.linearTotal.sums, s.linearTotal.dim, s.linearTotal.dim, 0);
      if ('failure' in solved) throw new Error(solved.failure);
      const linear = fitLinearFqe({
        data, policy, features: s.linear.training.part.features, discount: plant.discount, ridge: LINEAR_PART_RIDGE,
        quadratureNodes: 10, tolerance: 1e-12, maxIterations: 2,
      });
      const reference = linear.fixedPoint!.q.weights;
      for (let f = 0; f < reference.length; f++) expect(Math.abs(solved.weights[f] - reference[f])).toBeLessThan(1e-8 * (1 + Math.abs(reference[f])));

      // One episode resample: the same multiplicities through src/core/bootstrap.
      const features = s.linear.training.part.features, quadrature = createActionQuadrature(policy, 10);
      const starts = startStateFeatures(features, quadrature, data.startStates, plant.stateDim), c = episodeMultiplicities(data.episodeCount, 4, 0);
      const replicate = linearFqeReplicate({
        sums: episodeBellmanSums(data, features, quadrature), startFeatures: starts, startsFollowEpisodes: true,
        ridge: LINEAR_PART_RIDGE, constantIndex: 0, discount: plant.discount, solver: 'fixedPoint', tolerance: 1e-12, maxIterations: 2,
        initialWeights: new Float64Array(features.dim),
      }, c);
      const mine = solveLastLayer(combineSums(s.episodes.sums, c), features.dim, features.dim, 0);
      if ('failure' in mine) throw new Error(mine.failure);
      const j = meanRow(starts, features.dim, c).reduce((sum, x, f) => sum + x * mine.weights[f], 0);
      expect(relative(j, replicate.policyValue!)).toBeLessThan(1e-9);
    } finally {
      s.dispose();
    }
  });

  it.each(['cpu', 'wasm'] as const)('float32 totals give the J of double-precision per-episode sums (%s)', async (backend) => {
    expect(await loadBackend(backend, wasmDirectory)).toBeNull();
    const s = createFitSession({ data, policy, discount: plant.discount, quadratureNodes: 10, seed: 2, settings, method: { ...defaultNetworkMethod, linearPartDegree: 2 } });
    const features = hiddenFeatureRows(s.net.theta, s.layout, s.net.activation, s.rows.training.inputs, s.next.training);
    try {
      const dh = features.hidden.shape[1], { part, rewards } = s.linear.training;
      const totals = lastLayerTotals(s.linear.training.tensors, features, s.linearTotal);
      const episodes = episodeLastLayerSums(part, rewards, features.hidden.dataSync() as Float32Array, features.nextHidden.dataSync() as Float32Array, dh, s.episodes.sums, s.episodes.ranges);
      const a = solveLastLayer(totals.sums, totals.dim, totals.linearDim, 1e-3), b = solveLastLayer(combineSums(episodes), episodes.dim, episodes.linearDim, 1e-3);
      if ('failure' in a || 'failure' in b) throw new Error('last-layer solve failed');
      const rows = startFeatureRows(featureNetwork(s), s.quadrature, data.startStates, plant.stateDim), d = totals.dim;
      const ja = meanRow(rows, d).reduce((x, r, f) => x + r * a.weights[f], 0), jb = meanRow(rows, d).reduce((x, r, f) => x + r * b.weights[f], 0);
      expect(relative(ja, jb)).toBeLessThan(1e-4);

      // The interval machinery on these systems: every resample solves, and the full-data J lies inside its 90 % interval.
      const linearStartRows = startStateFeatures(s.comparator.features, s.quadrature, data.startStates, plant.stateDim);
      const r = valueReplicates({ joint: episodes, linear: s.comparator.episodes, ids: s.episodes.ids, hiddenRidge: 1e-3 },
        { startRows: rows, linearStartRows, startsFollowEpisodes: true, level: 0.9, resamples: 100, seed: 3 }, { network: jb, linear: jb });
      expect(r.failed).toBe(0);
      expect(r.network.percentile[0]).toBeLessThan(jb);
      expect(r.network.percentile[1]).toBeGreaterThan(jb);
    } finally {
      features.dispose();
      s.dispose();
    }
  });
});
