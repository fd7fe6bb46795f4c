/**
 * The present controller's J not settled across function classes: a caution on the whole log.
 *
 * Every difference and the ranking are taken against the present controller's J (the baseline). It is
 * fitted in the same function classes as a candidate (assessProject.ts, workInClasses) and judged by the
 * same rule (core/diagnostics/functionClassRange.ts); where its classes disagree, its J has a range to
 * report as a candidate's has, and a difference read against the single value may be off by as much as
 * the range is wide. A caution, not a serious finding: a candidate's own estimate is untouched, and the
 * differences are still computed against the baseline's own class, as before (only the words say to read
 * them against the range). Adopted by the rule written before measuring (test/battery/README.md,
 * "The baseline in other function classes").
 */
import type { AssessmentWarning, PresentControllerAssessment } from './assessment';
import { notSettledMessage } from './assessClassRange';
import { policyLabel } from './policyNames';

export const BASELINE_NOT_SETTLED_TOPIC = 'baselineNotSettled';

/** What the caution adds after the class verdict's own words: the reading of the differences. */
export const BASELINE_RANGE_READING = 'Every difference from the baseline is taken against its single value: read each difference as uncertain by as much as this range is wide.';

export function baselineClassWarnings(present: Pick<PresentControllerAssessment, 'name' | 'functionClasses' | 'rangeCut'> | null): AssessmentWarning[] {
  const classes = present?.functionClasses;
  if (!present || !classes || classes.settled) return [];
  const label = policyLabel(present.name);
  return [{
    severity: 'caution', topic: BASELINE_NOT_SETTLED_TOPIC,
    message: `${label.charAt(0).toUpperCase()}${label.slice(1)}: ${notSettledMessage(classes, present.rangeCut ?? null)} ${BASELINE_RANGE_READING}`,
  }];
}
