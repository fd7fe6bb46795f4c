/**
 * The Kish effective size of importance weights, in runs, as an engineer reads it (Kish 1965,
 * n_eff = (Σw)² / Σw²; common practice). From one run up: "12.3 runs". Kish's size is at least 1
 * whenever any weight is positive, and 0 when every weight is zero (effectiveSampleSize.ts): the
 * candidate would never take some action each logged run took, so no run speaks for it — "0.0 runs"
 * would read as a fault of the tool, so it is said in words. A size strictly between 0 and 1 (another
 * estimate of the size) is "less than one run's worth of weight (0.04 of a run)". One wording for the
 * cross-check notes, the coverage findings and the app.
 */

/** "12.3 runs"; "no run's worth of weight (…)" at 0; "less than one run's worth of weight (0.04 of a run)" between. */
export function effectiveRunsText(effectiveRuns: number): string {
  if (!Number.isFinite(effectiveRuns)) return 'an effective size that could not be computed';
  if (effectiveRuns >= 1) return `${effectiveRuns.toFixed(1)} runs`;
  if (!(effectiveRuns > 0)) return "no run's worth of weight (every logged run takes an action the candidate would never take)";
  return `less than one run's worth of weight (${Number(effectiveRuns.toPrecision(2))} of a run)`;
}
