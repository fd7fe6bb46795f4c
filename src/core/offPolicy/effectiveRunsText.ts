/**
 * The Kish effective size of importance weights, in runs, as an engineer reads it (Kish 1965,
 * n_eff = (Σw)² / Σw²; common practice). One precision wherever the number is written (the
 * cross-check notes, the coverage findings and sentences, the report's diagnostics table, the app):
 * EFFECTIVE_RUNS_DIGITS significant digits, trailing zeros dropped ("3.45", "12.3", "29", "1,234" is
 * "1230"), so "3.45 of 12" in one place is never "3.4 runs" in another.
 *
 * From one run up: "3.45 runs". Kish's size is at least 1 whenever any weight is positive, and 0
 * when every weight is zero (effectiveSampleSize.ts): no logged run can speak for the candidate —
 * "0 runs" would read as a fault of the tool, so it is said in words, and why (the caller knows:
 * WHY_NO_WEIGHT is the wording when the reason is not known more closely). A size strictly between
 * 0 and 1 (another estimate of the size) is "less than one run's worth of weight (0.041 of a run)".
 */

/** Significant digits of an effective number of runs, everywhere it is written. */
export const EFFECTIVE_RUNS_DIGITS = 3;

/** "3.45", "12.3", "29": the number alone, at EFFECTIVE_RUNS_DIGITS significant digits. */
export function effectiveRunsNumber(effectiveRuns: number): string {
  return String(Number(effectiveRuns.toPrecision(EFFECTIVE_RUNS_DIGITS)));
}

/**
 * Why no logged run carries weight, when every importance weight is zero or not a number. A weight is
 * zero where the candidate gives a logged action no density (outside its truncation limits), and not a
 * number where neither policy does (a logged action outside the present controller's limits too, see
 * importanceRatio.ts); either way no logged run is one the candidate could have produced.
 */
export const WHY_NO_WEIGHT = 'every logged run takes an action the candidate would never take';

/** "3.45 runs"; "no run’s worth of weight (…)" at 0; "less than one run’s worth of weight (0.041 of a run)" between. */
export function effectiveRunsText(effectiveRuns: number): string {
  if (!Number.isFinite(effectiveRuns)) return 'an effective size that could not be computed';
  if (effectiveRuns >= 1) return `${effectiveRunsNumber(effectiveRuns)} runs`;
  if (!(effectiveRuns > 0)) return `no run’s worth of weight (${WHY_NO_WEIGHT})`;
  return `less than one run’s worth of weight (${Number(effectiveRuns.toPrecision(2))} of a run)`;
}
