/**
 * The renderer's worker client against a scripted worker: replies find their requests, progress
 * reaches its callback, and cancelling resolves the pending run, restarts the worker and gives
 * the new one the data file again (common practice for stopping synchronous work in a worker).
 */
import { describe, expect, it } from 'vitest';
import { CANCELLED, createEvaluationClient, type WorkerPort } from '../../../src/renderer/src/worker/evaluationClient';
import type { WorkerReply, WorkerRequest } from '../../../src/shared/workerMessages';

class ScriptedWorker implements WorkerPort {
  received: WorkerRequest[] = [];
  terminated = false;
  onmessage: ((event: MessageEvent<WorkerReply>) => void) | null = null;
  onerror: ((event: ErrorEvent) => void) | null = null;
  postMessage(message: WorkerRequest): void {
    this.received.push(message);
  }
  terminate(): void {
    this.terminated = true;
  }
  reply(message: WorkerReply): void {
    this.onmessage?.({ data: message } as MessageEvent<WorkerReply>);
  }
}

const csv = { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' } as const;

describe('evaluation client', () => {
  it('matches replies to requests and passes progress on', async () => {
    const workers: ScriptedWorker[] = [];
    const client = createEvaluationClient(() => (workers.push(new ScriptedWorker()), workers[workers.length - 1]));
    const seen: number[] = [];
    const run = client.call('evaluate', { project: {} as never }, (p) => seen.push(p.elapsedMs));
    const id = workers[0].received[0].id;
    workers[0].reply({ kind: 'progress', id, progress: { elapsedMs: 5 } as never });
    workers[0].reply({ kind: 'result', id, ok: false, problems: [{ where: 'x', message: 'y' }] });
    await expect(run).resolves.toEqual({ kind: 'result', id, ok: false, problems: [{ where: 'x', message: 'y' }] });
    expect(seen).toEqual([5]);
  });

  it('passes an assessment’s progress on to its own callback', async () => {
    const worker = new ScriptedWorker();
    const client = createEvaluationClient(() => worker);
    const stages: string[] = [];
    const run = client.call('assess', { project: {} as never }, (p) => stages.push(p.stage));
    const id = worker.received[0].id;
    worker.reply({ kind: 'assessmentProgress', id, progress: { stage: 'resampling', done: 1, total: 20, elapsedMs: 3 } });
    worker.reply({ kind: 'result', id, ok: false, problems: [{ where: 'assessment', message: 'no' }] });
    await run;
    expect(stages).toEqual(['resampling']);
  });

  it('cancels by restarting the worker and sending it the data again', async () => {
    const workers: ScriptedWorker[] = [];
    const client = createEvaluationClient(() => (workers.push(new ScriptedWorker()), workers[workers.length - 1]));
    const bytes = new Uint8Array([1, 2, 3]);
    void client.call('setData', { bytes, fileName: 'a.csv', csv });
    const run = client.call('evaluate', { project: {} as never });
    client.cancel();
    const result = await run;
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems[0]).toBe(CANCELLED);
    expect(workers[0].terminated).toBe(true);
    expect(workers).toHaveLength(2);
    expect(workers[1].received).toMatchObject([{ call: 'setData', fileName: 'a.csv', bytes }]);
    // A late reply from the old worker's run is ignored.
    workers[0].reply({ kind: 'result', id: workers[0].received[1].id, ok: true, value: {} as never, warnings: [] });
  });
});
