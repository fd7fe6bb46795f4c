/**
 * Ask the worker a question whenever its arguments change, after a short pause so dragging a
 * slider costs one request per pause; an answer to an older question is dropped.
 */
import { useEffect, useState } from 'react';
import type { Problem } from '../../../../core/result';
import type { WorkerCalls } from '../../../../shared/workerMessages';
import { useWorkspace } from '../../WorkspaceContext';

export type QueryState<V> = { status: 'waiting' } | { status: 'done'; value: V } | { status: 'failed'; problems: Problem[] };

const PAUSE_MS = 120;

export function useWorkerQuery<K extends 'surface' | 'slice'>(call: K, args: WorkerCalls[K]['args'] | null, key: string): QueryState<WorkerCalls[K]['value']> {
  const { client } = useWorkspace();
  const [state, setState] = useState<QueryState<WorkerCalls[K]['value']>>({ status: 'waiting' });
  useEffect(() => {
    if (!args) return;
    let current = true;
    const timer = setTimeout(() => {
      void client.call(call, args).then((result) => {
        if (!current) return;
        setState(result.ok ? { status: 'done', value: result.value as WorkerCalls[K]['value'] } : { status: 'failed', problems: result.problems });
      });
    }, PAUSE_MS);
    return () => {
      current = false;
      clearTimeout(timer);
    };
    // key stands for args, which is a fresh object on every render.
  }, [client, call, key]);
  return state;
}
