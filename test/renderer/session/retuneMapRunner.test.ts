/**
 * The retune-map runner against a scripted worker client: it maps only the current evaluation,
 * passes progress into the session, keeps the maps under the run's key, and a cancel sets the
 * shared stop flag (the worker keeps the run: no restart) — or, where no shared memory exists,
 * restarts the worker; either way the state ends "cancelled".
 */
import { describe, expect, it } from 'vitest';
import { createRetuneMapRunner } from '../../../src/renderer/src/session/retuneMapRunner';
import { createSessionStore } from '../../../src/renderer/src/session/sessionStore';
import { CANCELLED, type EvaluationClient } from '../../../src/renderer/src/worker/evaluationClient';
import type { RetuneMapProgress, WorkerResult } from '../../../src/shared/workerMessages';

function scriptedClient() {
  let resolve: (r: WorkerResult) => void = () => undefined;
  let onProgress: (p: RetuneMapProgress) => void = () => undefined;
  const sent: { call: string; args: { stopFlag?: Int32Array | null } }[] = [];
  let restarts = 0;
  const client: EvaluationClient = {
    call(call, args, progress) {
      sent.push({ call, args: args as never });
      onProgress = progress as (p: RetuneMapProgress) => void;
      return new Promise((r) => { resolve = r as (r: WorkerResult) => void; });
    },
    cancel() {
      restarts++;
      resolve({ kind: 'result', id: 1, ok: false, problems: [CANCELLED] });
    },
    dispose() {},
  };
  return { client, sent, restarts: () => restarts, progress: (p: RetuneMapProgress) => onProgress(p), finish: (r: WorkerResult) => resolve(r) };
}

const doc = { retuneMaps: [{}] } as never;
const evaluated = { evaluation: {} as never, runKey: 'k1' };
const flag = () => new Int32Array(new SharedArrayBuffer(4));

describe('retune map runner', () => {
  it('does nothing without the matching evaluation', async () => {
    const session = createSessionStore(), s = scriptedClient();
    await createRetuneMapRunner(session, s.client, flag).compute(doc, 'k1');
    expect(s.sent).toEqual([]);
    expect(session.get().retuneMaps.status).toBe('idle');
  });

  it('passes progress into the session and keeps the maps under the run’s key', async () => {
    const session = createSessionStore(), s = scriptedClient();
    session.set((st) => ({ ...st, evaluation: evaluated }));
    const done = createRetuneMapRunner(session, s.client, flag).compute(doc, 'k1');
    s.progress({ map: 0, maps: 1, pointsDone: 3, pointsTotal: 100, elapsedMs: 250 });
    expect(session.get().retuneMaps).toMatchObject({ status: 'running', runKey: 'k1', progress: { pointsDone: 3 } });
    s.finish({ kind: 'result', id: 1, ok: true, value: [], warnings: [] });
    await done;
    expect(session.get().retuneMaps).toEqual({ status: 'done', runKey: 'k1', maps: [] });
  });

  it('cancels through the shared flag, without restarting the worker', async () => {
    const session = createSessionStore(), s = scriptedClient();
    session.set((st) => ({ ...st, evaluation: evaluated }));
    const runner = createRetuneMapRunner(session, s.client, flag);
    expect(runner.stopKeepsRun).toBe(true);
    const done = runner.compute(doc, 'k1');
    runner.cancel();
    const sentFlag = s.sent[0].args.stopFlag!;
    expect(Atomics.load(sentFlag, 0)).toBe(1);
    expect(s.restarts()).toBe(0);
    s.finish({ kind: 'result', id: 1, ok: false, problems: [{ where: 'evaluation', message: 'cancelled' }] });
    await done;
    expect(session.get().retuneMaps.status).toBe('cancelled');
  });

  it('restarts the worker to cancel where memory cannot be shared', async () => {
    const session = createSessionStore(), s = scriptedClient();
    session.set((st) => ({ ...st, evaluation: evaluated }));
    const runner = createRetuneMapRunner(session, s.client, () => null);
    expect(runner.stopKeepsRun).toBe(false);
    const done = runner.compute(doc, 'k1');
    runner.cancel();
    await done;
    expect(s.restarts()).toBe(1);
    expect(session.get().retuneMaps.status).toBe('cancelled');
  });
});
