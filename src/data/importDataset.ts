/**
 * CSV file → TransitionSet: the boundary between a user's file and the estimators. Every fault a
 * person can fix comes back as a Problem naming the file, the line as a spreadsheet numbers it
 * (header = line 1; a record with a quoted line break counts as one line), the column, the text
 * found and what was expected.
 *
 * Stages: decode → dialect → header and column plan → one streaming pass over the rows →
 * timestamps and rewards → bad rows (stop, or exclude and list) → episodes → transitions → summary.
 */
import { previousSteps, type ColumnRoles, type CsvSettings } from '../project/schema';
import { failure, success, type Result } from '../core/result';
import { importProblem, type ImportProblem } from './importProblem';
import type { TransitionSet, WholeLog } from '../core/transitions';
import type { TextEncodingName } from './sourceText';
import type { Dialect } from './csvDialect';
import { timestampColumnOf, type ColumnPlan } from './columnPlan';
import type { TableColumns } from './columnReader';
import { readTableSteps, type ImportSource } from './csvTable';
import { runSteps, type PassSteps } from '../core/fqe/cancellation';
import { RowProblems } from './rowProblems';
import { checkTimestampsForward, settleTimestamps, type SettledTimestamps } from './timestampChecks';
import { certainRewardBounds, rewardColumn, type RewardValues } from './rewardColumn';
import { assignEpisodes, runsApart, type EpisodeAssignment, type EpisodeInputs } from './episodes';
import { medianStepSeconds } from './stepMedian';
import { computeDerivedStates, stretchesOf, withoutUndefinedRows } from './derivedStates';
import { plural } from './reportFormat';
import { buildTransitions } from './transitionBuilder';
import { constantStateWarnings, summariseDataset, type DatasetSummary } from './datasetSummary';
import { badRowsHint, dialectReport, excludedRows, excludedWarning, rowProblemList, type ExcludedRow } from './importReport';
import { leftOutWindows, logClock, readTimeWindows, recordsInWindows, type LeftOutWindow, type LogClock, type TimeWindow } from './timeWindows';
import { leftOutRuns, readRunRanges, recordsInRunRanges, type LeftOutRuns, type RunRange } from './runRanges';
import { leftOutReport, type LeftOutLines } from './leftOutReasons';
import { groupsLeftOut } from '../core/trend/groupsLeftOut';
import { trendOfImport, type TrendData } from './trendSeries';

export type { DatasetSummary, ColumnSummary } from './datasetSummary';
export type { ExcludedRow } from './importReport';
export type { LeftOutWindow, LogClock } from './timeWindows';
export type { LeftOutRuns } from './runRanges';
export type { TrendData, TrendSignal } from './trendSeries';
export type { ImportProblem, ImportProblemKind } from './importProblem';
export type { HandedBytes, ImportSource } from './csvTable';

export interface ImportedDataset {
  transitions: TransitionSet;
  summary: DatasetSummary;
  /** Every row left out, with the first reason found (badRows = 'exclude'). */
  excluded: ExcludedRow[];
  /** Sentences for the import report: dialect, date order, episodes, transitions per rule. */
  episodeReport: string[];
  /** Where episodeReport holds the sentences on the runs and time windows left out (data/leftOutReasons.ts writes them again when a reason changes). */
  leftOutLines: LeftOutLines;
  /** Data rows read (without the header and blank lines at the end). */
  rowCount: number;
  /** Each time window left out (data.csv.excludedTimes) and how many rows it left out; their rows are in summary.excludedRowCount, not in `excluded`. */
  timeWindows: LeftOutWindow[];
  /** Each range of runs left out (data.csv.excludedRuns) with its runs and rows; their rows are in summary.excludedRowCount, not in `excluded` nor in a window's count. */
  runsLeftOut: LeftOutRuns[];
  /** The run column's labels in the order the runs first appear (core/runLabelText.ts writes one); empty without a run column. */
  runLabels: readonly string[];
  /** The timestamp column's first and last time, when there is one. */
  clock?: LogClock;
  /** The logged signals over every row, as min/max envelopes for drawing (trendSeries.ts). */
  trend: TrendData;
}

const lineOf = (record: number): number => record + 2;

export function importDataset(source: ImportSource, fileName: string, csv: CsvSettings, columns: ColumnRoles): Result<ImportedDataset> {
  return runSteps(importDatasetSteps(source, fileName, csv, columns));
}

/**
 * importDataset as a generator that yields between blocks of records and between stages
 * (core/fqe/cancellation.ts), so a host that drives it paced hears a stop request within a block.
 */
export function* importDatasetSteps(source: ImportSource, fileName: string, csv: CsvSettings, columns: ColumnRoles): PassSteps<Result<ImportedDataset>> {
  const csvTable = yield* readTableSteps(source, fileName, csv, columns);
  if (!csvTable.ok) return csvTable;
  const { table, plan, dialect, encoding, problems } = csvTable.value;
  if (table.recordCount === 0) {
    return failure(importProblem('header-only', `${fileName}, line 2`, 'the file has a header line but no data rows below it'));
  }
  const timestamps = settleTimestampColumn(columns, table, problems);
  const runLabels = columns.episode.kind === 'column' ? table.labels.get(columns.episode.column) : undefined;
  const episodeCodes = runLabels?.codes;
  const clock = timestamps && logClock(timestamps.seconds, episodeCodes);
  const read = readTimeWindows(csv.excludedTimes ?? [], timestamps?.column, timestamps?.decision.order ?? 'dayFirst', clock);
  const runs = readRunRanges(csv.excludedRuns ?? [], columns.episode, runLabels);
  if (read.problems.length + runs.problems.length > 0) return failure(...read.problems, ...runs.problems);
  const rewards = rewardColumn(columns.reward, plan.rewardExpression, table.numbers, table.recordCount, problems);
  if (timestamps) checkTimestampsForward(timestamps.column, timestamps.seconds, problems, lineOf, episodeCodes);
  // A row in a time window or a run left out is not a bad row: its problems neither stop the import nor list it twice.
  // A row of a run left out is counted by its range only (the whole run goes), not by a window it also lies in.
  const inRunRange = recordsInRunRanges(runs.ranges, runLabels, table.recordCount);
  const inWindow = recordsInWindows(read.windows, timestamps?.seconds, table.recordCount);
  // Before the runs left out forget their rows' problems and windows: the whole log (for the run-order check) still drops those rows.
  const wholeLog = runs.ranges.length > 0 ? wholeLogRecords(inRunRange, inWindow, problems) : undefined;
  inRunRange.forEach((k, r) => { if (k > 0) inWindow[r] = 0; });
  inWindow.forEach((w, r) => { if (w > 0) problems.forget(r); });
  inRunRange.forEach((k, r) => { if (k > 0) problems.forget(r); });
  if (problems.count > 0 && csv.badRows === 'stop') return failure(...rowProblemList(problems, fileName, lineOf), badRowsHint(problems.badRecords().length, fileName));
  yield;
  return yield* assemble({ fileName, columns, dialect, plan, table, problems, rewards, timestamps, encoding, clock, windows: read.windows, inWindow, runRanges: runs.ranges, inRunRange, wholeLog });
}

/** What the whole log drops that the runs left out forget: a record of such a run with a problem, and the window each record lies in. */
function wholeLogRecords(inRunRange: Uint16Array, inWindow: Uint16Array, problems: RowProblems): WholeLogRecords {
  const dropped = new Uint8Array(inRunRange.length);
  inRunRange.forEach((k, r) => { if (k > 0 && (inWindow[r] > 0 || problems.isBad(r))) dropped[r] = 1; });
  return { dropped, inWindow: inWindow.slice() };
}

function runLabelsOf(columns: ColumnRoles, table: TableColumns): readonly string[] {
  return columns.episode.kind === 'column' ? table.labels.get(columns.episode.column)?.values ?? [] : [];
}

function settleTimestampColumn(columns: ColumnRoles, table: TableColumns, problems: RowProblems): (SettledTimestamps & { column: string }) | undefined {
  const column = timestampColumnOf(columns);
  if (column === undefined) return undefined;
  return { column, ...settleTimestamps(column, table.timestamps.get(column)!, problems, lineOf) };
}

interface Stages {
  fileName: string;
  columns: ColumnRoles;
  dialect: Dialect;
  plan: ColumnPlan;
  table: TableColumns;
  problems: RowProblems;
  rewards: RewardValues;
  timestamps?: SettledTimestamps & { column: string };
  encoding: { name: TextEncodingName; how: 'byte-order mark' | 'detected' };
  clock?: LogClock;
  windows: TimeWindow[];
  inWindow: Uint16Array; // records: 1 + the window holding the record, or 0
  runRanges: RunRange[];
  inRunRange: Uint16Array; // records: 1 + the range of runs left out holding the record's run, or 0
  /** Present only when runs are left out: what the whole log, built for the run-order check, leaves out of those runs. */
  wholeLog?: WholeLogRecords;
}

interface WholeLogRecords {
  dropped: Uint8Array; // records: 1 where a row of a run left out has a problem or lies in a time window
  inWindow: Uint16Array; // records: as Stages.inWindow before the runs left out took their rows from the windows
}

function* assemble(s: Stages): PassSteps<Result<ImportedDataset>> {
  const { columns, table, fileName } = s;
  const kept = new Uint8Array(table.recordCount).fill(1);
  for (const r of s.problems.badRecords()) kept[r] = 0;
  s.inWindow.forEach((w, r) => { if (w > 0) kept[r] = 0; });
  s.inRunRange.forEach((k, r) => { if (k > 0) kept[r] = 0; });
  if (!kept.includes(1)) {
    const why = s.windows.length + s.runRanges.length === 0 ? 'every data row has a problem' : 'every data row has a problem or lies in a time window or run left out';
    return failure(...rowProblemList(s.problems, fileName, lineOf), importProblem('no-usable-rows', fileName, `${why}, so no row is left to import`));
  }
  // Found once for the run rule and the summary (each finding is a pass over the records).
  const periodSeconds = s.timestamps ? medianStepSeconds(s.timestamps.seconds, kept) : NaN;
  const { derived, episodeInputs, transitions, report } = transitionsOf(s, { kept, inWindow: s.inWindow, inRunRange: s.inRunRange }, periodSeconds);
  yield;
  const { episodes, derivedValues } = derived;
  const usedRows = derived.kept;
  if (transitions.count === 0) {
    return failure(importProblem('no-transitions', fileName, 'no transitions could be formed: every run has a single usable row; expected consecutive rows of the same run (or next-state columns)'));
  }
  yield;
  const summary = summarise(s, kept, transitions, derivedValues, usedRows, periodSeconds);
  yield;
  const excluded = excludedRows(s.problems, lineOf);
  const warnings: ImportProblem[] = [...s.plan.warnings, ...constantStateWarnings(summary, fileName), ...excludedWarning(excluded, table.recordCount, fileName, table.lastTextLine)];
  const timeWindows = leftOutWindows(s.windows, s.inWindow, kept, s.windows.length > 0 ? runsApart(columns.episode, episodeInputs) : undefined);
  const runsLeftOut = leftOutRuns(s.runRanges, s.inRunRange);
  const head = [...dialectReport(s.dialect, s.timestamps?.column, s.timestamps?.decision), encodingReport(s.encoding)];
  const leftOut = leftOutReport(runsLeftOut, timeWindows, s.clock, columns.episode);
  const episodeReport = [...head, ...leftOut, ...episodes.report, ...derived.report, ...report];
  const leftOutLines = { start: head.length, count: leftOut.length };
  const envelope = trendOfImport(columns, table.numbers, s.rewards.values, s.timestamps?.seconds, table.recordCount, lineOf, s.clock?.runRestarts);
  const trend = s.runRanges.length > 0 ? { ...envelope, leftOut: groupsLeftOut(s.inRunRange, envelope.rowsPerGroup, envelope.time.length) } : envelope;
  const rewardBounds = certainRewardBounds(columns.reward, s.plan.rewardExpression);
  const wholeLog = s.wholeLog && wholeLogOf(s, kept, s.wholeLog, periodSeconds);
  yield;
  return success({ transitions: { ...transitions, ...(rewardBounds ? { rewardBounds } : {}), ...(wholeLog ? { wholeLog } : {}) }, summary, excluded, episodeReport, leftOutLines, rowCount: table.recordCount, timeWindows, runsLeftOut, runLabels: runLabelsOf(columns, table), ...(s.clock ? { clock: s.clock } : {}), trend }, warnings);
}

/** Episodes, derived states and transitions over the rows `rows.kept` (the import's, or the whole log's). */
function transitionsOf(s: Stages, rows: Pick<EpisodeInputs, 'kept' | 'inWindow' | 'inRunRange'>, periodSeconds: number) {
  const { columns, table } = s;
  const terminal = columns.terminal === undefined ? undefined : table.flags.get(columns.terminal);
  const episodeInputs = {
    ...rows, terminal, lineOf, medianStepSeconds: periodSeconds,
    labels: columns.episode.kind === 'column' ? table.labels.get(columns.episode.column) : undefined,
    timestampsSeconds: s.timestamps?.seconds,
    isBlankLine: (r: number) => s.problems.firstProblem(r)?.problem.kind === 'blank-line',
  };
  const derived = derivedStates(s, episodeInputs, assignEpisodes(columns.episode, episodeInputs));
  const { episodes, derivedValues } = derived;
  const number = (name: string): Float64Array => table.numbers.get(name) ?? derivedValues.get(name)!;
  const { transitions, report } = buildTransitions({
    kept: derived.kept, supplyOnlyRows: derived.supplyOnlyRows, episodeOf: episodes.episodeOf, episodeCount: episodes.episodeCount, hasStart: episodes.hasStart, rewards: s.rewards.values, rewardSign: s.rewards.sign, terminal, lineOf,
    states: columns.states.map((c) => number(c.column)),
    actions: columns.actions.map((c) => number(c.column)),
    nextStates: columns.nextState.kind === 'columns' ? columns.nextState.columns.map(number) : undefined,
    stateNames: columns.states.map((c) => c.column),
    actionNames: columns.actions.map((c) => c.column),
    labels: episodeInputs.labels,
  });
  return { derived, episodeInputs, transitions, report };
}

/**
 * The whole log for the run-order check (core/transitions.ts WholeLog): the import's rows and the rows of the
 * runs left out, save those with a problem or in a time window; runs in data order, each marked kept or not
 * by its first row. Its reports are not the import's and are dropped.
 */
function wholeLogOf(s: Stages, kept: Uint8Array, whole: WholeLogRecords, periodSeconds: number): WholeLog {
  const rows = kept.map((k, r) => (k || (s.inRunRange[r] > 0 && !whole.dropped[r]) ? 1 : 0));
  const { transitions } = transitionsOf(s, { kept: rows, inWindow: whole.inWindow, inRunRange: new Uint16Array(rows.length) }, periodSeconds);
  const keptRuns = new Uint8Array(transitions.episodeCount);
  for (let i = transitions.count - 1; i >= 0; i--) keptRuns[transitions.episode[i]] = s.inRunRange[transitions.sourceLine[i] - 2] > 0 ? 0 : 1;
  return { transitions, keptRuns };
}

/**
 * Derived states along the episodes (derivedStates.ts). Where one is undefined on an episode's
 * first row, that row is taken out of the rows that start transitions and the episodes are
 * assigned again on the rows left (an episode reduced to nothing disappears; the cuts between the
 * others stay where they were).
 */
function derivedStates(s: Stages, inputs: EpisodeInputs, episodes: EpisodeAssignment) {
  const definitions = s.columns.derived ?? [];
  const stateNames = new Set(s.columns.states.map((c) => c.column));
  const used = definitions.filter((d) => stateNames.has(d.name));
  if (used.length === 0) return { episodes, derivedValues: new Map<string, Float64Array>(), kept: inputs.kept, report: [] as string[], supplyOnlyRows: 0 };
  const stretchOf = stretchesOf(inputs.kept, episodes.episodeOf); // a row excluded mid-run: no value reaches past it
  const { values, leadingRowsUndefined, rowsUndefinedAfterGap } = computeDerivedStates(used, {
    kept: inputs.kept, episodeOf: episodes.episodeOf, column: (name) => s.table.numbers.get(name)!, timestampsSeconds: s.timestamps?.seconds, stretchOf,
    firstRowKept: episodes.hasStart,
  });
  const report = [`Derived states computed along each run: ${used.map((d) => `${d.name} (${d.kind === 'previous' && previousSteps(d) > 1 ? `value ${previousSteps(d)} rows back` : DERIVED_WORDS[d.kind]})`).join(', ')}.`];
  const midRun = stretchOf.reduce((a, b) => Math.max(a, b), -1) + 1 - episodes.episodeCount; // stretches that begin after a row excluded mid-run
  const lostFirstRows = episodes.hasStart.reduce((a, h) => a + (h ? 0 : 1), 0); // runs whose first kept row is mid-run
  const atStart = Math.max(0, ...leadingRowsUndefined.values()), afterGap = midRun + lostFirstRows > 0 ? Math.max(0, ...rowsUndefinedAfterGap.values()) : 0;
  if (atStart === 0 && afterGap === 0) return { episodes, derivedValues: values, kept: inputs.kept, report, supplyOnlyRows: 0 };
  const { kept, ...removed } = withoutUndefinedRows(inputs.kept, stretchOf, episodes.episodeOf, atStart, afterGap, episodes.hasStart);
  if (atStart > 0) report.push(undefinedStartReport(leadingRowsUndefined, atStart, removed.atStart));
  if (afterGap > 0) report.push(undefinedAfterGapReport(rowsUndefinedAfterGap, { midRun, lostFirstRows }, afterGap, removed.afterGap));
  // The first row where every derived state is defined is the run's start: a run whose own first row
  // was a valid start keeps one (the rows removed here are not excluded rows, so no start is lost).
  const again = assignEpisodes(s.columns.episode, { ...inputs, kept, medianStepSeconds: undefined }); // other rows kept: the median is found again
  const hasStart = new Uint8Array(again.episodeCount), seen = new Set<number>();
  for (let r = 0, last = -1; r < kept.length; r++) {
    if (!kept[r] || again.episodeOf[r] === last) continue;
    last = again.episodeOf[r];
    // a run cut again where rows after an excluded one were taken out (a timestamp gap) is no start there
    hasStart[last] = seen.has(episodes.episodeOf[r]) ? 0 : episodes.hasStart[episodes.episodeOf[r]];
    seen.add(episodes.episodeOf[r]);
  }
  const lost = (line: string) => /first row to exclusion/.test(line);
  const episodeReport = [...again.report.filter((line) => !lost(line)), ...episodes.report.filter(lost)];
  // the rows taken out here only supply values to later rows: the row account counts them as such
  return { episodes: { ...again, hasStart, report: episodeReport }, derivedValues: values, kept, report, supplyOnlyRows: removed.atStart + removed.afterGap };
}

function undefinedStartReport(undefinedRows: Map<string, number>, rows: number, removed: number): string {
  const names = [...undefinedRows.keys()].join(', '), has = undefinedRows.size === 1 ? 'has' : 'have';
  const first = rows === 1 ? 'the first row of each run only supplies the value before it' : `the first ${rows} rows of each run only supply the values before them`;
  return `${names} ${has} no initial value, so ${first}: ${plural(removed, 'row')} start no transition.`;
}

function undefinedAfterGapReport(rowsBack: Map<string, number>, gaps: { midRun: number; lostFirstRows: number }, rows: number, removed: number): string {
  const names = [...rowsBack.keys()].join(', '), next = rows === 1 ? 'the next row' : `the next ${rows} rows`;
  const where = [
    ...(gaps.midRun > 0 ? [`After each of the ${gaps.midRun} places a row was excluded mid-run`] : []),
    ...(gaps.lostFirstRows > 0 ? [`${gaps.midRun > 0 ? 'in' : 'In'} the ${plural(gaps.lostFirstRows, 'run')} whose own first row was excluded (from the first kept row)`] : []),
  ].join(', and ');
  return `${where}, ${names} restart undefined on ${next} (no value reaches past it, and an initial value is for a run’s first rows only): ${plural(removed, 'row')} start no transition.`;
}

const DERIVED_WORDS = { errorIntegral: 'error integral', filtered: 'first-order lag', previous: 'previous value', difference: 'difference' } as const;

function summarise(s: Stages, kept: Uint8Array, transitions: TransitionSet, derived: Map<string, Float64Array>, derivedRows: Uint8Array, periodSeconds: number): DatasetSummary {
  const used: { name: string; roles: string[]; values: Float64Array; field: number; include?: Uint8Array }[] = [];
  for (const request of s.plan.requests) {
    const values = request.kind === 'number' ? s.table.numbers.get(request.name) : request.kind === 'timestamp' ? s.timestamps?.seconds : undefined;
    if (values) used.push({ name: request.name, roles: s.plan.roles.get(request.name) ?? [], values, field: request.field });
  }
  let field = Math.max(0, ...s.plan.requests.map((r) => r.field + 1));
  for (const [name, values] of derived) used.push({ name, roles: ['state', 'derived'], values, field: field++, include: derivedRows });
  used.sort((a, b) => a.field - b.field);
  const decision = s.timestamps?.decision;
  return summariseDataset({
    rowCount: s.table.recordCount, kept, transitionCount: transitions.count, episodeCount: transitions.episodeCount,
    columns: used, rewards: s.rewards,
    samplingPeriodSeconds: s.timestamps ? nullIfNaN(periodSeconds) : null,
    delimiter: s.dialect.delimiter, decimalMark: s.dialect.decimalMark, encoding: s.encoding.name,
    dateOrder: decision?.ambiguous ? decision.order : null,
  });
}

/** "Text encoding: Windows-1252 (detected; the bytes are not valid UTF-8)." */
function encodingReport(encoding: Stages['encoding']): string {
  const why = encoding.how === 'byte-order mark' ? 'from its byte-order mark' : encoding.name === 'Windows-1252' ? 'detected: the bytes are not valid UTF-8' : 'detected';
  return `Text encoding: ${encoding.name} (${why}).`;
}

function nullIfNaN(x: number): number | null {
  return Number.isNaN(x) ? null : x;
}
