/**
 * A retune map's numbers: linear FQE of every candidate on a grid of one or two parameters of a
 * candidate form, built on one structure. With the features, data, discount and ridge fixed, the
 * statistics of linear FQE split into a policy-free part — Φ, r, G = ΦᵀΦ/n, b = Φᵀr/n — formed
 * once (policyFreeSums.ts), and a policy part Ψ with M = ΦᵀΨ/n, H = ΨᵀΨ/n, e = Ψᵀr/n. Three
 * routes to the policy part, the cheapest that applies (all equal to rounding):
 *   closedForm — polynomial features and an affine Gaussian mean: ψ(s) = C·χ(s), so M, H, e are
 *     products of C with sums of the next-state monomials χ formed once (nextStateMonomialSums.ts,
 *     closedFormSums.ts), plus row corrections where actuator limits are within reach;
 *   moments — polynomial features, any mean (e.g. a schedule): one pass, ψ per row from
 *     closed-form moments of the (clipped) normal (policyFeatureAverage.ts);
 *   quadrature — any features: one pass, ψ per row by the action quadrature.
 * Each point is then solved as the main fit and the bootstrap solve it (solveReplicate: the FQE
 * iteration to the tolerance, or the LSTD-Q fixed point where it diverges), warm-started from the
 * previous point.
 *
 * Everything is in reward sense (J = ξ̄ᵀw). The per-point material — statistics, start features,
 * weights and, when asked for, per-episode sums — goes to onPoint and is not kept, so memory stays
 * that of one point; the caller builds intervals and the shift measure from it there.
 */
import type { EpisodeBellmanSums } from '../bootstrap/episodeBellmanSums';
import { solveReplicate, type ReplicateSolver, type ReplicateStatus } from '../bootstrap/linearFqeReplicate';
import { meanStartFeatures } from '../features/policyFeatures';
import type { FeatureMap } from '../features/featureMap';
import { bellmanResidual } from '../fqe/bellmanResidual';
import type { BellmanStatistics } from '../fqe/bellmanStatistics';
import { throwIfCancelled, type CancellationCheck } from '../fqe/cancellation';
import { FqeOptionsError } from '../fqe/fqeErrors';
import { checkDiscount, checkQuadratureNodes, checkRidge } from '../fqe/solveSettingChecks';
import type { GaussianPolicy } from '../policy';
import type { TransitionSet } from '../transitions';
import { closedFormPointSums, MAX_CORRECTED_SHARE, rowsNearLimits } from './closedFormSums';
import { nextStateMonomialSums, type NextStateMonomialSums } from './nextStateMonomialSums';
import { createPolicyFeatureAverage, momentRouteApplies, type PolicyFeatureAverage } from '../features/policyFeatureAverage';
import { policyDependentSums } from './policyDependentSums';
import { policyFreeSums, type PolicyFreeSums } from './policyFreeSums';
import type { PointSums } from './pointSums';
import { MAX_RETUNE_POINTS } from './retuneAxes';

export interface RetuneGridInput {
  readonly data: TransitionSet;
  readonly features: FeatureMap;
  /** One compiled candidate per grid point, row-major over the axes (retuneAxes.ts). */
  readonly policies: readonly GaussianPolicy[];
  readonly discount: number;
  readonly ridge: number;
  readonly quadratureNodes: number;
  readonly tolerance: number;
  readonly maxIterations: number;
  /** 'iteration' (default): the iterate, or the fixed point where the iteration diverges; 'fixedPoint': LSTD-Q. */
  readonly solver?: ReplicateSolver;
  /** e×ds start states for J; default data.startStates. */
  readonly startStates?: Float64Array;
  /**
   * Form ΨᵀΨ and Ψᵀr too, for each point's Bellman residual (default true). Nothing else needs them
   * (the solve and the bootstrap use G, M, b), and leaving them out saves about a third of a pass.
   */
  readonly withBellmanResidual?: boolean;
  /** Also form each point's per-episode sums (for bootstrap intervals); costs e·(3d² + 2d + 2) numbers per point. */
  readonly perEpisode?: boolean;
  readonly onPoint?: (material: RetunePointMaterial) => void;
  readonly onProgress?: (progress: RetuneProgress) => void;
  readonly cancel?: CancellationCheck;
}

export interface RetuneProgress {
  readonly stage: 'shared sums' | 'points';
  readonly pointsDone: number;
  readonly pointsTotal: number;
}

export interface RetunePoint {
  readonly index: number;
  /** J of the point's candidate, reward sense; null when no solution exists (status says why). */
  readonly policyValue: number | null;
  readonly status: ReplicateStatus;
  /** Mean squared TD error on the data; null without a solution or when not asked for. */
  readonly bellmanResidual: number | null;
  /**
   * How the point's sums were formed: 'closedForm' (ψ = C·χ from sums formed once, with row
   * corrections at actuator limits), 'moments' (a pass with closed-form moments per row) or
   * 'quadrature' (a pass with the action quadrature per row).
   */
  readonly route: RetuneRoute;
  /** Rows recomputed at actuator limits by the closed-form route (0 otherwise). */
  readonly correctedRows: number;
}

export type RetuneRoute = 'closedForm' | 'moments' | 'quadrature';

export interface RetunePointMaterial extends RetunePoint {
  readonly policy: GaussianPolicy;
  /** G, b and rr are the same objects at every point. */
  readonly statistics: BellmanStatistics;
  readonly startFeatures: Float64Array; // count×d: ξ(s0) per start state
  readonly meanStartFeatures: Float64Array; // d: ξ̄
  readonly weights: Float64Array | null; // d
  readonly episodeSums: EpisodeBellmanSums | null;
}

export interface RetuneGridResult {
  readonly points: readonly RetunePoint[];
  readonly featureDim: number;
  /** True when Φ was kept in memory between points. */
  readonly featuresKept: boolean;
}

export function retuneGrid(input: RetuneGridInput): RetuneGridResult {
  checkInput(input);
  const { data, features, policies } = input, total = policies.length;
  input.onProgress?.({ stage: 'shared sums', pointsDone: 0, pointsTotal: total });
  const free = policyFreeSums(data, features, { perEpisode: input.perEpisode ?? false, cancel: input.cancel });
  const monomials = lazyMonomialSums(input, free);
  const starts = input.startStates ?? data.startStates;
  const points: RetunePoint[] = [];
  let warm: Float64Array = new Float64Array(features.dim);
  for (let p = 0; p < total; p++) {
    throwIfCancelled(input.cancel);
    const policy = policies[p], average = createPolicyFeatureAverage(features, policy, input.quadratureNodes);
    const { sums, route, correctedRows } = pointSums(input, free, monomials, policy, average);
    const startFeatures = averagedRows(average, starts, data.stateDim), xiBar = meanStartFeatures(startFeatures, features.dim);
    const solution = solveReplicate({
      ridge: input.ridge, constantIndex: features.constantIndex, discount: input.discount, solver: input.solver ?? 'iteration',
      tolerance: input.tolerance, maxIterations: input.maxIterations, initialWeights: warm,
    }, sums.statistics, xiBar);
    if (solution.weights) warm = solution.weights;
    const point: RetunePoint = {
      index: p, policyValue: solution.policyValue, status: solution.status, route, correctedRows,
      bellmanResidual: solution.weights && input.withBellmanResidual !== false ? bellmanResidual(sums.statistics, solution.weights, input.discount) : null,
    };
    points.push(point);
    input.onPoint?.({ ...point, policy, statistics: sums.statistics, startFeatures, meanStartFeatures: xiBar, weights: solution.weights, episodeSums: sums.episodeSums });
    input.onProgress?.({ stage: 'points', pointsDone: p + 1, pointsTotal: total });
  }
  return { points, featureDim: features.dim, featuresKept: free.features !== null };
}

/** The closed-form route's sums, formed on first use (only polynomial features can use them). */
function lazyMonomialSums(input: RetuneGridInput, free: PolicyFreeSums): () => NextStateMonomialSums | null {
  let sums: NextStateMonomialSums | null | undefined;
  return () => {
    if (sums !== undefined) return sums;
    const spec = input.features.toSpec();
    sums = spec.kind === 'polynomial' ? nextStateMonomialSums(input.data, spec, free, input.cancel) : null;
    return sums;
  };
}

/** The closed-form route where it applies (affine mean, exact moments, sums available), else a pass. */
function pointSums(
  input: RetuneGridInput, free: PolicyFreeSums, monomials: () => NextStateMonomialSums | null, policy: GaussianPolicy, average: PolicyFeatureAverage,
): { sums: PointSums; route: RetuneRoute; correctedRows: number } {
  const spec = input.features.toSpec();
  const affine = !policy.schedules || policy.schedules.length === 0;
  if (spec.kind === 'polynomial' && affine && momentRouteApplies(spec, policy, input.quadratureNodes)) {
    const near = rowsNearLimits(input.data, free, policy);
    const mono = near.count <= MAX_CORRECTED_SHARE * free.count ? monomials() : null;
    if (mono) {
      const sums = closedFormPointSums(input.data, spec, free, mono, policy, average, near, input.cancel);
      return { sums, route: 'closedForm', correctedRows: sums.correctedRows };
    }
  }
  const sums = policyDependentSums(input.data, input.features, free, average, { cancel: input.cancel, withNextGram: input.withBellmanResidual !== false });
  return { sums, route: average.route, correctedRows: 0 };
}

/** ψ(s) for each row of states (count×ds) → count×d. */
function averagedRows(average: PolicyFeatureAverage, states: Float64Array, ds: number): Float64Array {
  const count = states.length / ds, d = average.dim, out = new Float64Array(count * d);
  for (let s = 0; s < count; s++) average.average(states, s * ds, out, s * d);
  return out;
}

function checkInput(input: RetuneGridInput): void {
  const { data, features, policies } = input;
  if (policies.length < 1 || policies.length > MAX_RETUNE_POINTS) throw new FqeOptionsError(`policies: expected 1 to ${MAX_RETUNE_POINTS} grid points, got ${policies.length}`);
  if (!(data.count >= 1)) throw new FqeOptionsError('data: the transition set is empty');
  if (features.inputDim !== data.stateDim + data.actionDim) throw new FqeOptionsError(`features: take ${features.inputDim} inputs, the data have ${data.stateDim} states + ${data.actionDim} actions`);
  policies.forEach((p, i) => {
    if (p.stateDim !== data.stateDim || p.actionDim !== data.actionDim) throw new FqeOptionsError(`policies[${i}]: has ${p.stateDim} states and ${p.actionDim} actions, the data ${data.stateDim} and ${data.actionDim}`);
  });
  checkDiscount(input.discount);
  checkRidge(input.ridge);
  policies.forEach((p) => checkQuadratureNodes(p, input.quadratureNodes));
  const starts = input.startStates ?? data.startStates;
  if (starts.length < data.stateDim || starts.length % data.stateDim !== 0) throw new FqeOptionsError(`startStates: expected whole rows of ${data.stateDim} values`);
}
