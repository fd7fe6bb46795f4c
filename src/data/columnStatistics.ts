/**
 * Per-column statistics for the dataset summary: count, min, max, mean and sample standard
 * deviation by the two-pass algorithm (the mean first, then the sum of squared deviations from it;
 * Chan, Golub & LeVeque 1983, "Algorithms for computing the sample variance", Am. Stat. 37(3):
 * as accurate as Welford's update and without a division per value), and a histogram of
 * equal-width bins over [min, max] (the last bin closed, so max is counted) counted in the second pass.
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
  let count = 0, sum = 0, min = Infinity, max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    if (!include[i]) continue;
    const x = values[i];
    count++;
    sum += x;
    min = x < min ? x : min; // a select, not a branch: the branches mispredicted on noisy signals (twice the time)
    max = x > max ? x : max;
  }
  if (count === 0) throw new RangeError('columnStatistics: no values selected');
  const mean = Math.min(max, Math.max(min, Number.isFinite(sum) ? sum / count : scaledMean(values, include, count, Math.max(-min, max))));
  // A constant column gets one bin of width 0: there is nothing to spread.
  const binCount = max > min ? bins : 1;
  const width = (max - min) / binCount, perWidth = width > 0 ? 1 / width : 0;
  const counts = new Float64Array(binCount), last = binCount - 1;
  let m2 = 0;
  for (let i = 0; i < values.length; i++) {
    if (!include[i]) continue;
    const x = values[i], d = x - mean;
    m2 += d * d;
    const bin = Math.floor((x - min) * perWidth);
    counts[bin > last ? last : bin]++;
  }
  const std = count > 1 ? Math.sqrt(m2 / (count - 1)) : 0;
  const edges = Array.from({ length: binCount + 1 }, (_, b) => (b === binCount ? max : min + b * width));
  return { count, min, max, mean, std, histogram: { edges, counts: Array.from(counts) } };
}

/** The mean of values whose plain sum overflows: each scaled by 1/scale first. */
function scaledMean(values: Float64Array, include: Uint8Array, count: number, scale: number): number {
  let sum = 0;
  for (let i = 0; i < values.length; i++) if (include[i]) sum += values[i] / scale;
  return (sum / count) * scale;
}
