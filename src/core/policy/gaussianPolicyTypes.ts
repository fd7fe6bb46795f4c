/**
 * The engine's Gaussian policy as a plain object (typed arrays and numbers only, so it crosses a
 * worker boundary by structured clone):
 *   ã ~ N(μ(s), Σ),  μ(s) = offset + G·s + Σ_k S_k(s)   (S_k: piecewise-linear schedule terms)
 *   a = ã limited to [L(s), U(s)] by clipping or truncation,
 * where the limits are the actuator's position limits, narrowed by a rate limit around the
 * previous action when there is one (actionLimits.ts). Without schedules the mean is affine and
 * `offset`/`gain` say everything about it; code that needs an affine mean checks
 * `notAffineReason` (policy.ts) and reports "not applicable" otherwise.
 *
 * Shapes: state s ∈ R^ds, action a ∈ R^m, gain G: m×ds row-major.
 */
export type BoundMode = 'clip' | 'truncate';

export interface ActuatorBounds {
  readonly lo: Float64Array; // m; -Infinity allowed
  readonly hi: Float64Array; // m; +Infinity allowed
  readonly mode: BoundMode;
}

/**
 * A piecewise-linear term of one action's mean in one state (a reset schedule): the values at
 * strictly increasing breakpoints, joined by straight lines, constant beyond the first and last.
 */
export interface MeanSchedule {
  readonly action: number; // index of the action it adds to, 0 ≤ action < m
  readonly state: number; // index of the state it reads, 0 ≤ state < ds
  readonly breakpoints: Float64Array; // k ≥ 1, strictly increasing, in the state’s units
  readonly values: Float64Array; // k, in the action’s units
}

/**
 * |a_j − a_prev,j| ≤ maxStep_j per step, applied as a clip to [a_prev − r, a_prev + r] before the
 * position limits; a_prev,j is the state at index previousActionState[j] (a derived state: the
 * previous value of the action column).
 */
export interface RateLimit {
  readonly previousActionState: Int32Array; // m; −1 where action j has no rate limit
  readonly maxStep: Float64Array; // m; +Infinity where action j has no rate limit
}

export interface GaussianPolicy {
  readonly stateDim: number;
  readonly actionDim: number;
  /** Affine part of the mean: offset (m) and gain G (m×ds row-major). */
  readonly offset: Float64Array;
  readonly gain: Float64Array;
  /** Lower Cholesky factor of the action covariance (m×m); diagonal = std for independent actions. */
  readonly covarianceFactor: Float64Array;
  /** True when the covariance is diagonal (required with limits). */
  readonly independent: boolean;
  readonly bounds?: ActuatorBounds;
  /** Piecewise-linear terms added to the mean; absent or empty for an affine mean. */
  readonly schedules?: readonly MeanSchedule[];
  readonly rateLimit?: RateLimit;
}
