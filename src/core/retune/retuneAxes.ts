/**
 * The axes of a retune map: one or two parameters of a candidate form, each swept over values
 * spaced evenly on a linear or logarithmic scale (integral times and gains are usually judged on
 * a log scale; common practice). Points are numbered row-major: the first axis varies slowest,
 * index = i₀·count₁ + i₁. The limits live here; the project schema reads them.
 */
export type AxisSpacing = 'linear' | 'logarithmic';

export interface RetuneAxis {
  readonly from: number;
  readonly to: number;
  readonly count: number;
  readonly spacing: AxisSpacing;
}

export const MIN_RETUNE_AXIS_POINTS = 2;
export const MAX_RETUNE_AXIS_POINTS = 50;
export const MAX_RETUNE_AXES = 2;
/** A map of at most this many points (e.g. 20×20). */
export const MAX_RETUNE_POINTS = 400;

export class RetuneAxisError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RetuneAxisError';
  }
}

/** The values along one axis, from `from` to `to` inclusive. */
export function axisValues(axis: RetuneAxis): number[] {
  const { from, to, count, spacing } = axis;
  if (!Number.isInteger(count) || count < MIN_RETUNE_AXIS_POINTS || count > MAX_RETUNE_AXIS_POINTS) {
    throw new RetuneAxisError(`count: expected a whole number from ${MIN_RETUNE_AXIS_POINTS} to ${MAX_RETUNE_AXIS_POINTS}, got ${count}`);
  }
  if (!Number.isFinite(from) || !Number.isFinite(to) || from === to) throw new RetuneAxisError(`from, to: expected two different finite numbers, got ${from} and ${to}`);
  if (spacing === 'logarithmic' && !(from > 0 && to > 0)) throw new RetuneAxisError(`from, to: a logarithmic axis needs positive ends, got ${from} and ${to}`);
  return Array.from({ length: count }, (_, i) => {
    const t = i / (count - 1);
    if (i === count - 1) return to;
    return spacing === 'logarithmic' ? from * (to / from) ** t : from + (to - from) * t;
  });
}

/** The grid's points as coordinate tuples, row-major. */
export function gridPoints(axes: readonly RetuneAxis[]): number[][] {
  if (axes.length < 1 || axes.length > MAX_RETUNE_AXES) throw new RetuneAxisError(`axes: expected 1 or ${MAX_RETUNE_AXES} axes, got ${axes.length}`);
  const values = axes.map(axisValues);
  const total = values.reduce((p, v) => p * v.length, 1);
  if (total > MAX_RETUNE_POINTS) throw new RetuneAxisError(`axes: ${total} points; at most ${MAX_RETUNE_POINTS} are supported`);
  return values.length === 1 ? values[0].map((v) => [v]) : values[0].flatMap((a) => values[1].map((b) => [a, b]));
}
