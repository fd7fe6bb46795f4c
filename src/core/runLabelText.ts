/**
 * How a run label is written wherever one is shown: the run column's cell text exactly as the import
 * reads it (trimmed, never re-written as a number, so "007" reads as in the file and is what a person
 * types to name the run in data.csv.excludedRuns), in straight double quotes, so "3" the label is not
 * read as a count. The same form as the import's own words (the since38 branch's data/runLabelText.ts);
 * here in core so the run-order words (diagnostics/runOrderFinding.ts) write it too.
 */
export function runLabelText(label: string): string {
  return `"${label}"`;
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

/** `runs "1" to "17"` (`run "1"` when the two are one), by label; null where the log has no run column. */
export function runSpanText(first: RunName, last: RunName): string | null {
  if (first.label === null || last.label === null) return null;
  return first.label === last.label ? `run ${runLabelText(first.label)}` : `runs ${runLabelText(first.label)} to ${runLabelText(last.label)}`;
}
