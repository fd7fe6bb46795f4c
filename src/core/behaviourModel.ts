/**
 * The behaviour policy, estimated from the log: a linear-Gaussian model of the logged actions
 * on the state, a = c + G·s + e, e ~ N(0, Σ), fitted by ordinary least squares per action.
 *
 * Σ is the residual covariance with the degrees-of-freedom correction, EᵀE / (n − ds − 1), which
 * makes each diagonal entry the unbiased estimate of that action's noise variance; the standard
 * errors of the coefficients are σ_j²·(XᵀX)⁻¹ (Greene, "Econometric Analysis", 7th ed., §4.3–4.5).
 * The fit works on centred data (states and actions minus their means), which gives the same
 * coefficients as regressing on [1, s] but keeps the normal equations well conditioned when
 * levels sit far from zero (e.g. 350 K ± 2 K).
 *
 *
 * Actuator limits: where the log shows an action saturating (loggedActionLimits.ts: repeated
 * extremes, or a logged extreme at a bound a candidate declares, passed in as `declared`), that action's
 * logged values are clipped, and least squares on them is biased toward zero slope and too small a
 * spread. Its offset, gain and std are then the censored-normal maximum-likelihood fit (the Tobit
 * model, censoredRegression.ts; started from least squares), the model carries the limits as a clip
 * (`bounds`), and the noise is taken as independent across actions (a clip needs independent noise;
 * policy.ts), so `covariance` is diagonal. A policy built from `behaviourPolicySpec(model)` then
 * reproduces the logged actions' law, limits included — the candidate "like the logged controller".
 * R² stays that of least squares on the logged values.
 *
 * Shapes: states n×ds row-major, actions n×m row-major; gain m×ds.
 */
import { CensoredRegressionError, fitCensoredRegression } from './censoredRegression';
import { ditherDependence, type DitherDependence } from './ditherDependence';
import { cholesky, choleskySolve, SingularMatrixError } from './linalg/dense';
import { selectedRows, selectRows } from './selectRows';
import { hasLimits, loggedActionLimits, NO_DECLARED_BOUNDS, type DeclaredActionBounds, type LoggedActionLimits } from './loggedActionLimits';
import type { GaussianPolicySpec } from './policy';

export interface BehaviourModel extends Required<Pick<GaussianPolicySpec, 'offset' | 'gain' | 'std' | 'covariance'>> {
  /** The actuator limits read from the log (±Infinity where none): repeated extremes, or an extreme at a declared bound (loggedActionLimits.ts). */
  limits: LoggedActionLimits;
  /** The same limits as a clip, present only when some limit is seen; ready for a GaussianPolicySpec. */
  bounds?: { lo: number[]; hi: number[]; mode: 'clip' };
  /** Coefficient of determination per action, 1 − SS_res/SS_tot. */
  rSquared: number[];
  offsetStandardError: number[]; // m
  gainStandardError: number[][]; // m×ds
  /** Transitions used, n. */
  count: number;
  /** s̄, the mean of the logged states over those transitions (ds): where the controller sits in the logs (meanActionAtMeanState). */
  stateMean: number[];
  /** n − ds − 1: the divisor of the residual covariance. */
  degreesOfFreedom: number;
  /**
   * With limits and two or more actions the model takes the noise as independent; this measures how
   * far the log agrees (ditherDependence.ts). Absent otherwise (a full covariance is fitted).
   */
  ditherDependence?: DitherDependence;
}

export class BehaviourModelError extends Error {
  /** 'noResidual' where an action is constant or follows the states exactly (no dither to model); 'other' otherwise. */
  constructor(message: string, readonly kind: 'noResidual' | 'other' = 'other') {
    super(message);
    this.name = 'BehaviourModelError';
  }
}

/**
 * The model's mean action before its limits, offset + gain·s̄ at s̄ the mean logged state: where the
 * controller sits in the logs (without limits, the mean logged action: least squares with an
 * intercept passes through the means; with them, the censored fit's own intercept on s − s̄, which
 * may lie past a limit). The offset alone is the mean at the state 0, often far outside the logs
 * (392.7 % on the heating sample, whose zone sits near 21 °C).
 */
export function meanActionAtMeanState(model: Pick<BehaviourModel, 'offset' | 'gain' | 'stateMean'>): number[] {
  return model.offset.map((o, j) => model.gain[j].reduce((sum, g, k) => sum + g * model.stateMean[k], o));
}

/** Means (length d) of the columns of an n×d row-major matrix. */
function columnMeans(x: Float64Array, n: number, d: number): Float64Array {
  const mean = new Float64Array(d);
  for (let i = 0; i < n; i++) for (let j = 0; j < d; j++) mean[j] += x[i * d + j];
  for (let j = 0; j < d; j++) mean[j] /= n;
  return mean;
}

/** Centred cross products Σ (x−x̄)(y−ȳ)ᵀ: dx×dy row-major. */
function crossProducts(x: Float64Array, xMean: Float64Array, y: Float64Array, yMean: Float64Array, n: number): Float64Array {
  const dx = xMean.length, dy = yMean.length;
  const out = new Float64Array(dx * dy);
  const cx = new Float64Array(dx);
  for (let i = 0; i < n; i++) {
    for (let p = 0; p < dx; p++) cx[p] = x[i * dx + p] - xMean[p];
    for (let p = 0; p < dx; p++) for (let q = 0; q < dy; q++) out[p * dy + q] += cx[p] * (y[i * dy + q] - yMean[q]);
  }
  return out;
}

/**
 * The plain least-squares law a = c + G·s + e on n rows, each action on [1, s] by the centred normal equations
 * (the doc comment above): the present controller's model starts from it, and the held-actions check
 * (diagnostics/heldActions.ts) fits it on every row and on the rows not held. Throws BehaviourModelError, naming
 * why, where it cannot be fitted: too few rows, a constant state, collinear states, a constant or noiseless action.
 * Shapes: states n×ds, actions n×m row-major; gain m×ds; covariance m×m (EᵀE / (n − ds − 1)).
 */
export interface LeastSquaresLaw {
  readonly offset: Float64Array;
  readonly gain: Float64Array;
  readonly covariance: Float64Array;
  readonly rSquared: number[];
  readonly degreesOfFreedom: number;
  /** s̄ (ds) and the Cholesky factor of the centred state scatter (ds×ds), for the standard errors. */
  readonly stateMean: Float64Array;
  readonly factor: Float64Array;
}

export function leastSquaresLaw(states: Float64Array, actions: Float64Array, n: number, ds: number, m: number): LeastSquaresLaw {
  const dof = n - ds - 1;
  if (dof < 1) throw new BehaviourModelError(`a model of the present controller on ${ds} states needs at least ${ds + 2} transitions, got ${n}`);
  const sMean = columnMeans(states, n, ds), aMean = columnMeans(actions, n, m);
  const factor = stateScatterFactor(crossProducts(states, sMean, states, sMean, n), ds);
  const ssa = crossProducts(states, sMean, actions, aMean, n); // ds×m
  const gain = new Float64Array(m * ds);
  for (let j = 0; j < m; j++) {
    const g = choleskySolve(factor, ds, Array.from({ length: ds }, (_, p) => ssa[p * m + j]));
    gain.set(g, j * ds);
  }
  const offset = new Float64Array(m);
  for (let j = 0; j < m; j++) {
    offset[j] = aMean[j];
    for (let p = 0; p < ds; p++) offset[j] -= gain[j * ds + p] * sMean[p];
  }
  const { covariance, rSquared } = residualMoments(states, actions, n, ds, m, offset, gain, aMean, dof);
  return { offset, gain, covariance, rSquared, degreesOfFreedom: dof, stateMean: sMean, factor };
}

/**
 * `moving` (n, optional): 1 for the rows the law is fitted on, where the held-actions check found held rows
 * (pipeline/plan/presentController.ts); the limits are still read on every row (a held row is never at one).
 */
export function fitBehaviourModel(
  states: Float64Array, actions: Float64Array, n: number, ds: number, m: number, declared: DeclaredActionBounds = NO_DECLARED_BOUNDS, moving?: Uint8Array,
): BehaviourModel {
  if (states.length !== n * ds) throw new BehaviourModelError(`states: expected ${n}×${ds} = ${n * ds} values, got ${states.length}`);
  if (actions.length !== n * m) throw new BehaviourModelError(`actions: expected ${n}×${m} = ${n * m} values, got ${actions.length}`);
  const limits = loggedActionLimits(actions, n, m, declared);
  if (!moving) return fitOnRows(states, actions, n, ds, m, limits);
  const kept = selectedRows(moving);
  return fitOnRows(selectRows(states, ds, kept), selectRows(actions, m, kept), kept.length, ds, m, limits);
}

function fitOnRows(states: Float64Array, actions: Float64Array, n: number, ds: number, m: number, limits: LoggedActionLimits): BehaviourModel {
  const law = leastSquaresLaw(states, actions, n, ds, m);
  checkJointNoise(law.covariance, m);
  const model = assembleModel({ n, ds, m, dof: law.degreesOfFreedom, offset: law.offset, gain: law.gain, covariance: law.covariance, rSquared: law.rSquared, factor: law.factor, sMean: law.stateMean });
  return hasLimits(limits) ? censoredModel(model, limits, states, actions, law.stateMean) : { ...model, limits };
}

function censoredFit(x: Float64Array, y: Float64Array, n: number, k: number, limits: LoggedActionLimits, j: number, start: { coefficients: number[]; sigma: number }) {
  try {
    return fitCensoredRegression(x, y, n, k, limits.lo[j], limits.hi[j], start);
  } catch (error) {
    if (!(error instanceof CensoredRegressionError)) throw error;
    throw new BehaviourModelError(`action ${j + 1} saturates at its limits in the log and ${error.message.replace(/^censored regression: /, 'its clipped fit failed: ')}`);
  }
}

/** The policy specification of the fitted behaviour: clipped at the logged limits when there are any. */
export function behaviourPolicySpec(model: BehaviourModel): GaussianPolicySpec {
  return model.bounds
    ? { offset: model.offset, gain: model.gain, std: model.std, bounds: model.bounds }
    : { offset: model.offset, gain: model.gain, covariance: model.covariance };
}

/** Refit each limited action by censored maximum likelihood on x = [1, s − s̄]; independent noise. */
function censoredModel(ols: Omit<BehaviourModel, 'limits'>, limits: LoggedActionLimits, states: Float64Array, actions: Float64Array, sMean: Float64Array): BehaviourModel {
  const n = ols.count, ds = sMean.length, m = ols.offset.length, k = ds + 1;
  const x = new Float64Array(n * k), y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    x[i * k] = 1;
    for (let p = 0; p < ds; p++) x[i * k + 1 + p] = states[i * ds + p] - sMean[p];
  }
  const model = structuredClone({ ...ols, limits });
  for (let j = 0; j < m; j++) {
    if (!Number.isFinite(limits.lo[j]) && !Number.isFinite(limits.hi[j])) continue;
    for (let i = 0; i < n; i++) y[i] = actions[i * m + j];
    const g = ols.gain[j];
    const centredOffset = ols.offset[j] + g.reduce((s, v, p) => s + v * sMean[p], 0);
    const fit = censoredFit(x, y, n, k, limits, j, { coefficients: [centredOffset, ...g], sigma: ols.std[j] });
    const c = fit.coefficients, cov = fit.covariance, q = k + 1;
    model.gain[j] = Array.from(c.subarray(1));
    model.offset[j] = c[0] - model.gain[j].reduce((s, v, p) => s + v * sMean[p], 0);
    model.std[j] = fit.sigma;
    model.gainStandardError[j] = model.gain[j].map((_, p) => Math.sqrt(cov[(1 + p) * q + 1 + p]));
    // Var(β0 − gᵀs̄) = Var β0 − 2 s̄ᵀCov(g, β0) + s̄ᵀ Cov(g) s̄.
    let variance = cov[0];
    for (let p = 0; p < ds; p++) {
      variance -= 2 * sMean[p] * cov[(1 + p) * q];
      for (let r = 0; r < ds; r++) variance += sMean[p] * cov[(1 + p) * q + 1 + r] * sMean[r];
    }
    model.offsetStandardError[j] = Math.sqrt(Math.max(0, variance));
  }
  model.covariance = model.std.map((s, a) => model.std.map((_, b) => (a === b ? s * s : 0)));
  model.bounds = { lo: [...limits.lo], hi: [...limits.hi], mode: 'clip' };
  if (m > 1) model.ditherDependence = ditherDependence(states, actions, n, ds, m, model, limits);
  return model;
}

function stateScatterFactor(sss: Float64Array, ds: number): Float64Array {
  for (let p = 0; p < ds; p++) {
    if (!(sss[p * ds + p] > 0)) throw new BehaviourModelError(`state ${p + 1} is constant in the log, so its gain cannot be estimated`);
  }
  const collinear = (p: number): BehaviourModelError => new BehaviourModelError(
    `state ${p + 1} is (almost) a linear combination of the states before it in the log, so the gains are not identifiable`);
  let factor: Float64Array;
  try {
    factor = cholesky(sss, ds);
  } catch (error) {
    if (!(error instanceof SingularMatrixError)) throw error;
    throw collinear(ds - 1);
  }
  // L_pp² / S_pp is the share of state p's variation not explained by states 1..p−1 (1 − R²_p).
  for (let p = 0; p < ds; p++) if (factor[p * ds + p] ** 2 < NEGLIGIBLE_SHARE * sss[p * ds + p]) throw collinear(p);
  return factor;
}

/**
 * The actions' residual noise must have a joint density: Σ positive definite. By the Cholesky
 * factor, L_jj²/Σ_jj is the share of action j's noise not explained by the actions before it
 * (1 − R², as for the states above); below NEGLIGIBLE_SHARE action j moves exactly with them — one
 * controller output driving several valves (split range, u₂ = c − u₁) — and no Gaussian density of
 * the logged actions exists to weigh a candidate against.
 */
function checkJointNoise(covariance: Float64Array, m: number): void {
  let factor: Float64Array;
  try {
    factor = cholesky(covariance, m);
  } catch (error) {
    if (!(error instanceof SingularMatrixError)) throw error;
    const j = error.pivot ?? m - 1;
    if (j === 0) return; // the first action has no noise at all: reported where its spread is checked
    throw movesWith(j);
  }
  for (let j = 1; j < m; j++) if (!(factor[j * m + j] ** 2 > NEGLIGIBLE_SHARE * covariance[j * m + j])) throw movesWith(j);
}

function movesWith(j: number): BehaviourModelError {
  return new BehaviourModelError(
    `action ${j + 1} moves exactly with action${j > 1 ? 's 1 to ' + j : ' 1'} in the log (one controller output drives them, as in split range), ` +
      'so the logged actions have no joint Gaussian density to model the present controller with',
  );
}

/** Below this relative share a variation is rounding noise, not signal (double precision, common practice). */
const NEGLIGIBLE_SHARE = 1e-12;

/** Residual covariance EᵀE/dof (m×m) and R² per action. */
function residualMoments(
  states: Float64Array, actions: Float64Array, n: number, ds: number, m: number,
  offset: Float64Array, gain: Float64Array, aMean: Float64Array, dof: number,
): { covariance: Float64Array; rSquared: number[] } {
  const covariance = new Float64Array(m * m);
  const total = new Float64Array(m);
  const e = new Float64Array(m);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < m; j++) {
      let fitted = offset[j];
      for (let p = 0; p < ds; p++) fitted += gain[j * ds + p] * states[i * ds + p];
      e[j] = actions[i * m + j] - fitted;
      total[j] += (actions[i * m + j] - aMean[j]) ** 2;
    }
    for (let j = 0; j < m; j++) for (let q = 0; q < m; q++) covariance[j * m + q] += e[j] * e[q];
  }
  const rSquared: number[] = [];
  for (let j = 0; j < m; j++) {
    if (!(total[j] > 0)) throw new BehaviourModelError(`action ${j + 1} is constant in the log; a Gaussian model of the present controller needs actions that vary`, 'noResidual');
    if (!(covariance[j * m + j] > NEGLIGIBLE_SHARE * total[j])) throw new BehaviourModelError(`action ${j + 1} follows the states exactly (no residual noise), so the present controller’s action density is degenerate`, 'noResidual');
    rSquared.push(1 - covariance[j * m + j] / total[j]);
  }
  for (let k = 0; k < m * m; k++) covariance[k] /= dof;
  return { covariance, rSquared };
}

interface FittedParts {
  n: number; ds: number; m: number; dof: number;
  offset: Float64Array; gain: Float64Array; covariance: Float64Array; rSquared: number[];
  factor: Float64Array; sMean: Float64Array;
}

function assembleModel(f: FittedParts): Omit<BehaviourModel, 'limits'> {
  const { ds, m } = f;
  // (XᵀX)⁻¹ for X = [1, s]: the slope block is S⁻¹ (S the centred scatter), and the intercept
  // entry is 1/n + s̄ᵀ S⁻¹ s̄ (partitioned inverse; Greene §3.5).
  const inverseDiagonal = Array.from({ length: ds }, (_, p) => choleskySolve(f.factor, ds, unit(ds, p))[p]);
  const w = choleskySolve(f.factor, ds, f.sMean);
  let interceptFactor = 1 / f.n;
  for (let p = 0; p < ds; p++) interceptFactor += f.sMean[p] * w[p];
  const rows = (a: Float64Array, c: number): number[][] => Array.from({ length: a.length / c }, (_, i) => Array.from(a.subarray(i * c, (i + 1) * c)));
  const variance = Array.from({ length: m }, (_, j) => f.covariance[j * m + j]);
  return {
    offset: Array.from(f.offset),
    gain: rows(f.gain, ds),
    std: variance.map(Math.sqrt),
    covariance: rows(f.covariance, m),
    rSquared: f.rSquared,
    offsetStandardError: variance.map((v) => Math.sqrt(v * interceptFactor)),
    gainStandardError: variance.map((v) => inverseDiagonal.map((d) => Math.sqrt(v * d))),
    count: f.n,
    stateMean: Array.from(f.sMean),
    degreesOfFreedom: f.dof,
  };
}

function unit(d: number, p: number): Float64Array {
  const e = new Float64Array(d);
  e[p] = 1;
  return e;
}
