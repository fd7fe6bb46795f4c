/**
 * The assessment runner against a scripted worker client: it assesses only the current
 * evaluation, passes assessment progress into the session, keeps the result under the run's key,
 * and a cancel is a stop request to the worker (which keeps the run's models: no terminate) that
 * leaves it "cancelled".
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
      if (call === 'stopAssessment') {
        // The worker's assessment sees the request between resamples and ends as cancelled.
        resolve({ kind: 'result', id: 1, ok: false, problems: [{ ...CANCELLED }] });
        return Promise.resolve({ kind: 'result', id: 2, ok: true, value: null, warnings: [] } as never);
      }
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
    await createAssessmentRunner(session, s.client).assess(doc, 'k1');
    session.set((st) => ({ ...st, evaluation: evaluated }));
    await createAssessmentRunner(session, s.client).assess(doc, 'other');
    expect(s.calls).toEqual([]);
    expect(session.get().assessment).toEqual({ status: 'idle' });
  });

  it('shows progress and keeps the result under the run key', async () => {
    const session = createSessionStore(), s = scriptedClient();
    session.set((st) => ({ ...st, evaluation: evaluated }));
    const running = createAssessmentRunner(session, s.client).assess(doc, 'k1');
    expect(s.calls).toEqual(['assess']);
    s.progress({ stage: 'resampling', done: 10, total: 200, elapsedMs: 50 });
    expect(session.get().assessment).toEqual({ status: 'running', runKey: 'k1', progress: { stage: 'resampling', done: 10, total: 200, elapsedMs: 50 } });
    const assessment = { valueSense: 'cost' } as Assessment;
    s.finish({ ok: true, value: assessment });
    await running;
    expect(session.get().assessment).toEqual({ status: 'done', runKey: 'k1', assessment });
  });

  it('cancels by a stop request that leaves the worker and its models alone, and says so', async () => {
    const session = createSessionStore(), s = scriptedClient();
    session.set((st) => ({ ...st, evaluation: evaluated }));
    const runner = createAssessmentRunner(session, s.client);
    const running = runner.assess(doc, 'k1');
    runner.cancel();
    await running;
    expect(s.calls).toEqual(['assess', 'stopAssessment']);
    expect(s.cancelled()).toBe(0); // no terminate-and-restart
    expect(session.get().assessment).toEqual({ status: 'cancelled', runKey: 'k1' });
    runner.cancel(); // nothing running: nothing is sent
    expect(s.calls).toEqual(['assess', 'stopAssessment']);
  });

  it('assesses every project in the evaluation worker that holds its run', async () => {
    const session = createSessionStore(), s = scriptedClient();
    session.set((st) => ({ ...st, evaluation: evaluated }));
    const network = { approximator: { kind: 'network' } } as never;
    const fitted = createAssessmentRunner(session, s.client).assess(network, 'k1');
    expect(s.args[0]).toEqual({ project: network });
    s.finish({ ok: false, problems: [{ where: 'x', message: 'y' }] });
    await fitted;
  });

  it('keeps the problems of a failed assessment', async () => {
    const session = createSessionStore(), s = scriptedClient();
    session.set((st) => ({ ...st, evaluation: evaluated }));
    const running = createAssessmentRunner(session, s.client).assess(doc, 'k1');
    const problems = [{ where: 'assessment', message: 'the bootstrap resamples whole episodes and needs at least 10' }];
    s.finish({ ok: false, problems });
    await running;
    expect(session.get().assessment).toEqual({ status: 'failed', runKey: 'k1', problems });
  });
});
