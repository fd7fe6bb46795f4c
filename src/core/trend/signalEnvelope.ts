/**
 * Logged signals over time, small enough to draw from a million rows: the rows, in file order,
 * are split into at most `buckets` consecutive groups of equal size, and each group keeps the
 * smallest and largest value of every signal (min/max decimation per pixel column, as
 * oscilloscopes and trend recorders draw long records: with one group per pixel column a spike
 * inside a group stays visible, which a mean or every k-th sample would hide). Drawn as a line
 * through (t, min), (t, max) of each group in turn, the envelope looks like the full-resolution
 * trace at that width. One pass over the rows per signal: O(rows · signals).
 *
 * Shapes: time, and each signal's lo and hi: g groups (g ≤ buckets); NaN where a group has no
 * readable value. Every row counts, kept or not, so a start-up or a test to leave out can be seen.
 */
export interface TrendSignal {
  readonly name: string;
  /** What the signal is in the project: 'state', 'action', or the reward's sense. */
  readonly role: 'state' | 'action' | 'cost' | 'reward';
  readonly unit: string;
  readonly lo: Float64Array; // g
  readonly hi: Float64Array; // g
}

export interface TrendData {
  /** 'seconds': the timestamp column's clock; 'line': line numbers of the file (no timestamp column). */
  readonly clock: 'seconds' | 'line';
  /** True when the clock is calendar time (seconds since 1970), see core/clockText.ts. */
  readonly calendar: boolean;
  readonly time: Float64Array; // g: the first readable time (or line) of each group
  /** The last readable time (or line) of all rows: where the last group ends. */
  readonly endTime: number;
  readonly rowsPerGroup: number;
  readonly rowCount: number;
  readonly signals: readonly TrendSignal[];
  /** g: 1 + the index of the range of runs left out by label whose rows the group holds, else 0 (groupsLeftOut.ts); absent when no run is left out by label. */
  readonly leftOut?: Uint16Array;
}

/** Groups drawn at most: about one per pixel column of a wide screen's chart (a choice). */
export const TREND_BUCKETS = 1600;

export interface TrendInput {
  readonly name: string;
  readonly role: TrendSignal['role'];
  readonly unit: string;
  readonly values: Float64Array; // rows
}

/** The min/max envelope of each signal. time: rows (seconds or line numbers, NaN where unreadable). */
export function signalEnvelope(
  inputs: readonly TrendInput[], time: Float64Array, clock: TrendData['clock'], calendar: boolean, buckets = TREND_BUCKETS,
): TrendData {
  const rows = time.length;
  const per = Math.max(1, Math.ceil(rows / buckets)), groups = Math.ceil(rows / per);
  const groupTime = new Float64Array(groups).fill(NaN);
  for (let g = 0; g < groups; g++) {
    for (let r = g * per, last = Math.min(rows, r + per); r < last; r++) {
      if (!Number.isNaN(time[r])) {
        groupTime[g] = time[r];
        break;
      }
    }
  }
  let endTime = NaN;
  for (let r = rows - 1; r >= 0 && Number.isNaN(endTime); r--) endTime = time[r];
  const signals = inputs.map(({ name, role, unit, values }) => {
    const lo = new Float64Array(groups), hi = new Float64Array(groups);
    for (let g = 0; g < groups; g++) envelopeOfGroup(values, g * per, Math.min(rows, (g + 1) * per), lo, hi, g);
    return { name, role, unit, lo, hi };
  });
  return { clock, calendar, time: groupTime, endTime, rowsPerGroup: per, rowCount: rows, signals };
}

/** lo[g], hi[g]: the least and greatest finite value of values[from, to), NaN when there is none (selects, not branches). */
function envelopeOfGroup(values: Float64Array, from: number, to: number, lo: Float64Array, hi: Float64Array, g: number): void {
  let least = NaN, greatest = NaN;
  for (let r = from; r < to; r++) {
    const v = values[r];
    if (!Number.isFinite(v)) continue;
    least = v >= least ? least : v; // NaN compares false: the first value sets both
    greatest = v <= greatest ? greatest : v;
  }
  lo[g] = least;
  hi[g] = greatest;
}
