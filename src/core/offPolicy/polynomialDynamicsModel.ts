/**
 * A one-step model of the plant for the model-based cross-check: the state increment and the reward
 * as polynomials in the standardised (s, a), by least squares, with Gaussian noise of the residual
 * covariance,
 *   s' = s + Bᵀφ_k(s, a) + w,  w ~ N(0, W),     r = cᵀφ_k'(s, a),
 * φ_k the monomials of total degree ≤ k (../features/polynomialFeatures.ts) — the same function
 * family as a polynomial Q, but fitted to a different target (the next state, not a Bellman
 * equation), so the rollout value it gives does not share Q's errors: a Q class too poor for V^π
 * need not make the one-step model wrong, and the reverse (Voloshin et al., "Empirical study of
 * off-policy policy evaluation for reinforcement learning", NeurIPS datasets 2021, on direct
 * model-based estimates). Modelling the increment s' − s keeps an integrating plant exact at degree 1.
 *
 * The moments are kept per episode (../bootstrap/episodeMoments.ts), so a bootstrap resample
 * refits from Σ c_k (episode moments) alone; the standardiser stays that of the full data. A small
 * ridge (RIDGE, per sample, constant unpenalised) keeps the normal equations solvable when a
 * monomial barely varies; it is far below any coefficient the data determine. Transitions into a
 * terminal state are left out of the dynamics. The logged state range is kept so rollouts can tell
 * when they leave it (modelRollouts.ts).
 *
 * Shapes: ds states, m actions, d = C(ds+m+k, k) regressors; weights d×ds row-major.
 */
import { episodeMoments, resampleMoments, resampleMomentsBlock, type EpisodeMoments, type RegressionMoments } from '../bootstrap/episodeMoments';
import type { EpisodeIndex } from '../bootstrap/episodeTransitions';
import { leadingEpisodeMoments } from '../bootstrap/leadingEpisodeMoments';
import type { FeatureMap } from '../features/featureMap';
import { createPolynomialFeatures, leadsPolynomial, polynomialFeatureSpec } from '../features/polynomialFeatures';
import { fitStateActionStandardiser } from '../features/standardiser';
import { cholesky, choleskySolve, SingularMatrixError } from '../linalg/dense';
import type { TransitionSet } from '../transitions';
import { ModelFitError } from './linearQuadraticModel';

/** What the model's regressions read of a transition set: a thread that forms them is sent no more. */
export type ModelData = Pick<TransitionSet, 'count' | 'stateDim' | 'actionDim' | 'states' | 'actions' | 'nextStates' | 'rewards' | 'terminal'>;

/** The fields of ModelData taken from a transition set (the same arrays, not copies). */
export function modelDataOf(data: ModelData): ModelData {
  const { count, stateDim, actionDim, states, actions, nextStates, rewards, terminal } = data;
  return { count, stateDim, actionDim, states, actions, nextStates, rewards, terminal };
}

export interface PolynomialModelOptions {
  readonly degree: number; // k of the dynamics, ≥ 1
  readonly rewardDegree: number; // k' of the reward, ≥ 1
}

export interface PolynomialModelRegressions {
  readonly stateDim: number;
  readonly actionDim: number;
  readonly dynamicsFeatures: FeatureMap;
  readonly rewardFeatures: FeatureMap;
  readonly dynamics: EpisodeMoments; // x = φ_k(s, a), y = s' − s
  readonly reward: EpisodeMoments; // x = φ_k'(s, a), y = r
  readonly stateLow: Float64Array; // ds: smallest logged state
  readonly stateHigh: Float64Array; // ds: largest logged state
}

export interface PolynomialModelFit {
  readonly regressions: PolynomialModelRegressions;
  readonly dynamicsWeights: Float64Array; // d×ds
  readonly noiseFactor: Float64Array; // lower Cholesky factor of W, ds×ds
  readonly rewardWeights: Float64Array; // d'
  readonly dynamicsRSquared: number[]; // per state, of the increment
  readonly rewardRSquared: number;
}

/** Ridge per sample on the averaged normal equations (constant unpenalised); our choice, far below the data's scale. */
const RIDGE = 1e-8;

export function polynomialModelRegressions(data: ModelData, index: EpisodeIndex, options: PolynomialModelOptions): PolynomialModelRegressions {
  const { stateDim: ds, actionDim: m } = data;
  if (!(Number.isInteger(options.degree) && options.degree >= 1 && Number.isInteger(options.rewardDegree) && options.rewardDegree >= 1)) {
    throw new ModelFitError(`model degrees: expected whole numbers ≥ 1, got ${options.degree} and ${options.rewardDegree}`);
  }
  const standardiser = fitStateActionStandardiser(data).spec;
  const dynamicsFeatures = createPolynomialFeatures(polynomialFeatureSpec(standardiser, options.degree));
  const rewardFeatures = createPolynomialFeatures(polynomialFeatureSpec(standardiser, options.rewardDegree));
  const input = new Float64Array(ds + m);
  const load = (i: number) => {
    input.set(data.states.subarray(i * ds, (i + 1) * ds));
    input.set(data.actions.subarray(i * m, (i + 1) * m), ds);
  };
  const increment = (i: number, y: Float64Array) => {
    for (let c = 0; c < ds; c++) y[c] = data.nextStates[i * ds + c] - data.states[i * ds + c];
  };
  // One pass for both where every row enters both and the reward's regressors lead the dynamics' (the same sums to the last bit).
  const { dynamics, reward } = !data.terminal.some((t) => t !== 0) && leadsPolynomial(rewardFeatures, dynamicsFeatures)
    ? renamed(leadingEpisodeMoments(index, dynamicsFeatures.dim, ds, rewardFeatures.dim, (i, x, y) => {
      load(i);
      dynamicsFeatures.evaluate(input, 0, x, 0);
      increment(i, y);
      y[ds] = data.rewards[i];
    }))
    : {
      dynamics: episodeMoments(index, dynamicsFeatures.dim, ds, (i, x, y) => {
        if (data.terminal[i]) return false; // no next state to regress on
        load(i);
        dynamicsFeatures.evaluate(input, 0, x, 0);
        increment(i, y);
        return true;
      }),
      reward: episodeMoments(index, rewardFeatures.dim, 1, (i, x, y) => {
        load(i);
        rewardFeatures.evaluate(input, 0, x, 0);
        y[0] = data.rewards[i];
        return true;
      }),
    };
  const stateLow = new Float64Array(ds).fill(Infinity), stateHigh = new Float64Array(ds).fill(-Infinity);
  for (let i = 0; i < data.count * ds; i++) {
    stateLow[i % ds] = Math.min(stateLow[i % ds], data.states[i]);
    stateHigh[i % ds] = Math.max(stateHigh[i % ds], data.states[i]);
  }
  return { stateDim: ds, actionDim: m, dynamicsFeatures, rewardFeatures, dynamics, reward, stateLow, stateHigh };
}

const renamed = (both: { first: EpisodeMoments; second: EpisodeMoments }) => ({ dynamics: both.first, reward: both.second });

/** Fit on the full data (multiplicities omitted) or on a bootstrap resample. */
export function fitPolynomialModel(regressions: PolynomialModelRegressions, multiplicities?: ArrayLike<number>): PolynomialModelFit {
  return fitFromMoments(regressions, resampleMoments(regressions.dynamics, multiplicities), resampleMoments(regressions.reward, multiplicities));
}

/**
 * fitPolynomialModel on each of several resamples, or the ModelFitError of one that cannot be
 * fitted: their moments are summed in one read of the episodes' (resampleMomentsBlock), the same
 * sums as one resample at a time to the last bit, so the same fits.
 */
export function fitPolynomialModels(regressions: PolynomialModelRegressions, multiplicities: readonly ArrayLike<number>[]): (PolynomialModelFit | ModelFitError)[] {
  const dynamics = resampleMomentsBlock(regressions.dynamics, multiplicities), reward = resampleMomentsBlock(regressions.reward, multiplicities);
  return multiplicities.map((_, b) => {
    try {
      return fitFromMoments(regressions, dynamics[b], reward[b]);
    } catch (error) {
      if (error instanceof ModelFitError) return error;
      throw error;
    }
  });
}

function fitFromMoments(regressions: PolynomialModelRegressions, dynamics: RegressionMoments, reward: RegressionMoments): PolynomialModelFit {
  const ds = regressions.stateDim;
  const dyn = ridgeLeastSquares(dynamics, 'the next states');
  const rew = ridgeLeastSquares(reward, 'the reward');
  const noiseFactor = semidefiniteFactor(dyn.residualCovariance, ds);
  return {
    regressions, dynamicsWeights: dyn.coefficients, noiseFactor, rewardWeights: rew.coefficients,
    dynamicsRSquared: dyn.rSquared, rewardRSquared: rew.rSquared[0],
  };
}

/**
 * A lower factor L with LLᵀ = W for a positive semi-definite W: Cholesky in which a pivot at rounding
 * level (≤ 1e-12 of the largest diagonal) leaves its column zero. A position whose increment is the
 * integrated rate (θ' = θ + Δt·ω') has noise fully correlated with the rate's, and W is singular;
 * the factor then drives both from one noise source, as the plant does (Higham, "Accuracy and
 * Stability of Numerical Algorithms", 2nd ed., §10.3, on semi-definite Cholesky).
 */
function semidefiniteFactor(w: Float64Array, n: number): Float64Array {
  let scale = 0;
  for (let i = 0; i < n; i++) scale = Math.max(scale, w[i * n + i]);
  const l = new Float64Array(n * n), floor = 1e-12 * scale;
  for (let j = 0; j < n; j++) {
    let pivot = w[j * n + j];
    for (let k = 0; k < j; k++) pivot -= l[j * n + k] ** 2;
    if (pivot < -1e-8 * scale) throw new ModelFitError('fitting the next states: the residual covariance is not positive semi-definite (the fit is numerically unreliable)');
    if (pivot <= floor) continue;
    const root = Math.sqrt(pivot);
    l[j * n + j] = root;
    for (let i = j + 1; i < n; i++) {
      let v = w[i * n + j];
      for (let k = 0; k < j; k++) v -= l[i * n + k] * l[j * n + k];
      l[i * n + j] = v / root;
    }
  }
  return l;
}

interface Fit { coefficients: Float64Array; residualCovariance: Float64Array; rSquared: number[] }

/** β = (XᵀX/n + λD)⁻¹XᵀY/n; residual covariance with the n − p divisor; R² per target. Feature 0 is the constant. */
function ridgeLeastSquares(mo: RegressionMoments, what: string): Fit {
  const p = Math.round(Math.sqrt(mo.xx.length)), q = mo.xy.length / p, n = mo.count;
  if (!(n > p)) throw new ModelFitError(`fitting ${what} needs more than ${p} transitions, got ${n}`);
  const a = Float64Array.from(mo.xx, (v, k) => v / n + (k % (p + 1) === 0 && k > 0 ? RIDGE : 0));
  let factor: Float64Array;
  try {
    factor = cholesky(a, p);
  } catch (error) {
    if (!(error instanceof SingularMatrixError)) throw error;
    throw new ModelFitError(`fitting ${what}: the states and actions are collinear in the log, so the model is not identifiable`);
  }
  const coefficients = new Float64Array(p * q), column = new Float64Array(p);
  for (let b = 0; b < q; b++) {
    for (let r = 0; r < p; r++) column[r] = mo.xy[r * q + b] / n;
    const beta = choleskySolve(factor, p, column);
    for (let r = 0; r < p; r++) coefficients[r * q + b] = beta[r];
  }
  const residualCovariance = new Float64Array(q * q), rSquared: number[] = [];
  for (let b = 0; b < q; b++) {
    for (let c = 0; c < q; c++) {
      // Σ(y_b − xᵀβ_b)(y_c − xᵀβ_c) = YᵀY − β_bᵀXᵀY_c − β_cᵀXᵀY_b + β_bᵀXᵀXβ_c (exact with the ridge too).
      let cross = mo.yy[b * q + c];
      for (let r = 0; r < p; r++) {
        cross -= coefficients[r * q + b] * mo.xy[r * q + c] + coefficients[r * q + c] * mo.xy[r * q + b];
        for (let s = 0; s < p; s++) cross += coefficients[r * q + b] * mo.xx[r * p + s] * coefficients[s * q + c];
      }
      residualCovariance[b * q + c] = cross / (n - p);
    }
    const total = mo.yy[b * q + b] - (mo.xy[b] * mo.xy[b]) / n; // row 0 of XᵀY is Σy (constant feature)
    rSquared.push(total > 0 ? Math.max(0, 1 - (residualCovariance[b * q + b] * (n - p)) / total) : 0);
  }
  for (let b = 0; b < q; b++) for (let c = 0; c < b; c++) residualCovariance[b * q + c] = residualCovariance[c * q + b] = 0.5 * (residualCovariance[b * q + c] + residualCovariance[c * q + b]);
  return { coefficients, residualCovariance, rSquared };
}
