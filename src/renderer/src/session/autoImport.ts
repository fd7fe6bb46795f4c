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
import type { SessionState, SessionStore } from './sessionStore';

export const IMPORT_PAUSE_MS = 250;

/** Enough roles to form transitions: a state, an action and a reward (column or expression). */
export function rolesComplete(doc: ProjectDocument): boolean {
  const c = doc.columns;
  const reward = c.reward.kind === 'column' ? c.reward.column : c.reward.expression;
  return c.states.length > 0 && c.actions.length > 0 && reward.trim() !== '';
}

/** What the parts of the following share: the stores, the worker client and what was last asked of it. */
interface Follower {
  readonly documents: DocumentStore;
  readonly session: SessionStore;
  readonly client: EvaluationClient;
  /** The pause before an import, while edits come in. */
  timer: ReturnType<typeof setTimeout> | null;
  /** The source version and the CSV settings (reasons blanked, csvAsData) of the last look at the header. */
  inspected: HeaderLook;
  /** The key of the import last asked for; '' when none stands (the roles were incomplete). */
  importedKey: string;
  /** Counts import requests: only the latest one's answer is shown (a stopped one may answer late, for the same key). */
  requests: number;
}

/** A look at the header: for which bytes (the session's source version) and which CSV settings. */
export interface HeaderLook {
  readonly version: number;
  readonly csv: string;
}

export function startAutoImport(documents: DocumentStore, session: SessionStore, client: EvaluationClient): () => void {
  const f: Follower = { documents, session, client, timer: null, inspected: { version: -1, csv: '' }, importedKey: '', requests: 0 };
  const check = (): void => follow(f);
  const stopDocuments = documents.subscribe(check);
  const stopSession = session.subscribe(check);
  return () => {
    stopDocuments();
    stopSession();
    if (f.timer) clearTimeout(f.timer);
  };
}

/** On every change of the document or the session: look at the header again, keep reasons current, or import (after a pause). */
function follow(f: Follower): void {
  const s = f.session.get(), doc = f.documents.get().history.present;
  if (s.source.kind === 'none' || s.inspection === null) return;
  lookAgainIfDue(f, s, doc);
  if (currentKey(f) === f.importedKey) return keepReasonsCurrent(f, doc);
  if (f.timer) clearTimeout(f.timer);
  if (!rolesComplete(doc)) return stopFollowing(f, s);
  f.timer = setTimeout(() => {
    f.timer = null;
    f.importedKey = currentKey(f);
    void importNow(f, f.documents.get().history.present, f.importedKey);
  }, IMPORT_PAUSE_MS);
}

/**
 * Whether the header is read again: the same bytes (the first look came with them) under CSV
 * settings that changed as data — a reason edited is not a new dialect (`csv` is csvAsData's).
 */
export function headerLookDue(last: HeaderLook, now: HeaderLook): boolean {
  return last.version === now.version && last.csv !== now.csv;
}

function lookAgainIfDue(f: Follower, s: SessionState, doc: ProjectDocument): void {
  const now = { version: s.sourceVersion, csv: JSON.stringify(csvAsData(doc.data.csv)) };
  if (headerLookDue(f.inspected, now)) void inspectAgain(f, doc, s.sourceVersion);
  f.inspected = now;
}

function currentKey(f: Follower): string {
  return importKey(f.documents.get().history.present, f.session.get().sourceVersion);
}

async function importNow(f: Follower, doc: ProjectDocument, key: string): Promise<void> {
  const request = ++f.requests;
  f.session.set((s) => ({ ...s, importState: { status: 'importing', key } }));
  const result = await f.client.call('importData', { project: doc });
  if (request !== f.requests || f.session.get().importState.status !== 'importing' || currentKey(f) !== key) return; // superseded
  f.session.set((s) => ({
    ...s,
    importState: result.ok ? { status: 'done', key, result: result.value, warnings: result.warnings } : { status: 'failed', key, problems: result.problems },
  }));
}

async function inspectAgain(f: Follower, doc: ProjectDocument, version: number): Promise<void> {
  const result = await f.client.call('inspect', { csv: doc.data.csv });
  if (result.ok && f.session.get().sourceVersion === version) f.session.set((s) => ({ ...s, inspection: result.value }));
}

/** A reason edited after the import: the import's report says the new one (a note: nothing is imported again). */
function keepReasonsCurrent(f: Follower, doc: ProjectDocument): void {
  const s = f.session.get().importState;
  if (s.status !== 'done') return;
  const result = withCurrentReasons(s.result, doc.data.csv, doc.columns.episode);
  if (result !== s.result) f.session.set((x) => ({ ...x, importState: { ...s, result } }));
}

/** The roles no longer make transitions: nothing stands imported, an import in progress is stopped (its answer would be dropped anyway). */
function stopFollowing(f: Follower, s: SessionState): void {
  f.importedKey = '';
  if (s.importState.status === 'importing') void f.client.call('stopImport', {});
  if (s.importState.status !== 'idle') f.session.set((x) => ({ ...x, importState: { status: 'idle' } }));
}
