/**
 * A retune map's tuning axis as the engineer reads it (rule: /work/notes/axis38-rule.md, written before
 * the change): a time (an integral time, in the project's seconds) is shown in minutes from 10 min of
 * axis and in hours above 10 h (TIME_AXIS_MINUTES_FROM_SECONDS, TIME_AXIS_HOURS_ABOVE_SECONDS in
 * core/limits.ts; common practice: integral times are read in minutes, seconds for fast loops), and a time axis or a logarithmically spaced one gets round ticks rather than
 * a label at each cell centre ("10, 20, 50, 100 min", never "4,301 s"). The ticks come from the house's
 * two tick writers — the log-axis rule's 1-2-5 × 10^k (logTicks.ts) on a geometric grid, Heckbert's
 * 1-2-5 steps (niceTicks.ts) on an even one — and on a cell map each stands at its true place between
 * cell centres, interpolated in the grid's own spacing (cellPosition). A linearly spaced axis that is
 * not a time keeps one label per cell (gridPointLabels): its values are the engineer's own even steps.
 * The heat map, the one-axis curve, their exports and the report all take their axes from here.
 */
import { TIME_AXIS_HOURS_ABOVE_SECONDS, TIME_AXIS_MINUTES_FROM_SECONDS } from '../../core/limits';
import { logTickValues } from './logTicks';
import { niceTicks } from './niceTicks';
import { formatTick, gridPointLabels } from './tickFormat';

/** The time units an axis may be shown in, in seconds (an axis already shown in one is read back by the same rule). */
const TIME_UNIT_SECONDS: Readonly<Record<string, number>> = { s: 1, min: 60, h: 3600 };
/** About this many ticks on an evenly spaced axis (Heckbert's target). */
const TICK_TARGET = 5;

export interface TuningAxisData {
  /** The name in the trade's words with the unit in brackets, "integral time T_{i} (s)". */
  readonly label: string;
  readonly values: readonly number[];
  /** The parameter's unit; absent in maps saved before it was kept, which are drawn as they were. */
  readonly unit?: string;
}

export interface AxisTick {
  /** In the shown unit. */
  readonly value: number;
  readonly label: string;
}

export interface TuningAxisView {
  /** The axis title in the shown unit, "integral time T_{i} (min)". */
  readonly title: string;
  /** Grid values in the shown unit. */
  readonly values: number[];
  readonly logarithmic: boolean;
  /** True: round ticks (rule 3); false: one label per cell centre. */
  readonly roundTicks: boolean;
  /** How many of the axis's own unit make one shown unit (60 for minutes of seconds). */
  readonly perShownUnit: number;
  /** The shown unit ('min' for an integral time of 30 min); the axis's own where it is not a time. */
  readonly unit?: string;
}

/** True when the values are positive and evenly spaced in their logarithm (to one part in 10⁶). */
export function geometricSpacing(values: readonly number[]): boolean {
  if (values.length < 3 || values.some((v) => !(v > 0))) return false;
  const ratio = Math.log(values[1] / values[0]);
  return Math.abs(ratio) > 0 && values.every((v, i) => i === 0 || Math.abs(Math.log(v / values[i - 1]) - ratio) <= 1e-6 * Math.abs(ratio));
}

/** The unit a time axis is shown in, its size in seconds and in the axis's own unit; null where the axis is not a time. */
export function shownTimeUnit(axis: TuningAxisData): { unit: string; seconds: number; perShownUnit: number } | null {
  const own = axis.unit === undefined ? undefined : TIME_UNIT_SECONDS[axis.unit];
  if (own === undefined || !axis.label.endsWith(` (${axis.unit})`)) return null;
  const largest = Math.max(...axis.values.map(Math.abs)) * own;
  const [unit, seconds] = largest > TIME_AXIS_HOURS_ABOVE_SECONDS ? ['h', 3600] : largest >= TIME_AXIS_MINUTES_FROM_SECONDS ? ['min', 60] : ['s', 1];
  return { unit, seconds, perShownUnit: seconds / own };
}

export function tuningAxisView(axis: TuningAxisData): TuningAxisView {
  const time = shownTimeUnit(axis), per = time?.perShownUnit ?? 1;
  const title = time ? `${axis.label.slice(0, -` (${axis.unit})`.length)} (${time.unit})` : axis.label;
  const logarithmic = geometricSpacing(axis.values);
  return { title, values: axis.values.map((v) => v / per), logarithmic, roundTicks: time !== null || logarithmic, perShownUnit: per, unit: time?.unit ?? axis.unit };
}

interface TuningMap {
  readonly axes: readonly TuningAxisData[];
  readonly points: readonly { readonly coordinates: readonly number[] }[];
  readonly best: { readonly index: number; readonly coordinates?: readonly number[] } | null;
}

/**
 * The map with every tuning value in its axis's shown unit — axis titles, grid values, each point's and
 * the best point's coordinates — so the figure, its readout, the app's headline and table, the report's
 * caption and grid and the command line's text all read one unit ("integral time T_i (min) = 36.9").
 * The same map where no axis changes; applied twice, the same as once.
 */
export function shownMap<M extends TuningMap>(map: M): M {
  const views = map.axes.map(tuningAxisView), per = views.map((v) => v.perShownUnit);
  if (views.every((v, i) => v.perShownUnit === 1 && v.title === map.axes[i].label)) return map;
  const shown = (c: readonly number[]) => c.map((v, i) => v / per[i]);
  return {
    ...map,
    axes: map.axes.map((a, i) => ({ ...a, label: views[i].title, values: views[i].values, ...(views[i].unit === undefined ? {} : { unit: views[i].unit }) })),
    points: map.points.map((p) => ({ ...p, coordinates: shown(p.coordinates) })),
    best: map.best && map.best.coordinates ? { ...map.best, coordinates: shown(map.best.coordinates) } : map.best,
  };
}

/** Round ticks between lo and hi (lo < hi, shown unit): 1-2-5 × 10^k on a log axis, else Heckbert's steps; Heckbert's where fewer than two. */
export function roundTicks(lo: number, hi: number, logarithmic: boolean): AxisTick[] {
  const onLog = logarithmic && lo > 0 ? logTickValues(lo, hi) : [];
  if (onLog.length >= 2) return onLog.map((value) => ({ value, label: formatTick(value, decimalsOf(value)) }));
  const set = niceTicks(lo, hi, TICK_TARGET);
  return set.values.map((value) => ({ value, label: formatTick(value, set.fractionDigits) }));
}

/** Digits after the point that write a 1, 2 or 5 × 10^k exactly ("0.5", "20"). */
function decimalsOf(value: number): number {
  return Math.max(0, -Math.floor(Math.log10(Math.abs(value)) + 1e-9));
}

/**
 * Where value v stands on a cell map whose cell k is centred on values[k]: the fractional index, by
 * interpolation between neighbouring centres in the grid's spacing (ln v on a geometric grid, v on
 * any other), extrapolated from the end pair beyond the first or last centre. values: n ≥ 2, monotone.
 */
export function cellPosition(values: readonly number[], v: number, logarithmic: boolean): number {
  const g = (x: number) => (logarithmic ? Math.log(x) : x), n = values.length, rising = values[n - 1] > values[0];
  let k = 0;
  while (k < n - 2 && (rising ? v > values[k + 1] : v < values[k + 1])) k++;
  return k + (g(v) - g(values[k])) / (g(values[k + 1]) - g(values[k]));
}

/** The value at fractional index i (the inverse of cellPosition on the end pairs): the cell edges −0.5 and n − 0.5. */
function valueAtPosition(values: readonly number[], i: number, logarithmic: boolean): number {
  const k = i < 0 ? 0 : values.length - 2, a = values[k], b = values[k + 1], t = i - k;
  return logarithmic ? a * (b / a) ** t : a + (b - a) * t;
}

/** A cell map's ticks: round ticks between the outer cell edges at their true positions, or one per cell centre. */
export function cellAxisTicks(view: TuningAxisView): (AxisTick & { position: number })[] {
  const { values, logarithmic } = view, n = values.length;
  if (!view.roundTicks || n < 2) return gridPointLabels(values).map((label, i) => ({ value: values[i], label, position: i }));
  const ends = [valueAtPosition(values, -0.5, logarithmic), valueAtPosition(values, n - 0.5, logarithmic)];
  return roundTicks(Math.min(...ends), Math.max(...ends), logarithmic)
    .map((tick) => ({ ...tick, position: cellPosition(values, tick.value, logarithmic) }))
    .filter((tick) => tick.position >= -0.5 - 1e-9 && tick.position <= n - 0.5 + 1e-9);
}
