/**
 * The weight each run carries at step h in the padded per-decision estimators
 * (perDecisionEstimators.ts), in log form, so that the effective size of the importance weights at
 * h (Kish, "Survey Sampling", 1965, §11.7) is taken over the weights those estimators use:
 *   a run acting at h:                              log W_{k,h};
 *   a run that ended in an end state at length T ≤ h: log W_{k,T−1} + Σ_{u=T}^{h} log κ_u,
 * where κ_u = L_u / (L_u + K_u) is the share of the runs known to be going at u that are not cut there
 * by a time limit (inverse probability of censoring weighting, Robins & Rotnitzky 1992; the
 * product-limit form of Kaplan & Meier 1958): L_u sums W_{u−1} over the runs acting at u, K_u over the
 * runs cut at length u. κ_u = 1 where no run is cut at u (exactly: x/x), so on a log without early cuts
 * these are each ended run's last weight. Runs cut before h are absent (they are missing there, not 0).
 */
import type { ImportanceWeightTable } from './importanceWeights';
import { notCutShare } from './perDecisionEstimators';

export function paddedLogWeightsAtStep(table: ImportanceWeightTable, h: number): number[] {
  const { index, step, scaled, scaledBefore, logWeight, absorbed } = table, offsets = index.offsets;
  const length = (k: number) => offsets[k + 1] - offsets[k];
  const live = new Float64Array(h + 1), cut = new Float64Array(h + 1), weights: number[] = []; // live and cut on step u − 1's scale
  for (let p = 0; p < step.length; p++) {
    if (step[p] >= 1 && step[p] <= h) live[step[p]] += scaledBefore[p];
    if (step[p] === h) weights.push(logWeight[p]);
  }
  for (let k = 0; k < index.episodes; k++) {
    const T = length(k);
    if (!absorbed[k] && T >= 1 && T <= h) cut[T] += scaled[offsets[k + 1] - 1];
  }
  const heldFrom = new Float64Array(h + 2); // heldFrom[T] = Σ_{u=T}^{h} log κ_u; heldFrom[h + 1] = 0
  for (let u = h; u >= 1; u--) heldFrom[u] = heldFrom[u + 1] + Math.log(notCutShare(live[u], cut[u]));
  for (let k = 0; k < index.episodes; k++) {
    const T = length(k);
    if (absorbed[k] && T >= 1 && T <= h) weights.push(logWeight[offsets[k + 1] - 1] + heldFrom[T]);
  }
  return weights;
}
