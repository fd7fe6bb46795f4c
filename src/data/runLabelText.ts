/**
 * How a run label is written wherever one is shown (the import report, problems, the Plant log's
 * runs left out): the run column's cell text exactly as the import reads it — trimmed of the spaces
 * around it, never re-written as a number, so a numeric run column's "007" or "1.0" reads as in the
 * file, and what is shown is what a person types to name the run (data.csv.excludedRuns) — in
 * straight double quotes, so "3" the label is not read as a count.
 */
export function runLabelText(label: string): string {
  return `"${label}"`;
}
