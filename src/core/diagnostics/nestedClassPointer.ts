/**
 * Where a linear project's function classes are not settled, whether the nested polynomial classes
 * point one way: degrees 2, 3 and 4 were all fitted (each holds the one below), degrees 3 and 4 agree
 * with each other by the class rule on paired resamples and could have seen a gap of
 * CROSS_CHECK_RULE.detectableGap (10 %) of J, and the project's own degree 2 disagrees with both.
 *
 * Why it might mean something: when a richer class adds nothing to the next richer one, the bias
 * of the poorer class is the likely cause of the gap (the nested-model view of approximation
 * error). Whether that holds on plants is measured, not assumed: the rule for saying so is in
 * bench/nestedClassRows.ts and its table in test/battery/README.md. It changes neither the range
 * nor the verdict.
 */
import { CROSS_CHECK_RULE } from '../offPolicy/crossCheckVerdict';
import { detectable, disagrees, type ClassGap } from './functionClassRange';

/** The labels of the three nested classes: the project's own (degree 2) and the two above it. */
export interface NestedClassLabels {
  readonly own: string;
  readonly middle: string;
  readonly top: string;
}

/** True when the pointer's conditions all hold on the verdict's pairs (see the file comment). */
export function nestedClassesPoint(verdict: { readonly settled: boolean; readonly gaps: readonly ClassGap[] }, labels: NestedClassLabels): boolean {
  if (verdict.settled) return false;
  const pair = (a: string, b: string) => verdict.gaps.find((g) => (g.first === a && g.second === b) || (g.first === b && g.second === a));
  const ownMiddle = pair(labels.own, labels.middle), ownTop = pair(labels.own, labels.top), upper = pair(labels.middle, labels.top);
  if (!ownMiddle || !ownTop || !upper) return false;
  return upper.paired && !disagrees(upper) && detectable(upper) <= CROSS_CHECK_RULE.detectableGap && disagrees(ownMiddle) && disagrees(ownTop);
}
