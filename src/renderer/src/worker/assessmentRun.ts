/**
 * One assessment inside the worker: the project's bootstrap settings, the (cached) import, the last
 * run's retained fits when they belong to this project, and progress at most every
 * PROGRESS_INTERVAL_MS (a change of stage always goes out). Like the evaluation, the resampling
 * loop is synchronous, so the renderer stops it by terminating the worker.
 */
import type { Result } from '../../../core/result';
import type { Assessment } from '../../../pipeline/assessment';
import { assessProject, type AssessmentProgress } from '../../../pipeline/assessProject';
import { assessmentSettingsFor } from '../../../pipeline/assessSettings';
import type { ProjectDocument } from '../../../project/schema';
import type { AssessRunProgress } from '../../../shared/workerMessages';
import type { WorkerSession } from './workerSession';

const PROGRESS_INTERVAL_MS = 100;

export async function runAssessment(
  session: WorkerSession, project: ProjectDocument, report: (progress: AssessRunProgress) => void, clock: () => number = () => performance.now(),
): Promise<Result<Assessment>> {
  const settings = assessmentSettingsFor(project);
  if (!settings.ok) return settings;
  const opened = session.open(project);
  if (!opened.ok) return opened;
  if (project.approximator.kind === 'network' && project.approximator.backend !== 'cpu') (await import('./tensorflowWasmFiles')).configureWasmFiles();
  const started = clock();
  let lastSent = -Infinity, lastStage = '';
  const onProgress = (progress: AssessmentProgress): void => {
    const now = clock();
    if (progress.stage === lastStage && now - lastSent < PROGRESS_INTERVAL_MS) return;
    lastSent = now;
    lastStage = progress.stage;
    report({ ...progress, elapsedMs: now - started });
  };
  return assessProject({ project, dataset: opened.value.dataset, settings: settings.value, onProgress, fits: session.retainedFits(project) });
}
