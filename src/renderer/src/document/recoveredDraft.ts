/**
 * A recovery copy back into a document. The copy was written while the user worked, so it may be
 * unfinished (no data file yet, a candidate half typed): a complete copy loads as any project
 * file; an unfinished one keeps every top-level setting that is valid on its own, every column
 * role and candidate that is, and the new-project default for the rest.
 */
import { parseProjectText } from '../../../project/projectFile';
import { candidateSchema, PROJECT_FORMAT, PROJECT_VERSION, projectSchema, type ProjectDocument } from '../../../project/schema';
import { newProjectDocument } from './newProject';

export interface RecoveredDraft {
  document: ProjectDocument;
  /** True when the copy passed the project schema as it was. */
  complete: boolean;
}

type Shape = Record<string, { safeParse(value: unknown): { success: boolean; data?: unknown } }>;

function validParts(raw: Record<string, unknown>, shape: Shape, base: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = { ...base };
  for (const key of Object.keys(shape)) {
    if (!(key in raw)) continue;
    const parsed = shape[key].safeParse(raw[key]);
    if (parsed.success) out[key] = parsed.data;
  }
  return out;
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

export function recoveredDraft(text: string): RecoveredDraft | null {
  const loaded = parseProjectText(text, 'recovery copy');
  if (loaded.ok) return { document: loaded.value.document, complete: true };
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    return null;
  }
  if (!isObject(raw) || raw.format !== PROJECT_FORMAT || raw.version !== PROJECT_VERSION) return null;
  const base = newProjectDocument() as unknown as Record<string, unknown>;
  const shape = projectSchema.shape as unknown as Shape;
  const document = validParts(raw, shape, base);
  for (const section of ['data', 'columns'] as const) {
    if (!isObject(raw[section])) continue;
    const sectionShape = projectSchema.shape[section].shape as unknown as Shape;
    document[section] = validParts(raw[section], sectionShape, base[section] as Record<string, unknown>);
  }
  if (Array.isArray(raw.candidates)) {
    document.candidates = raw.candidates.flatMap((c) => {
      const parsed = candidateSchema.safeParse(c);
      return parsed.success ? [parsed.data] : [];
    });
  }
  return { document: document as unknown as ProjectDocument, complete: false };
}
