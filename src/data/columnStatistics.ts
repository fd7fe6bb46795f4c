/**
 * Per-column statistics for the dataset summary: count, min, max, mean and sample standard
 * deviation by Welford's one-pass update (Welford 1962, Technometrics 4(3)), and a histogram of
 * equal-width bins over [min, max] (the last bin closed, so max is counted).
 */
export interface Histogram {
  /** bins + 1 ascending edges. */
  readonly edges: number[];
  readonly counts: number[];
}

export interface ColumnStatistics {
  readonly count: number;
  readonly min: number;
  readonly max: number;
  readonly mean: number;
  /** Sample standard deviation (n − 1); 0 for a single value. */
  readonly std: number;
  readonly histogram: Histogram;
}

export const HISTOGRAM_BINS = 30;

/** Statistics of values[i] over the i with include[i] = 1. Throws on an empty selection. */
export function columnStatistics(values: Float64Array, include: Uint8Array, bins = HISTOGRAM_BINS): ColumnStatistics {
  let count = 0, mean = 0, m2 = 0, min = Infinity, max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    if (!include[i]) continue;
    const x = values[i];
    count++;
    const delta = x - mean;
    mean += delta / count;
    m2 += delta * (x - mean);
    if (x < min) min = x;
    if (x > max) max = x;
  }
  if (count === 0) throw new RangeError('columnStatistics: no values selected');
  const std = count > 1 ? Math.sqrt(m2 / (count - 1)) : 0;
  return { count, min, max, mean, std, histogram: histogram(values, include, min, max, bins) };
}

function histogram(values: Float64Array, include: Uint8Array, min: number, max: number, bins: number): Histogram {
  // A constant column gets one bin of width 0: there is nothing to spread.
  const binCount = max > min ? bins : 1;
  const width = (max - min) / binCount;
  const edges = Array.from({ length: binCount + 1 }, (_, b) => (b === binCount ? max : min + b * width));
  const counts = new Array<number>(binCount).fill(0);
  for (let i = 0; i < values.length; i++) {
    if (!include[i]) continue;
    const b = width > 0 ? Math.floor((values[i] - min) / width) : 0;
    counts[Math.min(binCount - 1, b)]++;
  }
  return { edges, counts };
}
