/**
 * What the import found, for the data page and the report: row, transition and episode counts,
 * statistics and a histogram of every used column over the rows that were kept, the sampling
 * period, and how much of the file was excluded.
 */
import { importProblem, type ImportProblem } from './importProblem';
import type { DecimalMark } from './numericCell';
import type { Delimiter } from './csvDialect';
import type { DateOrder } from './dateOrder';
import { columnStatistics, HISTOGRAM_BINS, type ColumnStatistics } from './columnStatistics';
import type { RewardValues } from './rewardColumn';

export interface ColumnSummary extends ColumnStatistics {
  readonly name: string;
  /** What the column is used as: "state", "action", "reward", "cost input", "timestamp", … */
  readonly roles: readonly string[];
}

export interface DatasetSummary {
  /** Data rows in the file (without the header). */
  readonly rowCount: number;
  readonly usedRowCount: number;
  readonly excludedRowCount: number;
  /** excludedRowCount / rowCount. */
  readonly excludedFraction: number;
  readonly transitionCount: number;
  readonly episodeCount: number;
  /** Every used numeric or timestamp column, in header order (timestamps in seconds). */
  readonly columns: readonly ColumnSummary[];
  /** The rewards as imported (costs already negated), over kept rows. */
  readonly reward: ColumnStatistics;
  /** Median step between adjacent kept rows' timestamps; null without a timestamp column. */
  readonly samplingPeriodSeconds: number | null;
  readonly delimiter: Delimiter;
  readonly decimalMark: DecimalMark;
  /** How day/month dates were read; null when no date depended on it. */
  readonly dateOrder: DateOrder | null;
  /** The text encoding the file was read in (sourceText.ts). */
  readonly encoding?: string;
}

export interface SummaryInputs {
  readonly rowCount: number;
  readonly kept: Uint8Array;
  readonly transitionCount: number;
  readonly episodeCount: number;
  /** Used columns in header order, with their values over all records (over `include` where given, else `kept`). */
  readonly columns: readonly { name: string; roles: string[]; values: Float64Array; include?: Uint8Array }[];
  /** The rewards as sign · values (rewardColumn.ts). */
  readonly rewards: RewardValues;
  readonly samplingPeriodSeconds: number | null;
  readonly delimiter: Delimiter;
  readonly decimalMark: DecimalMark;
  readonly dateOrder: DateOrder | null;
  readonly encoding?: string;
}

export function summariseDataset(s: SummaryInputs): DatasetSummary {
  let used = 0;
  for (let r = 0; r < s.kept.length; r++) used += s.kept[r];
  return {
    rowCount: s.rowCount,
    usedRowCount: used,
    excludedRowCount: s.rowCount - used,
    excludedFraction: s.rowCount > 0 ? (s.rowCount - used) / s.rowCount : 0,
    transitionCount: s.transitionCount,
    episodeCount: s.episodeCount,
    columns: s.columns.map(({ name, roles, values, include }) => ({ name, roles, ...columnStatistics(values, include ?? s.kept) })),
    reward: columnStatistics(s.rewards.values, s.kept, HISTOGRAM_BINS, s.rewards.sign),
    samplingPeriodSeconds: s.samplingPeriodSeconds,
    delimiter: s.delimiter,
    decimalMark: s.decimalMark,
    dateOrder: s.dateOrder,
    ...(s.encoding ? { encoding: s.encoding } : {}),
  };
}

/** Warnings for state columns that never change over the kept rows: no information, singular fits. */
export function constantStateWarnings(summary: DatasetSummary, fileName: string): ImportProblem[] {
  return summary.columns
    .filter((c) => c.roles.includes('state') && c.min === c.max)
    .map((c) => importProblem('constant-state', `${fileName}, column ${c.name}`,
      `the state column is constant (${c.min}) in every used row; it carries no information and can make least-squares fits singular`));
}
