/**
 * The CLI's second thread for the resample loop (src/cli/helperThread.ts, src/pipeline/perDecisionRoute.ts)
 * against the loop's own thread: the same per-decision estimates to the last bit, replicate by
 * replicate (the same function on the same inputs, so nothing less than Object.is equality is
 * accepted), an ImportanceSamplingError carried across with its message, a helper that cannot
 * start or stops half-way replaced by the loop's own route without a change in any number, and a
 * stop request (Ctrl+C) ending the run with the cancelled status and the thread closed. The test
 * log is invented (the uneven cascade log of test/core/offPolicy/unevenCascadeLog.ts); no speed is asserted.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EXIT } from '../../src/cli/exitStatus';
import { evaluateProjectFile } from '../../src/cli/evaluateProjectFile';
import { helperThread } from '../../src/cli/helperThread';
import type { TerminalProgress } from '../../src/cli/terminalProgress';
import { modelRegressions } from '../../src/core/offPolicy/linearQuadraticModel';
import { modelDataOf } from '../../src/core/offPolicy/polynomialDynamicsModel';
import { ImportanceSamplingError, perDecisionData, type PerDecisionData } from '../../src/core/offPolicy/perDecisionEstimators';
import { RESAMPLE_BLOCK } from '../../src/core/offPolicy/perDecisionResamples';
import { createGaussianPolicy } from '../../src/core/policy';
import { assessRun } from '../../src/pipeline/assessProject';
import { assessmentSettingsFor, type AssessmentSettings } from '../../src/pipeline/assessSettings';
import type { ModelBlockValues, ModelJob } from '../../src/pipeline/modelBlocks';
import { drawBlock, helperBlocks, type PerDecisionOutcome } from '../../src/pipeline/perDecisionBlocks';
import type { HelperFeed, ResampleHelper } from '../../src/pipeline/helperFeed';
import { HELPER_THREAD_NOTE, ONE_THREAD_NOTE, openPerDecisionRoute, resampleWork, ROLLOUT_THREAD_NOTE } from '../../src/pipeline/perDecisionRoute';
import { openProject } from '../../src/pipeline/openProject';
import type { RolloutJob, RolloutValues } from '../../src/pipeline/rolloutValues';
import { CANCELLED_PROBLEM, startRun, type ProjectRun } from '../../src/pipeline/projectRun';
import { unevenLogInputs } from '../core/offPolicy/unevenCascadeLog';

const discount = 0.95, { data: log, index, table, tails, values } = unevenLogInputs(discount), e = log.episodeCount;

/** Only run 1 (one of the longest) keeps a non-zero weight: a resample without it has none at step 1, an ImportanceSamplingError (invented for the test). */
function onlyRunOneWeighs(data: PerDecisionData): PerDecisionData {
  const scaled = data.scaled.map((w, j) => (data.episode[j] === 1 ? w : 0));
  const scaledBefore = data.scaledBefore.map((w, j) => (data.episode[j] === 1 || j < data.stepOffsets[1] ? w : 0)); // 1 at step 1
  return { ...data, scaled, scaledBefore };
}

const sources = () => [perDecisionData(table, values, tails), perDecisionData(table, null), onlyRunOneWeighs(perDecisionData(table, values, tails))];
const job = { discount, episodes: e, seed: 11, resamples: 45 }; // 45: the last block is short

/**
 * The linear-quadratic model's share on the same log: a candidate and the logging controller, and
 * one without values between them; one start state, of run 1, so a resample without run 1 weighs no
 * start state and its value fails (ModelValueError, a null replicate) while the others are numbers.
 * A fresh job at each call, as the loop forms one again after a helper was given the last.
 */
const modelJob = (): ModelJob => ({
  regressions: modelRegressions(log, index), discount,
  policies: [createGaussianPolicy({ offset: [0], gain: [[-0.4, -0.2, -0.1]], std: [0.3] }, 3), null, createGaussianPolicy({ offset: [0.1], gain: [[-0.2, 0, -0.3]], std: [0.5] }, 3)],
  starts: { states: log.startStates.slice(3, 6), followEpisodes: true, episode: Int32Array.of(1) },
});

/**
 * The rollout check's simulations on the same log: the model's two policies and one for two states,
 * which the three-state model refuses (a ModelValueError: its reason, on either thread).
 */
const rolloutJob = (): RolloutJob => ({
  source: { data: modelDataOf(log), index, options: { degree: 2, rewardDegree: 2 } }, discount, seed: job.seed, episodes: e, resamples: 5,
  policies: [...modelJob().policies.filter((p) => p !== null), createGaussianPolicy({ offset: [0], gain: [[-0.1, -0.1]], std: [0.3] }, 2)],
  startStates: log.startStates.slice(0, 15), rollout: { rolloutsPerStart: 2, seed: 5 },
});
const shares = { model: modelJob, rollouts: rolloutJob };

/** Every block through a route, as the resample loop asks for them. */
interface RouteAnswers { outcomes: PerDecisionOutcome[][][]; models: (ModelBlockValues | null)[]; rollouts: RolloutValues[] | null; note: string }

/** Every block through a route, as the resample loop asks for them, then the rollouts. */
async function allOutcomes(helper: ResampleHelper | undefined, data: readonly PerDecisionData[] = sources()): Promise<RouteAnswers> {
  const route = openPerDecisionRoute(data, job, helper, shares), block = Array.from({ length: RESAMPLE_BLOCK }, () => new Uint32Array(e));
  const outcomes: PerDecisionOutcome[][][] = [], models: (ModelBlockValues | null)[] = [];
  try {
    for (let first = 0; first < job.resamples; first += RESAMPLE_BLOCK) {
      const share = await route.block(first, drawBlock(e, job.seed, first, job.resamples, block));
      outcomes.push(share.perDecision);
      models.push(share.models);
    }
    return { outcomes, models, rollouts: await route.rollouts(), note: route.note };
  } finally {
    route.close();
  }
}

/** Every rollout value the same number (Object.is), every reason the same words. */
function expectSameRollouts(a: RolloutValues[] | null, b: RolloutValues[] | null): void {
  expect(a).not.toBeNull();
  expect(b!.length).toBe(a!.length);
  a!.forEach((x, k) => {
    const y = b![k];
    if ('reason' in x) return expect(y).toEqual({ reason: x.reason });
    if ('reason' in y) throw new Error(`rollouts ${k}: ${y.reason}`);
    for (const key of ['value', 'monteCarloError', 'steps', 'shareOutsideLogs'] as const) expect(Object.is(x.full[key], y.full[key])).toBe(true);
    expect(y.resampled.length).toBe(x.resampled.length);
    x.resampled.forEach((v, i) => expect(Object.is(v, y.resampled[i])).toBe(true));
  });
}

function expectSameAnswers(a: RouteAnswers, b: RouteAnswers): void {
  expectIdentical(a.outcomes, b.outcomes);
  expectSameModels(a.models, b.models);
  expectSameRollouts(a.rollouts, b.rollouts);
}

/** Every model value the same number (Object.is: the same bits) or null in the same places, block by block. */
function expectSameModels(a: (ModelBlockValues | null)[], b: (ModelBlockValues | null)[]): void {
  expect(b.length).toBe(a.length);
  a.forEach((rows, s) => {
    if (rows === null) return expect(b[s]).toBeNull();
    expect(b[s]).not.toBeNull();
    rows.forEach((row, k) => {
      if (row === null) return expect(b[s]![k]).toBeNull();
      expect(b[s]![k]!.length).toBe(row.length);
      row.forEach((x, i) => expect(Object.is(x, b[s]![k]![i])).toBe(true));
    });
  });
}

function expectIdentical(a: PerDecisionOutcome[][][], b: PerDecisionOutcome[][][]): void {
  expect(a.length).toBe(b.length);
  a.forEach((rows, k) => rows.forEach((row, s) => row.forEach((x, i) => {
    const y = b[k][s][i];
    if (x instanceof ImportanceSamplingError) {
      expect(y).toBeInstanceOf(ImportanceSamplingError);
      expect((y as Error).message).toBe(x.message);
      return;
    }
    expect(y).not.toBeInstanceOf(Error);
    for (const key of ['importanceSampling', 'doublyRobust', 'importanceSamplingTail'] as const) expect(Object.is(x[key], (y as typeof x)[key])).toBe(true);
  })));
}

/** A helper on this thread that answers `blocks` blocks and then stops, counting its closes. */
function stoppingHelper(blocks: number): ResampleHelper & { closed: number } {
  const helper = {
    closed: 0,
    start(given: Parameters<ResampleHelper['start']>[0]): HelperFeed {
      const answers = helperBlocks(given);
      let answered = 0;
      return {
        next: async () => (answered++ < blocks ? answers.next().value ?? { stopped: 'ran out' } : { stopped: 'stopped: a test stop' }),
        close: () => { helper.closed++; },
      };
    },
  };
  return helper;
}

describe('the per-decision resamples on the helper thread', () => {
  it('stay on the loop’s own thread, without starting one, when the work is below the helper’s minimum', async () => {
    const work = resampleWork(sources(), modelJob(), rolloutJob(), job.resamples);
    let started = 0;
    const small: ResampleHelper = { minimumWork: work + 1, start: () => { started++; throw new Error('not expected'); } };
    const own = await allOutcomes(undefined), kept = await allOutcomes(small);
    expect(started).toBe(0);
    expect(kept.note).toContain(ONE_THREAD_NOTE);
    expectSameAnswers(own, kept);
  });

  it('equal the loop’s own route replicate by replicate, errors included', async () => {
    const own = await allOutcomes(undefined), helped = await allOutcomes(helperThread(0));
    expect(own.note).toBe(ONE_THREAD_NOTE);
    expect(helped.note).toBe('two threads for the resamples: the per-decision cross-checks, the linear-quadratic model and the model rollouts on the second');
    const failures = own.outcomes.flat(2).filter((x) => x instanceof ImportanceSamplingError).length;
    expect(failures).toBeGreaterThan(0); // the error route is exercised …
    expect(failures).toBeLessThan(job.resamples); // … and so is the estimate route on the same data
    const values = own.models.flatMap((rows) => rows!.flatMap((row) => row ?? []));
    expect(values.filter((v) => v === null).length).toBeGreaterThan(0); // a model value failure on some resamples …
    expect(values.filter((v) => typeof v === 'number').length).toBeGreaterThan(0); // … and values on the others
    expect(own.rollouts!.map((r) => 'reason' in r)).toEqual([false, false, true]); // rollouts, and a refusal
    expectSameAnswers(own, helped);
  });

  it('fall back to the loop’s own thread, with the same numbers, when the helper cannot start or stops', async () => {
    const own = await allOutcomes(undefined);
    const refused = await allOutcomes({ start: () => { throw new Error('no threads here'); } });
    expect(refused.note).toBe(`${ONE_THREAD_NOTE} (the helper thread could not start: no threads here)`);
    expectSameAnswers(own, refused);
    const stopping = stoppingHelper(2), halfway = await allOutcomes(stopping);
    expect(halfway.note).toBe(`${ONE_THREAD_NOTE} (from resample ${2 * RESAMPLE_BLOCK + 1}; the helper thread stopped: a test stop)`);
    expect(stopping.closed).toBeGreaterThan(0);
    expectSameAnswers(own, halfway);
    const beforeRollouts = stoppingHelper(Math.ceil(job.resamples / RESAMPLE_BLOCK)), late = await allOutcomes(beforeRollouts);
    expect(late.note).toBe(`${ONE_THREAD_NOTE} (for the model rollouts; the helper thread stopped: a test stop)`);
    expectSameAnswers(own, late);
  });

  it('take the models’ shares alone, the same as on the loop’s own thread, when there are no per-decision data', async () => {
    const own = await allOutcomes(undefined, []), helped = await allOutcomes(helperThread(0), []);
    expect(helped.note).toBe('two threads for the resamples: the linear-quadratic model and the model rollouts on the second'); // it never fell back
    expectSameAnswers(own, helped);
  });
});

const tank = join(__dirname, '..', '..', 'sample-projects', 'tank-levels', 'tank-levels.spcritic');

describe('the assessment with the CLI’s helper thread', () => {
  let run: ProjectRun, settings: AssessmentSettings;
  beforeAll(async () => {
    const opened = await openProject(await readFile(tank, 'utf8'), 'tank-levels.spcritic', async (p) => new Uint8Array(await readFile(join(tank, '..', p))));
    if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
    const chosen = assessmentSettingsFor(opened.value.project, { resamples: 60 }), started = await startRun(opened.value.project, opened.value.dataset);
    if (!chosen.ok || !started.ok) throw new Error('setup failed');
    [run, settings] = [started.value, { ...chosen.value, sensitivity: false }]; // the sweep does not resample
  });
  afterAll(() => run?.dispose());

  it('gives the same assessment as one thread on the tank-levels sample, and says which route ran', async () => {
    const one = await assessRun(run, { settings });
    const two = await assessRun(run, { settings, helper: helperThread(0) });
    if (!one.ok || !two.ok) throw new Error('assessment failed');
    expect(one.value.settings.threads).toBe(ONE_THREAD_NOTE);
    expect(two.value.settings.threads).toBe(`${HELPER_THREAD_NOTE}; ${ROLLOUT_THREAD_NOTE}`); // the loop's helper, and the rollouts' own thread before it
    expect({ ...two.value, settings: { ...two.value.settings, threads: '' } }).toEqual({ ...one.value, settings: { ...one.value.settings, threads: '' } });
  });

  it('closes the helper thread when the run stops, as when it ends', async () => {
    const real = helperThread(0);
    let closed = 0, started = 0, stop = false;
    const counting: ResampleHelper = { start: (given) => { const feed = real.start(given); started++; return { next: () => feed.next(), close: () => { closed++; feed.close(); } }; } };
    const stopped = await assessRun(run, {
      settings: { ...settings, resamples: 5000 }, helper: counting, cancel: () => stop,
      onProgress: (p) => { if (p.stage === 'resampling' && p.done > 0) stop = true; },
    });
    expect(stopped.ok).toBe(false);
    if (!stopped.ok) expect(stopped.problems).toEqual([CANCELLED_PROBLEM]);
    expect(started).toBe(2); // the rollouts' thread and the loop's
    expect(closed).toBe(started);
    const ended = await assessRun(run, { settings, helper: counting });
    expect(ended.ok).toBe(true);
    expect(started).toBe(4);
    expect(closed).toBe(started);
    let early = false; // a stop while the function classes are fitted, the rollouts' thread at work
    const beforeLoop = await assessRun(run, { settings, helper: counting, cancel: () => early, onProgress: (p) => { if (p.stage === 'preparing') early = true; } });
    expect(beforeLoop.ok).toBe(false);
    expect(started).toBeGreaterThan(4);
    expect(closed).toBe(started);
  });

  it('ends with exit 130 and the cancelled message on a stop request during the resamples', async () => {
    let stop = false;
    const resampled: number[] = [];
    const progress: TerminalProgress = {
      evaluation: () => undefined,
      assessment(p) {
        if (p.stage !== 'resampling') return;
        resampled.push(p.done);
        if (p.done > 0 && !stop) setTimeout(() => { stop = true; }, 0);
      },
      cancelled: () => stop,
      done: () => undefined,
    };
    const result = await evaluateProjectFile(tank, { resamples: 5000 }, undefined, progress);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.failure.exitCode).toBe(EXIT.cancelled);
    expect(result.failure.message).toBe('Cancelled (Ctrl+C): no results were written.');
    expect(resampled[resampled.length - 1]).toBeLessThan(5000);
  });
});
