/**
 * Whether a cross-check can confirm or contradict fitted Q-evaluation (FQE), and what the checks
 * together say. Thresholds are ours unless marked, named once in CROSS_CHECK_RULE.
 *
 * A check is informative only when it rests on something other than FQE's own fit and can see an
 * error worth knowing about:
 *   - weighted importance sampling / doubly robust: the importance weights at the effective horizon
 *     1/(1 − γ) keep a Kish effective size of at least max(10, 10 % of the episodes reaching it) (a
 *     common rule of thumb) — below it doubly robust falls back on FQE's own Q̂ and agreement proves
 *     little — and the bootstrapped tail past the episodes' ends carries at most maxTailWeight (half)
 *     of the discount weight, γ^H ≤ ½, since the tail is FQE's own value;
 *   - model rollouts: at most maxShareOutsideLogs (5 %) of the discounted simulated steps reach the
 *     edge of the logged state range (modelRollouts.ts), beyond which the fitted model extrapolates;
 *     and at most maxRewardShareAtEdge of the model's discounted |reward| is collected in states held
 *     at that edge. An extrapolated part of the value may be wrong by its whole size, so for the
 *     check to see a gap of detectableGap (10 %) of J, what it cannot vouch for must stay below half
 *     of it: maxRewardShareAtEdge = detectableGap / 2 (5 %). The step count alone misses a model
 *     that runs away to states far costlier than any logged: on the backlash level hold-out, 5.0 %
 *     of the steps were held and carried most of the model's cost, and a right estimate read
 *     "contradicted" (test/battery/README.md).
 * A check that passes those disagrees when its difference from FQE exceeds 3 standard errors of the
 * paired difference and 2 % of |J| (both needed: significance and size). Otherwise it agrees only if
 * it could have seen a gap of detectableGap (10 %) of |J| — 3 standard errors of the paired
 * difference below that; a check whose interval spans ±20 % "agrees" with anything, so it is then
 * uninformative. (A noisy check can still disagree: a gap beyond 3 of its standard errors is seen.)
 * Where the fit has no resamples to pair with (a network), the standard error is the unpaired
 * bound σ_check + σ_fit, which holds whatever the two estimates' correlation (unpairedDifference.ts).
 * Together: contradicted if any informative check disagrees; confirmed if at least one agrees and
 * none disagrees; unconfirmed when no check is informative — nothing in the logs can then confirm
 * the estimate, and the headline must say so. One exception: where the function classes disagree
 * (not settled), checks that rest on a plant model fitted to the same logs (rollouts, the
 * linear-quadratic closed form) do not confirm on their own — the classes' disagreement says the
 * logs do not pin J down where the candidate goes, and a smooth plant model extrapolates there as
 * a smooth Q does (seen on the battery's saturating pendulum: linear FQE 30 % off, both model
 * checks within 2 % of it). The estimate is then unconfirmed unless a check on the logged actions
 * and rewards themselves (importance sampling) agrees.
 */
import { effectiveRunsText } from './effectiveRunsText';
import { shareText } from '../shareText';

const DETECTABLE_GAP = 0.1;

export const CROSS_CHECK_RULE = {
  standardErrors: 3, relative: 0.02, detectableGap: DETECTABLE_GAP,
  minEffectiveEpisodes: 10, minEffectiveShare: 0.1, maxTailWeight: 0.5, maxShareOutsideLogs: 0.05,
  /** Half the gap the check must see: an extrapolated part of the value may be wrong by its whole size. */
  maxRewardShareAtEdge: DETECTABLE_GAP / 2,
} as const;

export type CheckAgreement = 'agrees' | 'disagrees' | 'uninformative';

export interface CrossCheckEvidence {
  readonly label: string;
  readonly difference: number; // check − FQE (reward or cost sense, as long as fqe is the same)
  readonly differenceStandardError: number; // paired bootstrap standard error of the difference (unpaired: unpairedDifference.ts)
  /** False when the fit had no resamples to pair with, so the standard error is the unpaired bound (unpairedDifference.ts); true when omitted. */
  readonly paired?: boolean;
  readonly fqe: number; // J by FQE
  /** Weighted importance sampling and doubly robust: weights at the effective horizon and the tail weight γ^H. */
  readonly weights?: { readonly effectiveEpisodes: number; readonly episodesReaching: number; readonly horizonSteps: number; readonly tailWeight: number; readonly notNumbers?: number };
  /** Model rollouts: the discounted share of simulated steps at the logged-range edge. */
  readonly shareOutsideLogs?: number;
  /** Model rollouts: the share of the model's discounted |reward| collected in states held at that edge. */
  readonly rewardShareAtEdge?: number;
}

export interface CheckVerdict {
  readonly label: string;
  readonly agreement: CheckAgreement;
  readonly note: string;
  /** The check rests on a plant model fitted to the logs (not on the logged actions and rewards themselves). */
  readonly fromPlantModel?: boolean;
}

const UNPAIRED_WORDS = 'standard errors of the difference, unpaired: a network’s fit is not paired with the checks, so its own standard error is added to the check’s';

export function crossCheckVerdict(e: CrossCheckEvidence): CheckVerdict {
  const r = CROSS_CHECK_RULE, scale = Math.max(Math.abs(e.fqe), Number.MIN_VALUE);
  const relative = Math.abs(e.difference) / scale;
  const z = e.differenceStandardError > 0 ? Math.abs(e.difference) / e.differenceStandardError : Infinity;
  const size = `differs from fitted Q-evaluation by ${shareText(relative)} of J`;
  // No standard error (no resampled values): a count of standard errors would read 0.0 and the gap it could see ∞ %.
  const gap = Number.isFinite(e.differenceStandardError)
    ? `${size} (${Number.isFinite(z) ? z.toFixed(1) : '∞'} ${e.paired === false ? UNPAIRED_WORDS : 'standard errors of the paired difference'})`
    : size;
  const weak = weakness(e);
  if (weak) return { label: e.label, agreement: 'uninformative', note: `Uninformative: ${weak}; it ${gap}.` };
  if (z > r.standardErrors && relative > r.relative) return { label: e.label, agreement: 'disagrees', note: `Disagrees: it ${gap}.` };
  const detectable = (r.standardErrors * e.differenceStandardError) / scale;
  if (!Number.isFinite(detectable)) {
    return { label: e.label, agreement: 'uninformative', note: `Uninformative: it has no standard error from the resampled runs, so it cannot show an error of ${shareText(r.detectableGap)} of J; it ${gap}.` };
  }
  if (!(detectable <= r.detectableGap)) {
    return {
      label: e.label, agreement: 'uninformative',
      note: `Uninformative: its uncertainty is too wide to see an error of ${shareText(r.detectableGap)} of J (it would need a gap of ${shareText(detectable)}); it ${gap}.`,
    };
  }
  return { label: e.label, agreement: 'agrees', note: `Agrees: it ${gap}.` };
}

function weakness(e: CrossCheckEvidence): string | null {
  const r = CROSS_CHECK_RULE, w = e.weights;
  if (w) {
    const needed = Math.max(r.minEffectiveEpisodes, r.minEffectiveShare * w.episodesReaching);
    if (w.notNumbers) return `at step ${w.horizonSteps} the importance weights carry ${effectiveRunsText(0, w.notNumbers)}, where ${needed.toFixed(0)} runs are needed`;
    if (w.effectiveEpisodes < needed) return w.effectiveEpisodes >= 1
      ? `at step ${w.horizonSteps} the importance weights have an effective size of ${effectiveRunsText(w.effectiveEpisodes)} (below ${needed.toFixed(0)})`
      : `at step ${w.horizonSteps} the importance weights carry ${effectiveRunsText(w.effectiveEpisodes)}, where ${needed.toFixed(0)} runs are needed`;
    if (w.tailWeight > r.maxTailWeight) return `${shareText(w.tailWeight)} of the discount weight lies past the logged runs’ ends, where it uses fitted Q-evaluation’s own value`;
  }
  if (e.shareOutsideLogs !== undefined && e.shareOutsideLogs > r.maxShareOutsideLogs) {
    return `${shareText(e.shareOutsideLogs)} of the simulated (discounted) steps reach the edge of the logged states, where the fitted model extrapolates`;
  }
  if (e.rewardShareAtEdge !== undefined && e.rewardShareAtEdge > r.maxRewardShareAtEdge) return rewardAtEdgeText(e.rewardShareAtEdge);
  return null;
}

/** The words for a value resting on held states, from the same constants the rule applies. */
export function rewardAtEdgeText(share: number): string {
  const r = CROSS_CHECK_RULE;
  return `${shareText(share)} of the model’s value (its discounted rewards, in size) comes from simulated states held at the edge of the logged states, ` +
    `where the fitted model extrapolates and may be wrong by the whole of that part; at most ${shareText(r.maxRewardShareAtEdge)} may, half the ${shareText(r.detectableGap)} error the check must see`;
}

export type Confirmation = 'confirmed' | 'contradicted' | 'unconfirmed';

/** classesSettled: the function-class verdict (false: not settled; null or omitted: no verdict). */
export function confirmationOf(verdicts: readonly CheckVerdict[], classesSettled: boolean | null = null): { readonly status: Confirmation; readonly text: string } {
  const against = verdicts.filter((v) => v.agreement === 'disagrees'), support = verdicts.filter((v) => v.agreement === 'agrees');
  const names = (list: readonly CheckVerdict[]) => list.map((v) => v.label.toLowerCase()).join(', ');
  if (against.length) return { status: 'contradicted', text: `Contradicted by ${names(against)}: treat this estimate as unreliable until the difference is explained.` };
  if (classesSettled === false && support.length && support.every((v) => v.fromPlantModel)) {
    return {
      status: 'unconfirmed',
      text: `The function classes disagree, and the checks that agree with this value (${names(support)}) rest on a plant model fitted to the same logs, ` +
        'which extrapolates where the logs are thin as a smooth Q does: they cannot tell which class is right, so the estimate is unconfirmed.',
    };
  }
  if (support.length) return { status: 'confirmed', text: `Confirmed by ${names(support)}, which rest${support.length === 1 ? 's' : ''} on assumptions other than the fitted Q.` };
  if (verdicts.length === 0) return { status: 'unconfirmed', text: 'Nothing in the logs can confirm this estimate: no cross-check applies here (each says why), so it rests on the fitted Q alone.' };
  return { status: 'unconfirmed', text: 'Nothing in the logs can confirm this estimate: every cross-check is uninformative here, so it rests on the fitted Q alone.' };
}
