/**
 * Held actions: rows whose action repeats the row before exactly. A continuous law with dither repeats
 * a value with probability zero, so a stretch of exact repeats away from the actuator's limits means the
 * action did not come from the law: the loop was in manual (an operator held the valve), a signal froze,
 * or a historian compressed the column. No mode column says so; the rows look like any other.
 *
 * The harm is in the present controller's model (core/behaviourModel.ts): least squares of the action on
 * the state over every row mixes the law with the held rows, whose action does not follow the state, so
 * the fitted gain shrinks and the dither widens — a law that never ran, which FQE then values faithfully,
 * and the cross-checks, built on the same fitted law, confirm.
 *
 * Held rows: row i with row i − 1 in the same run (data order), every action component equal to row
 * i − 1's exactly, and no component at a limit: one the behaviour model reads (loggedActionLimits.ts), or that
 * action's smallest or largest logged value (a valve resting at its stop repeats by design, and the limit reader
 * needs 0.1 % of the rows there: the surge drum's valve rests at 0 and 1 on fewer). Stretches: maximal runs of held rows.
 *
 * Effect (the consequence, not a significance test: at 10⁵ rows any difference is significant; cf.
 * plantMemory.ts): ordinary least squares of each action on [1, s] on every row ("pooled") and on the rows
 * not held ("moving"), rows with any action at a limit the behaviour model reads left out of both; per action j,
 *   E_j = RMS over the moving rows' states of (μ_pooled(s) − μ_moving(s)) / σ_moving,
 * σ_moving the moving fit's residual standard deviation (divisor n − ds − 1, as behaviourModel.ts), and
 * E = max_j E_j: by how much of its own dither the pooled law's mean sits off the law the other rows follow.
 *
 * Shapes: states n×ds, actions n×m row-major; limits lo/hi m each (±Infinity where none).
 */
import { BehaviourModelError, leastSquaresLaw, type LeastSquaresLaw } from '../behaviourModel';
import { selectRows } from '../selectRows';
import type { LoggedActionLimits } from '../loggedActionLimits';

export interface HeldActionData {
  readonly count: number;
  readonly stateDim: number;
  readonly actionDim: number;
  readonly states: ArrayLike<number>;
  readonly actions: ArrayLike<number>;
  readonly episode: ArrayLike<number>;
}

/** The limits the behaviour model reads (±Infinity where none) and each action's logged extremes, as loggedActionLimits.ts reads them. */
export type ActionLimits = Pick<LoggedActionLimits, 'lo' | 'hi' | 'extremes'>;

type Stops = Pick<ActionLimits, 'lo' | 'hi'>;

export interface HeldStretches {
  /** Held rows, their share of all rows, the number of maximal stretches and the longest (rows). */
  readonly rows: number;
  readonly share: number;
  readonly stretches: number;
  readonly longest: number;
}

export type HeldEffect = { readonly effect: number; readonly action: number } | { readonly reason: string };

/** The limits read from the log widened by each action's logged extremes: a value at either is at a stop. */
function stops(limits: ActionLimits): Stops {
  return {
    lo: limits.lo.map((l, j) => (Number.isFinite(l) ? l : limits.extremes.min[j])),
    hi: limits.hi.map((h, j) => (Number.isFinite(h) ? h : limits.extremes.max[j])),
  };
}

/** Whether any action of row i sits at a stop (stops() above). */
function atLimit(data: HeldActionData, at: Stops, i: number): boolean {
  const m = data.actionDim;
  for (let j = 0; j < m; j++) {
    const a = data.actions[i * m + j];
    if (a === at.lo[j] || a === at.hi[j]) return true;
  }
  return false;
}

/** 1 for a held row (see the doc comment), 0 otherwise. */
export function heldRowMask(data: HeldActionData, limits: ActionLimits): Uint8Array {
  const m = data.actionDim, held = new Uint8Array(data.count), at = stops(limits);
  for (let i = 1; i < data.count; i++) {
    if (data.episode[i] !== data.episode[i - 1]) continue;
    let same = true;
    for (let j = 0; j < m && same; j++) same = data.actions[i * m + j] === data.actions[(i - 1) * m + j];
    if (same && !atLimit(data, at, i)) held[i] = 1;
  }
  return held;
}

/** Counts of a held-row mask: rows, share, maximal stretches, longest. */
export function heldStretches(held: Uint8Array): HeldStretches {
  let rows = 0, stretches = 0, longest = 0, run = 0;
  for (let i = 0; i < held.length; i++) {
    if (held[i]) {
      rows++;
      if (run === 0) stretches++;
      longest = Math.max(longest, ++run);
    } else run = 0;
  }
  return { rows, share: held.length > 0 ? rows / held.length : 0, stretches, longest };
}

/** The least-squares law (behaviourModel.ts) on the given rows; the reason it cannot be fitted otherwise. */
function lawOn(data: HeldActionData, rows: readonly number[]): LeastSquaresLaw | { reason: string; noResidual: boolean } {
  const ds = data.stateDim, m = data.actionDim;
  try {
    return leastSquaresLaw(selectRows(data.states, ds, rows), selectRows(data.actions, m, rows), rows.length, ds, m);
  } catch (error) {
    if (error instanceof BehaviourModelError) return { reason: error.message, noResidual: error.kind === 'noResidual' };
    throw error;
  }
}

function mean(law: LeastSquaresLaw, j: number, data: HeldActionData, i: number): number {
  const ds = data.stateDim;
  let mu = law.offset[j];
  for (let p = 0; p < ds; p++) mu += law.gain[j * ds + p] * data.states[i * ds + p];
  return mu;
}

/** E (see the doc comment) and the action it is read on (E = ∞ where the rows not held show no dither: action 0 stands for the log); a reason where either fit cannot be made otherwise. */
export function heldActionEffect(data: HeldActionData, limits: ActionLimits, held: Uint8Array): HeldEffect {
  // Only the limits the behaviour model reads are left out of the fits (it fits the rest by least squares too).
  const all: number[] = [], moving: number[] = [];
  for (let i = 0; i < data.count; i++) {
    if (atLimit(data, limits, i)) continue;
    all.push(i);
    if (!held[i]) moving.push(i);
  }
  const pooled = lawOn(data, all), free = lawOn(data, moving);
  const cannot = (why: string): HeldEffect => ({ reason: `the action cannot be fitted on the state over the ${moving.length} rows that are neither held nor at a limit (${why})` });
  if ('reason' in pooled) return cannot(pooled.reason);
  // The rows not held follow the states with no dither at all, while every row's law has some: all of its dither
  // came from the held rows, so the two laws differ by an unbounded share of the second's (E = ∞).
  if ('reason' in free) return free.noResidual ? { effect: Infinity, action: 0 } : cannot(free.reason);
  let effect = 0, action = 0;
  for (let j = 0; j < data.actionDim; j++) {
    let sum = 0;
    for (const i of moving) sum += (mean(pooled, j, data, i) - mean(free, j, data, i)) ** 2;
    // σ > 0: the law's fit refuses an action with no residual noise.
    const e = Math.sqrt(sum / moving.length) / Math.sqrt(free.covariance[j * data.actionDim + j]);
    if (e > effect || j === 0) { effect = e; action = j; }
  }
  return { effect, action };
}
