/**
 * How a run label is written wherever one is shown (the import report, problems, the Plant log's runs
 * left out, the run-order finding): the run column's cell text exactly as the import reads it — trimmed
 * of the spaces around it, never re-written as a number, so a numeric run column's "007" or "1.0" reads
 * as in the file, and what is shown is what a person types to name the run (data.csv.excludedRuns) — in
 * straight double quotes, so "3" the label is not read as a count (a quote or backslash inside escaped as the
 * project file writes it). In core so that the data layer, the
 * renderer and the run-order words (diagnostics/runOrderChangeWords.ts) share the one writer.
 */
export function runLabelText(label: string): string {
  // As a JSON string (review39: a label holding a double quote read `"a"b"`): the same as `"${label}"` for any
  // label without a quote, backslash or control character, and otherwise exactly what the project file holds.
  return JSON.stringify(label);
}

/**
 * A label's length in Unicode code points, the count MAX_RUN_LABEL_LENGTH (core/limits.ts) limits:
 * a string's iterator steps by code point (ECMA-262, String.prototype[@@iterator]), so a surrogate
 * pair is one.
 */
export function runLabelLength(label: string): number {
  let n = 0;
  for (const _ of label) n++;
  return n;
}

/** A run as the words name it: its label where the log has a run column, else the line its first row is on. */
export interface RunName {
  readonly label: string | null;
  readonly line: number;
}

/** `run "17"`, or `the run from line 5,002` where the log has no run column. */
export function runNameText(run: RunName): string {
  return run.label !== null ? `run ${runLabelText(run.label)}` : `the run from line ${run.line.toLocaleString('en-US')}`;
}

/** `"1" to "17"`, or `"1"` when the two are one: a span of runs by label (the import report's ranges, the run-order advice). */
export function labelSpanText(first: string, last: string): string {
  return first === last ? runLabelText(first) : `${runLabelText(first)} to ${runLabelText(last)}`;
}

/** `runs "1" to "17"` (`run "1"` when the two are one), by label; null where the log has no run column. */
export function runSpanText(first: RunName, last: RunName): string | null {
  if (first.label === null || last.label === null) return null;
  return `${first.label === last.label ? 'run' : 'runs'} ${labelSpanText(first.label, last.label)}`;
}
