/**
 * The renderer's side of the evaluation worker: numbered requests, one promise per request, and
 * progress callbacks while a run lasts. A synchronous fit cannot listen for messages, so cancelling
 * terminates the worker and starts a fresh one, sending it the data file again; every pending
 * request then resolves as cancelled.
 */
import type { Problem } from '../../../core/result';
import type { AssessRunProgress, ProgressOf, RetuneMapProgress, RunProgress, WorkerCall, WorkerCalls, WorkerReply, WorkerRequest, WorkerResult } from '../../../shared/workerMessages';

/** The part of a Worker the client uses (a fake one in unit tests). */
export interface WorkerPort {
  postMessage(message: WorkerRequest): void;
  terminate(): void;
  onmessage: ((event: MessageEvent<WorkerReply>) => void) | null;
  onerror: ((event: ErrorEvent) => void) | null;
}

export interface EvaluationClient {
  call<K extends WorkerCall>(call: K, args: WorkerCalls[K]['args'], onProgress?: (progress: ProgressOf<K>) => void): Promise<WorkerResult<K>>;
  /** Stop whatever the worker is doing; pending calls resolve with a "cancelled" problem. */
  cancel(): void;
  dispose(): void;
}

interface Pending {
  resolve: (result: WorkerResult) => void;
  onProgress?: (progress: RunProgress | AssessRunProgress | RetuneMapProgress) => void;
}

export const CANCELLED: Problem = { where: 'evaluation', message: 'cancelled before it finished; no results were kept' };

export function createEvaluationWorker(): WorkerPort {
  return new Worker(new URL('./evaluationWorker.ts', import.meta.url), { type: 'module' }) as unknown as WorkerPort;
}

export function createEvaluationClient(factory: () => WorkerPort = createEvaluationWorker): EvaluationClient {
  const pending = new Map<number, Pending>();
  let nextId = 1;
  let lastData: WorkerCalls['setData']['args'] | null = null;
  let worker = start();

  function start(): WorkerPort {
    const w = factory();
    w.onmessage = (event) => receive(event.data);
    w.onerror = (event) => {
      event.preventDefault?.();
      failAll({ where: 'evaluation worker', message: `stopped unexpectedly (${event.message || 'no message'}); it has been restarted` });
      restart();
    };
    return w;
  }

  function receive(reply: WorkerReply): void {
    const entry = pending.get(reply.id);
    if (!entry) return; // a reply to a request already resolved as cancelled
    if (reply.kind !== 'result') {
      entry.onProgress?.(reply.progress);
      return;
    }
    pending.delete(reply.id);
    entry.resolve(reply);
  }

  function failAll(problem: Problem): void {
    const entries = [...pending.entries()];
    pending.clear();
    for (const [id, entry] of entries) entry.resolve({ kind: 'result', id, ok: false, problems: [problem] });
  }

  function restart(): void {
    worker.terminate();
    worker = start();
    // The fresh worker knows nothing: give it the data file again (its answer is not awaited).
    if (lastData) worker.postMessage({ call: 'setData', id: nextId++, ...lastData });
  }

  return {
    call(call, args, onProgress) {
      const id = nextId++;
      if (call === 'setData') lastData = args as WorkerCalls['setData']['args'];
      return new Promise((resolve) => {
        pending.set(id, { resolve: resolve as (result: WorkerResult) => void, onProgress: onProgress as Pending['onProgress'] });
        worker.postMessage({ call, id, ...args } as WorkerRequest);
      });
    },
    cancel() {
      failAll(CANCELLED);
      restart();
    },
    dispose() {
      failAll(CANCELLED);
      worker.terminate();
    },
  };
}
