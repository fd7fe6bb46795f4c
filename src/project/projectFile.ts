/**
 * Reading and writing the project document as text. Pure: the caller reads and writes the bytes
 * (the main process's atomic file store, or the CLI), so every host shares one parser.
 */
import type { z } from 'zod';
import { failure, success, type Problem, type Result } from '../core/result';
import { checkProjectConsistency } from './consistency';
import { MigrationError, migrateDocument } from './migrations';
import { PROJECT_FORMAT, projectSchema, type ProjectDocument } from './schema';

export interface LoadedProject {
  document: ProjectDocument;
  /** The format version found in the file; lower than the current one when it was migrated. */
  fromVersion: number;
}

export function parseProjectText(text: string, fileName: string): Result<LoadedProject> {
  let raw: unknown;
  try {
    raw = JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (e) {
    return failure({ where: fileName, message: `is not a readable project file (not valid JSON: ${(e as Error).message})` });
  }
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) {
    return failure({ where: fileName, message: 'is not a project file: expected a JSON object' });
  }
  const object = raw as Record<string, unknown>;
  if (object.format !== PROJECT_FORMAT) {
    return failure({ where: `${fileName}, format`, message: `expected "${PROJECT_FORMAT}", found ${JSON.stringify(object.format)}; this is not a Setpoint Critic project` });
  }
  let migrated: { document: Record<string, unknown>; fromVersion: number };
  try {
    migrated = migrateDocument(object);
  } catch (e) {
    if (e instanceof MigrationError) return failure({ where: fileName, message: e.message });
    throw e;
  }
  const parsed = projectSchema.safeParse(migrated.document);
  if (!parsed.success) return failure(...zodProblems(parsed.error, fileName));
  const problems = checkProjectConsistency(parsed.data, fileName, migrated.document);
  if (problems.length > 0) return failure(...problems);
  return success({ document: parsed.data, fromVersion: migrated.fromVersion });
}

/** Stable, readable JSON (2-space indent, trailing newline) so project files diff well. */
export function serializeProject(document: ProjectDocument): string {
  return `${JSON.stringify(document, null, 2)}\n`;
}

export function zodProblems(error: z.ZodError, fileName: string): Problem[] {
  return error.issues.map((issue) => ({
    where: `${fileName}, ${formatPath(issue.path) || '(top level)'}`,
    message: issue.message,
  }));
}

function formatPath(path: readonly PropertyKey[]): string {
  return path.reduce<string>((text, key) => (typeof key === 'number' ? `${text}[${key}]` : text ? `${text}.${String(key)}` : String(key)), '');
}
