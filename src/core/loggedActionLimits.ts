/**
 * Actuator limits read from the logged actions.
 *
 * A limit is seen when at least max(2, 0.1 % of n) logged values of an action equal its smallest
 * (largest) value exactly: ties at the extreme of a continuous law have probability zero, so
 * repeated extremes mean the actuator saturates there; the 0.1 % floor keeps coarse logging
 * resolution from looking like a limit (our rule, stated in the report).
 *
 * Shapes: actions n×m row-major.
 */

export interface LoggedActionLimits {
  readonly lo: number[]; // m; -Infinity where no lower limit is seen
  readonly hi: number[]; // m; +Infinity where no upper limit is seen
  /** Share of logged actions at a detected limit, per action. */
  readonly shareAtLimit: number[];
}

/** Smallest share of repeated extreme values read as a limit (our rule). */
export const LIMIT_SHARE = 0.001;

export function loggedActionLimits(actions: ArrayLike<number>, n: number, m: number): LoggedActionLimits {
  const needed = Math.max(2, Math.ceil(LIMIT_SHARE * n));
  const lo: number[] = [], hi: number[] = [], shareAtLimit: number[] = [];
  for (let j = 0; j < m; j++) {
    let min = Infinity, max = -Infinity;
    for (let i = 0; i < n; i++) {
      min = Math.min(min, actions[i * m + j]);
      max = Math.max(max, actions[i * m + j]);
    }
    let atMin = 0, atMax = 0;
    for (let i = 0; i < n; i++) {
      if (actions[i * m + j] === min) atMin++;
      if (actions[i * m + j] === max) atMax++;
    }
    const lower = atMin >= needed && min < max, upper = atMax >= needed && min < max;
    lo.push(lower ? min : -Infinity);
    hi.push(upper ? max : Infinity);
    shareAtLimit.push(((lower ? atMin : 0) + (upper ? atMax : 0)) / n);
  }
  return { lo, hi, shareAtLimit };
}

/** True when any action has a finite limit. */
export function hasLimits(limits: LoggedActionLimits): boolean {
  return limits.lo.some(Number.isFinite) || limits.hi.some(Number.isFinite);
}
