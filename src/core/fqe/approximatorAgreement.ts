/**
 * Do the network and the linear estimate of J agree? One rule, with its thresholds named once, so
 * the words a user reads come from the same numbers the code applies. The linear estimate is the
 * linear approximator's default class (networkComparator.ts), not the network's own polynomial part.
 *
 * Both estimates come from the same logged episodes, so their sampling errors are strongly
 * correlated; the right yardstick for their difference is the interval of the PAIRED difference
 * (each episode resample gives both values; networkInterval.ts). When only the two separate
 * intervals are known, the rule falls back to asking whether they overlap — conservative, since
 * separate intervals of correlated estimates overlap more often than their difference's interval
 * contains 0 (common practice; e.g. Schenker & Gentleman, "On judging the significance of
 * differences by examining the overlap between confidence intervals", Am. Stat. 55, 2001).
 *
 *   disagree      the difference is beyond what resampling the episodes explains (the paired
 *                 interval excludes 0, or the two intervals do not overlap) AND it is at least
 *                 NEGLIGIBLE_SHARE of the value: at least one function class is biased here;
 *   inconclusive  not beyond the intervals, but the difference's interval reaches further than
 *                 WIDE_SHARE of the value from 0 (without a paired interval: |difference| plus
 *                 the two half-widths added in quadrature): too little data to tell them apart;
 *   agree         otherwise.
 */

import { COMPARATOR_DEGREE, comparatorName } from './comparatorDegree';
import { shareText } from '../shareText';

/**
 * A difference below this share of |J| is immaterial for a decision: under the 3 % accuracy the
 * battery asks of either estimator (a choice, measured on the battery: on its linear-quadratic
 * plants, where the quadratic is exact, the two differed by up to 2.2 % with both within 3.2 % of
 * the exact value — at 1 % the app called half of those fits "not settled").
 */
export const NEGLIGIBLE_SHARE = 0.025;
/** A difference interval reaching beyond this share of |J| from the difference is too wide to call agreement (a choice). */
export const WIDE_SHARE = 0.05;

export interface EstimateWithInterval {
  readonly value: number;
  readonly interval: { readonly lower: number; readonly upper: number; readonly level: number };
}

export interface ApproximatorEstimates {
  readonly network: EstimateWithInterval;
  readonly linear: EstimateWithInterval;
  /** network − linear with the interval of the paired difference, when the two were resampled together. */
  readonly difference?: EstimateWithInterval;
}

export type AgreementVerdict = 'agree' | 'inconclusive' | 'disagree';

export interface Agreement {
  readonly verdict: AgreementVerdict;
  /** network − linear. */
  readonly difference: number;
  /** |difference| / max(|network|, |linear|). */
  readonly relativeDifference: number;
  /** Which test decided: the paired difference's interval, or the overlap of the two intervals. */
  readonly basis: 'pairedDifference' | 'intervalOverlap';
  /** Plain words for the user: the verdict and what it means. */
  readonly message: string;
}

export function approximatorAgreement(e: ApproximatorEstimates): Agreement {
  const difference = e.network.value - e.linear.value;
  const size = Math.max(Math.abs(e.network.value), Math.abs(e.linear.value), Number.MIN_VALUE);
  const relativeDifference = Math.abs(difference) / size;
  const basis = e.difference ? 'pairedDifference' : 'intervalOverlap';
  const beyond = e.difference
    ? e.difference.interval.lower > 0 || e.difference.interval.upper < 0
    : e.network.interval.lower > e.linear.interval.upper || e.linear.interval.lower > e.network.interval.upper;
  const reach = e.difference
    ? Math.max(Math.abs(e.difference.interval.lower), Math.abs(e.difference.interval.upper))
    : Math.abs(difference) + Math.hypot(halfWidth(e.network), halfWidth(e.linear)); // as if independent
  let verdict: AgreementVerdict = 'agree';
  if (beyond && relativeDifference >= NEGLIGIBLE_SHARE) verdict = 'disagree';
  else if (reach / size > WIDE_SHARE) verdict = 'inconclusive';
  return { verdict, difference, relativeDifference, basis, message: agreementMessage(verdict, difference, relativeDifference, e) };
}

function halfWidth(e: EstimateWithInterval): number {
  return (e.interval.upper - e.interval.lower) / 2;
}

function agreementMessage(verdict: AgreementVerdict, difference: number, relative: number, e: ApproximatorEstimates): string {
  const by = `differ by ${formatNumber(difference)} (${shareText(relative)} of the value)`;
  const level = shareText((e.difference ?? e.network).interval.level);
  if (verdict === 'disagree') {
    return `The network and the ${comparatorName()} estimate disagree: they ${by}, more than resampling the logged runs explains ` +
      `(${level} intervals). At least one of them is biased by its function class — a polynomial of degree ${COMPARATOR_DEGREE} cannot follow saturation, clipping ` +
      'or an asymmetric cost, and a network can extrapolate poorly outside the logged states. Treat both values with caution; ' +
      'prefer the network where the plant is known to saturate and the candidate stays inside the logged states.';
  }
  if (verdict === 'inconclusive') {
    return `The network and the ${comparatorName()} estimate ${by}, within what resampling the logged runs explains, but the ` +
      `${level} interval of their difference is wider than ${shareText(WIDE_SHARE)} of the value: too little data to tell ` +
      'whether they agree. More logged runs would narrow it.';
  }
  const negligible = relative < NEGLIGIBLE_SHARE ? `, under ${shareText(NEGLIGIBLE_SHARE)} of the value` : ', within what resampling the logged runs explains';
  return `The network and the ${comparatorName()} estimate agree: they ${by}${negligible}.`;
}

function formatNumber(x: number): string {
  return Math.abs(x) >= 100 ? x.toFixed(0) : x.toPrecision(3);
}
