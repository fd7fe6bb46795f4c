/**
 * A spread of bootstrap replicates that a few runaway resamples cannot inflate: the normalised
 * interquartile range
 *   σ̂ = (q(0.75) − q(0.25)) / (2·Φ⁻¹(0.75)) = IQR / 1.34898,
 * which equals the standard deviation when the replicates are normal (Φ⁻¹(0.75) = 0.674490, the
 * normal table's upper quartile) and moves by at most a little when up to a quarter of them are
 * arbitrarily wild (its breakdown point is 25 %; Rousseeuw & Croux, "Alternatives to the median
 * absolute deviation", JASA 88 (1993), 1273–1283 — common practice for a robust scale).
 * Why here: where a richer function class is only just stable on the logs, a few resamples give
 * far-off values; their standard deviation then swamps a gap that the class's own percentile
 * interval (and every other resample) shows clearly. Quantiles as bootstrapInterval.ts takes them
 * (Hyndman & Fan definition 7), so the spread is read like the intervals beside it.
 */
import { sampleQuantile } from '../bootstrap/bootstrapInterval';

/** 2·Φ⁻¹(0.75): the interquartile range of a standard normal law. */
export const NORMAL_INTERQUARTILE_RANGE = 1.3489795003921634;

/** IQR/1.349 of the values (at least 2; any order); NaN when a value is not finite. */
export function normalisedInterquartileRange(values: ArrayLike<number>): number {
  if (values.length < 2) throw new RangeError(`robust spread: expected at least 2 values, got ${values.length}`);
  const sorted = Float64Array.from(values as ArrayLike<number>).sort();
  if (!Number.isFinite(sorted[0]) || !Number.isFinite(sorted[sorted.length - 1])) return NaN;
  return (sampleQuantile(sorted, 0.75) - sampleQuantile(sorted, 0.25)) / NORMAL_INTERQUARTILE_RANGE;
}
