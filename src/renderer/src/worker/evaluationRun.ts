/**
 * One evaluation inside the worker: import (or reuse) the data, run the pipeline with progress
 * reports at most every PROGRESS_INTERVAL_MS, and keep every candidate's fitted Q for later
 * surface and slice queries. The fit loop is synchronous, so the renderer stops a run by
 * terminating this worker; nothing here needs to listen for a cancel message.
 */
import type { Result } from '../../../core/result';
import type { Evaluation } from '../../../pipeline/estimates';
import { evaluateProject, type EvaluationProgress } from '../../../pipeline/evaluateProject';
import type { ProjectDocument } from '../../../project/schema';
import type { RunProgress } from '../../../shared/workerMessages';
import type { WorkerSession } from './workerSession';

const PROGRESS_INTERVAL_MS = 100;

export async function runEvaluation(
  session: WorkerSession, project: ProjectDocument, report: (progress: RunProgress) => void, clock: () => number = () => performance.now(),
): Promise<Result<Evaluation>> {
  const opened = session.open(project);
  if (!opened.ok) return opened;
  // The network fit picks its TensorFlow.js backend itself (wasm where it verifies, else cpu); it
  // only needs to know where the wasm files are served, before the backend first starts.
  if (project.approximator.kind === 'network' && project.approximator.backend !== 'cpu') (await import('./tensorflowWasmFiles')).configureWasmFiles();
  const run = session.beginRun(project, opened.value);
  const started = clock();
  let lastSent = -Infinity;
  const settings = project.approximator;
  const onProgress = (progress: EvaluationProgress): void => {
    const now = clock();
    // A candidate's first report (iteration null) always goes out, so the screen names it at once.
    if (progress.iteration !== null && now - lastSent < PROGRESS_INTERVAL_MS) return;
    lastSent = now;
    report({
      ...progress,
      elapsedMs: now - started,
      maxIterations: settings.kind === 'linear' ? settings.maxIterations : null,
      tolerance: settings.kind === 'linear' ? settings.tolerance : null,
      outerIterations: settings.kind === 'network' ? settings.outerIterations : null,
    });
  };
  return evaluateProject({
    project,
    dataset: opened.value.dataset,
    warnings: opened.value.warnings.map((w) => `${w.where}: ${w.message}`),
    onProgress,
    retainFit: (index, fit, policy) => run.fits.set(index, { fit, policy, name: project.candidates[index].name }),
  });
}
