/**
 * Bootstrap throughput at 100,000 transitions on the tank-levels plant (200 runs × 501 steps,
 * quadratic features d = 10, 10 quadrature nodes): the one-off per-episode sums, then resamples per
 * second of each estimator on the fast path (per-episode sums reweighted by episode multiplicities),
 * beside one naive refit on a materialised resample for scale. Printed by `npm run bench`, never asserted.
 */
import { createActionQuadrature } from '../src/core/actionQuadrature';
import { episodeBellmanSums } from '../src/core/bootstrap/episodeBellmanSums';
import { episodeMultiplicities, unitMultiplicities } from '../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes, resampledTransitions } from '../src/core/bootstrap/episodeTransitions';
import { linearFqeReplicate, type LinearReplicateSetup } from '../src/core/bootstrap/linearFqeReplicate';
import { startStateFeatures } from '../src/core/features/policyFeatures';
import { createFeatureMap } from '../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../src/core/features/standardiser';
import { fitLinearFqe } from '../src/core/fqe/linearFqe';
import { fittedBehaviourPolicy } from '../src/core/offPolicy/behaviourPolicy';
import { importanceWeightTable } from '../src/core/offPolicy/importanceWeights';
import { fitLinearQuadraticModel, modelRegressions } from '../src/core/offPolicy/linearQuadraticModel';
import { modelPolicyValue } from '../src/core/offPolicy/modelBasedValue';
import { perDecisionData, perDecisionEstimates } from '../src/core/offPolicy/perDecisionEstimators';
import { createGaussianPolicy } from '../src/core/policy';
import { stateValues } from '../src/core/value';
import type { ActionValueFunction } from '../src/core/actionValue';
import type { ActionQuadrature } from '../src/core/actionQuadrature';
import type { EpisodeIndex } from '../src/core/bootstrap/episodeTransitions';
import type { GaussianPolicy } from '../src/core/policy';
import type { TransitionSet } from '../src/core/transitions';
import { importDataset } from '../src/data/importDataset';
import { TANK_COLUMNS } from './tankColumns';
import { simulateTankLevels, tankDiscount, tankLevelsCsv, tankTunedPolicy } from '../sample-projects/tank-levels/simulate';


const seconds = (start: bigint) => Number(process.hrtime.bigint() - start) / 1e9;

/** Resamples per second of `replicate`, run for at least `minimumSeconds`. */
function rate(replicate: (b: number) => void, minimumSeconds = 1.5): number {
  const t = process.hrtime.bigint();
  let b = 0;
  while (b < 20 || seconds(t) < minimumSeconds) replicate(b++);
  return b / seconds(t);
}

export async function runBootstrapBench(): Promise<Record<string, number | string>> {
  const csv = tankLevelsCsv(simulateTankLevels({ runs: 200, stepsPerRun: 501, seed: 5 }));
  const imported = importDataset(csv, 'bench.csv', { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' }, TANK_COLUMNS);
  if (!imported.ok) throw new Error(imported.problems.map((p) => p.message).join('\n'));
  const data = imported.value.transitions;
  const policy = createGaussianPolicy(tankTunedPolicy, 2);
  const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
  const quadrature = createActionQuadrature(policy, 10), index = indexEpisodes(data), e = data.episodeCount;

  let t = process.hrtime.bigint();
  const sums = episodeBellmanSums(data, features, quadrature, undefined, index);
  const sumsSeconds = seconds(t);
  const setup: LinearReplicateSetup = {
    sums, startFeatures: startStateFeatures(features, quadrature, data.startStates, 2), startsFollowEpisodes: true, ridge: 1e-9,
    constantIndex: features.constantIndex, discount: tankDiscount, solver: 'fixedPoint', tolerance: 1e-10, maxIterations: 5000, initialWeights: new Float64Array(features.dim),
  };
  const full = linearFqeReplicate(setup, unitMultiplicities(e));
  const counts = new Uint32Array(e), scratch = new Float64Array(sums.stride);
  const fixedPointRate = rate((b) => linearFqeReplicate(setup, episodeMultiplicities(e, 1, b, counts), scratch));
  const iterationRate = rate((b) => linearFqeReplicate({ ...setup, solver: 'iteration', initialWeights: full.weights! }, episodeMultiplicities(e, 1, b, counts), scratch));

  t = process.hrtime.bigint();
  fitLinearFqe({ data: resampledTransitions(data, index, episodeMultiplicities(e, 1, 0, counts)), policy, features, discount: tankDiscount, ridge: 1e-9, quadratureNodes: 10, tolerance: 1e-10, maxIterations: 5000 });
  const naiveRefitSeconds = seconds(t);

  const fit = fitLinearFqe({ data, policy, features, discount: tankDiscount, ridge: 1e-9, quadratureNodes: 10, tolerance: 1e-10, maxIterations: 5000 });
  const prepared = perDecisionInputs(data, index, policy, fit.iterative!.q, quadrature);
  const weightedRate = rate((b) => perDecisionEstimates(prepared, tankDiscount, episodeMultiplicities(e, 1, b, counts)));
  const regressions = modelRegressions(data, index);
  const modelRate = rate((b) => modelPolicyValue(fitLinearQuadraticModel(regressions, episodeMultiplicities(e, 1, b, counts)), policy, tankDiscount, data.startStates, counts));

  return {
    transitions: data.count, episodes: e, features: features.dim,
    perEpisodeSumsSeconds: sumsSeconds,
    fqeFixedPointResamplesPerSecond: fixedPointRate,
    fqeIterationResamplesPerSecond: iterationRate,
    naiveRefitSecondsPerResample: naiveRefitSeconds,
    fastPathSpeedup: naiveRefitSeconds * fixedPointRate,
    weightedIsAndDrResamplesPerSecond: weightedRate,
    linearQuadraticModelResamplesPerSecond: modelRate,
    policyValue: -(full.policyValue ?? NaN),
    peakRssMiB: process.resourceUsage().maxRSS / 1024,
  };
}

function perDecisionInputs(data: TransitionSet, index: EpisodeIndex, policy: GaussianPolicy, q: ActionValueFunction, quadrature: ActionQuadrature) {
  const n = data.count, inputs = new Float64Array(n * 3), states = new Float64Array(n * 2);
  for (let p = 0; p < n; p++) {
    const i = index.order[p];
    inputs.set([data.states[2 * i], data.states[2 * i + 1], data.actions[i]], 3 * p);
    states.set([data.states[2 * i], data.states[2 * i + 1]], 2 * p);
  }
  const actionValues = new Float64Array(n);
  q.evaluate(inputs, n, actionValues);
  const table = importanceWeightTable(data, index, policy, fittedBehaviourPolicy(data).policy);
  return perDecisionData(table, { actionValues, stateValues: stateValues(q, policy, states, n, quadrature) });
}
