/**
 * The assessment runner against a scripted worker client: it assesses only the current
 * evaluation, passes assessment progress into the session, keeps the result under the run's key,
 * and a cancel (the client's terminate-and-restart, as for the run) leaves it "cancelled".
 */
import { describe, expect, it } from 'vitest';
import type { Problem } from '../../../src/core/result';
import type { Assessment } from '../../../src/pipeline/assessment';
import { createAssessmentRunner } from '../../../src/renderer/src/session/assessmentRunner';
import { createSessionStore } from '../../../src/renderer/src/session/sessionStore';
import { CANCELLED, type EvaluationClient } from '../../../src/renderer/src/worker/evaluationClient';
import type { AssessRunProgress, WorkerResult } from '../../../src/shared/workerMessages';

interface Scripted {
  client: EvaluationClient;
  calls: string[];
  args: unknown[];
  progress: (p: AssessRunProgress) => void;
  finish: (result: { ok: true; value: Assessment } | { ok: false; problems: Problem[] }) => void;
  cancelled: () => number;
}

function scriptedClient(): Scripted {
  const calls: string[] = [], args: unknown[] = [];
  let resolve: (r: WorkerResult) => void = () => undefined;
  let onProgress: (p: AssessRunProgress) => void = () => undefined;
  let cancels = 0;
  const client: EvaluationClient = {
    call(call, callArgs, progress) {
      calls.push(call);
      args.push(callArgs);
      onProgress = progress as (p: AssessRunProgress) => void;
      return new Promise((r) => { resolve = r as (r: WorkerResult) => void; });
    },
    cancel() {
      cancels++;
      resolve({ kind: 'result', id: 1, ok: false, problems: [CANCELLED] });
    },
    dispose() {},
  };
  return {
    client, calls, args, progress: (p) => onProgress(p), cancelled: () => cancels,
    finish: (r) => resolve(r.ok ? { kind: 'result', id: 1, ok: true, value: r.value, warnings: [] } : { kind: 'result', id: 1, ok: false, problems: r.problems }),
  };
}

const doc = { approximator: { kind: 'linear' } } as never;
const evaluated = { evaluation: {} as never, runKey: 'k1' };

describe('assessment runner', () => {
  it('does nothing without the matching evaluation', async () => {
    const session = createSessionStore(), s = scriptedClient();
    await createAssessmentRunner(session, { evaluation: s.client, assessment: () => s.client }).assess(doc, 'k1');
    session.set((st) => ({ ...st, evaluation: evaluated }));
    await createAssessmentRunner(session, { evaluation: s.client, assessment: () => s.client }).assess(doc, 'other');
    expect(s.calls).toEqual([]);
    expect(session.get().assessment).toEqual({ status: 'idle' });
  });

  it('shows progress and keeps the result under the run key', async () => {
    const session = createSessionStore(), s = scriptedClient();
    session.set((st) => ({ ...st, evaluation: evaluated }));
    const running = createAssessmentRunner(session, { evaluation: s.client, assessment: () => s.client }).assess(doc, 'k1');
    expect(s.calls).toEqual(['assess']);
    s.progress({ stage: 'resampling', done: 10, total: 200, elapsedMs: 50 });
    expect(session.get().assessment).toEqual({ status: 'running', runKey: 'k1', progress: { stage: 'resampling', done: 10, total: 200, elapsedMs: 50 } });
    const assessment = { valueSense: 'cost' } as Assessment;
    s.finish({ ok: true, value: assessment });
    await running;
    expect(session.get().assessment).toEqual({ status: 'done', runKey: 'k1', assessment });
  });

  it('cancels like the run (through the client) and says so', async () => {
    const session = createSessionStore(), s = scriptedClient();
    session.set((st) => ({ ...st, evaluation: evaluated }));
    const runner = createAssessmentRunner(session, { evaluation: s.client, assessment: () => s.client });
    const running = runner.assess(doc, 'k1');
    runner.cancel();
    await running;
    expect(s.cancelled()).toBe(1);
    expect(session.get().assessment).toEqual({ status: 'cancelled', runKey: 'k1' });
    runner.cancel(); // nothing running: the worker is left alone
    expect(s.cancelled()).toBe(1);
  });

  it('sends a linear project with the data bytes to its own worker, a network project to the worker holding its fits', async () => {
    const session = createSessionStore(), own = scriptedClient(), evaluation = scriptedClient();
    const bytes = new Uint8Array([1, 2, 3]);
    session.set((st) => ({ ...st, evaluation: evaluated, source: { kind: 'file', absolutePath: '/logs/tank.csv', bytes } }));
    const runner = createAssessmentRunner(session, { evaluation: evaluation.client, assessment: () => own.client });
    const linear = runner.assess(doc, 'k1');
    expect(own.args[0]).toEqual({ project: doc, data: { bytes, fileName: 'tank.csv' } });
    runner.cancel();
    await linear;
    expect([own.cancelled(), evaluation.cancelled()]).toEqual([1, 0]);
    const network = { approximator: { kind: 'network' } } as never;
    const fitted = runner.assess(network, 'k1');
    expect(evaluation.args[0]).toEqual({ project: network });
    evaluation.finish({ ok: false, problems: [{ where: 'x', message: 'y' }] });
    await fitted;
  });

  it('keeps the problems of a failed assessment', async () => {
    const session = createSessionStore(), s = scriptedClient();
    session.set((st) => ({ ...st, evaluation: evaluated }));
    const running = createAssessmentRunner(session, { evaluation: s.client, assessment: () => s.client }).assess(doc, 'k1');
    const problems = [{ where: 'assessment', message: 'the bootstrap resamples whole episodes and needs at least 10' }];
    s.finish({ ok: false, problems });
    await running;
    expect(session.get().assessment).toEqual({ status: 'failed', runKey: 'k1', problems });
  });
});
