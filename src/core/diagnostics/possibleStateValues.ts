/**
 * The possible range (possibleValues.ts) state by state: with every reward a policy meets between
 * r_min and r_max, the same geometric series bounds V^π(s) at every state s, not only J, which is
 * the mean of V^π over the start states. A fit whose V̂ lies outside the range at most of the
 * logged states — the states it was fitted on, where it has data — is failing there, not merely
 * extrapolating; and its bootstrap interval cannot show it, since every resample refits the same
 * function class on the same kind of data and shares its error.
 *
 * Why this is needed beside the check on J: the check on J allows a slack of 1 % of the range's
 * width, and the width is set by the single most extreme logged step. On a log where rare large
 * upsets dominate (an invented surge drum, test/battery/holdout/surgeDrumPlant.ts) the width is
 * thousands of times the typical discounted cost, a quadratic Q bends to the few upset runs, and a
 * fit can put V̂ above 0 — a gain on a plant where every step costs — on almost every logged state
 * while J stays inside the slack and its interval, widened by the same few runs, still reaches a
 * possible value.
 *
 * The rule (ours): the median of V̂ over the logged states lies beyond an end of the range by more
 * than one standard error of J. The median says "most of the logged states" and is moved by no
 * handful of extreme states (a breakdown point of 50 %; Hampel et al., "Robust Statistics", 1986,
 * §2.2; common practice). The allowance is for sampling: a right fit's V̂ errs at a logged state by
 * about J's own error, mostly a shift common to all states (the constant feature carries the
 * level), so where the true values lie at the edge of the range (a plant that costs almost nothing
 * in most states) a right fit's median can pass the end by sampling alone; beyond one standard
 * error that happens in at most P(Z > 1) ≈ 16 % of logs whose true values all sit exactly at the
 * end, and in 2.3 % where they sit one standard error inside (normal table). Each choice — the
 * median and one standard error — is ours.
 *
 * Reward sense. values: V̂ at the logged states checked (any order).
 */
import { sampleQuantile } from '../bootstrap/bootstrapInterval';
import { POSSIBLE_SLACK, type PossibleValues } from './possibleValues';
import { shareText } from '../shareText';

/** The allowance for sampling error, in standard errors of J (our rule). */
export const STATE_VALUE_ALLOWANCE = 1;

export interface StateValuesOutside {
  /** Which end of the range most of the states pass. */
  readonly side: 'above' | 'below';
  /** Median of V̂ over the states checked. */
  readonly median: number;
  /** Share of the states checked whose V̂ lies beyond that end. */
  readonly share: number;
  /** How many states were checked. */
  readonly states: number;
}

/**
 * Most of the logged states' V̂ beyond an end of the range by more than STATE_VALUE_ALLOWANCE
 * standard errors; null otherwise, and null when there is nothing to compare (no states, an
 * undefined standard error, a value that is not finite).
 */
export function stateValuesOutsidePossible(values: ArrayLike<number>, range: PossibleValues, standardError: number): StateValuesOutside | null {
  if (values.length === 0 || !(standardError >= 0) || !Number.isFinite(standardError)) return null;
  const sorted = Float64Array.from(values).sort();
  if (!Number.isFinite(sorted[0]) || !Number.isFinite(sorted[sorted.length - 1])) return null;
  const median = sampleQuantile(sorted, 0.5), allowance = STATE_VALUE_ALLOWANCE * standardError;
  let side: 'above' | 'below';
  if (median > range.upper + allowance) side = 'above';
  else if (median < range.lower - allowance) side = 'below';
  else return null;
  let beyond = 0;
  for (let i = 0; i < sorted.length; i++) if (side === 'above' ? sorted[i] > range.upper : sorted[i] < range.lower) beyond++;
  return { side, median, share: beyond / sorted.length, states: sorted.length };
}

/**
 * Indices of up to `limit` of `count` rows at an even stride (all rows when count ≤ limit): the
 * states checked, spread over the whole log in its order.
 */
export function evenStride(count: number, limit: number): Int32Array {
  const take = Math.min(count, Math.max(0, Math.floor(limit)));
  const out = new Int32Array(take);
  for (let i = 0; i < take; i++) out[i] = Math.floor((i * count) / take);
  return out;
}

/** Both possible-value rules in words, for the method section (quoting the constants the code applies). */
export function possibleValuesRuleText(maxStates: number): string {
  return 'Possible values: with every logged reward between r_min and r_max, no policy’s J, nor its value at any state, can leave r_min/(1 − γ) … r_max/(1 − γ) ' +
    '(the geometric series; where runs end in an end state, min(r_min, r_min/(1 − γ)) … max(r_max, r_max/(1 − γ)), since a run may pay a single step). ' +
    `An estimate is marked impossible (serious) when J lies outside this range by more than ${shareText(POSSIBLE_SLACK)} of its width, when its whole interval lies outside it, ` +
    `or when the fitted V̂ lies outside it at most of the logged states — its median over up to ${maxStates} logged states beyond an end by more than ` +
    `${STATE_VALUE_ALLOWANCE === 1 ? 'one standard error' : `${STATE_VALUE_ALLOWANCE} standard errors`} of J: the fit then fails on the states it was fitted on, ` +
    'which its interval (the same fit on resampled runs) cannot show. The range’s width is set by the most extreme logged step, so the state rule, which does not use it, is the one that speaks where a few large upsets dominate the log (our rules).';
}
