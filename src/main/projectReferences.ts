/**
 * What the main process needs to know about a project document it passes through: the data file
 * it references (for the allow-list) and whether an existing file may be written over. Parsing is
 * the project layer's (parseProjectText), so main and renderer agree on what a project is.
 */
import { describeProblems } from '../core/result';
import { parseProjectText } from '../project/projectFile';

/** The project's data path as written (relative to its folder, or absolute), or null if none is readable. */
export function referencedDataPath(text: string, fileName: string): string | null {
  const loaded = parseProjectText(text, fileName);
  if (loaded.ok) return loaded.value.document.data.path;
  // A project with other problems may still name its data; the renderer shows the problems.
  try {
    const raw = JSON.parse(text.replace(/^\uFEFF/, '')) as { data?: { path?: unknown } };
    return typeof raw?.data?.path === 'string' && raw.data.path.trim() !== '' ? raw.data.path.trim() : null;
  } catch {
    return null;
  }
}

/**
 * Why an existing file must not be replaced by a save, or null when it may: a file that is not a
 * project this version reads (corrupt, from a newer version, not ours) is never overwritten
 * without the user choosing it again in a save dialog.
 */
export function overwriteRefusal(existingText: string, fileName: string): string | null {
  const loaded = parseProjectText(existingText, fileName);
  return loaded.ok ? null : describeProblems(loaded.problems.slice(0, 1));
}
