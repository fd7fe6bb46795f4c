/**
 * What stands between the document being edited and one the project schema accepts, keyed by the
 * field's path ("candidates.0.std.1") so each message can stand next to its field. Messages for
 * the things a new project lacks say what to do rather than which field is empty.
 */
import type { z } from 'zod';
import { checkProjectConsistency } from '../../../project/consistency';
import { projectSchema, type ProjectDocument } from '../../../project/schema';

export interface FieldProblem {
  /** Dotted path of the field, e.g. "candidates.0.std.1"; "" for the document as a whole. */
  readonly path: string;
  readonly message: string;
}

const GUIDANCE: Record<string, string> = {
  'data.path': 'choose a data file (CSV) first',
  'columns.states': 'give at least one column the role "state"',
  'columns.actions': 'give at least one column the role "action"',
  'columns.reward.column': 'give one column the role "reward" or "cost", or write a reward expression',
  'columns.reward.expression': 'write the reward (or cost) expression',
  candidates: 'define at least one candidate policy',
};

export function projectProblems(doc: ProjectDocument): FieldProblem[] {
  const parsed = projectSchema.safeParse(doc);
  if (!parsed.success) return schemaProblems(parsed.error);
  return checkProjectConsistency(parsed.data, 'project').map((p) => ({ path: consistencyPath(p.where), message: p.message }));
}

function schemaProblems(error: z.ZodError): FieldProblem[] {
  return error.issues.map((issue) => {
    const path = issue.path.map(String).join('.');
    return { path, message: GUIDANCE[path] ?? issue.message };
  });
}

/**
 * checkProjectConsistency names places as "project, candidates[0] "name".offset"; turn that into
 * the dotted path of the field (the candidate's index is what the editor knows it by).
 */
export function consistencyPath(where: string): string {
  const place = where.replace(/^project, /, '');
  return place
    .replace(/\[(\d+)\] "(?:[^"\\]|\\.)*"/g, '.$1')
    .replace(/\[(\d+)\]/g, '.$1')
    .replace(/^\./, '');
}

/** Problems whose path is `path` or lies inside it. */
export function problemsUnder(problems: readonly FieldProblem[], path: string): FieldProblem[] {
  return problems.filter((p) => p.path === path || p.path.startsWith(`${path}.`));
}

export function problemAt(problems: readonly FieldProblem[], path: string): string | null {
  return problems.find((p) => p.path === path)?.message ?? null;
}
