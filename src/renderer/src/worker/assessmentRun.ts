/**
 * One assessment inside the worker: it extends the last run's models (the same project, by
 * runKey) with the project's bootstrap settings, reporting progress at most every
 * PROGRESS_INTERVAL_MS (a change of stage always goes out). The resampling loop yields now and
 * then, so a stop request (a message) is seen between resamples and the run's models survive it.
 */
import { failure, type Result } from '../../../core/result';
import type { Assessment } from '../../../pipeline/assessment';
import { assessRun, type AssessmentProgress } from '../../../pipeline/assessProject';
import { assessmentSettingsFor } from '../../../pipeline/assessSettings';
import type { ProjectDocument } from '../../../project/schema';
import type { AssessRunProgress } from '../../../shared/workerMessages';
import { helperWorker } from './helperWorker';
import type { WorkerMemory } from './workerMemory';

const PROGRESS_INTERVAL_MS = 100;

export async function runAssessment(
  memory: WorkerMemory, project: ProjectDocument, report: (progress: AssessRunProgress) => void, clock: () => number = () => performance.now(),
): Promise<Result<Assessment>> {
  const settings = assessmentSettingsFor(project);
  if (!settings.ok) return settings;
  const evaluated = memory.runFor(project);
  if (!evaluated) return failure({ where: 'assessment', message: 'there is no finished evaluation of this project to assess; run the evaluation first' });
  const started = clock();
  let lastSent = -Infinity, lastStage = '';
  const onProgress = (progress: AssessmentProgress): void => {
    const now = clock();
    if (progress.stage === lastStage && now - lastSent < PROGRESS_INTERVAL_MS) return;
    lastSent = now;
    lastStage = progress.stage;
    report({ ...progress, elapsedMs: now - started });
  };
  const stop = memory.assessmentStop;
  stop.requested = false;
  return assessRun(evaluated.run, { settings: settings.value, onProgress, cancel: () => stop.requested, helper: helperWorker() });
}
