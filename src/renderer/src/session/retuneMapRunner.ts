/**
 * Computing and stopping the project's retune maps for the last evaluation. They start only on
 * request (a map costs seconds to a minute) and run in the evaluation worker over the run it keeps,
 * so nothing is imported or fitted again.
 *
 * Stopping: the maps run synchronously in the worker, so a stop message would only be read after
 * they finish. Where the page is cross-origin isolated (the app and its test server are), a flag on
 * a SharedArrayBuffer is shared with the worker and read between points; the run's models survive.
 * Elsewhere the only way to stop is to restart the worker, which loses the kept run.
 */
import type { ProjectDocument } from '../../../project/schema';
import type { RetuneMapProgress } from '../../../shared/workerMessages';
import { CANCELLED, type EvaluationClient } from '../worker/evaluationClient';
import type { SessionStore } from './sessionStore';

export interface RetuneMapRunner {
  /** Map doc, the evaluated project (runKey its key); does nothing unless that is the current evaluation, or while maps are computed. */
  compute(doc: ProjectDocument, currentRunKey: string): Promise<void>;
  cancel(): void;
  /** False where a stop must restart the worker (no SharedArrayBuffer): the run is then lost. */
  readonly stopKeepsRun: boolean;
}

/** A one-entry stop flag the worker can read while it is busy, or null where memory cannot be shared. */
export function sharedStopFlag(): Int32Array | null {
  const isolated = (globalThis as { crossOriginIsolated?: boolean }).crossOriginIsolated === true;
  return isolated && typeof SharedArrayBuffer === 'function' ? new Int32Array(new SharedArrayBuffer(4)) : null;
}

export function createRetuneMapRunner(session: SessionStore, client: EvaluationClient, makeFlag: () => Int32Array | null = sharedStopFlag): RetuneMapRunner {
  let stopFlag: Int32Array | null = null, stopped = false;
  const stopKeepsRun = makeFlag() !== null;
  return {
    stopKeepsRun,
    async compute(doc, currentRunKey) {
      const state = session.get();
      if (!state.evaluation || state.evaluation.runKey !== currentRunKey || state.retuneMaps.status === 'running') return;
      stopped = false;
      stopFlag = makeFlag();
      session.set((s) => ({ ...s, retuneMaps: { status: 'running', runKey: currentRunKey, progress: null } }));
      const onProgress = (progress: RetuneMapProgress): void => session.set((s) => (s.retuneMaps.status !== 'running' ? s : {
        ...s, retuneMaps: { ...s.retuneMaps, progress },
      }));
      const result = await client.call('retuneMaps', { project: doc, stopFlag }, onProgress);
      session.set((s) => {
        if (s.retuneMaps.status !== 'running' || s.retuneMaps.runKey !== currentRunKey) return s;
        if (result.ok) return { ...s, retuneMaps: { status: 'done', runKey: currentRunKey, maps: result.value } };
        const cancelled = stopped || (result.problems.length === 1 && result.problems[0].message === CANCELLED.message);
        return { ...s, retuneMaps: cancelled ? { status: 'cancelled', runKey: currentRunKey } : { status: 'failed', runKey: currentRunKey, problems: result.problems } };
      });
    },
    cancel() {
      if (session.get().retuneMaps.status !== 'running') return;
      stopped = true;
      if (stopFlag) Atomics.store(stopFlag, 0, 1);
      else client.cancel();
    },
  };
}
