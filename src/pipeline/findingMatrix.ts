/**
 * The findings matrix: which check raised what for which policy, at a glance. Rows are the whole log,
 * each candidate, and the present controller where it has findings; columns are the kinds of finding
 * that occur (findingTopicWords.ts, in its stated order); a cell is the worst severity in it or none.
 * Each row also carries its findings, serious first, so the sentences below the matrix are grouped by
 * the same rows and a cell can point to the first sentence it stands for. Host-free: the app's
 * Coverage panel and the report's Diagnostics read the same model.
 *
 * Which row a warning belongs to: a candidate's own warnings, and those in the whole-log list that
 * name it (`candidate`), are its row; the present controller's topics (its model, its function
 * classes, its cross-checks) are its row; every other whole-log warning is the whole log's.
 */
import type { Assessment, AssessmentWarning, Severity } from './assessment';
import { FINDING_COLUMNS, OTHER_COLUMN, findingColumnOf, type FindingColumn } from './findingTopicWords';

/**
 * The whole-log topics that are about the present controller: its model (assessAssembly.ts), its
 * classes (baselineClassWarning.ts) and its cross-checks (crossCheckWarnings.ts). Written out rather
 * than imported, so the app's screens take the words without the assembly; the test checks they match.
 */
export const PRESENT_CONTROLLER_TOPICS: readonly string[] = ['presentController', 'baselineNotSettled', 'baselineContradicted', 'baselineUnconfirmed'];

export type FindingRowKind = 'log' | 'candidate' | 'presentController';

export interface FindingRow {
  /** Stable key for anchors: "log", "candidate-0", …, "present". */
  readonly key: string;
  readonly kind: FindingRowKind;
  /** The row's heading as shown: "Whole log", a candidate's name, "Present controller". */
  readonly label: string;
  /** A candidate's place in Assessment.candidates; null for the whole log and the present controller. */
  readonly candidateIndex: number | null;
  /** Its findings, serious first, otherwise in the pipeline's order. */
  readonly findings: readonly AssessmentWarning[];
  readonly serious: number;
  readonly cautions: number;
}

export interface FindingCell {
  /** The worst severity in the cell, or null for none. */
  readonly severity: Severity | null;
  /** How many findings the cell stands for. */
  readonly count: number;
  /** The index in its row's `findings` of the first it stands for (the one a link goes to); -1 when empty. */
  readonly first: number;
}

export interface FindingMatrix {
  readonly columns: readonly FindingColumn[];
  readonly rows: readonly FindingRow[];
  /** cells[row][column], in the order of `rows` and `columns`. */
  readonly cells: readonly (readonly FindingCell[])[];
}

type MatrixInput = Pick<Assessment, 'warnings' | 'candidates'>;

/** The matrix's caption, in the app and the report. */
export const FINDING_MATRIX_CAPTION = 'What the checks found, by policy: serious, caution or — for none. Each mark links to its sentence below.';

export const WHOLE_LOG_LABEL = 'Whole log';
export const PRESENT_CONTROLLER_LABEL = 'Present controller';

/** The rows, columns and cells of an assessment's findings. */
export function findingMatrix(assessment: MatrixInput): FindingMatrix {
  const rows = findingRows(assessment);
  const seen = new Set(rows.flatMap((r) => r.findings.map((w) => findingColumnOf(w.topic).key)));
  const columns = [...FINDING_COLUMNS, OTHER_COLUMN].filter((c) => seen.has(c.key));
  return { columns, rows, cells: rows.map((row) => columns.map((column) => cellOf(row, column))) };
}

function findingRows(assessment: MatrixInput): FindingRow[] {
  const logWide = assessment.warnings.filter((w) => w.candidate === undefined && !PRESENT_CONTROLLER_TOPICS.includes(w.topic));
  const present = assessment.warnings.filter((w) => w.candidate === undefined && PRESENT_CONTROLLER_TOPICS.includes(w.topic));
  const named = new Set(assessment.candidates.map((c) => c.name));
  // A whole-log warning naming a policy that is not a candidate (never expected) stays with the whole log.
  const stray = assessment.warnings.filter((w) => w.candidate !== undefined && !named.has(w.candidate));
  return [
    rowOf('log', 'log', WHOLE_LOG_LABEL, null, [...logWide, ...stray]),
    ...assessment.candidates.map((c, i) => rowOf(`candidate-${i}`, 'candidate', c.name, i, [...c.warnings, ...assessment.warnings.filter((w) => w.candidate === c.name)])),
    ...(present.length ? [rowOf('present', 'presentController', PRESENT_CONTROLLER_LABEL, null, present)] : []),
  ];
}

function rowOf(key: string, kind: FindingRowKind, label: string, candidateIndex: number | null, warnings: readonly AssessmentWarning[]): FindingRow {
  const findings = [...warnings.filter((w) => w.severity === 'serious'), ...warnings.filter((w) => w.severity !== 'serious')];
  const serious = findings.filter((w) => w.severity === 'serious').length;
  return { key, kind, label, candidateIndex, findings, serious, cautions: findings.length - serious };
}

function cellOf(row: FindingRow, column: FindingColumn): FindingCell {
  const first = row.findings.findIndex((w) => findingColumnOf(w.topic) === column);
  const count = row.findings.filter((w) => findingColumnOf(w.topic) === column).length;
  // Serious findings come first in the row, so the first in the column is its worst.
  return { severity: first < 0 ? null : row.findings[first].severity, count, first };
}

/** "1 serious, 2 cautions", "no findings": a row's count, the summary line of its group. */
export function findingCountText(row: Pick<FindingRow, 'serious' | 'cautions'>): string {
  const parts = [row.serious ? `${row.serious} serious` : '', row.cautions ? `${row.cautions} caution${row.cautions === 1 ? '' : 's'}` : ''].filter(Boolean);
  return parts.length ? parts.join(', ') : 'no findings';
}

/** A cell as read: "serious", "caution", or "—" for none. */
export const cellText = (cell: FindingCell): string => cell.severity ?? '—';

/** A marked cell's text as it reads out of the table (a screen reader's list of links): "PI A, Weight spread: serious (2)". The app and the report. */
export function cellLabel(row: Pick<FindingRow, 'label'>, column: Pick<FindingColumn, 'title'>, cell: FindingCell): string {
  return `${row.label}, ${column.title}: ${cellText(cell)}${cell.count > 1 ? ` (${cell.count})` : ''}`;
}

/** The anchor of a row's n-th finding, the same in the app and the report. */
export const findingAnchor = (row: Pick<FindingRow, 'key'>, index: number): string => `finding-${row.key}-${index}`;
