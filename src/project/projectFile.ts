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
  const body = text.replace(/^\uFEFF/, '');
  const nesting = jsonNesting(body);
  if (nesting > MAX_NESTING) {
    return failure({ where: fileName, message: `is not a readable project file (its JSON nests ${nesting > 10_000 ? 'more than 10,000' : nesting} levels deep; a project nests at most ${MAX_NESTING})` });
  }
  let raw: unknown;
  try {
    raw = JSON.parse(body);
  } catch (e) {
    return failure({ where: fileName, message: `is not a readable project file (not valid JSON${jsonErrorPlace(body, e)})` });
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
  return error.issues.map((issue) => {
    // One unknown field: the location names it (candidates[0].bound), the message the known ones.
    const path = issue.code === 'unrecognized_keys' && issue.keys.length === 1 ? [...issue.path, issue.keys[0]] : issue.path;
    return { where: `${fileName}, ${formatPath(path) || '(top level)'}`, message: issue.message };
  });
}

/** Deepest JSON nesting a project may have (it needs 5; notes may hold a little structure). */
const MAX_NESTING = 64;

/** The deepest nesting of [ and { in JSON text (strings skipped), stopping early past 10,000. */
function jsonNesting(text: string): number {
  let depth = 0, deepest = 0, inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c) i++; // backslash: skip the escaped character
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x5b || c === 0x7b) {
      deepest = Math.max(deepest, ++depth);
      if (deepest > 10_000) return deepest;
    } else if (c === 0x5d || c === 0x7d) depth--;
  }
  return deepest;
}

/**
 * ": line L, column C" of a JSON syntax error when the parser gives a position, else "". The
 * parser's own message is not shown: it quotes the text around the error, and a file that is not
 * a project (a key, a password file) must never be echoed.
 */
function jsonErrorPlace(text: string, error: unknown): string {
  const match = /position (\d+)/.exec(error instanceof Error ? error.message : '');
  if (!match) return '';
  const position = Number(match[1]);
  const before = text.slice(0, position);
  const line = before.split('\n').length, column = position - before.lastIndexOf('\n');
  return `: line ${line}, column ${column}`;
}

function formatPath(path: readonly PropertyKey[]): string {
  return path.reduce<string>((text, key) => (typeof key === 'number' ? `${text}[${key}]` : text ? `${text}.${String(key)}` : String(key)), '');
}
