/**
 * The words of an import: the problem list of a failed import (in file order, capped), the list
 * of excluded rows, and the sentences on how the file was read.
 */
import { importProblem, type ImportProblem, type ImportProblemKind } from './importProblem';
import type { Dialect } from './csvDialect';
import type { DateOrderDecision } from './dateOrder';
import type { RowProblems } from './rowProblems';
import { formatCount, plural } from './reportFormat';
import { shareText } from '../core/shareText';

export interface ExcludedRow {
  /** 1-based line as a spreadsheet numbers it (header = line 1). */
  readonly line: number;
  readonly column?: string;
  readonly kind: ImportProblemKind;
  readonly reason: string;
}

/** Problems shown in full before "… and N more". */
export const LISTED_PROBLEMS = 50;

export function whereOf(fileName: string, line: number, column?: string): string {
  return column === undefined ? `${fileName}, line ${line}` : `${fileName}, line ${line}, column ${column}`;
}

export function rowProblemList(problems: RowProblems, fileName: string, lineOf: (record: number) => number): ImportProblem[] {
  const listed = problems.inFileOrder().slice(0, LISTED_PROBLEMS).map((p) => importProblem(p.kind, whereOf(fileName, lineOf(p.record), p.column), p.reason));
  const more = problems.count - listed.length;
  if (more > 0) {
    listed.push(importProblem('more-problems', fileName,
      `… and ${plural(more, 'more problem')} (${formatCount(problems.count)} in all, the first ${LISTED_PROBLEMS} shown)`));
  }
  return listed;
}

/**
 * The closing problem of an import stopped by rows that cannot be used: how many, and how to
 * import without them, in the words of the Plant log step and of the project file. `rows` carries
 * the count as data, so the app can offer the switch with it.
 */
export function badRowsHint(rows: number, fileName: string): ImportProblem {
  const them = rows === 1 ? 'it' : 'them';
  return {
    ...importProblem('bad-rows', fileName,
      `${plural(rows, 'row')} cannot be used. To import without ${them}, fix the file, or on the Plant log step set “Rows that cannot be used” to `
      + `“Leave them out and list them” (in the project file: "badRows": "exclude" under data.csv); each row left out is then counted and listed with its reason. `
      + 'To leave out a whole period instead (a start-up, a plant test), add a time window left out (data.csv.excludedTimes), or, with a run column, leave out whole runs by label (data.csv.excludedRuns).'),
    rows,
  };
}

export function excludedRows(problems: RowProblems, lineOf: (record: number) => number): ExcludedRow[] {
  return problems.badRecords().map((record) => {
    const { problem, count } = problems.firstProblem(record)!;
    const others = count > 1 ? ` (and ${plural(count - 1, 'more problem')} on this line)` : '';
    const reason = `${problem.reason}${others}`;
    const line = lineOf(record), kind = problem.kind;
    return problem.column === undefined ? { line, kind, reason } : { line, column: problem.column, kind, reason };
  });
}

/**
 * The warning that rows were left out. `lastTextLine` is the file's last line of text with a row on
 * it: when the rows (plus the header) are fewer, some row spans several lines of text (a quoted
 * line break, or a quote never closed), and the warning says how many lines the rows hold.
 */
export function excludedWarning(excluded: readonly ExcludedRow[], rowCount: number, fileName: string, lastTextLine = rowCount + 1): ImportProblem[] {
  if (excluded.length === 0) return [];
  const first = excluded.slice(0, 5).map((e) => e.line).join(', ');
  const extraLines = lastTextLine - (rowCount + 1);
  const spans = extraLines > 0
    ? `; the file’s ${formatCount(lastTextLine)} lines of text hold the header and ${formatCount(rowCount)} rows, so rows span ${formatCount(extraLines)} more lines than one each (a quoted line break or a quote never closed) — see the reasons`
    : '';
  return [importProblem('rows-excluded', fileName,
    `${plural(excluded.length, 'row')} of ${formatCount(rowCount)} (${shareText(excluded.length / rowCount)}) excluded because they could not be used (first at line${excluded.length > 1 ? 's' : ''} ${first}); each is listed with its reason${spans}`)];
}

const DELIMITER_NAMES: Record<string, string> = { ',': 'comma', ';': 'semicolon', '\t': 'tab' };

export function dialectReport(dialect: Dialect, timestampColumn?: string, decision?: DateOrderDecision): string[] {
  const how = (detected: boolean): string => (detected ? 'detected' : 'as set');
  const lines = [
    `Fields separated by ${DELIMITER_NAMES[dialect.delimiter]} (${how(dialect.delimiterDetected)}); decimal mark "${dialect.decimalMark}" (${how(dialect.decimalMarkDetected)}).`,
  ];
  if (timestampColumn !== undefined && decision?.ambiguous) lines.push(`Dates in column ${timestampColumn}: ${decision.reason}.`);
  return lines;
}
