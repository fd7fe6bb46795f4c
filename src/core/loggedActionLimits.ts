/**
 * Actuator limits read from the logged actions.
 *
 * Two ways to see a limit at an action's smallest (largest) logged value (our rule, stated in the
 * report by loggedLimitRuleText):
 *   - repeated: at least max(2, 0.1 % of n) logged values equal it exactly. Ties at the extreme of
 *     a continuous law have probability zero, so repeated extremes mean the actuator saturates
 *     there; the 0.1 % floor keeps coarse logging resolution from looking like a limit.
 *   - declared: at least DECLARED_LIMIT_ROWS = 1 logged value equals it exactly and it is exactly a
 *     position limit some candidate declares for that action (taken as the actuator's own end). A
 *     continuous law hits a number fixed before the log was read with probability zero, so one
 *     row there already says the valve sat at its end; the number comes from the project, not
 *     from the log, so no resolution floor is needed. Two rows would not do: on the battery's
 *     clipped greenhouse (seeds 1 and 5, 100,000 rows, runs from the steady state) one heater
 *     command of 100,000 sits at 0, where both candidates clip; needing two, both importance-sampling
 *     checks stay not applicable for the whole log over that row; with one they apply (uninformative
 *     there, the weights being concentrated), no check disagrees and no summary or class changes, as on the
 *     kettle, pipe heater and surge drum logs whose valves sit at their ends on 2 to 131 rows.
 * Below the floor the censored fit (censoredRegression.ts, globally concave in Olsen's parameters
 * for any share at a limit, zero included) estimates the small mass from the Gaussian tail.
 *
 * Shapes: actions n×m row-major; declared lo/hi: m lists each (values in the action's unit).
 */
import { shareText } from './shareText';

/** How a limit was read: not seen, repeated at the extreme, or at a declared bound below the floor. */
export type LimitEvidence = 'none' | 'repeated' | 'declared';

export interface LoggedActionLimits {
  readonly lo: number[]; // m; -Infinity where no lower limit is seen
  readonly hi: number[]; // m; +Infinity where no upper limit is seen
  /** Share of logged actions at a detected limit, per action. */
  readonly shareAtLimit: number[];
  /** Which rule saw each limit, per action. */
  readonly evidence: { readonly lo: LimitEvidence[]; readonly hi: LimitEvidence[] };
  /** Each action's smallest and largest logged value, read here once (the held-actions check takes them as stops too). */
  readonly extremes: { readonly min: number[]; readonly max: number[] };
}

/** Position limits declared for each action (by candidates), per action a list; empty where none. */
export interface DeclaredActionBounds {
  readonly lo: readonly (readonly number[])[];
  readonly hi: readonly (readonly number[])[];
}

/** Smallest share of repeated extreme values read as a limit (our rule). */
export const LIMIT_SHARE = 0.001;
/** Fewest repeated extreme values read as a limit whatever n (our rule). */
export const LIMIT_MIN_ROWS = 2;
/** Fewest logged values at a declared bound read as a limit there (our rule; see the doc comment). */
export const DECLARED_LIMIT_ROWS = 1;

export const NO_DECLARED_BOUNDS: DeclaredActionBounds = { lo: [], hi: [] };

/** The limits the rule reads, named in a few words where a sentence mentions them. */
export const LOGGED_LIMITS_NAMED = 'the limits read from the log: repeated extremes, or an extreme exactly at a bound a candidate declares';

/** The rule above in the user's words, for the report's method text. */
export function loggedLimitRuleText(): string {
  return `an actuator limit is read from the log where at least max(${LIMIT_MIN_ROWS}, ${shareText(LIMIT_SHARE)} of the rows) logged values of an action equal its smallest (largest) value exactly, ` +
    `or where at least ${DECLARED_LIMIT_ROWS} logged value${DECLARED_LIMIT_ROWS === 1 ? '' : 's'} sit${DECLARED_LIMIT_ROWS === 1 ? 's' : ''} exactly at the extreme and it is the bound a candidate declares for that action (taken as the actuator’s own end, so declare bounds where the actuator really stops); ` +
    `below the ${shareText(LIMIT_SHARE)} share the clipped fit estimates the small chance of sitting there from the Gaussian tail`;
}

export function loggedActionLimits(actions: ArrayLike<number>, n: number, m: number, declared: DeclaredActionBounds = NO_DECLARED_BOUNDS): LoggedActionLimits {
  const needed = Math.max(LIMIT_MIN_ROWS, Math.ceil(LIMIT_SHARE * n));
  const lo: number[] = [], hi: number[] = [], shareAtLimit: number[] = [];
  const evidence = { lo: [] as LimitEvidence[], hi: [] as LimitEvidence[] }, extremes = { min: [] as number[], max: [] as number[] };
  for (let j = 0; j < m; j++) {
    let min = Infinity, max = -Infinity;
    for (let i = 0; i < n; i++) {
      min = Math.min(min, actions[i * m + j]);
      max = Math.max(max, actions[i * m + j]);
    }
    extremes.min.push(min);
    extremes.max.push(max);
    let atMin = 0, atMax = 0;
    for (let i = 0; i < n; i++) {
      if (actions[i * m + j] === min) atMin++;
      if (actions[i * m + j] === max) atMax++;
    }
    const lower = min < max ? evidenceAt(atMin, needed, declared.lo[j]?.includes(min) ?? false) : 'none';
    const upper = min < max ? evidenceAt(atMax, needed, declared.hi[j]?.includes(max) ?? false) : 'none';
    evidence.lo.push(lower);
    evidence.hi.push(upper);
    lo.push(lower !== 'none' ? min : -Infinity);
    hi.push(upper !== 'none' ? max : Infinity);
    shareAtLimit.push(((lower !== 'none' ? atMin : 0) + (upper !== 'none' ? atMax : 0)) / n);
  }
  return { lo, hi, shareAtLimit, evidence, extremes };
}

function evidenceAt(count: number, needed: number, declared: boolean): LimitEvidence {
  if (count >= needed) return 'repeated';
  return declared && count >= DECLARED_LIMIT_ROWS ? 'declared' : 'none';
}

/** True when any action has a finite limit. */
export function hasLimits(limits: LoggedActionLimits): boolean {
  return limits.lo.some(Number.isFinite) || limits.hi.some(Number.isFinite);
}
