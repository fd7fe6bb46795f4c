/**
 * Kish's effective sample size of a set of weights, ESS = (Σ w)² / Σ w² (Kish, "Survey
 * Sampling", 1965, §11.7): the number of equally weighted observations that would give a
 * weighted mean the same variance. 1 ≤ ESS ≤ n; ESS = n only for equal weights. Weights are
 * given by their logarithms so products of many importance ratios can be used directly.
 */
export function effectiveSampleSizeFromLogs(logWeights: ArrayLike<number>): number {
  let largest = -Infinity;
  for (let i = 0; i < logWeights.length; i++) largest = Math.max(largest, logWeights[i]);
  if (largest === -Infinity || Number.isNaN(largest)) return 0; // every weight is zero
  let sum = 0, squares = 0;
  for (let i = 0; i < logWeights.length; i++) {
    const w = Math.exp(logWeights[i] - largest); // scaled by the largest weight; ESS is scale-free
    sum += w;
    squares += w * w;
  }
  return (sum * sum) / squares;
}
