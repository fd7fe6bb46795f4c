/**
 * One bootstrap replicate of linear fitted Q-evaluation, from per-episode sums and the resample's
 * episode multiplicities: the resample's Bellman statistics (O(e·d²), episodeBellmanSums.ts), then
 * the same solve the full-data fit runs (../fqe/linearFqe.ts) — Cholesky of G + λD, the FQE
 * iteration to the same tolerance, or the LSTD-Q fixed point — and J = ξ̄ᵀw over the resample's
 * start states. Feature map, ridge λ, discount and quadrature are those of the full-data fit: the
 * bootstrap is conditional on them (the feature standardiser is not refitted per resample).
 *
 * The iteration starts from the full-data weights (initialWeights): it then needs only the steps
 * from there, and stops by the same relative-change tolerance, so the answer differs from a cold
 * start by at most the tolerance.
 */
import { dot } from '../linalg/dense';
import { FqeDataError } from '../fqe/fqeErrors';
import { runFqeIteration, type FqeStatus } from '../fqe/fqeIteration';
import { fixedPointWeights, iterationMatrix, ridgeGram, ridgeGramFactor } from '../fqe/ridgeSystem';
import { countedSpectralRadiusBound } from '../fqe/spectralRadiusBound';
import type { BellmanStatistics } from '../fqe/bellmanStatistics';
import { resampleBellmanStatisticsBlock, type EpisodeBellmanSums } from './episodeBellmanSums';
import { meanStartFeatures } from '../features/policyFeatures';
import { holdsStartState, startMultiplicities } from './startMultiplicities';
import { countWork, overBudget, solveWork, stepsAllowed, type SolveTally } from './solveWork';

/**
 * iteration: the iterate at the tolerance, or — as the pipeline reports it — the fixed point when
 * the iteration diverges; fixedPoint: always the LSTD-Q fixed point.
 */
export type ReplicateSolver = 'iteration' | 'fixedPoint';

/** How the linear fit is solved on any statistics. */
export interface LinearSolveSettings {
  readonly ridge: number;
  readonly constantIndex: number | null;
  readonly discount: number;
  readonly solver: ReplicateSolver;
  readonly tolerance: number;
  readonly maxIterations: number;
  readonly initialWeights: Float64Array; // d
}

export interface LinearReplicateSetup extends LinearSolveSettings {
  readonly sums: EpisodeBellmanSums;
  /** ξ(s0) per start state, count×d (features/policyFeatures.ts). */
  readonly startFeatures: Float64Array;
  /** True when the start states are episodes' first states, so they are resampled with their episodes. */
  readonly startsFollowEpisodes: boolean;
  /** Episode of each start state (TransitionSet.startEpisode); absent when start state k is episode k's. */
  readonly startEpisode?: Int32Array;
}

/** singular: no solution; noStartStates: the resample holds no episode with a start state. */
export type ReplicateStatus = FqeStatus | 'singular' | 'noStartStates';

export interface LinearReplicate {
  /** J of the resample (reward sense); null when no solution exists (status says why). */
  readonly policyValue: number | null;
  readonly weights: Float64Array | null;
  readonly status: ReplicateStatus;
  /** Steps of the fitted Q-evaluation iteration run for it (0 where none ran: solved at its fixed point only, or no solution). */
  readonly iterations?: number;
  /** Work its solve did, multiply-adds (solveWork.ts; reachedSolve only, the ridge system passed in not included). */
  readonly work?: number;
}

export function linearFqeReplicate(setup: LinearReplicateSetup, multiplicities: ArrayLike<number>, scratch: Float64Array = new Float64Array(setup.sums.stride)): LinearReplicate {
  return linearFqeReplicateBlock(setup, [multiplicities], [scratch])[0];
}

/**
 * linearFqeReplicate on a block of resamples, their statistics formed in one read of the sums
 * (resampleBellmanStatisticsBlock); the same numbers. A resample without start states is answered
 * before any statistics are formed, as one at a time.
 */
export function linearFqeReplicateBlock(setup: LinearReplicateSetup, block: readonly ArrayLike<number>[], scratch: readonly Float64Array[]): LinearReplicate[] {
  return replicateBlock(setup, block, scratch, (stats, xiBar) => solveReplicate(setup, stats, xiBar), { policyValue: null, weights: null, status: 'noStartStates' });
}

/**
 * linearFqeReplicateBlock at several discounts: each resample's statistics and ridge system (G + λD
 * and its factor), which do not depend on γ, formed once and solved at each discount (for a discount
 * sweep's paired changes) by the sweep's own rule (reachedSolve). values[r][k] is resample r's J at
 * discounts[k]; null where that solve has no solution or the iteration does not reach it, and at every
 * discount whose startWeights[k] is null (the full data's own point there has no J, so no pair holds it).
 *
 * startWeights[k]: where the iteration at discounts[k] starts — the full data's weights at that
 * discount. Whether an affine iteration w ← Aw + c reaches its fixed point does not depend on where it
 * starts (it does from every start exactly when the spectral radius of A is below 1; common practice,
 * e.g. Golub & Van Loan, "Matrix Computations", 4th ed., §11.2), so the verdict is the drawn point's
 * rule; started near the resample's answer, it needs only the steps from there. tally: where given, the
 * work done is added to it (solveWork.ts), the statistics' included.
 */
export function linearFqeReplicateDiscounts(
  setup: LinearReplicateSetup, block: readonly ArrayLike<number>[], scratch: readonly Float64Array[], discounts: readonly number[],
  startWeights: readonly (Float64Array | null)[], tally?: SolveTally,
): (number | null)[][] {
  const d = setup.sums.dim;
  return replicateBlock(setup, block, scratch, (stats, xiBar) => {
    if (tally && overBudget(tally)) return discounts.map(() => null); // the caller drops the block's answers
    countWork(tally, solveWork.statistics(setup.sums.episodes, d));
    const system = replicateSystem(setup, stats, tally);
    return discounts.map((discount, k) => {
      const from = startWeights[k];
      if (!from) return null;
      const fit = reachedSolve({ ...setup, discount, initialWeights: from }, stats, xiBar, system, tally);
      return fit.status === 'converged' ? fit.policyValue : null;
    });
  }, discounts.map(() => null));
}

/**
 * G + λD and its lower Cholesky factor on one set of statistics (ridgeSystem.ts): what every solve on
 * them shares, at any discount and by either route. factor is null where G + λD has none (singular).
 */
export interface ReplicateSystem {
  readonly stats: BellmanStatistics;
  readonly gram: Float64Array; // d×d
  readonly factor: Float64Array | null; // d×d lower
}

export function replicateSystem(setup: Pick<LinearSolveSettings, 'ridge' | 'constantIndex'>, stats: BellmanStatistics, tally?: SolveTally): ReplicateSystem {
  const d = stats.dim, gram = ridgeGram(stats, setup.ridge, setup.constantIndex);
  countWork(tally, solveWork.ridgeSystem(d));
  try {
    return { stats, gram, factor: ridgeGramFactor(gram, d, setup.ridge) };
  } catch (error) {
    if (error instanceof FqeDataError) return { stats, gram, factor: null };
    throw error;
  }
}

/**
 * A solve kept only where the fitted Q-evaluation iteration reaches it, by the rule the project's own
 * fit is judged by (pipeline/model/reportedSolution.ts): the iteration meets its tolerance, or it
 * provably contracts (a spectral-radius bound of its matrix below 1, spectralRadiusBound.ts), in
 * which case its limit is the fixed point from every start (Banach; Golub & Van Loan, "Matrix
 * Computations", 4th ed., §11.2) and no step need be run. One place for a discount sweep's drawn
 * points (assessSensitivity.ts) and its paired check on resamples (assessSweepCheck.ts). A fit solved
 * at its fixed point (the route of a converged fit's resamples) keeps that value only where one of the
 * two holds, the iteration from setup.initialWeights run only where no contraction is proved; else no
 * J, with the iteration's status. A fit solved by the iteration (the route of a fit that did not
 * converge at the project's discount) that stops at its limit while provably contracting is, by the
 * same rule, converged at its fixed point. The fixed point exists wherever its equations are regular,
 * reachable or not, so without this a discount where the iteration diverges would still give a number.
 *
 * system: the statistics' ridge system where the caller has formed it (replicateSystem; the same at
 * every discount). The bound is formed at most once per call and handed to the iteration that needs it.
 * tally: the work is added to it, and its limit stops an iteration (solveWork.ts); the answer's work
 * says what this call did.
 */
export function reachedSolve(
  setup: LinearSolveSettings, stats: BellmanStatistics, xiBar: Float64Array, system: ReplicateSystem = replicateSystem(setup, stats), tally?: SolveTally,
): LinearReplicate {
  const own: SolveTally = { units: 0, limit: tally?.limit === undefined ? undefined : tally.limit - tally.units };
  const fit = reachedOnSystem(setup, system, xiBar, own);
  countWork(tally, own.units);
  if (tally && own.exhausted) tally.exhausted = true;
  return { ...fit, work: own.units };
}

function reachedOnSystem(setup: LinearSolveSettings, system: ReplicateSystem, xiBar: Float64Array, tally: SolveTally): LinearReplicate {
  const bound = contractionBound(system, setup.discount, tally), contracts = () => bound() < 1;
  const fit = solveOnSystem(setup, system, xiBar, bound, tally);
  if (setup.solver === 'iteration') return fit.status === 'maxIterations' && !tally.exhausted && contracts() ? atFixedPoint(setup, system, xiBar, fit, bound, tally) : fit;
  if (fit.status !== 'converged' || contracts()) return fit;
  const iterated = solveOnSystem({ ...setup, solver: 'iteration' }, system, xiBar, bound, tally);
  return iterated.status === 'converged' ? { ...fit, iterations: iterated.iterations } : { policyValue: null, weights: null, status: iterated.status, iterations: iterated.iterations };
}

/** An iteration stopped at its limit while provably contracting: its limit, the fixed point, as reportedSolution.ts reports such a fit (converged). */
function atFixedPoint(setup: LinearSolveSettings, system: ReplicateSystem, xiBar: Float64Array, stopped: LinearReplicate, bound: () => number, tally?: SolveTally): LinearReplicate {
  const fixed = solveOnSystem({ ...setup, solver: 'fixedPoint' }, system, xiBar, bound, tally);
  return fixed.status === 'converged' ? { ...fixed, iterations: stopped.iterations } : stopped;
}

/**
 * The spectral-radius bound of the FQE iteration matrix γ(G + λD)⁻¹M on a system with a factor,
 * formed on first use and then kept: the contraction test and the iteration's divergence test read
 * the same number.
 */
function contractionBound(system: ReplicateSystem, discount: number, tally?: SolveTally): () => number {
  let bound: number | undefined;
  return () => {
    if (bound === undefined) {
      const d = system.stats.dim, counted = countedSpectralRadiusBound(iterationMatrix(system.stats, system.factor!, discount), d);
      countWork(tally, solveWork.iterationMatrix(d) + solveWork.bound(d, counted.squarings));
      bound = counted.bound;
    }
    return bound;
  };
}

function replicateBlock<T>(
  setup: LinearReplicateSetup, block: readonly ArrayLike<number>[], scratch: readonly Float64Array[], solve: (stats: BellmanStatistics, xiBar: Float64Array) => T, noStarts: T,
): T[] {
  const startWeights = block.map((c) => (setup.startsFollowEpisodes ? startMultiplicities(c, setup.startEpisode) : undefined));
  const holds = startWeights.map((w) => !w || holdsStartState(w));
  const stats = resampleBellmanStatisticsBlock(setup.sums, block.filter((_, r) => holds[r]), scratch);
  let next = 0;
  return block.map((_, r): T => (holds[r] ? solve(stats[next++], meanStartFeatures(setup.startFeatures, setup.sums.dim, startWeights[r])) : noStarts));
}

/** The solve on given statistics (also used for the full data and for a discount sweep). */
export function solveReplicate(setup: LinearSolveSettings, stats: BellmanStatistics, xiBar: Float64Array): LinearReplicate {
  const system = replicateSystem(setup, stats);
  return solveOnSystem(setup, system, xiBar, contractionBound(system, setup.discount));
}

/** An iteration the tally's limit stopped: no answer, and the tally says why. */
function exhausted(tally: SolveTally): LinearReplicate {
  tally.exhausted = true;
  return { policyValue: null, weights: null, status: 'maxIterations' };
}

/** The solve on a formed ridge system, by setup.solver; bound: the iteration's spectral-radius bound, asked for only by the iteration. */
function solveOnSystem(setup: LinearSolveSettings, system: ReplicateSystem, xiBar: Float64Array, bound: () => number, tally?: SolveTally): LinearReplicate {
  const { stats, gram, factor } = system, d = stats.dim;
  if (!factor) return { policyValue: null, weights: null, status: 'singular' };
  let status: ReplicateStatus = 'converged', weights: Float64Array | null = null, iterations = 0;
  if (setup.solver === 'iteration') {
    const allowed = Math.min(setup.maxIterations, stepsAllowed(tally, d));
    if (allowed < 1) return exhausted(tally!);
    const outcome = runFqeIteration({
      stats, factor, discount: setup.discount, tolerance: setup.tolerance, maxIterations: allowed,
      initialWeights: setup.initialWeights, startFeatures: xiBar, spectralRadiusBound: bound(),
    });
    status = outcome.status;
    weights = outcome.weights;
    iterations = outcome.history.length;
    countWork(tally, solveWork.steps(d, iterations));
    if (allowed < setup.maxIterations && status === 'maxIterations') return exhausted(tally!);
  }
  if (!weights) {
    countWork(tally, solveWork.fixedPoint(d));
    const fixed = fixedPointWeights(stats, gram, setup.discount);
    if ('failure' in fixed) return { policyValue: null, weights: null, status: 'singular', iterations };
    weights = fixed.weights;
  }
  return { policyValue: dot(xiBar, weights), weights, status, iterations };
}
