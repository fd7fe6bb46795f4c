/**
 * Imports follow the document: whenever the CSV settings, the column roles or the data bytes
 * change, and the roles are complete enough to read transitions, the worker imports again (after
 * a short pause, so a burst of edits costs one import). CSV settings that change the dialect also
 * refresh the header preview. An import in progress stops in the worker when a newer one is asked
 * for, and on a stop message when the roles no longer make transitions. A reason given for a time
 * window or runs left out is a note: editing it imports nothing, the last import's report takes it
 * (data/leftOutReasons.ts).
 */
import type { ProjectDocument } from '../../../project/schema';
import type { DocumentStore } from '../document/documentStore';
import type { EvaluationClient } from '../worker/evaluationClient';
import { csvAsData, importKey } from '../../../shared/runKey';
import { withCurrentReasons } from '../../../data/leftOutReasons';
import type { SessionStore } from './sessionStore';

export const IMPORT_PAUSE_MS = 250;

/** Enough roles to form transitions: a state, an action and a reward (column or expression). */
export function rolesComplete(doc: ProjectDocument): boolean {
  const c = doc.columns;
  const reward = c.reward.kind === 'column' ? c.reward.column : c.reward.expression;
  return c.states.length > 0 && c.actions.length > 0 && reward.trim() !== '';
}

export function startAutoImport(documents: DocumentStore, session: SessionStore, client: EvaluationClient): () => void {
  let timer: ReturnType<typeof setTimeout> | null = null;
  let inspected = { version: -1, csv: '' };
  let importedKey = '';
  /** Counts import requests: only the latest one's answer is shown (a stopped one may answer late, for the same key). */
  let requests = 0;

  async function importNow(doc: ProjectDocument, key: string): Promise<void> {
    const request = ++requests;
    session.set((s) => ({ ...s, importState: { status: 'importing', key } }));
    const result = await client.call('importData', { project: doc });
    if (request !== requests || session.get().importState.status !== 'importing' || currentKey() !== key) return; // superseded
    session.set((s) => ({
      ...s,
      importState: result.ok ? { status: 'done', key, result: result.value, warnings: result.warnings } : { status: 'failed', key, problems: result.problems },
    }));
  }

  async function inspectAgain(doc: ProjectDocument, version: number): Promise<void> {
    const result = await client.call('inspect', { csv: doc.data.csv });
    if (result.ok && session.get().sourceVersion === version) session.set((s) => ({ ...s, inspection: result.value }));
  }

  function currentKey(): string {
    return importKey(documents.get().history.present, session.get().sourceVersion);
  }

  /** A reason edited after the import: the import's report says the new one (a note: nothing is imported again). */
  function keepReasonsCurrent(doc: ProjectDocument): void {
    const s = session.get().importState;
    if (s.status !== 'done') return;
    const result = withCurrentReasons(s.result, doc.data.csv, doc.columns.episode);
    if (result !== s.result) session.set((x) => ({ ...x, importState: { ...s, result } }));
  }

  function check(): void {
    const s = session.get(), doc = documents.get().history.present;
    if (s.source.kind === 'none' || s.inspection === null) return;
    const csv = JSON.stringify(csvAsData(doc.data.csv)); // a reason edited is not a new dialect
    // The first look came with the bytes; later looks follow changes of the CSV settings.
    if (inspected.version === s.sourceVersion && inspected.csv !== csv) void inspectAgain(doc, s.sourceVersion);
    inspected = { version: s.sourceVersion, csv };
    const key = currentKey();
    if (key === importedKey) return keepReasonsCurrent(doc);
    if (timer) clearTimeout(timer);
    if (!rolesComplete(doc)) {
      importedKey = '';
      if (s.importState.status === 'importing') void client.call('stopImport', {}); // its answer would be dropped anyway
      if (s.importState.status !== 'idle') session.set((x) => ({ ...x, importState: { status: 'idle' } }));
      return;
    }
    timer = setTimeout(() => {
      timer = null;
      importedKey = currentKey();
      void importNow(documents.get().history.present, importedKey);
    }, IMPORT_PAUSE_MS);
  }

  const stopDocuments = documents.subscribe(check);
  const stopSession = session.subscribe(check);
  return () => {
    stopDocuments();
    stopSession();
    if (timer) clearTimeout(timer);
  };
}
