/**
 * Starting and stopping an evaluation. A run needs a document the schema accepts and a finished
 * import of the current data; progress reports collect in the session (the last few, enough to
 * estimate the time remaining), and the result replaces the previous evaluation.
 */
import type { Problem } from '../../../core/result';
import type { RunProgress } from '../../../shared/workerMessages';
import type { ProjectDocument } from '../../../project/schema';
import type { DocumentStore } from '../document/documentStore';
import { projectProblems, type FieldProblem } from '../document/projectProblems';
import { CANCELLED, type EvaluationClient } from '../worker/evaluationClient';
import { importKey, runKey } from '../../../shared/runKey';
import type { SessionState, SessionStore } from './sessionStore';

/** Progress reports kept for the time-remaining estimate. */
export const PROGRESS_KEPT = 40;

export interface EvaluationRunner {
  run(): Promise<void>;
  cancel(): void;
}

export function asProblems(fields: readonly FieldProblem[]): Problem[] {
  return fields.map((f) => ({ where: f.path || 'project', message: f.message }));
}

/** Why a run cannot start now, or null when it can. */
export function runBlockers(session: SessionState, documentProblems: readonly FieldProblem[], currentImportKey: string): Problem[] | null {
  if (session.run.status === 'running') return [{ where: 'evaluation', message: 'an evaluation is already running' }];
  if (documentProblems.length > 0) return asProblems(documentProblems);
  if (session.source.kind === 'none') return [{ where: 'data', message: 'choose a data file on the Plant log step' }];
  const imported = session.importState;
  if (imported.status === 'failed') return [{ where: 'data', message: 'the data could not be imported; see the Plant log step' }, ...imported.problems];
  if (imported.status !== 'done' || imported.key !== currentImportKey) return [{ where: 'data', message: 'the data is still being imported' }];
  return null;
}

/** What follows a run: the assessment starts after a successful one, and a running one stops before a new run. */
export interface RunFollowUp {
  assess(doc: ProjectDocument, runKey: string): Promise<void>;
  cancel(): void;
}

export function createEvaluationRunner(documents: DocumentStore, session: SessionStore, client: EvaluationClient, followUp?: RunFollowUp): EvaluationRunner {
  return {
    async run() {
      const doc = documents.get().history.present;
      const state = session.get();
      const blockers = runBlockers(state, projectProblems(doc), importKey(doc, state.sourceVersion));
      if (blockers) {
        session.set((s) => (s.run.status === 'running' ? s : { ...s, run: { status: 'failed', problems: blockers } }));
        return;
      }
      const fingerprint = state.importState.status === 'done' ? state.importState.result.fingerprint : '';
      followUp?.cancel();
      session.set((s) => ({ ...s, run: { status: 'running', progress: [], startsMs: [] }, evaluation: null, assessment: { status: 'idle' }, retuneMaps: { status: 'idle' } }));
      const onProgress = (progress: RunProgress): void => session.set((s) => (s.run.status !== 'running' ? s : {
        ...s,
        run: {
          status: 'running',
          progress: [...s.run.progress, progress].slice(-PROGRESS_KEPT),
          startsMs: progress.iteration === null ? [...s.run.startsMs, progress.elapsedMs] : s.run.startsMs,
        },
      }));
      const result = await client.call('evaluate', { project: doc }, onProgress);
      session.set((s) => {
        if (result.ok) return { ...s, run: { status: 'idle' }, evaluation: { evaluation: result.value, runKey: runKey(doc, fingerprint) } };
        const cancelled = result.problems.length === 1 && result.problems[0] === CANCELLED;
        return { ...s, run: cancelled ? { status: 'cancelled' } : { status: 'failed', problems: result.problems } };
      });
      if (result.ok) await followUp?.assess(doc, runKey(doc, fingerprint));
    },
    cancel() {
      if (session.get().run.status === 'running') client.cancel();
    },
  };
}
