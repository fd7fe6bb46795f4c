/**
 * The fitted Q-evaluation loop on the one-pass statistics: each iteration is the least-squares
 * regression of r + γ ψᵀw_k on φ (Ernst, Geurts & Wehenkel, "Tree-based batch mode reinforcement
 * learning", JMLR 2005, for the fitted scheme; here with linear features), which with the
 * statistics is w_{k+1} = (G + λD)⁻¹(b + γ M w_k) at O(d²) per iteration.
 *
 * Divergence: with function approximation and off-policy data the update need not contract
 * (Tsitsiklis & Van Roy, "An analysis of temporal-difference learning with function
 * approximation", IEEE TAC 1997). It is declared when the weights stop being finite, or when the
 * iteration matrix has a spectral-radius bound ≥ 1 and the weight changes grow by a large factor
 * (or have not shrunk when the iteration limit is reached).
 */
import { choleskySolve, dot } from '../linalg/dense';
import type { BellmanStatistics } from './bellmanStatistics';
import { bellmanResidual } from './bellmanResidual';
import { throwIfCancelled, type CancellationCheck } from './cancellation';

import type { FqeStatus } from './fitStatus';
import { ASCII_MINUS, exponentText } from '../exponentText';

export type { FqeStatus } from './fitStatus';

export interface FqeIterationProgress {
  readonly iteration: number; // 1-based
  /** ‖w_k − w_{k−1}‖ / max(‖w_k‖, ‖w_{k−1}‖). */
  readonly weightChange: number;
  /** Mean squared TD error of w_k (see bellmanResidual). */
  readonly bellmanResidual: number;
  /** J of w_k over the start states. */
  readonly policyValue: number;
}

export interface IterationSetup {
  readonly stats: BellmanStatistics;
  readonly factor: Float64Array; // Cholesky factor of G + λD
  readonly discount: number;
  readonly tolerance: number;
  readonly maxIterations: number;
  readonly initialWeights: Float64Array;
  readonly spectralRadiusBound: number;
  /** Mean over start states of Σ_j ω_j φ(s0, a_j), so J(w) = startFeaturesᵀw. */
  readonly startFeatures: Float64Array;
  readonly onIteration?: (progress: FqeIterationProgress) => void;
  readonly cancel?: CancellationCheck;
}

export interface IterationOutcome {
  readonly status: FqeStatus;
  /** The last iterate; null when diverged (its numbers would mean nothing). */
  readonly weights: Float64Array | null;
  readonly history: FqeIterationProgress[];
  /** Why it stopped, in plain words. */
  readonly reason: string;
}

/** Weight changes this many times their smallest value, with a bound ≥ 1, are taken as divergence. */
const GROWTH_FACTOR = 1e3;
/** Past this weight norm the quadratic residual could overflow; stop while numbers are finite. */
const WEIGHT_NORM_LIMIT = 1e100;

export function runFqeIteration(setup: IterationSetup): IterationOutcome {
  const { stats, factor, discount, tolerance, maxIterations, spectralRadiusBound: bound } = setup;
  const d = stats.dim, rhs = new Float64Array(d), history: FqeIterationProgress[] = [];
  let w: Float64Array = Float64Array.from(setup.initialWeights), smallestStep = Infinity, lastStep = Infinity;
  for (let k = 1; k <= maxIterations; k++) {
    throwIfCancelled(setup.cancel);
    const next = fqeStep(stats, factor, discount, w, rhs);
    const { step, size } = stepSize(w, next);
    const residual = bellmanResidual(stats, next, discount);
    if (!Number.isFinite(step) || !Number.isFinite(residual) || size > WEIGHT_NORM_LIMIT) {
      return diverged(history, `the weights grew beyond ${exponentText(WEIGHT_NORM_LIMIT, 0, ASCII_MINUS)} after ${k} iterations`, bound);
    }
    const progress = { iteration: k, weightChange: size === 0 ? 0 : step / size, bellmanResidual: residual, policyValue: dot(setup.startFeatures, next) };
    history.push(progress);
    setup.onIteration?.(progress);
    w = next;
    if (progress.weightChange <= tolerance) {
      return { status: 'converged', weights: w, history, reason: `converged in ${k} iterations (relative weight change ${fmt(progress.weightChange)} ≤ tolerance ${fmt(tolerance)})` };
    }
    smallestStep = Math.min(smallestStep, step);
    lastStep = step;
    if (bound >= 1 && step > GROWTH_FACTOR * smallestStep) {
      return diverged(history, `the weight changes grew ${fmt(step / smallestStep)}-fold by iteration ${k}`, bound);
    }
  }
  if (bound >= 1 && lastStep > smallestStep) {
    return diverged(history, `the weight changes had stopped shrinking after ${maxIterations} iterations`, bound);
  }
  const lastChange = history[history.length - 1].weightChange;
  const rate = bound < 1
    ? `the iteration contracts by a factor of at most ${fmt(bound)} per step in the long run`
    : `the spectral-radius estimate ${fmt(bound)} is not below 1, so convergence is not guaranteed`;
  return {
    status: 'maxIterations', weights: w, history,
    reason: `stopped at the limit of ${maxIterations} iterations before reaching the tolerance (last relative weight change ` +
      `${fmt(lastChange)}, tolerance ${fmt(tolerance)}; ${rate})`,
  };
}

/** w_{k+1} = (G + λD)⁻¹(b + γ M w_k); rhs is a scratch buffer of length d. */
function fqeStep(stats: BellmanStatistics, factor: Float64Array, discount: number, w: Float64Array, rhs: Float64Array): Float64Array {
  const d = stats.dim;
  for (let a = 0; a < d; a++) {
    let mw = 0;
    for (let b = 0; b < d; b++) mw += stats.crossNext[a * d + b] * w[b];
    rhs[a] = stats.featureReward[a] + discount * mw;
  }
  return choleskySolve(factor, d, rhs);
}

function stepSize(w: Float64Array, next: Float64Array): { step: number; size: number } {
  let step = 0, a = 0, b = 0;
  for (let i = 0; i < w.length; i++) {
    step += (next[i] - w[i]) ** 2;
    a += w[i] ** 2;
    b += next[i] ** 2;
  }
  return { step: Math.sqrt(step), size: Math.sqrt(Math.max(a, b)) };
}

function diverged(history: FqeIterationProgress[], what: string, bound: number): IterationOutcome {
  const radius = bound >= 1 ? ` (spectral-radius estimate of the update ${fmt(bound)} ≥ 1)` : '';
  return {
    status: 'diverged', weights: null, history,
    reason: `diverged: ${what}. With these features the Bellman update is not a contraction on the logged data${radius}, ` +
      'so repeating it drives the weights without bound. This happens when the candidate policy leads to states or actions ' +
      'the data covers poorly, or the features cannot represent its Q; try a larger ridge, a smaller discount or other features',
  };
}

function fmt(x: number): string {
  return Number.isFinite(x) ? x.toPrecision(3) : String(x);
}
