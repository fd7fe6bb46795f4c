/**
 * Runs the project leaves out of the import by their label (data.csv.excludedRuns): the runs before
 * a retune, a trip test, a week under another controller. A range names its first and last run as
 * the run column's cells read them (core/runLabelText.ts) and takes every run between, both included,
 * in the order the runs first appear in the data (a label's codes are given in that order on import,
 * columnSink.ts); `to` absent is that one run. Every row of those runs is left out with the range's
 * reason — counted per range and reported, never dropped silently — so every later stage (runs,
 * transitions, fits, checks, start states) sees only the runs kept. A label that reappears later in
 * the file is one label: all its rows go.
 *
 * A problem names a range by its number, never by its reason (a note that changes without an
 * import: data/leftOutReasons.ts). A range stops the import with a problem naming its field when the log has no run column (runs cut
 * at time gaps or a single run have no labels to name), names a label the log does not hold (the
 * closest label offered), ends before it starts, overlaps another range, or when the ranges
 * together leave no run.
 */
import type { ColumnRoles, ExcludedRun } from '../project/schema';
import { closestName } from '../core/closestName';
import { importProblem, type ImportProblem } from './importProblem';
import { plural } from './reportFormat';
import { labelSpanText, runLabelText } from '../core/runLabelText';

/** A range read against the log: its first and last run as label codes (codes in order of first appearance). */
export interface RunRange {
  readonly from: string;
  readonly to: string;
  readonly fromCode: number;
  readonly toCode: number;
  readonly reason: string;
}

/** A range with the runs and rows it left out, for the import report, the app and `--json`. */
export interface LeftOutRuns {
  readonly from: string;
  readonly to: string;
  readonly reason: string;
  readonly runs: number;
  readonly rows: number;
}

/** The run column's labels: codes per record (−1 unreadable) into `values`, given in order of first appearance. */
export interface RunLabels {
  readonly codes: Float64Array; // records
  readonly values: readonly string[];
}

type End = 'from' | 'to';
const fieldOf = (i: number, end?: End) => ['data', 'csv', 'excludedRuns', i, ...(end ? [end] : [])];
const whereOf = (i: number, end?: End) => `data.csv.excludedRuns[${i}]${end ? `.${end}` : ''}`;

function rangeProblem(i: number, message: string, end?: End): ImportProblem {
  return { ...importProblem('bad-run-range', whereOf(i, end), message), field: fieldOf(i, end) };
}


/** What to do instead when the runs have no labels, by how the project finds its runs. */
function noRunColumn(episode: ColumnRoles['episode']): string {
  const instead = episode.kind === 'timeGap'
    ? 'runs found at time gaps have no labels: leave out time windows instead (data.csv.excludedTimes)'
    : 'the log is read as a single run, which cannot be cut by label: leave out time windows instead (data.csv.excludedTimes)';
  return `runs can be left out by label only when a column gives the runs (Runs: from a column); ${instead}`;
}

/** The ranges as label codes, or the problems that stop the import. */
export function readRunRanges(
  ranges: readonly ExcludedRun[], episode: ColumnRoles['episode'], labels: RunLabels | undefined,
): { ranges: RunRange[]; problems: ImportProblem[] } {
  if (ranges.length === 0) return { ranges: [], problems: [] };
  if (episode.kind !== 'column' || !labels) return { ranges: [], problems: [rangeProblem(0, noRunColumn(episode))] };
  const codeOf = new Map(labels.values.map((label, code) => [label, code]));
  const problems: ImportProblem[] = [], read: (RunRange & { index: number })[] = [];
  const find = (i: number, end: End, label: string): number | undefined => {
    const code = codeOf.get(label);
    if (code !== undefined) return code;
    const near = closestName(label, labels.values);
    // only a close, short, printable label is echoed (closestName.ts), never other cells of the file
    const hint = near === undefined ? `none of its ${plural(labels.values.length, 'label')} is close; write the label as its cells read` : `did you mean ${runLabelText(near)}?`;
    problems.push(rangeProblem(i, `no run of column ${episode.column} is labelled ${runLabelText(label)}; ${hint}`, end));
    return undefined;
  };
  ranges.forEach((r, i) => {
    const to = r.to ?? r.from;
    const fromCode = find(i, 'from', r.from), toCode = r.to === undefined ? fromCode : find(i, 'to', to);
    if (fromCode === undefined || toCode === undefined) return;
    if (toCode < fromCode) {
      problems.push(rangeProblem(i, `run ${runLabelText(to)} (to) appears in the data before run ${runLabelText(r.from)} (from); runs are taken in the order they first appear, so name the earlier run first`, 'to'));
    } else read.push({ from: r.from, to, fromCode, toCode, reason: r.reason, index: i });
  });
  const sorted = [...read].sort((a, b) => a.fromCode - b.fromCode);
  for (let k = 1; k < sorted.length; k++) {
    const [a, b] = [sorted[k - 1], sorted[k]];
    if (b.fromCode <= a.toCode) {
      problems.push(rangeProblem(b.index, `range ${b.index + 1} overlaps range ${a.index + 1} (${whereOf(a.index)}); join them into one range or move an end`));
    }
  }
  const leftOut = read.reduce((sum, r) => sum + r.toCode - r.fromCode + 1, 0);
  if (problems.length === 0 && leftOut >= labels.values.length) {
    problems.push(rangeProblem(ranges.length - 1, `the runs left out are all ${plural(labels.values.length, 'run')} of column ${episode.column}, so no run is left to evaluate; keep at least one run`));
  }
  return { ranges: read.map(({ index: _index, ...range }) => range), problems };
}

/** For each record, 1 + the index of the range holding its run, or 0. codes: records. */
export function recordsInRunRanges(ranges: readonly RunRange[], labels: RunLabels | undefined, recordCount: number): Uint16Array {
  const inRange = new Uint16Array(recordCount);
  if (!labels || ranges.length === 0) return inRange;
  const rangeOfCode = new Uint16Array(labels.values.length);
  ranges.forEach((r, i) => rangeOfCode.fill(i + 1, r.fromCode, r.toCode + 1));
  for (let record = 0; record < recordCount; record++) {
    const code = labels.codes[record];
    if (code >= 0) inRange[record] = rangeOfCode[code];
  }
  return inRange;
}

/** Each range with the runs it names and the rows it left out. inRange: records. */
export function leftOutRuns(ranges: readonly RunRange[], inRange: Uint16Array): LeftOutRuns[] {
  const rows = new Array<number>(ranges.length).fill(0);
  for (let r = 0; r < inRange.length; r++) if (inRange[r] > 0) rows[inRange[r] - 1]++;
  return ranges.map((range, i) => ({ from: range.from, to: range.to, reason: range.reason, runs: range.toCode - range.fromCode + 1, rows: rows[i] }));
}

/** "40 runs, "0" to "39", 40,000 rows" or "1 run, "57", 1,000 rows". */
export function leftOutRunsText(left: LeftOutRuns): string {
  return `${plural(left.runs, 'run')}, ${labelSpanText(left.from, left.to)}, ${plural(left.rows, 'row')}`;
}

/** "Runs left out by label (column run): 41 runs and 41,000 rows in all; 40 runs, "0" to "39", 40,000 rows: before the retune; …." */
export function runRangeReport(left: readonly LeftOutRuns[], column: string | undefined): string[] {
  if (left.length === 0) return [];
  const runs = left.reduce((sum, r) => sum + r.runs, 0), rows = left.reduce((sum, r) => sum + r.rows, 0);
  const each = left.map((r) => `${leftOutRunsText(r)}${r.reason ? `: ${r.reason}` : ''}`);
  return [`Runs left out by label (column ${column}): ${plural(runs, 'run')} and ${plural(rows, 'row')} in all; ${each.join('; ')}.`];
}
