/**
 * What a save writes and how the document reads afterwards: the data file's fingerprint and row
 * count from the current import (so a changed file is noticed on reopening), and the data path
 * relative to wherever the project file landed.
 */
import type { ProjectDocument } from '../../../project/schema';
import { relativeDataPath } from '../document/dataPath';
import { importKey } from '../../../shared/runKey';
import type { SessionState } from '../session/sessionStore';

/** The document as it should be written before the project file's final place is known. */
export function documentToWrite(doc: ProjectDocument, session: SessionState, pathKnown: boolean): ProjectDocument {
  const imported = session.importState;
  let data = doc.data;
  if (imported.status === 'done' && imported.key === importKey(doc, session.sourceVersion)) {
    data = { ...data, sha256: imported.result.fingerprint, rowCount: imported.result.rowCount };
  }
  // Until the project file's folder is known, only the absolute path is sure to find the data.
  if (!pathKnown && session.source.kind === 'file') data = { ...data, path: session.source.absolutePath };
  return { ...doc, data };
}

/** The document once written to projectPath: the data path relative to that file's folder. */
export function documentAt(doc: ProjectDocument, session: SessionState, projectPath: string): ProjectDocument {
  if (session.source.kind !== 'file') return doc;
  return { ...doc, data: { ...doc.data, path: relativeDataPath(projectPath, session.source.absolutePath) } };
}

/** A file name to suggest in the save dialog: the project name without characters file systems refuse. */
export function suggestedFileName(doc: ProjectDocument): string {
  const base = doc.name.replace(/[\\/:*?"<>|\u0000-\u001f]+/g, ' ').replace(/\s+/g, ' ').trim() || 'project';
  return `${base}.spcritic`;
}
