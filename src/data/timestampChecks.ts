/**
 * A timestamp column after the whole file is read: settle the day/month order, report cells the
 * chosen order cannot read, and report timestamps that go backwards. A backwards step is checked
 * against the previous usable row, so one bad clock reading cannot hide behind an excluded row.
 */
import { decideDateOrder, type DateOrderDecision } from './dateOrder';
import type { RowProblems } from './rowProblems';
import type { TimestampColumn } from './columnReader';

export interface SettledTimestamps {
  readonly seconds: Float64Array; // records; NaN where unreadable
  readonly decision: DateOrderDecision;
}

export function settleTimestamps(
  column: string, readings: TimestampColumn,
  problems: RowProblems, lineOf: (record: number) => number,
): SettledTimestamps {
  const decision = decideDateOrder(readings.dayFirst, readings.monthFirst, lineOf);
  const seconds = decision.order === 'dayFirst' ? readings.dayFirst : readings.monthFirst;
  const order = decision.order === 'dayFirst' ? 'day/month/year' : 'month/day/year';
  for (const [r, text] of readings.oneOrderOnly) {
    if (Number.isNaN(seconds[r])) {
      problems.add(r, column, 'invalid-date', `"${text}" is not a valid ${order} date; this file’s dates read in that order because ${decision.reason}`);
    }
  }
  return { seconds, decision };
}

/**
 * Flag rows whose timestamp is earlier than the previous good row's. With an episode column the
 * clock may restart in each episode (a run's own elapsed time), so the check starts afresh wherever
 * the episode code changes. episodeCodes: one code per record, or undefined for one timeline.
 * Call after all other cell checks.
 */
export function checkTimestampsForward(
  column: string, seconds: Float64Array, problems: RowProblems, lineOf: (record: number) => number, episodeCodes?: Float64Array,
): void {
  let previous = -1;
  for (let r = 0; r < seconds.length; r++) {
    if (problems.isBad(r)) continue;
    if (previous >= 0 && episodeCodes && episodeCodes[r] !== episodeCodes[previous]) previous = -1;
    if (previous >= 0 && seconds[r] < seconds[previous]) {
      const back = seconds[previous] - seconds[r];
      problems.add(r, column, 'timestamp-backwards', `the timestamp goes backwards by ${+back.toPrecision(6)} s from line ${lineOf(previous)}; timestamps must not decrease`);
      continue;
    }
    previous = r;
  }
}
