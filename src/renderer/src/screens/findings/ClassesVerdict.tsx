/**
 * A policy's J across the function classes: the verdict in bold, the range to report, each class's
 * value and interval, and why (the verdict's own reason and what the range covers). One writer for the
 * candidates and the present controller, the baseline (both in CrossChecksPanel).
 */
import type { FunctionClassAssessment } from '../../../../pipeline/assessment';
import { intervalAtPrecision, valueInInterval } from '../../../../figures/parts/uncertainNumber';
import { sentenceCase, typesetMinus } from './assessmentWords';

/** reasonTestId: the test id of the reason's span (`classes-reason-<name>`). */
export function ClassesVerdict({ classes, reportedRange, reasonTestId }: { classes: FunctionClassAssessment; reportedRange: [number, number] | null; reasonTestId: string }) {
  return (
    <>
      <strong>{classes.settled ? 'Settled across function classes' : 'Not settled across function classes'}</strong>
      {' '}(range to report {intervalAtPrecision(reportedRange)}): {classes.classes.map((k) => `${k.label}: ${valueInInterval(k.value, k.interval).text}`).join('; ')}.
      {/* Why, from the verdict itself (which classes differ, or are too uncertain to check the project's own); its lead is the bold words above. */}
      {' '}<span data-testid={reasonTestId}>{classReason(classes.reason)}</span> {classes.coverage}
    </>
  );
}

/** The verdict's reason without its lead ("Not settled: ", "Settled: "), which the bold words beside it say, as a sentence. */
function classReason(reason: string): string {
  return typesetMinus(sentenceCase(reason.replace(/^(Not settled|Settled): /, '')));
}
