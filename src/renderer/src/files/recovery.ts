/**
 * Unsaved work survives a crash: every RECOVERY_INTERVAL_MS while the document has unsaved changes,
 * its text goes to the main process's recovery file. On start, a copy left by a session that did not
 * close cleanly is offered back (restore or discard).
 */
import type { AppApi } from '../../../shared/appApi';
import { isDirty, serializedDocument, type DocumentStore } from '../document/documentStore';
import { recoveredDraft } from '../document/recoveredDraft';
import type { DataLoading } from '../session/dataLoading';
import { emptySession, type SessionStore } from '../session/sessionStore';
import type { QuestionStore } from '../state/questionStore';

export const RECOVERY_INTERVAL_MS = 60_000;

export function startRecoveryAutosave(api: AppApi, documents: DocumentStore, intervalMs = RECOVERY_INTERVAL_MS): () => void {
  let lastWritten = '';
  const timer = setInterval(() => {
    const state = documents.get();
    if (!isDirty(state)) return;
    const text = serializedDocument(state.history.present);
    if (text === lastWritten) return;
    lastWritten = text;
    api.writeRecovery(text, state.projectPath).catch(() => {
      lastWritten = ''; // try again at the next tick
    });
  }, intervalMs);
  return () => clearInterval(timer);
}

interface OfferDeps {
  api: AppApi;
  documents: DocumentStore;
  session: SessionStore;
  questions: QuestionStore;
  data: DataLoading;
}

export async function offerRecovery({ api, documents, session, questions, data }: OfferDeps): Promise<void> {
  const offer = await api.pendingRecovery().catch(() => null);
  if (!offer) return;
  const when = new Date(offer.savedAt).toLocaleString();
  const answer = await questions.ask({
    title: 'Recover unsaved work?',
    body: `Setpoint Critic did not close cleanly last time. A copy of unsaved work from ${when}${offer.projectPath ? ` (${offer.projectPath})` : ' (a project never saved)'} was kept.`,
    choices: [{ id: 'restore', label: 'Restore it', primary: true }, { id: 'discard', label: 'Discard it' }],
    dismiss: 'restore',
  });
  if (answer === 'discard') {
    await api.discardRecovery();
    return;
  }
  const draft = recoveredDraft(offer.text);
  if (!draft) {
    session.set((s) => ({ ...s, notice: { tone: 'error', title: 'The recovery copy could not be read', problems: [{ where: 'recovery copy', message: 'it is not a readable project document' }] } }));
    return;
  }
  // Restored work is unsaved work: an empty baseline keeps the unsaved-changes marker on.
  documents.load(draft.document, offer.projectPath, false);
  session.set((s) => ({
    ...emptySession(s.recentProjects, s.sourceVersion),
    notice: offer.projectPath || draft.document.data.path === '' ? null : {
      tone: 'warning', title: 'Choose the data file again', problems: [{ where: 'data', message: `the restored project was never saved, so “${draft.document.data.path}” must be chosen again with “Choose CSV file…”` }],
    },
  }));
  if (offer.projectPath && draft.document.data.path !== '') await data.readProjectData(offer.projectPath);
}
