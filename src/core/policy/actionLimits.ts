/**
 * The action limits in force at a state: position limits [lo, hi] and, with a rate limit r
 * around the previous action p, the band [p − r, p + r]. A rate limiter followed by a position
 * limiter (the usual order in a controller's output block; common practice) gives
 *   a = clip(clip(ã, p − r, p + r), lo, hi) = clip(ã, L, U),
 *   L = min(max(p − r, lo), hi),  U = min(max(p + r, lo), hi),
 * the band clamped into [lo, hi]. When the band lies wholly outside [lo, hi] (a logged previous
 * action beyond the position limits), L = U: the action is the nearer position limit with
 * probability 1. Clipping puts point masses at L and U (censored normal); a rate limit is always a
 * clip, so it cannot be combined with truncation (createGaussianPolicy refuses that).
 *
 * Shapes: state read from state[stateOffset .. stateOffset+ds); lo, hi: m.
 */
import type { BoundMode, GaussianPolicy } from './gaussianPolicyTypes';

/** True when some action is limited (position or rate), so action laws need the bounded rules. */
export function hasActionLimits(p: GaussianPolicy): boolean {
  return p.bounds !== undefined || p.rateLimit !== undefined;
}

/** 'clip' or 'truncate' when the policy has limits, else null. */
export function limitModeOf(p: GaussianPolicy): BoundMode | null {
  if (p.bounds) return p.bounds.mode;
  return p.rateLimit ? 'clip' : null;
}

/**
 * Write the limits L(s), U(s) of every action into lo and hi (m each; ±Infinity where a side is
 * open) and return the limit mode, or null (lo/hi untouched) when the policy has no limits.
 */
export function actionLimitsAt(
  p: GaussianPolicy, state: ArrayLike<number>, stateOffset: number, lo: Float64Array, hi: Float64Array,
): BoundMode | null {
  const mode = limitModeOf(p);
  if (mode === null) return null;
  const m = p.actionDim, b = p.bounds, rate = p.rateLimit;
  for (let j = 0; j < m; j++) {
    const positionLo = b ? b.lo[j] : -Infinity, positionHi = b ? b.hi[j] : Infinity;
    let l = positionLo, u = positionHi;
    const index = rate ? rate.previousActionState[j] : -1;
    if (rate && index >= 0) {
      const previous = state[stateOffset + index], r = rate.maxStep[j];
      l = Math.min(Math.max(previous - r, positionLo), positionHi);
      u = Math.min(Math.max(previous + r, positionLo), positionHi);
    }
    lo[j] = l;
    hi[j] = u;
  }
  return mode;
}

/** A reusable evaluator of actionLimitsAt with its own buffers (one per quadrature or sampler). */
export interface LimitsAtState {
  readonly lo: Float64Array; // m
  readonly hi: Float64Array; // m
  /** Fill lo/hi for the state; returns the mode or null. */
  at(state: ArrayLike<number>, stateOffset: number): BoundMode | null;
}

export function limitsAtState(p: GaussianPolicy): LimitsAtState {
  const lo = new Float64Array(p.actionDim), hi = new Float64Array(p.actionDim);
  return { lo, hi, at: (state, stateOffset) => actionLimitsAt(p, state, stateOffset, lo, hi) };
}
