/**
 * Gaussian setpoint policies π(a|s) = N(μ(s), Σ), with an affine mean μ(s) = offset + G·s plus
 * optional piecewise-linear schedule terms, optionally limited by actuator position limits that
 * either clip the action (probability mass at the limit) or truncate the distribution
 * (renormalised density on [lo, hi]), and by a rate limit around the previous action (always a
 * clip; policy/actionLimits.ts). Types: policy/gaussianPolicyTypes.ts.
 *
 * Every consumer reads the mean through policyMean() and the limits through actionLimitsAt();
 * code that needs an affine mean or fixed limits asks notAffineReason() first.
 *
 * Shapes: state s ∈ R^ds, action a ∈ R^m, gain G: m×ds row-major.
 */
import type { RandomSource } from './random';
import { cholesky } from './linalg/dense';
import { logNormalDensity, normalCdf, normalIntervalProbability, normalSurvival } from './normalDistribution';
import type { ActuatorBounds, BoundMode, GaussianPolicy, MeanSchedule, RateLimit } from './policy/gaussianPolicyTypes';
import { checkSchedule, scheduleValue, ScheduleError } from './policy/meanSchedule';
import { actionLimitsAt, hasActionLimits, limitModeOf } from './policy/actionLimits';

const NO_LIMITS = new Float64Array(0);

export type { ActuatorBounds, BoundMode, GaussianPolicy, MeanSchedule, RateLimit } from './policy/gaussianPolicyTypes';
export { actionLimitsAt, hasActionLimits, limitModeOf, limitsAtState } from './policy/actionLimits';

export interface GaussianPolicySpec {
  offset: number[];
  gain: number[][];
  /** Standard deviation per action dimension (independent actions): the dither. */
  std?: number[];
  /** Full action covariance m×m (instead of std); not allowed together with limits. */
  covariance?: number[][];
  bounds?: { lo: number[]; hi: number[]; mode: BoundMode };
  /** Piecewise-linear terms added to the mean (indices into actions and states). */
  schedules?: { action: number; state: number; breakpoints: number[]; values: number[] }[];
  /** Per action: the state holding its previous value (−1: none) and the largest step per sample. */
  rateLimit?: { previousActionState: number[]; maxStep: number[] };
}

export class PolicyError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PolicyError';
  }
}

/** Validate shapes and build a policy. Messages name the offending field. */
export function createGaussianPolicy(spec: GaussianPolicySpec, stateDim: number): GaussianPolicy {
  const m = spec.offset.length;
  if (m < 1 || m > 3) throw new PolicyError(`offset: expected 1 to 3 action dimensions, got ${m}`);
  if (spec.gain.length !== m) throw new PolicyError(`gain: expected ${m} rows (one per action), got ${spec.gain.length}`);
  spec.gain.forEach((row, i) => {
    if (row.length !== stateDim) throw new PolicyError(`gain row ${i + 1}: expected ${stateDim} entries (one per state), got ${row.length}`);
  });
  const factor = covarianceFactorOf(spec, m);
  const independent = spec.covariance === undefined || isDiagonal(factor, m);
  const bounds = boundsOf(spec, m, independent);
  const rateLimit = rateLimitOf(spec, m, stateDim, independent);
  return {
    stateDim,
    actionDim: m,
    offset: Float64Array.from(spec.offset),
    gain: Float64Array.from(spec.gain.flat()),
    covarianceFactor: factor,
    independent,
    bounds,
    ...schedulesOf(spec, m, stateDim),
    ...(rateLimit ? { rateLimit } : {}),
  };
}

function boundsOf(spec: GaussianPolicySpec, m: number, independent: boolean): ActuatorBounds | undefined {
  if (!spec.bounds) return undefined;
  if (!independent) throw new PolicyError('bounds: actuator bounds need independent action noise (give std, not a full covariance)');
  const { lo, hi, mode } = spec.bounds;
  if (lo.length !== m || hi.length !== m) throw new PolicyError(`bounds: expected ${m} lower and upper limits`);
  for (let i = 0; i < m; i++) {
    if (!(lo[i] < hi[i])) throw new PolicyError(`bounds for action ${i + 1}: lower limit ${lo[i]} must be below upper limit ${hi[i]}`);
  }
  return { lo: Float64Array.from(lo), hi: Float64Array.from(hi), mode };
}

function schedulesOf(spec: GaussianPolicySpec, m: number, ds: number): { schedules?: MeanSchedule[] } {
  if (!spec.schedules || spec.schedules.length === 0) return {};
  const schedules = spec.schedules.map((s, k): MeanSchedule => {
    const schedule = { action: s.action, state: s.state, breakpoints: Float64Array.from(s.breakpoints), values: Float64Array.from(s.values) };
    try {
      checkSchedule(schedule, ds, m, `schedules[${k}]`);
    } catch (error) {
      if (error instanceof ScheduleError) throw new PolicyError(error.message);
      throw error;
    }
    return schedule;
  });
  return { schedules };
}

function rateLimitOf(spec: GaussianPolicySpec, m: number, ds: number, independent: boolean): RateLimit | undefined {
  const rate = spec.rateLimit;
  if (!rate) return undefined;
  if (!independent) throw new PolicyError('rateLimit: a rate limit needs independent action noise (give std, not a full covariance)');
  if (spec.bounds?.mode === 'truncate') {
    throw new PolicyError('rateLimit: a rate limit clips the action, so the position limits must clip too (mode "clip", not "truncate")');
  }
  if (rate.previousActionState.length !== m || rate.maxStep.length !== m) {
    throw new PolicyError(`rateLimit: expected ${m} previous-action states and ${m} step limits, one per action`);
  }
  for (let j = 0; j < m; j++) {
    const index = rate.previousActionState[j], r = rate.maxStep[j];
    if (!Number.isInteger(index) || index < -1 || index >= ds) {
      throw new PolicyError(`rateLimit.previousActionState[${j}]: expected a state index from 0 to ${ds - 1} (or −1 for none), got ${index}`);
    }
    if (index >= 0 && !(r > 0)) throw new PolicyError(`rateLimit.maxStep[${j}]: expected a positive step limit, got ${r}`);
  }
  return { previousActionState: Int32Array.from(rate.previousActionState), maxStep: Float64Array.from(rate.maxStep) };
}

function covarianceFactorOf(spec: GaussianPolicySpec, m: number): Float64Array {
  if (spec.covariance !== undefined) {
    if (spec.covariance.length !== m || spec.covariance.some((r) => r.length !== m)) {
      throw new PolicyError(`covariance: expected a ${m}×${m} matrix`);
    }
    try {
      return cholesky(spec.covariance.flat(), m);
    } catch {
      throw new PolicyError('covariance: must be symmetric positive definite');
    }
  }
  const std = spec.std;
  if (!std || std.length !== m) throw new PolicyError(`std: expected ${m} standard deviations`);
  const factor = new Float64Array(m * m);
  std.forEach((s, i) => {
    if (!(s > 0) || !Number.isFinite(s)) throw new PolicyError(`std for action ${i + 1}: must be a positive number, got ${s}`);
    factor[i * m + i] = s;
  });
  return factor;
}

function isDiagonal(a: Float64Array, m: number): boolean {
  for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) if (i !== j && a[i * m + j] !== 0) return false;
  return true;
}

/** Standard deviation of action dimension i before limits. */
export function actionStd(p: GaussianPolicy, i: number): number {
  let s = 0;
  for (let k = 0; k <= i; k++) s += p.covarianceFactor[i * p.actionDim + k] ** 2;
  return Math.sqrt(s);
}

/**
 * Why a method that needs an affine mean (a = offset + G·s + e, no state-dependent limits)
 * does not apply to this policy, or null when it does. `limits`: also refuse any actuator limit
 * (for closed forms that need a linear-Gaussian action).
 */
export function notAffineReason(p: GaussianPolicy, limits: 'allowFixedLimits' | 'noLimits' = 'allowFixedLimits'): string | null {
  if (p.schedules && p.schedules.length > 0) return 'its mean follows a schedule (piecewise-linear in a state), not an affine function of the states';
  if (p.rateLimit) return 'it has a rate limit, so its action limits move with the previous action';
  const b = p.bounds;
  if (limits === 'noLimits' && b && (b.lo.some(Number.isFinite) || b.hi.some(Number.isFinite))) {
    return 'it has actuator limits, so a clipped or truncated action is not linear-Gaussian';
  }
  return null;
}

/** μ(s) = offset + G·s + Σ schedules, written to out[outOffset .. outOffset+m). state is read from stateOffset. */
export function policyMean(
  p: GaussianPolicy, state: ArrayLike<number>, out: Float64Array, stateOffset = 0, outOffset = 0,
): void {
  const { actionDim: m, stateDim: ds, gain, offset } = p;
  for (let i = 0; i < m; i++) {
    let v = offset[i];
    for (let j = 0; j < ds; j++) v += gain[i * ds + j] * state[stateOffset + j];
    out[outOffset + i] = v;
  }
  const schedules = p.schedules;
  if (!schedules) return;
  for (let k = 0; k < schedules.length; k++) {
    const s = schedules[k];
    out[outOffset + s.action] += scheduleValue(s, state[stateOffset + s.state]);
  }
}

/**
 * log π(a|s). With clip limits an action exactly at a limit L(s) or U(s) carries the point mass
 * log Φ((L−μ)/σ) (or the upper tail), and when L = U the whole mass; the density elsewhere is
 * the Gaussian's. For truncation the density is renormalised by Φ(β) − Φ(α). Outside the limits
 * the log-density is −∞.
 */
const EMPTY = new Float64Array(0);

/** mean: scratch of length m for the mean action, for callers that run this per logged transition (no allocation per call). */
export function logDensity(p: GaussianPolicy, state: ArrayLike<number>, action: ArrayLike<number>, mean = new Float64Array(p.actionDim)): number {
  const m = p.actionDim;
  policyMean(p, state, mean);
  if (!p.independent) return fullCovarianceLogDensity(p, mean, action);
  const limited = limitModeOf(p) !== null, lo = limited ? new Float64Array(m) : EMPTY, hi = limited ? new Float64Array(m) : EMPTY;
  const mode = limited ? actionLimitsAt(p, state, 0, lo, hi) : null; // the arrays only where there are limits: this runs per logged transition
  let total = 0;
  for (let i = 0; i < m; i++) {
    const sigma = p.covarianceFactor[i * m + i];
    if (mode === null) total += logNormalDensity((action[i] - mean[i]) / sigma) - Math.log(sigma);
    else total += limitedLogDensity(action[i], mean[i], sigma, lo[i], hi[i], mode);
    if (total === -Infinity) return total;
  }
  return total;
}

function limitedLogDensity(a: number, mean: number, sigma: number, lo: number, hi: number, mode: BoundMode): number {
  if (a < lo || a > hi) return -Infinity;
  if (lo === hi) return 0; // the band collapsed onto one value: probability 1
  const alpha = (lo - mean) / sigma, beta = (hi - mean) / sigma;
  const density = logNormalDensity((a - mean) / sigma) - Math.log(sigma);
  if (mode === 'truncate') return density - Math.log(normalIntervalProbability(alpha, beta));
  if (a === lo) return Math.log(normalCdf(alpha));
  if (a === hi) return Math.log(normalSurvival(beta));
  return density;
}

function fullCovarianceLogDensity(p: GaussianPolicy, mean: Float64Array, action: ArrayLike<number>): number {
  const m = p.actionDim, l = p.covarianceFactor;
  // Solve L y = (a − μ); log N = −½‖y‖² − Σ log L_ii − (m/2) log 2π.
  const y = new Float64Array(m);
  let logDet = 0, quad = 0;
  for (let i = 0; i < m; i++) {
    let s = action[i] - mean[i];
    for (let k = 0; k < i; k++) s -= l[i * m + k] * y[k];
    y[i] = s / l[i * m + i];
    quad += y[i] * y[i];
    logDet += Math.log(l[i * m + i]);
  }
  return -0.5 * quad - logDet - 0.5 * m * Math.log(2 * Math.PI);
}

/**
 * Draw a ~ π(·|s) into out (length m). Truncation uses rejection from the untruncated normal;
 * clipping (position and rate limits) clips to the limits at s.
 */
export function sampleAction(p: GaussianPolicy, state: ArrayLike<number>, rng: RandomSource, out: Float64Array): void {
  const m = p.actionDim, l = p.covarianceFactor;
  // Limit buffers only when there are limits: unlimited sampling stays allocation-free for simulators.
  const lo = hasActionLimits(p) ? new Float64Array(m) : NO_LIMITS, hi = lo === NO_LIMITS ? NO_LIMITS : new Float64Array(m);
  const mode = lo === NO_LIMITS ? null : actionLimitsAt(p, state, 0, lo, hi);
  for (let attempt = 0; attempt < SAMPLING_TRIES; attempt++) {
    // a = μ(s) + L z with z ~ N(0, I); m ≤ 3, so z lives in three locals.
    const z0 = rng.normal(), z1 = m > 1 ? rng.normal() : 0, z2 = m > 2 ? rng.normal() : 0;
    policyMean(p, state, out);
    for (let i = 0; i < m; i++) {
      out[i] += l[i * m] * z0 + (i >= 1 ? l[i * m + 1] * z1 : 0) + (i >= 2 ? l[i * m + 2] * z2 : 0);
    }
    if (mode === null) return;
    if (mode === 'clip') {
      for (let i = 0; i < m; i++) out[i] = Math.min(hi[i], Math.max(lo[i], out[i]));
      return;
    }
    let inside = true;
    for (let i = 0; i < m; i++) if (out[i] < lo[i] || out[i] > hi[i]) inside = false;
    if (inside) return;
  }
  const mean = new Float64Array(m);
  policyMean(p, state, mean);
  throw new PolicyError(`sampling: at the state (${Array.from(state, (v) => Number(v.toPrecision(4))).join(', ')}) the truncated action distribution has almost no mass inside its limits: ` +
    `${whereMeanLies(p, mean, lo, hi)}, so no action within ${limitsText(lo, hi)} could be drawn in ${SAMPLING_TRIES.toLocaleString('en-GB')} tries`);
}

/** Draws from the untruncated normal before a truncated policy's action is called undrawable (mass inside below about 1e−4; ours). */
const SAMPLING_TRIES = 10_000;

/**
 * How far the mean lies past the limits in dithers (limits need independent noise, so the factor's
 * diagonal is each action's dither), measured, not assumed: the draws can also fail where the limits
 * are narrow beside the dither with the mean between them.
 */
function whereMeanLies(p: GaussianPolicy, mean: Float64Array, lo: ArrayLike<number>, hi: ArrayLike<number>): string {
  const m = p.actionDim, l = p.covarianceFactor;
  let past = 0;
  for (let i = 0; i < m; i++) past = Math.max(past, Math.max(lo[i] - mean[i], mean[i] - hi[i], 0) / l[i * m + i]);
  const meanText = Array.from(mean, (v) => Number(v.toPrecision(4))).join(', ');
  if (past >= 1) return `the mean (${meanText}) lies ${Number(past.toPrecision(2))} dithers outside them`;
  const dither = Array.from({ length: m }, (_, i) => Number(l[i * m + i].toPrecision(4))).join(', ');
  return `the mean (${meanText}) lies within a dither of them, but they are narrow beside the dither (${dither})`;
}

function limitsText(lo: ArrayLike<number>, hi: ArrayLike<number>): string {
  return Array.from(lo, (l, i) => `${Number(l.toPrecision(4))} … ${Number(hi[i].toPrecision(4))}`).join('; ');
}
