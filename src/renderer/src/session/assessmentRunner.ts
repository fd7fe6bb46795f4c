/**
 * Starting and stopping the assessment of the last evaluation: bootstrap intervals, cross-checks,
 * diagnostics, sensitivity and the comparison, with the project's `bootstrap` settings. It starts by
 * itself after every successful run and again on request (after a cancel or a failure).
 *
 * The assessment runs in the evaluation worker and extends the run's models there (nothing is
 * refitted). Stopping it is a request the worker sees between resamples, so the run's models —
 * and the surfaces and slices drawn from them — survive a cancel.
 */
import type { ProjectDocument } from '../../../project/schema';
import type { AssessRunProgress } from '../../../shared/workerMessages';
import { CANCELLED, type EvaluationClient } from '../worker/evaluationClient';
import type { SessionStore } from './sessionStore';

export interface AssessmentRunner {
  /** Assess doc, the evaluated project (runKey its key); does nothing unless that is the current evaluation, or while one runs. */
  assess(doc: ProjectDocument, currentRunKey: string): Promise<void>;
  cancel(): void;
}

export function createAssessmentRunner(session: SessionStore, client: EvaluationClient): AssessmentRunner {
  let stopped = false;
  return {
    async assess(doc, currentRunKey) {
      const state = session.get();
      if (!state.evaluation || state.evaluation.runKey !== currentRunKey || state.assessment.status === 'running') return;
      stopped = false;
      session.set((s) => ({ ...s, assessment: { status: 'running', runKey: currentRunKey, progress: null } }));
      const onProgress = (progress: AssessRunProgress): void => session.set((s) => (s.assessment.status !== 'running' ? s : {
        ...s, assessment: { ...s.assessment, progress },
      }));
      const result = await client.call('assess', { project: doc }, onProgress);
      session.set((s) => {
        if (s.assessment.status !== 'running' || s.assessment.runKey !== currentRunKey) return s;
        if (result.ok) return { ...s, assessment: { status: 'done', runKey: currentRunKey, assessment: result.value } };
        const cancelled = stopped || (result.problems.length === 1 && result.problems[0].message === CANCELLED.message);
        return { ...s, assessment: cancelled ? { status: 'cancelled', runKey: currentRunKey } : { status: 'failed', runKey: currentRunKey, problems: result.problems } };
      });
    },
    cancel() {
      if (session.get().assessment.status !== 'running') return;
      stopped = true;
      void client.call('stopAssessment', {});
    },
  };
}
