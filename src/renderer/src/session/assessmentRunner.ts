/**
 * Starting and stopping the assessment of the last evaluation: bootstrap intervals, cross-checks,
 * diagnostics, sensitivity and the comparison, with the project's `bootstrap` settings. It starts by
 * itself after every successful run and again on request (after a cancel or a failure).
 *
 * A linear project is assessed in a worker of its own, given the data bytes: the assessment refits
 * the linear features itself, and the evaluation worker stays free to draw surfaces and slices. A
 * network project is assessed in the evaluation worker, which holds the run's (slow) network fits.
 * Cancelling works as for the run: the worker in use is terminated and restarted — for a network
 * project that takes the run's retained fits with it.
 */
import type { ProjectDocument } from '../../../project/schema';
import type { AssessRunProgress, WorkerCalls } from '../../../shared/workerMessages';
import { CANCELLED, type EvaluationClient } from '../worker/evaluationClient';
import type { DataSource, SessionStore } from './sessionStore';

export interface AssessmentRunner {
  /** Assess doc, the evaluated project (runKey its key); does nothing unless that is the current evaluation, or while one runs. */
  assess(doc: ProjectDocument, currentRunKey: string): Promise<void>;
  cancel(): void;
}

export interface AssessmentClients {
  /** The evaluation worker, holding the last run's fits. */
  evaluation: EvaluationClient;
  /** A worker for linear assessments, made on first use. */
  assessment: () => EvaluationClient;
}

function dataOf(source: DataSource): { bytes: Uint8Array; fileName: string } | null {
  if (source.kind === 'file') return { bytes: source.bytes, fileName: source.absolutePath.split(/[\\/]/).pop() ?? 'data.csv' };
  return source.kind === 'dropped' ? { bytes: source.bytes, fileName: source.fileName } : null;
}

export function createAssessmentRunner(session: SessionStore, clients: AssessmentClients): AssessmentRunner {
  let active: EvaluationClient | null = null;
  const route = (doc: ProjectDocument): { client: EvaluationClient; args: WorkerCalls['assess']['args'] } => {
    const data = doc.approximator.kind === 'linear' ? dataOf(session.get().source) : null;
    return data ? { client: clients.assessment(), args: { project: doc, data } } : { client: clients.evaluation, args: { project: doc } };
  };
  return {
    async assess(doc, currentRunKey) {
      const state = session.get();
      if (!state.evaluation || state.evaluation.runKey !== currentRunKey || state.assessment.status === 'running') return;
      const { client, args } = route(doc);
      active = client;
      session.set((s) => ({ ...s, assessment: { status: 'running', runKey: currentRunKey, progress: null } }));
      const onProgress = (progress: AssessRunProgress): void => session.set((s) => (s.assessment.status !== 'running' ? s : {
        ...s, assessment: { ...s.assessment, progress },
      }));
      const result = await client.call('assess', args, onProgress);
      if (active === client) active = null;
      session.set((s) => {
        if (s.assessment.status !== 'running' || s.assessment.runKey !== currentRunKey) return s;
        if (result.ok) return { ...s, assessment: { status: 'done', runKey: currentRunKey, assessment: result.value } };
        const cancelled = result.problems.length === 1 && result.problems[0] === CANCELLED;
        return { ...s, assessment: cancelled ? { status: 'cancelled', runKey: currentRunKey } : { status: 'failed', runKey: currentRunKey, problems: result.problems } };
      });
    },
    cancel() {
      if (session.get().assessment.status === 'running') active?.cancel();
    },
  };
}
