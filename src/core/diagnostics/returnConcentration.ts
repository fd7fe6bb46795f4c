/**
 * How much of the logged discounted return the costliest tenth of the runs carry:
 *   share = Σ_{k in the ⌈e/10⌉ runs with the largest |G_k|} G_k / Σ_k G_k,
 * over the runs' discounted returns G_k, all of one sign (costs only, or rewards only). A tenth of
 * equal runs carries 10 %; normal run-to-run scatter a little more (for the battery's plants,
 * 12–28 %, starts two to three times wider than the steady state included; the hold-out dryer,
 * neutralisation tank and batch kettle 11–20 %; the surge drum, defined for rare large upsets, 50–94 %).
 *
 * Why it matters: the intervals resample whole runs, and when a few runs carry most of the return
 * the sampling law of any mean over runs is set by how many of those few a log happens to hold,
 * which a resample of that same log cannot show. For returns with a Pareto tail of index α (heavier
 * for smaller α) the top tenth's share of the mean is 0.1^(1 − 1/α) (Lorenz curve of the Pareto law;
 * common practice): more than half means α < 1/(1 − log 0.5/log 0.1) ≈ 1.43, well inside α < 2, where
 * the variance is infinite and the bootstrap of a mean is not consistent — its law does not approach
 * the estimator's however many runs are logged (Athreya, "Bootstrap of the mean in the infinite
 * variance case", Annals of Statistics 15 (1987), 724–731). Above half, then, the intervals, and
 * the verdicts read from them (settled across classes, the cross-checks' agreement), are a caution
 * (our rule; the threshold by the Pareto equivalence above, not chosen on any log).
 */
import { shareText } from '../shareText';

/** A caution above this share of the logged return in the costliest tenth of the runs (our rule). */
export const CONCENTRATION_LIMIT = 0.5;
/** The share of the runs read: the costliest tenth. */
export const CONCENTRATION_RUNS = 0.1;

/** The costliest tenth's share of the total; null with fewer than 10 runs, a total of 0, or returns of both signs. */
export function returnConcentration(returns: ArrayLike<number>): number | null {
  const e = returns.length;
  if (e < 10) return null;
  let total = 0, negative = false, positive = false;
  for (let k = 0; k < e; k++) {
    total += returns[k];
    if (returns[k] < 0) negative = true;
    if (returns[k] > 0) positive = true;
  }
  if ((negative && positive) || total === 0 || !Number.isFinite(total)) return null;
  const magnitudes = Float64Array.from(returns, Math.abs).sort(), top = Math.ceil(CONCENTRATION_RUNS * e);
  let carried = 0;
  for (let k = e - top; k < e; k++) carried += magnitudes[k];
  return carried / Math.abs(total);
}

export function returnConcentrationRuleText(): string {
  return `Runs that carry the return: the share of the logged discounted return carried by the costliest ${shareText(CONCENTRATION_RUNS)} of the runs; ` +
    `above ${shareText(CONCENTRATION_LIMIT)} a caution, since the intervals resample those few runs (a tail that heavy has an infinite variance, where the bootstrap of a mean fails; Athreya 1987).`;
}

/** The caution's words, or null at or below the limit. costs: the logged return is a cost (costs only, in either sense of the project). */
export function returnConcentrationFinding(share: number | null, runs: number, costs: boolean): { severity: 'caution'; topic: string; message: string } | null {
  if (share === null || !(share > CONCENTRATION_LIMIT)) return null;
  const top = Math.ceil(CONCENTRATION_RUNS * runs), which = costs ? `The ${top} costliest` : `The ${top} most rewarding`;
  return {
    severity: 'caution', topic: 'runConcentration',
    message: `${which} of the ${runs} logged runs carry ${shareText(share)} of the logged discounted ${costs ? 'cost' : 'return'}: the intervals resample runs and rest on those few, ` +
      'so they, and the verdicts read from them, may be far too narrow or too wide; a longer log with more of the rare events would say more.',
  };
}
