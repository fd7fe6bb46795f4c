/**
 * The reported range of J when more than one function class was fitted, and whether the estimate
 * is settled.
 *
 * Why: a bootstrap over episodes refits the same class on resampled data, so its interval measures
 * sampling error only. When the class cannot represent Q^π (a saturating actuator, a nonlinear
 * plant), every resample shares the same approximation bias and the interval can sit entirely on
 * the wrong side of the truth. Fitting several classes (polynomials of two degrees, radial basis,
 * a network) exposes that bias where they disagree: classes with different misspecifications rarely
 * share the same bias (the model-selection argument of Xie & Jiang, "Batch value-function
 * approximation with only realizability", ICML 2021, and the robust-range view of Jiang & Huang,
 * "Minimax value interval for off-policy evaluation and policy optimization", NeurIPS 2020).
 *
 * The rule (thresholds ours, named once below):
 *   - Two classes disagree when their estimates differ by more than CLASS_AGREEMENT.standardErrors
 *     standard errors of the difference AND by more than CLASS_AGREEMENT.relative of |J|. The
 *     standard error of the difference is the spread of the paired differences over the same
 *     resamples when every class has replicates (classes fitted to the same resample are strongly
 *     correlated, so pairing is much sharper), else √(se_a² + se_b²) (conservative). The spread is
 *     the normalised interquartile range (robustSpread.ts), not the standard deviation: it is the
 *     same for normal replicates, but a richer class that runs away on a few resamples would
 *     otherwise make a gap of 18 % of J read as 0.8 standard errors ("settled") while its own 90 %
 *     interval, and nearly every resample, showed the gap plainly (found on the hold-out
 *     neutralisation tank, test/battery/holdout/neutralisationPlant.ts).
 *   - A pair can check the first class (the project's own, listed first) only when it could have
 *     seen a gap of CROSS_CHECK_RULE.detectableGap (10 %) of |J|: CLASS_AGREEMENT.standardErrors
 *     standard errors of the difference below that, the cross-checks' own yardstick
 *     (src/core/offPolicy/crossCheckVerdict.ts). A class whose interval spans ±80 % of J "agrees"
 *     with anything (seen on an invented two-valve log: degree 3 at 19 [−56, 84] beside degree 2 at
 *     30 [18, 40], 38 % apart and called settled).
 *   - Settled: no pair disagrees and at least one pair can check the first class; the classes that
 *     cannot are named. Not settled: some pair disagrees (a noisy pair can still show a gap), or
 *     none can check the first class; the reason names the widest gap, or the closest check.
 *   - Where a linear project of degree 2 is not settled and degrees 3 and 4 agree with each other
 *     (paired, able to see 10 %) while both disagree with degree 2, the reason adds that the gap most
 *     likely lies in degree 2 (nestedClassPointer.ts, adopted on a measured rule); range and verdict unchanged.
 *     For a network project the same where the network, degrees 3 and 4 agree pairwise (the network's
 *     pairs unpaired, unpairedGap) and all three differ from degree 2 (withUnresampledOwn, assessClassRange.ts).
 *   - A class that was fitted but whose fitted Q-evaluation did not converge (it diverged, or stopped
 *     at its iteration limit) has no value to compare. When it leaves the project's own class alone,
 *     the estimate is not settled: the richer classes could not be fitted stably on these logs,
 *     which is what linear fitted Q-evaluation does where the candidate's states and actions lie
 *     beyond the data (the off-policy divergence of Tsitsiklis & Van Roy, "An analysis of
 *     temporal-difference learning with function approximation", IEEE TAC 42(5), 1997), so nothing
 *     checks the one class that could. Beside classes that agree it is named in the reason.
 *   - The reported range is the hull of all classes' sampling intervals, whatever the verdict, so
 *     it never sits tight around a value another class contradicts. It covers the sampling of
 *     episodes and the spread across the classes fitted, and nothing beyond them: if every class
 *     shares one bias, no range built from them can show it (say so beside it).
 * Two standard errors, not the three of the cross-check rule, because a false "not settled" only
 * widens a range, while a missed disagreement shows a confident wrong number.
 */
import { CROSS_CHECK_RULE } from '../offPolicy/crossCheckVerdict';
import { normalisedInterquartileRange } from './robustSpread';
import { shareText } from '../shareText';

export interface ClassEstimate {
  /** The function class in words, e.g. "polynomial, degree 2". */
  readonly label: string;
  readonly value: number; // J on the full data
  readonly standardError: number; // bootstrap standard error
  readonly interval: readonly [number, number]; // its sampling interval (e.g. the 90 % percentile interval)
  /** Bootstrap replicates on resamples shared by every class (same seeds, same order), when available. */
  readonly replicates?: ArrayLike<number>;
}

export const CLASS_AGREEMENT = { standardErrors: 2, relative: 0.02 } as const;

/** A class that was fitted but did not converge: its label and why, in a few words ("diverged"). */
export interface UnconvergedClass {
  readonly label: string;
  readonly why: string;
}

export type RangeCoverage = 'sampling' | 'samplingAndClasses';

export interface ClassGap {
  readonly first: string;
  readonly second: string;
  readonly difference: number; // first − second
  readonly standardErrors: number; // |difference| / its standard error
  readonly relative: number; // |difference| / max |J|
  readonly paired: boolean;
  /** The difference's standard error as a share of max |J| (Infinity where J is 0). */
  readonly relativeStandardError: number;
}

export interface ClassVerdict {
  readonly settled: boolean;
  readonly range: readonly [number, number];
  readonly covers: RangeCoverage;
  /** What the range covers, in words for the reader. */
  readonly coverageText: string;
  /** Why settled or not, naming the widest gap and the rule. */
  readonly reason: string;
  /** The disagreeing pair with the largest relative gap, or the largest gap when all agree; null for one class. */
  readonly widestGap: ClassGap | null;
  /** Every pair of classes compared, in the order the estimates were given (empty for one class). */
  readonly gaps: readonly ClassGap[];
}

/**
 * ownFirst: the first estimate is the project's own class (a linear approximator), which some other
 * class must be able to check; false where the project's own value is not among them (a network,
 * checked against the linear estimate by its own rule, approximatorAgreement.ts).
 */
export function functionClassVerdict(estimates: readonly ClassEstimate[], unconverged: readonly UnconvergedClass[] = [], ownFirst = true): ClassVerdict {
  if (estimates.length === 0) throw new RangeError('function classes: at least one estimate is needed');
  for (const e of estimates) {
    if (![e.value, e.standardError, e.interval[0], e.interval[1]].every(Number.isFinite)) throw new RangeError(`function class "${e.label}": its estimate and interval must be finite numbers`);
  }
  const range: [number, number] = [Math.min(...estimates.map((e) => e.interval[0])), Math.max(...estimates.map((e) => e.interval[1]))];
  const failed = unconverged.map((u) => `${u.label} (${u.why})`).join('; ');
  if (estimates.length === 1 && unconverged.length > 0) {
    return {
      settled: false, range, covers: 'sampling', widestGap: null, gaps: [],
      coverageText: 'Covers the sampling of runs only: the other function classes fitted did not converge, so the error of the class itself is not measured.',
      reason: `Not settled: the other function classes fitted did not converge (${failed}), so no second class checks this one; ` +
        'that happens where the candidate leads beyond the states and actions the logs cover.',
    };
  }
  const notCompared = unconverged.length === 0 ? '' : ` Not compared, as their fits did not converge: ${failed}.`;
  if (estimates.length === 1) {
    return {
      settled: true, range, covers: 'sampling', widestGap: null, gaps: [],
      coverageText: 'Covers the sampling of runs only: no other function class was fitted, so the error of the class itself is not measured.',
      reason: 'One function class only: its approximation error is not checked.',
    };
  }
  const gaps = pairGaps(estimates), disagreeing = gaps.filter(disagrees);
  const widest = (list: ClassGap[]) => list.reduce((w, g) => (g.relative > w.relative ? g : w));
  const coverageText = `Covers the sampling of runs and the spread across the ${estimates.length} function classes fitted ` +
    `(${estimates.map((e) => e.label).join('; ')}); a bias they all share would not show.`;
  if (disagreeing.length === 0) {
    const own = estimates[0].label, checks = gaps.filter((x) => x.first === own), checking = checks.filter((x) => detectable(x) <= CROSS_CHECK_RULE.detectableGap);
    if (ownFirst && checking.length === 0) {
      const closest = checks.reduce((c, x) => (detectable(x) < detectable(c) ? x : c));
      return {
        settled: false, range, covers: 'samplingAndClasses', coverageText, widestGap: closest, gaps,
        reason: `Not settled: no other function class checks ${own} closely enough. The closest, ${closest.second}, differs from it by ${percentText(closest.relative)} of J, ` +
          `but could not have seen a gap of ${shareText(CROSS_CHECK_RULE.detectableGap)} of J (it would need a gap of ${detectableText(detectable(closest))}), so the error of the class is not measured.${notCompared}`,
      };
    }
    const g = widest(gaps), loose = ownFirst ? checks.filter((x) => !checking.includes(x)) : [];
    const tooLoose = loose.length === 0 ? '' : ` Too uncertain to check ${own}: ${loose.map((x) => `${x.second} (the smallest gap it could see is ${detectableText(detectable(x))} of J, not ${shareText(CROSS_CHECK_RULE.detectableGap)})`).join('; ')}.`;
    return { settled: true, range, covers: 'samplingAndClasses', coverageText, widestGap: g, gaps, reason: `Settled: the function classes agree; the widest gap: ${describe(g)}.${tooLoose}${notCompared}` };
  }
  const g = widest(disagreeing);
  return {
    settled: false, range, covers: 'samplingAndClasses', coverageText, widestGap: g, gaps,
    reason: `Not settled: ${describe(g)}, beyond ${CLASS_AGREEMENT.standardErrors} standard errors and ${shareText(CLASS_AGREEMENT.relative)} of J, ` +
      `so at least one class cannot represent the value of this policy; the range spans them all.${notCompared}`,
  };
}

function pairGaps(estimates: readonly ClassEstimate[]): ClassGap[] {
  const paired = estimates.every((e) => e.replicates && e.replicates.length >= 2 && e.replicates.length === estimates[0].replicates!.length);
  const gaps: ClassGap[] = [];
  for (let i = 0; i < estimates.length; i++) {
    for (let j = i + 1; j < estimates.length; j++) {
      const a = estimates[i], b = estimates[j];
      gaps.push(paired ? gapOf(a, b, pairedSpread(a.replicates!, b.replicates!), true) : unpairedGap(a, b));
    }
  }
  return gaps;
}

/** Two classes compared without shared resamples: the standard error of their difference is √(se_a² + se_b²) (conservative). */
export function unpairedGap(a: Pick<ClassEstimate, 'label' | 'value' | 'standardError'>, b: Pick<ClassEstimate, 'label' | 'value' | 'standardError'>): ClassGap {
  return gapOf(a, b, Math.hypot(a.standardError, b.standardError), false);
}

function gapOf(a: Pick<ClassEstimate, 'label' | 'value'>, b: Pick<ClassEstimate, 'label' | 'value'>, se: number, paired: boolean): ClassGap {
  const difference = a.value - b.value, scale = Math.max(Math.abs(a.value), Math.abs(b.value), Number.MIN_VALUE);
  return {
    first: a.label, second: b.label, difference, paired,
    standardErrors: se > 0 ? Math.abs(difference) / se : difference === 0 ? 0 : Infinity, relative: Math.abs(difference) / scale,
    relativeStandardError: se / scale,
  };
}

export function disagrees(g: ClassGap): boolean {
  return g.standardErrors > CLASS_AGREEMENT.standardErrors && g.relative > CLASS_AGREEMENT.relative;
}

/** The smallest gap, as a share of |J|, the pair could have seen: CLASS_AGREEMENT.standardErrors of its difference's standard errors. */
export function detectable(g: ClassGap): number {
  return CLASS_AGREEMENT.standardErrors * g.relativeStandardError;
}

function percentText(share: number): string {
  return Number.isFinite(share) ? shareText(share) : 'an unbounded gap';
}

/**
 * The smallest gap a pair that is no check could have seen: past the limit, so never printed at or
 * below it (10.04 % would round to "10 %" beside "could not have seen a gap of 10 %"); rounded up at
 * one decimal of a percent there, then written by the one share writer.
 */
function detectableText(share: number): string {
  const text = percentText(share), limit = CROSS_CHECK_RULE.detectableGap;
  return share > limit && text === shareText(limit) ? shareText(Math.ceil(1000 * share) / 1000) : text;
}

/** Robust spread (IQR/1.349) of the paired differences a_b − b_b. */
function pairedSpread(a: ArrayLike<number>, b: ArrayLike<number>): number {
  return normalisedInterquartileRange(Float64Array.from({ length: a.length }, (_, k) => a[k] - b[k]));
}

function describe(g: ClassGap): string {
  return `${g.first} and ${g.second} differ by ${shareText(g.relative)} of J (${standardErrorsText(g)})`;
}

/** A gap in its standard errors, as the class sentences say it: "0.9 paired standard errors" (one decimal; ∞ where the spread is 0). */
export function standardErrorsText(g: ClassGap): string {
  const z = Number.isFinite(g.standardErrors) ? g.standardErrors.toFixed(1) : '∞';
  return `${z} ${g.paired ? 'paired ' : ''}standard errors`;
}
