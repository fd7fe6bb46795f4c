/**
 * The chance that a step ends its run in an end state (terminal = 1; ../absorbingEnds.ts), for the
 * one-step model's rollouts (modelRollouts.ts): a logistic regression of the logged end on the
 * model's quadratic features ψ(s, a) of the standardised state and action,
 *   P(end | s, a) = σ(βᵀψ(s, a)),   σ(η) = 1/(1 + e^(−η)),
 * fitted by maximum likelihood with Newton's method (iteratively reweighted least squares; McCullagh &
 * Nelder, "Generalized Linear Models", 2nd ed., 1989, §4.4), halving a step that does not raise the
 * penalised log-likelihood. A small ridge (RIDGE per sample, on every coefficient) keeps β finite
 * where the logs separate ends from non-ends exactly (a batch that ends on a threshold the state
 * crosses), where the unpenalised maximum lies at infinity; it leaves the chance as sharp as the
 * data show. A run cut by a time limit logs terminal = 0 and counts as going on, as it did.
 *
 * A bootstrap resample refits from the full data's β (a few Newton steps) with each transition
 * weighted by its episode's multiplicity, so the rollouts' spread includes the end model's.
 * A log longer than END_MODEL_ROWS is regressed on a weighted subsample (../limits.ts says how).
 *
 * Shapes: n rows regressed (at most END_MODEL_ROWS); d features; the design X (n×d, row-major) formed once.
 */
import { absorbingEndCount } from '../absorbingEnds';
import type { EpisodeIndex } from '../bootstrap/episodeTransitions';
import type { FeatureMap } from '../features/featureMap';
import { END_MODEL_ROWS } from '../limits';
import { cholesky, choleskySolve, SingularMatrixError } from '../linalg/dense';
import { ModelFitError } from './linearQuadraticModel';
import type { ModelData } from './polynomialDynamicsModel';

/** Ridge per sample on every coefficient (our choice: far below what 10⁴ logged steps determine). */
const RIDGE = 1e-6;
/** Newton steps at most; the relative change at which β has converged (ours). */
const MAX_STEPS = 100;
const TOLERANCE = 1e-9;

/** The logged ends regressed on ψ(s, a): the design formed once, for the full fit and every refit. */
export interface EndChanceData {
  readonly features: FeatureMap;
  readonly design: Float64Array; // n×d
  readonly ended: Uint8Array; // n
  readonly episodeOf: Int32Array; // n: the transition’s episode
  /** Each row's sampling weight: 1 where every row of its class is kept. */
  readonly rowWeight: Float64Array; // n
}

export interface EndChanceFit {
  readonly features: FeatureMap;
  readonly weights: Float64Array; // β, d
}

/** The regression's data; null where no logged transition ends its run (the model then never ends one). */
export function endChanceData(data: ModelData, index: EpisodeIndex, features: FeatureMap, maxRows = END_MODEL_ROWS): EndChanceData | null {
  const ds = data.stateDim, m = data.actionDim, d = features.dim;
  const { rows, weights } = keptRows(data.terminal, maxRows);
  if (rows.length === 0) return null;
  const n = rows.length, design = new Float64Array(n * d), input = new Float64Array(ds + m), episodeOfRow = new Int32Array(data.count);
  for (let k = 0; k < index.episodes; k++) for (let p = index.offsets[k]; p < index.offsets[k + 1]; p++) episodeOfRow[index.order[p]] = k;
  rows.forEach((i, r) => {
    input.set(data.states.subarray(i * ds, (i + 1) * ds));
    input.set(data.actions.subarray(i * m, (i + 1) * m), ds);
    features.evaluate(input, 0, design, r * d);
  });
  return {
    features, design, ended: Uint8Array.from(rows, (i) => (data.terminal[i] !== 0 ? 1 : 0)), episodeOf: Int32Array.from(rows, (i) => episodeOfRow[i]), rowWeight: weights,
  };
}

/**
 * The rows regressed and their weights: all of them when the log has at most maxRows; else every end
 * up to half of maxRows and as many of the rest as fill maxRows, evenly spread through the log, each
 * class weighted by rows it has ÷ rows kept. No row at all where nothing ends.
 */
function keptRows(terminal: Uint8Array, maxRows: number): { rows: Int32Array; weights: Float64Array } {
  const n = terminal.length, ends = absorbingEndCount(terminal);
  if (ends === 0) return { rows: new Int32Array(0), weights: new Float64Array(0) };
  if (n <= maxRows) return { rows: Int32Array.from({ length: n }, (_, i) => i), weights: new Float64Array(n).fill(1) };
  const endsKept = Math.min(ends, Math.floor(maxRows / 2)), othersKept = Math.min(n - ends, maxRows - endsKept);
  // Row j of a class of `had` rows is kept when ⌊(j + 1)·kept/had⌋ passes an integer: exactly `kept` of them, evenly spread.
  const keeps = (j: number, had: number, kept: number) => Math.floor(((j + 1) * kept) / had) > Math.floor((j * kept) / had);
  const rows: number[] = [];
  for (let i = 0, e = 0, o = 0; i < n; i++) {
    if (terminal[i] !== 0 ? keeps(e++, ends, endsKept) : keeps(o++, n - ends, othersKept)) rows.push(i);
  }
  const picked = Int32Array.from(rows), pickedEnds = picked.reduce((s, i) => s + (terminal[i] !== 0 ? 1 : 0), 0);
  const endWeight = ends / pickedEnds, otherWeight = picked.length > pickedEnds ? (n - ends) / (picked.length - pickedEnds) : 1;
  return { rows: picked, weights: Float64Array.from(picked, (i) => (terminal[i] !== 0 ? endWeight : otherWeight)) };
}

/** β on the full data (multiplicities omitted) or on a bootstrap resample, from `start` (zeros if omitted). */
export function fitEndChance(source: EndChanceData, multiplicities?: ArrayLike<number>, start?: Float64Array): EndChanceFit {
  const d = source.features.dim, n = source.ended.length;
  const weightOf = (i: number) => source.rowWeight[i] * (multiplicities ? multiplicities[source.episodeOf[i]] : 1);
  let total = 0;
  for (let i = 0; i < n; i++) total += weightOf(i);
  if (!(total > d)) throw new ModelFitError(`fitting the chance that a run ends needs more than ${d} transitions, got ${total}`);
  let beta = start ? Float64Array.from(start) : new Float64Array(d), objective = penalisedLikelihood(source, beta, weightOf, total);
  for (let step = 0; step < MAX_STEPS; step++) {
    const direction = newtonDirection(source, beta, weightOf, total);
    let scale = 1, next = beta, value = -Infinity;
    for (let halving = 0; halving < 40; halving++, scale /= 2) {
      next = Float64Array.from(beta, (b, j) => b + scale * direction[j]);
      value = penalisedLikelihood(source, next, weightOf, total);
      if (value >= objective) break;
    }
    const change = Math.max(...next.map((b, j) => Math.abs(b - beta[j]))), size = Math.max(1, ...next.map(Math.abs));
    beta = next;
    objective = Math.max(objective, value);
    if (change <= TOLERANCE * size) return { features: source.features, weights: beta };
  }
  throw new ModelFitError(`fitting the chance that a run ends: Newton’s method did not settle in ${MAX_STEPS} steps`);
}

/** σ(βᵀψ) at one (s, a) whose features are ψ (d, from offset). */
export function endChance(fit: EndChanceFit, psi: ArrayLike<number>, offset = 0): number {
  let eta = 0;
  for (let j = 0; j < fit.weights.length; j++) eta += fit.weights[j] * psi[offset + j];
  return logistic(eta);
}

/** βᵀx_i for row i of the design (d = β's length). */
function linearPredictor(design: Float64Array, i: number, beta: Float64Array): number {
  const d = beta.length;
  let eta = 0;
  for (let j = 0; j < d; j++) eta += beta[j] * design[i * d + j];
  return eta;
}

function logistic(eta: number): number {
  return eta >= 0 ? 1 / (1 + Math.exp(-eta)) : Math.exp(eta) / (1 + Math.exp(eta));
}

/** (1/N) Σ w_i [y_i η_i − log(1 + e^η_i)] − (RIDGE/2)‖β‖², with log(1 + e^η) formed without overflow. */
function penalisedLikelihood(source: EndChanceData, beta: Float64Array, weightOf: (i: number) => number, total: number): number {
  const { design, ended } = source;
  let sum = 0;
  for (let i = 0; i < ended.length; i++) {
    const w = weightOf(i);
    if (w === 0) continue;
    const eta = linearPredictor(design, i, beta);
    const softplus = eta > 0 ? eta + Math.log1p(Math.exp(-eta)) : Math.log1p(Math.exp(eta));
    sum += w * (ended[i] * eta - softplus);
  }
  return sum / total - 0.5 * RIDGE * beta.reduce((s, b) => s + b * b, 0);
}

/** The Newton step H⁻¹g of the penalised log-likelihood: g = Xᵀ(y − p)/N − λβ, H = XᵀWX/N + λI. */
function newtonDirection(source: EndChanceData, beta: Float64Array, weightOf: (i: number) => number, total: number): Float64Array {
  const d = beta.length, { design, ended } = source, hessian = new Float64Array(d * d), gradient = new Float64Array(d);
  for (let i = 0; i < ended.length; i++) {
    const w = weightOf(i);
    if (w === 0) continue;
    const p = logistic(linearPredictor(design, i, beta)), residual = (w * (ended[i] - p)) / total, curvature = (w * p * (1 - p)) / total;
    for (let j = 0; j < d; j++) {
      const xj = design[i * d + j];
      gradient[j] += residual * xj;
      for (let k = 0; k <= j; k++) hessian[j * d + k] += curvature * xj * design[i * d + k];
    }
  }
  for (let j = 0; j < d; j++) {
    gradient[j] -= RIDGE * beta[j];
    hessian[j * d + j] += RIDGE;
    for (let k = 0; k < j; k++) hessian[k * d + j] = hessian[j * d + k];
  }
  try {
    return choleskySolve(cholesky(hessian, d), d, gradient);
  } catch (error) {
    if (!(error instanceof SingularMatrixError)) throw error;
    throw new ModelFitError('fitting the chance that a run ends: the curvature is not positive definite (the fit is numerically unreliable)');
  }
}
