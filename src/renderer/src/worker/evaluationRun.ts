/**
 * One evaluation inside the worker: import (or reuse) the data, start the run — plan and one model
 * per candidate — with progress reports at most every PROGRESS_INTERVAL_MS, keep the run for
 * surface and slice queries and the assessment, and answer with the evaluation. The import yields
 * between blocks of records (a newer import or a stop message ends it); the fit loops are
 * synchronous, so the renderer stops a run by terminating this worker.
 */
import { success, type Result } from '../../../core/result';
import type { Evaluation } from '../../../pipeline/estimates';
import { evaluationOf } from '../../../pipeline/evaluateProject';
import { startRun, type EvaluationProgress } from '../../../pipeline/projectRun';
import type { ProjectDocument } from '../../../project/schema';
import type { RunProgress } from '../../../shared/workerMessages';
import type { WorkerMemory } from './workerMemory';

const PROGRESS_INTERVAL_MS = 100;

export async function runEvaluation(
  memory: WorkerMemory, project: ProjectDocument, report: (progress: RunProgress) => void, clock: () => number = () => performance.now(),
): Promise<Result<Evaluation>> {
  const opened = await memory.open(project);
  if (!opened.ok) return opened;
  // The network fit picks its TensorFlow.js backend itself (wasm where it verifies, else cpu); it
  // only needs to know where the wasm files are served, before the backend first starts.
  if (project.approximator.kind === 'network' && project.approximator.backend !== 'cpu') (await import('./tensorflowWasmFiles')).configureWasmFiles();
  memory.dropRun();
  const started = clock();
  let lastSent = -Infinity;
  const settings = project.approximator;
  const onProgress = (progress: EvaluationProgress): void => {
    const now = clock();
    // A candidate's first report (no iteration, no data pass yet) always goes out, so the screen names it at once.
    const first = progress.iteration === null && progress.dataPass === null;
    if (!first && now - lastSent < PROGRESS_INTERVAL_MS) return;
    lastSent = now;
    report({
      ...progress,
      elapsedMs: now - started,
      maxIterations: settings.kind === 'linear' ? settings.maxIterations : null,
      tolerance: settings.kind === 'linear' ? settings.tolerance : null,
      outerIterations: settings.kind === 'network' ? settings.outerIterations : null,
    });
  };
  const run = await startRun(project, opened.value.dataset, { onProgress });
  if (!run.ok) return run;
  const openingWarnings = [...opened.value.warnings, ...run.warnings].map((w) => `${w.where}: ${w.message}`);
  memory.keepRun({ project, opened: opened.value, run: run.value });
  return success(evaluationOf(run.value, openingWarnings));
}
