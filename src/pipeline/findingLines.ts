/**
 * The sentences under the findings matrix (findingMatrix.ts) as a reader scans them: a finding said
 * in the same words of two or more candidates is said once, naming them; every other finding stays
 * in its row's group. The app's Coverage panel and the report's Diagnostics both lay out these lines,
 * so what goes where has one writer.
 *
 * "The same words": the same severity, topic and message, once a leading "<candidate's name>: " is
 * taken off (the cross-checks' sentences open with the name they are about). Only candidates' rows
 * share: the whole log is one row, and the present controller's topics are its own. Every warning of
 * every row lands in exactly one line, and each line keeps the place (row, index in the row's
 * findings) of every warning it stands for, so each matrix mark still has an anchor to go to.
 */
import type { Severity } from './assessment';
import { findingCountText, type FindingMatrix, type FindingRow } from './findingMatrix';
import { findingColumnOf } from './findingTopicWords';

/** Where a warning sits in the matrix: its row and its index in the row's findings (findingAnchor). */
export interface FindingPlace {
  readonly row: FindingRow;
  readonly index: number;
}

export interface FindingLine {
  readonly severity: Severity;
  readonly topic: string;
  /** The words, said once (without the leading candidate's name where the line is shared). */
  readonly message: string;
  /** The warnings it stands for: one place, or one per candidate when their words are the same. */
  readonly places: readonly FindingPlace[];
}

export interface FindingLines {
  /** Lines said alike of two or more candidates, serious first, each naming them (`places`). */
  readonly shared: readonly FindingLine[];
  /** Per matrix row, in its order: the row's own lines (serious first, as the row holds them). */
  readonly own: readonly (readonly FindingLine[])[];
}

/** A candidate's warning in words that do not name it, so the same finding of two candidates compares equal. */
export function wordsWithoutName(message: string, name: string): string {
  return message.startsWith(`${name}: `) ? message.slice(name.length + 2) : message;
}

const sameWordsKey = (line: Pick<FindingLine, 'severity' | 'topic' | 'message'>): string => `${line.severity}|${line.topic}|${line.message}`;

/** The lines under the matrix: shared where candidates' words are the same, else each row's own. */
export function findingLines(matrix: Pick<FindingMatrix, 'rows'>): FindingLines {
  const byWords = new Map<string, FindingPlace[]>();
  for (const row of matrix.rows.filter((r) => r.kind === 'candidate')) {
    row.findings.forEach((w, index) => {
      const key = sameWordsKey({ ...w, message: wordsWithoutName(w.message, row.label) });
      byWords.set(key, [...(byWords.get(key) ?? []), { row, index }]);
    });
  }
  // A key shared by two or more rows (the same row twice is two findings of its own).
  const isShared = (places: readonly FindingPlace[]): boolean => new Set(places.map((p) => p.row.key)).size > 1;
  const sharedKeys = new Set([...byWords].filter(([, places]) => isShared(places)).map(([key]) => key));
  const shared = [...sharedKeys].map((key) => sharedLine(byWords.get(key)!));
  const own = matrix.rows.map((row) => row.findings.flatMap((w, index): FindingLine[] => {
    const key = sameWordsKey({ ...w, message: wordsWithoutName(w.message, row.label) });
    return row.kind === 'candidate' && sharedKeys.has(key) ? [] : [{ severity: w.severity, topic: w.topic, message: w.message, places: [{ row, index }] }];
  }));
  return { shared: [...shared.filter((l) => l.severity === 'serious'), ...shared.filter((l) => l.severity !== 'serious')], own };
}

function sharedLine(places: readonly FindingPlace[]): FindingLine {
  const { row, index } = places[0], w = row.findings[index];
  return { severity: w.severity, topic: w.topic, message: wordsWithoutName(w.message, row.label), places };
}

/** How many of a row's findings are said in the shared lines (its group's count says so). */
export function sharedCountOf(lines: FindingLines, row: Pick<FindingRow, 'key'>): number {
  return lines.shared.reduce((n, line) => n + line.places.filter((p) => p.row.key === row.key).length, 0);
}

/** "PI A", "PI A and PI B", "PI A, PI B and PI C": the candidates a shared line names, in the matrix's order. */
export function namesText(names: readonly string[]): string {
  return names.map((name, k) => `${nameJoint(k, names.length)}${name}`).join('');
}

/** What goes before the k-th of `count` names: nothing, ", ", or " and " before the last (the app and the report set each name as an anchor). */
export function nameJoint(k: number, count: number): string {
  return k === 0 ? '' : k === count - 1 ? ' and ' : ', ';
}

/** The heading of the shared lines, in the app and the report. */
export const SHARED_LINES_HEADING = 'Said of several candidates';

/** A finding's severity as the line opens with it, in the app and the report. */
export const SEVERITY_WORD: Record<Severity, string> = { serious: 'Serious', caution: 'Caution' };

/** "2 cautions: Weight spread, Cross-checks": the one line a group's cautions fold behind (the columns' titles, each once). */
export function cautionsSummaryText(cautions: readonly Pick<FindingLine, 'topic'>[]): string {
  const kinds = [...new Set(cautions.map((c) => findingColumnOf(c.topic).title))];
  return `${cautions.length} caution${cautions.length === 1 ? '' : 's'}: ${kinds.join(', ')}`;
}

/** "2 serious, 2 cautions, 1 said above with other candidates": a group's count line, the app's and the report's. */
export function groupCountText(row: Pick<FindingRow, 'serious' | 'cautions'>, shared: number): string {
  return `${findingCountText(row)}${shared ? `, ${shared} said above with other candidates` : ''}`;
}
