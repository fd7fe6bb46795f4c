/**
 * States derived from logged signals, computed along each episode during import (declared in the
 * project under columns.derived; one value per row, in the unit the declaration states):
 *
 *   error integral  I_first = I_0,            I_{t+1} = I_t + (r_t − y_t)·Δt_t      (forward Euler)
 *   first-order lag f_first = f_0 or x_first, f_t = f_{t−1} + (1 − e^{−Δt/τ})·(x_t − f_{t−1})
 *   previous value  p_t = p_0 on the first k rows, p_t = x_{t−k}   (k = steps, 1 by default)
 *   difference      d_first = d_0,            d_t = x_t − x_{t−1}
 *
 * Δt_t is the stated period, or the time to the next (for the integral) or from the previous (for
 * the lag) kept row of the episode from the timestamp column; across excluded rows it spans the
 * gap, holding the last known value (zero-order hold). The lag is the exact discretisation of
 * τ·ḟ = x − f for an input held between samples (common practice). The integral is the forward
 * (rectangular) sum Σ_{k<t} e_k·Δt_k, so I_t uses only errors before row t; the error is
 * r − y, the reverse-acting sign, whatever the direction of the loop that reads it.
 * Without a stated initial value, a previous value or difference is undefined on an episode's
 * first row (a previous value k rows back on its first k rows): those rows then only supply x for
 * later ones, and start no transition. "Rows" are the kept rows of the episode, as for k = 1; where a
 * row is excluded mid-run (or a run's own first row is excluded, so its first kept row is mid-run), a
 * previous value or difference restarts after it undefined on the next k rows, with or without an initial value (the initial value states what came before a run's first
 * row, not what the excluded row held), so it never reads a row further back than k.
 *
 * Why they are Markov under a candidate. Each derived value at row t+1 is a fixed function of the
 * derived value at row t and the logged signals at rows t and t+1: I_{t+1} = I_t + e_t·Δt_t,
 * f_{t+1} = f_t + α(x_{t+1} − f_t), p_{t+1} = x_t, d_{t+1} = x_{t+1} − x_t. A value k rows back is
 * the one exception to "a fixed function of the derived value at row t": p^k_{t+1} = x_{t+1−k} =
 * p^{k−1}_t, so it is Markov only when the values 1 … k − 1 rows back of the same source are states
 * too (then the set shifts by one row: p^1_{t+1} = x_t, p^j_{t+1} = p^{j−1}_t); the project check
 * refuses a lag without them (derivedStateConsistency.ts). This is what a dead time asks for: the
 * valve positions still travelling to the measurement are the missing state. None reads the action
 * the policy is choosing at the row it describes; a candidate acting on row t's state changes the
 * later signals only through the plant, exactly as the logged controller did, so the logged
 * transition (s_t, a_t, s_{t+1}) with its derived parts is a valid sample of the plant the
 * candidate would face, and the state with them is as Markov as the signals it is built from.
 * The previous action is the one exception allowed: p_{t+1} = a_t is fixed before the choice at
 * t+1, and its dependence on a_t is part of the logged transition; so are its values k rows back
 * (a_{t+1−k}, fixed even earlier). Any other use of an action
 * column (its first-order lag, difference, or an error built from it) would make the state at t depend on a_t,
 * the policy's input on its own output; the project check refuses it (derivedStateConsistency.ts).
 */
import { previousSteps, type DerivedStateSpec } from '../project/schema';

export interface DerivedInputs {
  readonly kept: Uint8Array; // records
  readonly episodeOf: Int32Array; // records, −1 where not kept
  /** A file column's values over records. */
  readonly column: (name: string) => Float64Array;
  readonly timestampsSeconds?: Float64Array; // records
  /**
   * The episodes cut after every row excluded mid-run as well (stretchesOf): a value a whole number of
   * rows back restarts there, undefined, rather than reach past the gap.
   */
  readonly stretchOf?: Int32Array; // records
  /**
   * Per episode, 0 where the run's own first row was excluded (EpisodeAssignment.hasStart): its first
   * kept row is mid-run, so a value rows back restarts there undefined, as after a row excluded mid-run.
   */
  readonly firstRowKept?: Uint8Array; // episodes
}

/** episodeOf with a new number after every excluded record inside an episode (−1 where not kept). */
export function stretchesOf(kept: Uint8Array, episodeOf: Int32Array): Int32Array {
  const out = new Int32Array(kept.length).fill(-1);
  let stretch = -1, previous = -1;
  for (let r = 0; r < kept.length; r++) {
    if (!kept[r]) continue;
    if (previous < 0 || episodeOf[r] !== episodeOf[previous] || previous !== r - 1) stretch++;
    out[r] = stretch;
    previous = r;
  }
  return out;
}

export interface DerivedColumns {
  /** Each derived state's values over records (NaN on rows not kept). */
  readonly values: Map<string, Float64Array>;
  /** Each declaration whose first rows per episode are undefined (no initial value), with how many. */
  readonly leadingRowsUndefined: Map<string, number>;
  /** Each declaration a whole number of rows back, with how many rows it is undefined on after a row excluded mid-run. */
  readonly rowsUndefinedAfterGap: Map<string, number>;
}

export function computeDerivedStates(definitions: readonly DerivedStateSpec[], inputs: DerivedInputs): DerivedColumns {
  const values = new Map<string, Float64Array>(), leadingRowsUndefined = new Map<string, number>(), rowsUndefinedAfterGap = new Map<string, number>();
  for (const d of definitions) {
    const rowsBack = d.kind === 'previous' ? previousSteps(d) : d.kind === 'difference' ? 1 : 0;
    // a value rows back goes along the stretches between excluded rows; its initial value only at a run's own start
    const along: AlongInputs = rowsBack > 0 ? { ...inputs, episodeOf: inputs.stretchOf ?? inputs.episodeOf, runOf: inputs.episodeOf } : { ...inputs, firstRowKept: undefined };
    values.set(d.name, d.kind === 'previous' ? laggedColumn(inputs.column(d.source), d.initial, rowsBack, along) : derivedColumn(d, along));
    if (rowsBack > 0 && d.initial === undefined) leadingRowsUndefined.set(d.name, rowsBack);
    if (rowsBack > 0) rowsUndefinedAfterGap.set(d.name, rowsBack);
  }
  return { values, leadingRowsUndefined, rowsUndefinedAfterGap };
}

/** Inputs walked along `episodeOf`, which may be the stretches of the runs (`runOf`) between excluded rows. */
type AlongInputs = DerivedInputs & { readonly runOf?: Int32Array };

/** True where kept record r begins its stretch as its run's own first row (not after an excluded row, nor where the run's first row was excluded). */
function opensRun(inputs: AlongInputs, previous: number, r: number): boolean {
  return startsOwnRun(inputs.runOf ?? inputs.episodeOf, inputs.firstRowKept, previous, r);
}

/** Kept record r (after kept record `previous`, −1 for none) is the first row of its run (runOf) and that run's first row was not excluded. */
function startsOwnRun(runOf: Int32Array, firstRowKept: Uint8Array | undefined, previous: number, r: number): boolean {
  return (previous < 0 || runOf[previous] !== runOf[r]) && firstRowKept?.[runOf[r]] !== 0;
}

/**
 * x k kept rows back within the stretch, or `initial` on a run's first k kept rows (NaN without one,
 * and NaN on the first k rows after a row excluded mid-run).
 */
function laggedColumn(x: Float64Array, initial: number | undefined, k: number, inputs: AlongInputs): Float64Array {
  const { kept, episodeOf } = inputs, out = new Float64Array(kept.length).fill(NaN);
  const recent: number[] = []; // the stretch’s last k kept rows, oldest first
  let episode = -2, previous = -1, before = NaN;
  for (let r = 0; r < kept.length; r++) {
    if (!kept[r]) continue;
    if (episodeOf[r] !== episode) {
      recent.length = 0;
      episode = episodeOf[r];
      before = opensRun(inputs, previous, r) ? (initial ?? NaN) : NaN;
    }
    out[r] = recent.length === k ? x[recent[0]] : before;
    recent.push(r);
    if (recent.length > k) recent.shift();
    previous = r;
  }
  return out;
}

/** The declarations computed row by row from the one before (a previous value goes through laggedColumn). */
type AlongRunSpec = Exclude<DerivedStateSpec, { kind: 'previous' }>;

/** One declaration over all records, restarting at each episode's first kept row. */
function derivedColumn(d: AlongRunSpec, inputs: AlongInputs): Float64Array {
  const { kept, episodeOf } = inputs, n = kept.length;
  const out = new Float64Array(n).fill(NaN);
  const step = stepper(d, inputs);
  let previous = -1;
  for (let r = 0; r < n; r++) {
    if (!kept[r]) continue;
    const first = previous < 0 || episodeOf[r] !== episodeOf[previous];
    out[r] = !first ? step.next(previous, r, out[previous]) : opensRun(inputs, previous, r) ? step.start(r) : NaN;
    previous = r;
  }
  return out;
}

interface Stepper {
  /** Value on an episode's first kept row r. */
  start(r: number): number;
  /** Value on kept row r given the previous kept row p of the same episode and its value. */
  next(p: number, r: number, before: number): number;
}

function stepper(d: AlongRunSpec, inputs: DerivedInputs): Stepper {
  const seconds = (p: number, r: number): number => {
    if ('periodSeconds' in d && d.periodSeconds !== undefined) return d.periodSeconds;
    const t = inputs.timestampsSeconds;
    return t ? t[r] - t[p] : NaN;
  };
  switch (d.kind) {
    case 'errorIntegral': {
      const y = inputs.column(d.measurement);
      const sp = typeof d.setpoint === 'number' ? null : inputs.column(d.setpoint);
      const error = (r: number) => (sp ? sp[r] : (d.setpoint as number)) - y[r];
      return { start: () => d.initial, next: (p, r, before) => before + error(p) * seconds(p, r) };
    }
    case 'filtered': {
      const x = inputs.column(d.source);
      return {
        start: (r) => d.initial ?? x[r],
        next: (p, r, before) => before + -Math.expm1(-seconds(p, r) / d.timeConstantSeconds) * (x[r] - before),
      };
    }
    case 'difference': {
      const x = inputs.column(d.source);
      return { start: () => d.initial ?? NaN, next: (p, r) => x[r] - x[p] };
    }
  }
}

/**
 * The kept mask with the rows where a value rows back is undefined removed: the first `atRunStart`
 * kept rows of each run (declarations without an initial value) and the first `afterGap` kept rows of
 * each stretch that begins after a row excluded mid-run, or as a run whose own first row was excluded
 * (firstRowKept 0); with how many each removed.
 * Shapes: kept, stretchOf, runOf over records (stretchesOf(kept, runOf) gives stretchOf).
 */
export function withoutUndefinedRows(
  kept: Uint8Array, stretchOf: Int32Array, runOf: Int32Array, atRunStart: number, afterGap: number, firstRowKept?: Uint8Array,
): { kept: Uint8Array; atStart: number; afterGap: number } {
  const out = Uint8Array.from(kept), removed = { atStart: 0, afterGap: 0 };
  let stretch = -2, seen = 0, previous = -1, where: keyof typeof removed = 'atStart';
  for (let r = 0; r < kept.length; r++) {
    if (!kept[r]) continue;
    if (stretchOf[r] !== stretch) {
      stretch = stretchOf[r];
      seen = 0;
      where = startsOwnRun(runOf, firstRowKept, previous, r) ? 'atStart' : 'afterGap';
    }
    if (seen++ < (where === 'atStart' ? atRunStart : afterGap)) {
      out[r] = 0;
      removed[where]++;
    }
    previous = r;
  }
  return { kept: out, ...removed };
}
