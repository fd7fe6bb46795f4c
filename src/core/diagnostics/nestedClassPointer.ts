/**
 * Where a linear project's function classes are not settled, whether the nested polynomial classes
 * point one way: degrees 2, 3 and 4 were all fitted (each holds the one below), degrees 3 and 4 agree
 * with each other by the class rule on paired resamples and could have seen a gap of
 * CROSS_CHECK_RULE.detectableGap (10 %) of J, and the project's own degree 2 disagrees with both.
 * Then the verdict's reason says the gap most likely lies in degree 2; the range and the verdict
 * stay as they are (functionClassRange.ts).
 *
 * Why only as a sentence, and on what evidence: a richer class that adds nothing to the next one
 * suggests, without proving, that the poorer class's bias makes the gap (our reading). The rule for
 * saying so was written before any measurement and judged on every battery and hold-out plant the
 * command-line bench takes the truth of (bench/nestedClassRows.ts; the table in test/battery/README.md,
 * "Where degrees 3 and 4 agree and degree 2 stands apart"): it fired on 4 of 50 rows, on 2 plants,
 * and there the hull of degrees 3 and 4's intervals held the truth and degree 4 was nearer the truth
 * than degree 2 on all 4. Few rows: a plant where it fires and misleads would be news to record there.
 */
import { CROSS_CHECK_RULE } from '../offPolicy/crossCheckVerdict';
import { detectable, disagrees, standardErrorsText, type ClassGap } from './functionClassRange';
import { shareText } from '../shareText';

/** What the pointers read of a class verdict: whether it settled, and every pair it compared. */
type ClassPairs = { readonly settled: boolean; readonly gaps: readonly ClassGap[] };

/** The pair of classes a and b, in either order; undefined where they were not compared. */
function pairOf(gaps: readonly ClassGap[], a: string, b: string): ClassGap | undefined {
  return gaps.find((g) => (g.first === a && g.second === b) || (g.first === b && g.second === a));
}

/** A pair that agrees by the class rule and could have seen a gap of CROSS_CHECK_RULE.detectableGap of J. */
function agreesVisibly(g: ClassGap): boolean {
  return !disagrees(g) && detectable(g) <= CROSS_CHECK_RULE.detectableGap;
}

/** The labels of the three nested classes: the project's own (degree 2) and the two above it. */
export interface NestedClassLabels {
  readonly own: string;
  readonly middle: string;
  readonly top: string;
}

/** True when the pointer's conditions all hold on the verdict's pairs (see the file comment). */
export function nestedClassesPoint(verdict: ClassPairs, labels: NestedClassLabels): boolean {
  return pointingPair(verdict, labels) !== null;
}

/**
 * The sentence a not-settled verdict's reason carries where the pointer holds, else null: written
 * here once, so the command line, the app and the report read the same words.
 */
export function nestedClassSentence(verdict: ClassPairs, labels: NestedClassLabels): string | null {
  const upper = pointingPair(verdict, labels);
  if (!upper) return null;
  return `The two richer classes (${labels.middle}; ${labels.top}), each holding the one below it, agree with each other by the same rule ` +
    `(${shareText(upper.relative)} of J apart, ${standardErrorsText(upper)}; they could have seen a gap of ${shareText(CROSS_CHECK_RULE.detectableGap)}), ` +
    `and both differ from ${labels.own}: the gap most likely lies in that class, too simple for the value of this policy.`;
}

/** The agreeing upper pair where every condition holds, else null. */
function pointingPair(verdict: ClassPairs, labels: NestedClassLabels): ClassGap | null {
  if (verdict.settled) return null;
  const pair = (a: string, b: string) => pairOf(verdict.gaps, a, b);
  const ownMiddle = pair(labels.own, labels.middle), ownTop = pair(labels.own, labels.top), upper = pair(labels.middle, labels.top);
  if (!ownMiddle || !ownTop || !upper) return null;
  const points = upper.paired && agreesVisibly(upper) && disagrees(ownMiddle) && disagrees(ownTop);
  return points ? upper : null;
}

/** The labels a network project's pointer reads: the network's own class and the three nested polynomial classes beside it. */
export interface NetworkNestedLabels extends NestedClassLabels {
  readonly network: string;
}

/**
 * The same question for a network project (issue 9): the verdict is not settled; the network and
 * degrees 2, 3 and 4 were all fitted and converged (the caller leaves out the pairs of any class that
 * did not converge, the network's own included); every pair among
 * {network, degree 3, degree 4} agrees by the class rule and could have seen a gap of
 * CROSS_CHECK_RULE.detectableGap of J; and degree 2 disagrees with each of the three. The network's
 * pairs are not in the class verdict (it is checked against the linear estimate by its own rule), so
 * the caller compares them unpaired (unpairedGap, functionClassRange.ts); the pairs among the
 * polynomial classes are the verdict's own, paired where it paired them. Adopted by a rule written
 * before measuring, on network rows of 10+ battery and hold-out plants through the command line
 * (bench/networkNestedRows.ts; test/battery/README.md, "Where the network, degrees 3 and 4 agree"):
 * it fired on 2 of 29 rows, one candidate on one plant (greenhouse, seeds 1–2), so the evidence is thin; a plant where it fires and misleads is news.
 */
export function networkNestedClassesPoint(verdict: ClassPairs, labels: NetworkNestedLabels): boolean {
  return networkPointingPairs(verdict, labels) !== null;
}

/** The sentence a network project's not-settled reason carries where networkNestedClassesPoint holds, else null (written once here). */
export function networkNestedClassSentence(verdict: ClassPairs, labels: NetworkNestedLabels): string | null {
  const agreeing = networkPointingPairs(verdict, labels);
  if (!agreeing) return null;
  const widest = agreeing.reduce((w, g) => (g.relative > w.relative ? g : w));
  return `The network and the two richer polynomial classes (${labels.middle}; ${labels.top}) agree with each other by the class rule ` +
    `(at most ${shareText(widest.relative)} of J apart; each pair could have seen a gap of ${shareText(CROSS_CHECK_RULE.detectableGap)}), ` +
    `and all three differ from ${labels.own}: the gap most likely lies in that class, too simple for the value of this policy.`;
}

/** The three agreeing pairs among {network, middle, top} where every condition holds, else null. */
function networkPointingPairs(verdict: ClassPairs, labels: NetworkNestedLabels): ClassGap[] | null {
  if (verdict.settled) return null;
  const pair = (a: string, b: string) => pairOf(verdict.gaps, a, b);
  const agreeing = [pair(labels.network, labels.middle), pair(labels.network, labels.top), pair(labels.middle, labels.top)];
  const apart = [pair(labels.own, labels.network), pair(labels.own, labels.middle), pair(labels.own, labels.top)];
  if (![...agreeing, ...apart].every((g) => g !== undefined)) return null;
  const points = agreeing.every((g) => agreesVisibly(g!)) && apart.every((g) => disagrees(g!));
  return points ? (agreeing as ClassGap[]) : null;
}
