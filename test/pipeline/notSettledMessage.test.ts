/**
 * The serious warning of an estimate not settled across function classes prints its range at the
 * precision the tables beside it use (src/figures/parts/tickFormat.ts: an interval's ends to the place
 * that gives its width three significant digits; JCGM 100 (the GUM) §7.2.6 — common practice), so one
 * page never shows "[5.62, 9.55]" in the table and "[5.624, 9.549]" in the warning.
 */
import { describe, expect, it } from 'vitest';
import { notSettledMessage } from '../../src/pipeline/assessClassRange';
import type { FunctionClassAssessment } from '../../src/pipeline/assessment';

const classEntry = (label: string, value: number, interval: [number, number]) => ({ label, value, interval, standardError: 1 });

describe('notSettledMessage', () => {
  it('prints the range to report at its own precision, as the intervals table does, and says "Not settled" once', () => {
    const classes = {
      classes: [classEntry('polynomial, degree 2', 7.72, [6.09, 9.55]), classEntry('polynomial, degree 3', 7.14, [5.624, 9.03])],
      settled: false, range: [5.6241, 9.5488], coverage: '', reason: 'Not settled: the classes differ.',
    } as unknown as FunctionClassAssessment;
    // width 3.92 → three significant digits at two decimals (worked by hand)
    expect(notSettledMessage(classes)).toBe('Not settled across function classes: the classes differ. Report the range [5.62, 9.55], not a single value.');
  });

  it('keeps the ASCII minus of the command line and the precision of a narrow range', () => {
    const classes = {
      classes: [classEntry('a', -101.2, [-101.31, -101.05]), classEntry('b', -101.4, [-101.5, -101.2])],
      settled: false, range: [-101.5012, -101.0497], coverage: '', reason: 'Not settled.',
    } as unknown as FunctionClassAssessment;
    // width 0.4515 → three significant digits at three decimals (worked by hand)
    expect(notSettledMessage(classes)).toContain('[-101.501, -101.050]');
  });
});
