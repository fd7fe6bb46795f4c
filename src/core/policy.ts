/**
 * Gaussian setpoint policies π(a|s) = N(μ(s), Σ) with an affine mean μ(s) = offset + G·s,
 * optionally limited by actuator bounds that either clip the action (probability mass at the
 * bound) or truncate the distribution (renormalised density on [lo, hi]).
 *
 * Shapes: state s ∈ R^ds, action a ∈ R^m, gain G: m×ds row-major.
 */
import type { RandomSource } from './random';
import { cholesky } from './linalg/dense';
import { logNormalDensity, normalCdf, normalIntervalProbability, normalSurvival } from './normalDistribution';

export type BoundMode = 'clip' | 'truncate';

export interface ActuatorBounds {
  readonly lo: Float64Array; // m; -Infinity allowed
  readonly hi: Float64Array; // m; +Infinity allowed
  readonly mode: BoundMode;
}

export interface GaussianPolicy {
  readonly stateDim: number;
  readonly actionDim: number;
  readonly offset: Float64Array; // m
  readonly gain: Float64Array; // m×ds row-major
  /** Lower Cholesky factor of the action covariance (m×m); diagonal = std for independent actions. */
  readonly covarianceFactor: Float64Array;
  /** True when the covariance is diagonal (required with bounds). */
  readonly independent: boolean;
  readonly bounds?: ActuatorBounds;
}

export interface GaussianPolicySpec {
  offset: number[];
  gain: number[][];
  /** Standard deviation per action dimension (independent actions). */
  std?: number[];
  /** Full action covariance m×m (instead of std); not allowed together with bounds. */
  covariance?: number[][];
  bounds?: { lo: number[]; hi: number[]; mode: BoundMode };
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
  let bounds: ActuatorBounds | undefined;
  if (spec.bounds) {
    if (!independent) throw new PolicyError('bounds: actuator bounds need independent action noise (give std, not a full covariance)');
    const { lo, hi, mode } = spec.bounds;
    if (lo.length !== m || hi.length !== m) throw new PolicyError(`bounds: expected ${m} lower and upper limits`);
    for (let i = 0; i < m; i++) {
      if (!(lo[i] < hi[i])) throw new PolicyError(`bounds for action ${i + 1}: lower limit ${lo[i]} must be below upper limit ${hi[i]}`);
    }
    bounds = { lo: Float64Array.from(lo), hi: Float64Array.from(hi), mode };
  }
  return {
    stateDim,
    actionDim: m,
    offset: Float64Array.from(spec.offset),
    gain: Float64Array.from(spec.gain.flat()),
    covarianceFactor: factor,
    independent,
    bounds,
  };
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

/** Standard deviation of action dimension i before bounds. */
export function actionStd(p: GaussianPolicy, i: number): number {
  let s = 0;
  for (let k = 0; k <= i; k++) s += p.covarianceFactor[i * p.actionDim + k] ** 2;
  return Math.sqrt(s);
}

/** μ(s) = offset + G·s, written to out[outOffset .. outOffset+m). state is read from stateOffset. */
export function policyMean(
  p: GaussianPolicy, state: ArrayLike<number>, out: Float64Array, stateOffset = 0, outOffset = 0,
): void {
  const { actionDim: m, stateDim: ds, gain, offset } = p;
  for (let i = 0; i < m; i++) {
    let v = offset[i];
    for (let j = 0; j < ds; j++) v += gain[i * ds + j] * state[stateOffset + j];
    out[outOffset + i] = v;
  }
}

/**
 * log π(a|s). For clipped bounds an action exactly at a bound carries the point mass
 * log Φ((lo−μ)/σ) (or the upper tail); the density elsewhere is the Gaussian's. For truncation
 * the density is renormalised by Φ(β) − Φ(α). Outside the bounds the log-density is −∞.
 */
export function logDensity(p: GaussianPolicy, state: ArrayLike<number>, action: ArrayLike<number>): number {
  const m = p.actionDim;
  const mean = new Float64Array(m);
  policyMean(p, state, mean);
  if (!p.independent) return fullCovarianceLogDensity(p, mean, action);
  let total = 0;
  for (let i = 0; i < m; i++) {
    const sigma = p.covarianceFactor[i * m + i];
    const z = (action[i] - mean[i]) / sigma;
    const b = p.bounds;
    if (!b) {
      total += logNormalDensity(z) - Math.log(sigma);
      continue;
    }
    const alpha = (b.lo[i] - mean[i]) / sigma, beta = (b.hi[i] - mean[i]) / sigma;
    if (action[i] < b.lo[i] || action[i] > b.hi[i]) return -Infinity;
    if (b.mode === 'clip') {
      if (action[i] === b.lo[i]) total += Math.log(normalCdf(alpha));
      else if (action[i] === b.hi[i]) total += Math.log(normalSurvival(beta));
      else total += logNormalDensity(z) - Math.log(sigma);
    } else {
      total += logNormalDensity(z) - Math.log(sigma) - Math.log(normalIntervalProbability(alpha, beta));
    }
  }
  return total;
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
 * Draw a ~ π(·|s) into out (length m), allocation-free (simulators call it once per step).
 * Truncation uses rejection from the untruncated normal.
 */
export function sampleAction(p: GaussianPolicy, state: ArrayLike<number>, rng: RandomSource, out: Float64Array): void {
  const m = p.actionDim, l = p.covarianceFactor, b = p.bounds;
  for (let attempt = 0; attempt < 10_000; attempt++) {
    // a = μ(s) + L z with z ~ N(0, I); m ≤ 3, so z lives in three locals.
    const z0 = rng.normal(), z1 = m > 1 ? rng.normal() : 0, z2 = m > 2 ? rng.normal() : 0;
    policyMean(p, state, out);
    for (let i = 0; i < m; i++) {
      out[i] += l[i * m] * z0 + (i >= 1 ? l[i * m + 1] * z1 : 0) + (i >= 2 ? l[i * m + 2] * z2 : 0);
    }
    if (!b) return;
    if (b.mode === 'clip') {
      for (let i = 0; i < m; i++) out[i] = Math.min(b.hi[i], Math.max(b.lo[i], out[i]));
      return;
    }
    let inside = true;
    for (let i = 0; i < m; i++) if (out[i] < b.lo[i] || out[i] > b.hi[i]) inside = false;
    if (inside) return;
  }
  throw new PolicyError('sampling: the truncated action distribution has almost no mass inside the bounds at this state');
}
