/**
 * The project's retune maps inside the worker, over the last run (the same project, by runKey):
 * the plan's data, features and present controller are reused, nothing is imported or fitted
 * again. Progress goes out at most every PROGRESS_INTERVAL_MS, and always for the last point of a
 * map. The computation is synchronous (src/pipeline/retuneMaps.ts), so a stop request is read
 * from a shared flag between points, not from a message.
 */
import { failure, type Result } from '../../../core/result';
import { retuneMapsOfRun, type RetuneMapResult } from '../../../pipeline/retuneMaps';
import type { ProjectDocument } from '../../../project/schema';
import type { RetuneMapProgress } from '../../../shared/workerMessages';
import type { WorkerMemory } from './workerMemory';

const PROGRESS_INTERVAL_MS = 100;

/** True once the renderer has set stopFlag[0] (Atomics, so the write is seen while this thread is busy). */
export function stopRequested(stopFlag: Int32Array | null): boolean {
  return stopFlag !== null && Atomics.load(stopFlag, 0) !== 0;
}

export function runRetuneMaps(
  memory: WorkerMemory, project: ProjectDocument, stopFlag: Int32Array | null, report: (progress: RetuneMapProgress) => void,
  clock: () => number = () => performance.now(),
): Result<RetuneMapResult[]> {
  if ((project.retuneMaps ?? []).length === 0) return failure({ where: 'retuneMaps', message: 'the project has no retune map; add one to the project file' });
  const evaluated = memory.runFor(project);
  if (!evaluated) return failure({ where: 'retuneMaps', message: 'there is no finished evaluation of this project to map; run the evaluation first' });
  const started = clock();
  let lastSent = -Infinity;
  const onProgress = (p: Omit<RetuneMapProgress, 'elapsedMs'>): void => {
    const now = clock();
    if (p.pointsDone < p.pointsTotal && now - lastSent < PROGRESS_INTERVAL_MS) return;
    lastSent = now;
    report({ ...p, elapsedMs: now - started });
  };
  return retuneMapsOfRun(evaluated.run, { cancel: () => stopRequested(stopFlag), onProgress });
}
