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

/** Why no logged run carries weight, when every importance weight is zero: the candidate gives some action of each logged run no probability (outside its truncation limits, say). */
export const WHY_NO_WEIGHT = 'every logged run takes an action the candidate would never take';

/**
 * Why a run's importance weight is not a number (NaN or +∞ in log form), which Kish's size cannot
 * use: where a candidate's mean lies more than about 38.5 dithers outside its truncation limits, the
 * probability it gives the band underflows to 0 in a double (Φ(−38.5) ≈ φ(38.5)/38.5 ≈ 2e−324, the
 * smallest double being 4.9e−324), so its density there is 0/0 or x/0 (importanceRatio.ts, policy.ts logDensity). A
 * project file reaches it with truncation limits and a small dither, e.g. a 0.1 % dither on limits
 * 40 to 50 % where the mean at some logged states is 64 %. Said for what it is, never as "every run
 * takes an action the candidate would never take".
 */
export const WHY_NOT_A_NUMBER = 'at some logged state the candidate’s mean lies so far outside its truncation limits (dozens of dithers) ' +
  'that the probability it gives the band is below what the computation can hold; check its limits, offset, gains and dither against the logged states';

/**
 * "3.45 runs"; "no run’s worth of weight (…)" at 0; "less than one run’s worth of weight (0.041 of a
 * run)" between; and, where the weights of `notNumbers` runs are not numbers (WHY_NOT_A_NUMBER), that.
 */
export function effectiveRunsText(effectiveRuns: number, notNumbers = 0): string {
  if (notNumbers > 0) return `no usable weight (the importance weight${notNumbers === 1 ? ' of 1 run is' : `s of ${notNumbers} runs are`} not a number: ${WHY_NOT_A_NUMBER})`;
  if (!Number.isFinite(effectiveRuns)) return 'an effective size that could not be computed';
  if (effectiveRuns >= 1) {
    const text = effectiveRunsNumber(effectiveRuns);
    return `${text} ${text === '1' ? 'run' : 'runs'}`; // "1 run": Kish's size is exactly 1 where one weight dominates
  }
  if (!(effectiveRuns > 0)) return `no run’s worth of weight (${WHY_NO_WEIGHT})`;
  return `less than one run’s worth of weight (${Number(effectiveRuns.toPrecision(2))} of a run)`;
}

/** How many of the log weights are not numbers Kish's size can use (NaN, or +∞: see WHY_NOT_A_NUMBER). */
export function weightsNotNumbers(logWeights: ArrayLike<number>): number {
  let count = 0;
  for (let i = 0; i < logWeights.length; i++) if (Number.isNaN(logWeights[i]) || logWeights[i] === Infinity) count++;
  return count;
}
