/**
 * Test harness: one candidate's fitted Q-evaluation and its cross-checks on one log, each with the
 * same episode-bootstrap resamples (seeded), so that estimates, intervals and paired differences can
 * be compared with an exact or rollout truth. Mirrors what the assessment does, without its words.
 */
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { episodeBellmanSums } from '../../../src/core/bootstrap/episodeBellmanSums';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes } from '../../../src/core/bootstrap/episodeTransitions';
import { linearFqeReplicate } from '../../../src/core/bootstrap/linearFqeReplicate';
import { startStateFeatures } from '../../../src/core/features/policyFeatures';
import { effectiveSampleSizeFromLogs } from '../../../src/core/diagnostics/effectiveSampleSize';
import type { FeatureMap } from '../../../src/core/features/featureMap';
import { linearActionValue } from '../../../src/core/fqe/linearActionValue';
import { episodeEnds } from '../../../src/core/loggedReturn';
import { importanceWeightTable } from '../../../src/core/offPolicy/importanceWeights';
import { modelRolloutValue } from '../../../src/core/offPolicy/modelRollouts';
import { perDecisionData, perDecisionEstimates } from '../../../src/core/offPolicy/perDecisionEstimators';
import { fitPolynomialModel, type PolynomialModelRegressions } from '../../../src/core/offPolicy/polynomialDynamicsModel';
import type { GaussianPolicy } from '../../../src/core/policy';
import type { TransitionSet } from '../../../src/core/transitions';
import { stateValues } from '../../../src/core/value';

export interface Estimate { point: number; replicates: number[] }

export interface CrossCheckRun {
  fqe: Estimate;
  importanceSampling: Estimate; doublyRobust: Estimate; // with tails
  importanceSamplingNoTail: Estimate; doublyRobustNoTail: Estimate;
  effectiveEpisodes: number; horizonSteps: number; episodesAtHorizon: number;
  model: (Estimate & { shareOutsideLogs: number; rewardShareAtEdge: number; monteCarloError: number }) | null;
}

export interface CrossCheckOptions {
  data: TransitionSet; policy: GaussianPolicy; behaviour: GaussianPolicy; features: FeatureMap; discount: number;
  resamples: number; seed: number;
  /** Model-based rollouts: the regressions, and how many of the resamples refit and rerun the model (costly). */
  model?: { regressions: PolynomialModelRegressions; resamples: number; rolloutsPerStart: number };
}

/**
 * Linear FQE (LSTD-Q fixed point) on the full data and on the seeded resamples, all from one set of
 * per-episode sums (the full data is the resample with every multiplicity 1).
 */
export function fqeEstimate(data: TransitionSet, policy: GaussianPolicy, features: FeatureMap, discount: number, resamples: number, seed: number) {
  const index = indexEpisodes(data), quadrature = createActionQuadrature(policy, 10), d = features.dim;
  const setup = {
    sums: episodeBellmanSums(data, features, quadrature, undefined, index), startFeatures: startStateFeatures(features, quadrature, data.startStates, data.stateDim),
    startsFollowEpisodes: true, ridge: 1e-6, constantIndex: features.constantIndex, discount, solver: 'fixedPoint' as const,
    tolerance: 1e-10, maxIterations: 20000, initialWeights: new Float64Array(d),
  };
  const full = linearFqeReplicate(setup, new Uint32Array(data.episodeCount).fill(1));
  if (full.weights === null) throw new Error('the LSTD-Q fixed point does not exist on the full data');
  const q = linearActionValue(features, full.weights, data.stateDim, data.actionDim);
  const replicates = Array.from({ length: resamples }, (_, b) => linearFqeReplicate(setup, episodeMultiplicities(data.episodeCount, seed, b)).policyValue!);
  return { q, quadrature, estimate: { point: full.policyValue!, replicates } as Estimate };
}

export function runCrossChecks(o: CrossCheckOptions): CrossCheckRun {
  const { data, policy, behaviour, features, discount } = o, index = indexEpisodes(data), n = data.count, ds = data.stateDim, m = data.actionDim;
  const { q, quadrature, estimate: fqe } = fqeEstimate(data, policy, features, discount, o.resamples, o.seed);
  const draws = Array.from({ length: o.resamples }, (_, b) => episodeMultiplicities(data.episodeCount, o.seed, b));
  const inputs = new Float64Array(n * (ds + m)), states = new Float64Array(n * ds), actionValues = new Float64Array(n);
  for (let p = 0; p < n; p++) {
    const i = index.order[p];
    inputs.set(data.states.subarray(i * ds, (i + 1) * ds), p * (ds + m));
    inputs.set(data.actions.subarray(i * m, (i + 1) * m), p * (ds + m) + ds);
    states.set(data.states.subarray(i * ds, (i + 1) * ds), p * ds);
  }
  q.evaluate(inputs, n, actionValues);
  const values = { actionValues, stateValues: stateValues(q, policy, states, n, quadrature) };
  const ends = episodeEnds(data, discount);
  const tails = { finalStateValues: stateValues(q, policy, ends.finalStates, data.episodeCount, quadrature), tailWeights: ends.tailWeights };
  const table = importanceWeightTable(data, index, policy, behaviour);
  const withTails = perDecisionData(table, values, tails), without = perDecisionData(table, values);
  const run = (prepared: typeof withTails, pick: (e: ReturnType<typeof perDecisionEstimates>) => number): Estimate => ({
    point: pick(perDecisionEstimates(prepared, discount)), replicates: draws.map((c) => pick(perDecisionEstimates(prepared, discount, c))),
  });
  const horizonSteps = Math.max(1, Math.min(table.horizon, Math.round(1 / (1 - discount)))), atHorizon: number[] = [];
  for (let p = 0; p < table.step.length; p++) if (table.step[p] === horizonSteps - 1) atHorizon.push(table.logWeight[p]);
  return {
    fqe,
    importanceSampling: run(withTails, (e) => e.importanceSampling), doublyRobust: run(withTails, (e) => e.doublyRobust!),
    importanceSamplingNoTail: run(without, (e) => e.importanceSampling), doublyRobustNoTail: run(without, (e) => e.doublyRobust!),
    effectiveEpisodes: effectiveSampleSizeFromLogs(atHorizon), horizonSteps, episodesAtHorizon: atHorizon.length,
    model: o.model ? modelRun(o, draws.slice(0, o.model.resamples)) : null,
  };
}

function modelRun(o: CrossCheckOptions, draws: Uint32Array[]) {
  const { regressions, rolloutsPerStart } = o.model!, settings = { rolloutsPerStart, seed: o.seed + 1 };
  const full = modelRolloutValue(fitPolynomialModel(regressions), o.policy, o.discount, o.data.startStates, settings);
  return {
    point: full.value, shareOutsideLogs: full.shareOutsideLogs, rewardShareAtEdge: full.rewardShareAtEdge, monteCarloError: full.monteCarloError,
    replicates: draws.map((c) => modelRolloutValue(fitPolynomialModel(regressions, c), o.policy, o.discount, o.data.startStates, settings, c).value),
  };
}

export function standardDeviation(values: number[]): number {
  const mean = values.reduce((a, v) => a + v, 0) / values.length;
  return Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / (values.length - 1));
}

/** Percentile interval [q(α/2), q(1 − α/2)] of the replicates (nearest rank; enough for a test's reading). */
export function percentileInterval(values: number[], level: number): [number, number] {
  const sorted = [...values].sort((a, b) => a - b), b = sorted.length, alpha = 1 - level;
  return [sorted[Math.floor((alpha / 2) * (b - 1))], sorted[Math.ceil((1 - alpha / 2) * (b - 1))]];
}

/** Paired differences of two estimates over the same resamples. */
export function paired(a: Estimate, b: Estimate): Estimate {
  return { point: a.point - b.point, replicates: a.replicates.map((v, i) => v - b.replicates[i]) };
}
