/**
 * A fitted linear-quadratic model of the plant, for the model-based cross-check: affine dynamics
 * s' = s̄ + A(s − s̄) + B(a − ā) + c + w and a quadratic cost (−reward) in (s, a), both by ordinary
 * least squares over the logged transitions, with R² per fitted quantity so the caller can judge
 * whether the model describes the data (Greene, "Econometric Analysis", 7th ed., §3.5 for R²).
 *
 * Regressors are centred on the data means (s̄, ā) and scaled by their standard deviations, so
 * the normal equations stay well conditioned when levels sit far from zero; the coefficients are
 * unscaled afterwards. Moments are kept per episode (../bootstrap/episodeMoments.ts), so a bootstrap
 * resample refits the model from Σ c_k (episode moments) alone.
 *
 * Shapes: ds states, m actions; A ds×ds, B ds×m, W ds×ds; cost Hessian blocks as named.
 */
import { episodeMoments, resampleMoments, resampleMomentsBlock, type EpisodeMoments, type RegressionMoments } from '../bootstrap/episodeMoments';
import type { EpisodeIndex } from '../bootstrap/episodeTransitions';
import { cholesky, choleskySolve, SingularMatrixError } from '../linalg/dense';
import type { TransitionSet } from '../transitions';

export class ModelFitError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ModelFitError';
  }
}

/** cost(x, v) = constant + gxᵀx + gvᵀv + xᵀHxx x + 2xᵀHxv v + vᵀHvv v, with x = s − s̄, v = a − ā. */
export interface QuadraticCostFit {
  readonly constant: number;
  readonly stateLinear: Float64Array; // gx: ds
  readonly actionLinear: Float64Array; // gv: m
  readonly stateQuadratic: Float64Array; // Hxx: ds×ds symmetric
  readonly cross: Float64Array; // Hxv: ds×m
  readonly actionQuadratic: Float64Array; // Hvv: m×m symmetric
}

export interface LinearQuadraticModelFit {
  readonly stateCentre: Float64Array; // s̄
  readonly actionCentre: Float64Array; // ā
  readonly dynamics: Float64Array; // A
  readonly inputGain: Float64Array; // B
  readonly intercept: Float64Array; // c
  readonly noiseCovariance: Float64Array; // W, residual covariance with n − p divisor
  readonly dynamicsRSquared: number[]; // per next-state component
  readonly cost: QuadraticCostFit;
  readonly costRSquared: number;
}

export interface ModelRegressions {
  readonly stateDim: number;
  readonly actionDim: number;
  readonly centre: Float64Array; // [s̄, ā]
  readonly scale: Float64Array; // [σ_s, σ_a], 1 for a constant column
  readonly dynamics: EpisodeMoments; // x = [1, u], y = s' − s̄
  readonly cost: EpisodeMoments; // x = [1, u, u_i u_j (i ≤ j)], y = −reward
}

export function modelRegressions(data: TransitionSet, index: EpisodeIndex): ModelRegressions {
  const { stateDim: ds, actionDim: m } = data, p = ds + m;
  const { centre, scale } = inputMoments(data);
  const u = new Float64Array(p);
  const standardised = (i: number): void => {
    for (let c = 0; c < ds; c++) u[c] = (data.states[i * ds + c] - centre[c]) / scale[c];
    for (let c = 0; c < m; c++) u[ds + c] = (data.actions[i * m + c] - centre[ds + c]) / scale[ds + c];
  };
  const dynamics = episodeMoments(index, 1 + p, ds, (i, x, y) => {
    if (data.terminal[i]) return false;
    standardised(i);
    x[0] = 1;
    x.set(u, 1);
    for (let c = 0; c < ds; c++) y[c] = data.nextStates[i * ds + c] - centre[c];
    return true;
  });
  const cost = episodeMoments(index, quadraticTermCount(p), 1, (i, x, y) => {
    standardised(i);
    quadraticTerms(u, x);
    y[0] = -data.rewards[i];
    return true;
  });
  return { stateDim: ds, actionDim: m, centre, scale, dynamics, cost };
}

/** Fit on the full data (multiplicities omitted) or on a resample. */
export function fitLinearQuadraticModel(regressions: ModelRegressions, multiplicities?: ArrayLike<number>): LinearQuadraticModelFit {
  return fitFromMoments(regressions, resampleMoments(regressions.dynamics, multiplicities), resampleMoments(regressions.cost, multiplicities));
}

/**
 * fitLinearQuadraticModel on each resample of a block, the moments summed in one read
 * (resampleMomentsBlock: the same sums, so the same fits); a ModelFitError in place of a fit that fails.
 */
export function fitLinearQuadraticModels(regressions: ModelRegressions, multiplicities: readonly ArrayLike<number>[]): (LinearQuadraticModelFit | ModelFitError)[] {
  const dynamics = resampleMomentsBlock(regressions.dynamics, multiplicities), cost = resampleMomentsBlock(regressions.cost, multiplicities);
  return dynamics.map((d, b) => {
    try {
      return fitFromMoments(regressions, d, cost[b]);
    } catch (error) {
      if (error instanceof ModelFitError) return error;
      throw error;
    }
  });
}

function fitFromMoments(regressions: ModelRegressions, dynamicsMoments: RegressionMoments, costMoments: RegressionMoments): LinearQuadraticModelFit {
  const { stateDim: ds, actionDim: m, centre, scale } = regressions;
  const dyn = leastSquares(dynamicsMoments, 'the next states');
  const dynamics = new Float64Array(ds * ds), inputGain = new Float64Array(ds * m), intercept = new Float64Array(ds);
  for (let j = 0; j < ds; j++) {
    intercept[j] = dyn.coefficients[j];
    for (let c = 0; c < ds; c++) dynamics[j * ds + c] = dyn.coefficients[(1 + c) * ds + j] / scale[c];
    for (let c = 0; c < m; c++) inputGain[j * m + c] = dyn.coefficients[(1 + ds + c) * ds + j] / scale[ds + c];
  }
  const costFit = leastSquares(costMoments, 'the reward');
  return {
    stateCentre: centre.slice(0, ds), actionCentre: centre.slice(ds), dynamics, inputGain, intercept,
    noiseCovariance: dyn.residualCovariance, dynamicsRSquared: dyn.rSquared,
    cost: unscaledCost(costFit.coefficients, scale, ds, m), costRSquared: costFit.rSquared[0],
  };
}

interface LeastSquaresFit {
  coefficients: Float64Array; // p×q row-major: coefficient of regressor a for target b at a·q + b
  residualCovariance: Float64Array; // q×q
  rSquared: number[]; // q
}

/** β = (XᵀX)⁻¹XᵀY from moments; x_0 = 1 is the intercept, so Σy is row 0 of XᵀY. */
function leastSquares(mo: RegressionMoments, what: string): LeastSquaresFit {
  const p = Math.round(Math.sqrt(mo.xx.length)), q = mo.xy.length / p, n = mo.count;
  if (!(n > p)) throw new ModelFitError(`fitting ${what} needs more than ${p} transitions, got ${n}`);
  let factor: Float64Array;
  try {
    factor = cholesky(mo.xx, p);
  } catch (error) {
    if (!(error instanceof SingularMatrixError)) throw error;
    throw new ModelFitError(`fitting ${what}: the states and actions are collinear in the log, so the model is not identifiable`);
  }
  const coefficients = new Float64Array(p * q), column = new Float64Array(p);
  for (let b = 0; b < q; b++) {
    for (let a = 0; a < p; a++) column[a] = mo.xy[a * q + b];
    const beta = choleskySolve(factor, p, column);
    for (let a = 0; a < p; a++) coefficients[a * q + b] = beta[a];
  }
  const residualCovariance = new Float64Array(q * q), rSquared: number[] = [];
  for (let b = 0; b < q; b++) {
    for (let c = 0; c < q; c++) {
      let explained = 0; // βᵀXᵀY: the residual sum of squares is YᵀY − βᵀXᵀY (normal equations)
      for (let a = 0; a < p; a++) explained += coefficients[a * q + b] * mo.xy[a * q + c];
      residualCovariance[b * q + c] = (mo.yy[b * q + c] - explained) / (n - p);
    }
    const total = mo.yy[b * q + b] - (mo.xy[b] * mo.xy[b]) / n;
    rSquared.push(total > 0 ? Math.max(0, 1 - (residualCovariance[b * q + b] * (n - p)) / total) : 0);
  }
  return { coefficients, residualCovariance: symmetric(residualCovariance, q), rSquared };
}

function unscaledCost(beta: Float64Array, scale: Float64Array, ds: number, m: number): QuadraticCostFit {
  const p = ds + m, g = new Float64Array(p), h = new Float64Array(p * p);
  for (let i = 0; i < p; i++) g[i] = beta[1 + i] / scale[i];
  let k = 1 + p;
  for (let i = 0; i < p; i++) {
    for (let j = i; j < p; j++, k++) {
      const value = (i === j ? beta[k] : beta[k] / 2) / (scale[i] * scale[j]);
      h[i * p + j] = value;
      h[j * p + i] = value;
    }
  }
  const block = (r0: number, c0: number, rows: number, cols: number) =>
    Float64Array.from({ length: rows * cols }, (_, t) => h[(r0 + Math.floor(t / cols)) * p + c0 + (t % cols)]);
  return {
    constant: beta[0], stateLinear: g.slice(0, ds), actionLinear: g.slice(ds),
    stateQuadratic: block(0, 0, ds, ds), cross: block(0, ds, ds, m), actionQuadratic: block(ds, ds, m, m),
  };
}

/**
 * Lack of fit of the linear dynamics: per next-state component, the share of the linear model's
 * residual sum of squares that the quadratic terms in (s, a) would explain on the full data,
 * 1 − SS_quadratic/SS_linear (the numerator of the nested-model F test; Greene §5.3). Near 0 for a
 * linear plant whatever its noise level — unlike R², which also rises with persistence.
 */
export function dynamicsNonlinearity(data: TransitionSet, regressions: ModelRegressions): number[] {
  const { stateDim: ds, actionDim: m, centre, scale } = regressions, p = ds + m, n = data.count;
  const whole = { episodes: 1, offsets: Int32Array.of(0, n), order: Int32Array.from({ length: n }, (_, i) => i) };
  const u = new Float64Array(p);
  const quadratic = episodeMoments(whole, quadraticTermCount(p), ds, (i, x, y) => {
    if (data.terminal[i]) return false;
    for (let c = 0; c < ds; c++) u[c] = (data.states[i * ds + c] - centre[c]) / scale[c];
    for (let c = 0; c < m; c++) u[ds + c] = (data.actions[i * m + c] - centre[ds + c]) / scale[ds + c];
    quadraticTerms(u, x);
    for (let c = 0; c < ds; c++) y[c] = data.nextStates[i * ds + c] - centre[c];
    return true;
  });
  const linear = leastSquares(resampleMoments(regressions.dynamics), 'the next states');
  const richer = leastSquares(resampleMoments(quadratic), 'the next states');
  const pLinear = 1 + p, pQuadratic = quadraticTermCount(p), count = quadratic.sums[quadratic.stride - 1];
  return Array.from({ length: ds }, (_, j) => {
    // A component the linear model explains to rounding (a derived lag, p' = x; a position integrated
    // from its rate) is exactly linear: its residual is rounding noise, and a ratio of two such noises
    // read as a share came out at 2,600 % on a logged valve lag.
    if (!(1 - linear.rSquared[j] > EXACT_SHARE)) return 0;
    const ssLinear = linear.residualCovariance[j * ds + j] * (count - pLinear);
    const ssQuadratic = richer.residualCovariance[j * ds + j] * (count - pQuadratic);
    return ssLinear > 0 ? Math.min(1, Math.max(0, 1 - ssQuadratic / ssLinear)) : 0;
  });
}

/**
 * Below this share of its variation left unexplained, a next-state component is taken as an exact
 * linear function of the state and action: the residual sum of squares by the normal equations,
 * YᵀY − βᵀXᵀY, cancels to about 1e-16·YᵀY times the design's condition number, so shares this small
 * are rounding, not process noise (ours; double precision, common practice).
 */
const EXACT_SHARE = 1e-9;

/** 1 + p + p(p+1)/2 terms: the constant, u_i, and u_i u_j for i ≤ j. */
function quadraticTermCount(p: number): number {
  return 1 + p + (p * (p + 1)) / 2;
}

function quadraticTerms(u: Float64Array, out: Float64Array): void {
  const p = u.length;
  out[0] = 1;
  for (let i = 0; i < p; i++) out[1 + i] = u[i];
  let k = 1 + p;
  for (let i = 0; i < p; i++) for (let j = i; j < p; j++) out[k++] = u[i] * u[j];
}

function inputMoments(data: TransitionSet): { centre: Float64Array; scale: Float64Array } {
  const { count: n, stateDim: ds, actionDim: m } = data, p = ds + m;
  const value = (i: number, c: number) => (c < ds ? data.states[i * ds + c] : data.actions[i * m + c - ds]);
  const centre = new Float64Array(p), scale = new Float64Array(p);
  for (let c = 0; c < p; c++) {
    let sum = 0;
    for (let i = 0; i < n; i++) sum += value(i, c);
    centre[c] = sum / n;
    let squares = 0;
    for (let i = 0; i < n; i++) squares += (value(i, c) - centre[c]) ** 2;
    scale[c] = Math.sqrt(squares / n) || 1;
  }
  return { centre, scale };
}

function symmetric(a: Float64Array, q: number): Float64Array {
  for (let i = 0; i < q; i++) for (let j = 0; j < i; j++) a[i * q + j] = a[j * q + i] = 0.5 * (a[i * q + j] + a[j * q + i]);
  return a;
}
