/**
 * The import's trend: the project's states, actions and reward or cost over every row of the file,
 * on the timestamp column's clock (or line numbers without one), as min/max envelopes
 * (core/trend/signalEnvelope.ts). A cost is drawn as a cost, a reward as a reward.
 */
import type { ColumnRoles } from '../project/schema';
import { isCalendarClock } from '../core/clockText';
import { signalEnvelope, TREND_BUCKETS, type TrendData, type TrendInput } from '../core/trend/signalEnvelope';

export type { TrendData, TrendSignal } from '../core/trend/signalEnvelope';

/**
 * On a clock that starts again in each run the runs are drawn over one another, so each run's rows
 * share the chart's width with every other run's: the envelope keeps this many times more groups
 * (a choice: about eight runs' worth of one group per pixel column; more only adds points that
 * land on the same pixels).
 */
export const RUN_TIME_GROUP_FACTOR = 8;

/**
 * numbers: every numeric column read (rows each); ruleValues: rows, the reward rule's own values (a
 * cost as a cost: RewardValues.values, rewardColumn.ts); runRestarts: how often the clock started
 * again at a new run (LogClock.runRestarts).
 */
export function trendOfImport(
  columns: ColumnRoles, numbers: ReadonlyMap<string, Float64Array>, ruleValues: Float64Array,
  seconds: Float64Array | undefined, rowCount: number, lineOf: (record: number) => number, runRestarts = 0,
): TrendData {
  const inputs: TrendInput[] = [];
  for (const c of columns.states) {
    const values = numbers.get(c.column);
    if (values) inputs.push({ name: c.column, role: 'state', unit: c.unit ?? '', values }); // a derived state has no file column: not drawn
  }
  for (const c of columns.actions) inputs.push({ name: c.column, role: 'action', unit: c.unit ?? '', values: numbers.get(c.column)! });
  const sense = columns.reward.sense;
  const name = columns.reward.kind === 'column' ? columns.reward.column : sense;
  inputs.push({ name, role: sense, unit: columns.reward.unit ?? '', values: ruleValues });
  const first = seconds?.find((t) => Number.isFinite(t)) ?? NaN;
  const time = seconds ?? Float64Array.from({ length: rowCount }, (_, r) => lineOf(r));
  const buckets = runRestarts > 0 ? TREND_BUCKETS * Math.min(runRestarts + 1, RUN_TIME_GROUP_FACTOR) : TREND_BUCKETS;
  return signalEnvelope(inputs, time, seconds ? 'seconds' : 'line', seconds !== undefined && isCalendarClock(first), buckets);
}
