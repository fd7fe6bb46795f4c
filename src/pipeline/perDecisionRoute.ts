/**
 * Where the resample loop's share that a second core can take is computed — the per-decision
 * cross-checks, the linear-quadratic model's refits and values, and the rollout check's simulations
 * (answered after the last block; assessRollouts.ts opens a route of their own, with no blocks,
 * before the function classes are fitted): on a helper thread the host
 * lends (the CLI's is built on node:worker_threads, src/cli/helperThread.ts), which runs every block
 * ahead of the loop while the loop's own thread takes the other estimators of each block — a
 * pipeline over two cores — or, without one, on the loop's own thread, block by block. Both routes
 * run perDecisionBlocks.ts's functions (modelBlocks.ts's, rolloutValues.ts's) on the same inputs, so the replicates
 * are the same to the last bit; the route only changes which core does the work.
 *
 * Any trouble with the helper (it cannot start, stops, answers out of turn) sends the loop back to
 * its own route from the block in question, never to a failure: the entries are ranked again and
 * the models' moments formed again from the data (the helper holds the transferred arrays), and an
 * error of the numerics themselves then arises on the loop's thread exactly as without a helper.
 * `note` says which route ran, and why.
 */
import type { CancellationCheck } from '../core/fqe/cancellation';
import type { PerDecisionData } from '../core/offPolicy/perDecisionEstimators';
import { prepareResampleEntries, type ResampleEntries } from '../core/offPolicy/perDecisionResamples';
import { answerOrStop, type HelperAnswer, type HelperFeed, type ResampleHelper } from './helperFeed';
import { answersModelBlock, modelMomentValues, type ModelJob } from './modelBlocks';
import { receiveOutcome, shareOfBlock, type BlockShare, type ResampleJob, type SentBlock } from './perDecisionBlocks';
import { answersRollouts, rolloutSteps, rolloutValues, type RolloutJob, type RolloutValues } from './rolloutValues';

export interface PerDecisionRoute {
  /** Per data (in the order given), the outcomes of resamples first … first + drawn.length − 1; the model's values on them. */
  block(first: number, drawn: readonly Uint32Array[]): Promise<BlockShare>;
  /** After the last block: the rollout check's simulations per policy of its job (null without one). */
  rollouts(cancel?: CancellationCheck): Promise<RolloutValues[] | null>;
  /** Which thread computed the resamples' shares, in words for the details of a result. */
  readonly note: string;
  close(): void;
}

/** The parts of the job beside the per-decision data, each made on demand (null: the loop has none); see openPerDecisionRoute. */
export interface HelperShares {
  readonly model: (() => ModelJob) | null;
  readonly rollouts: (() => RolloutJob) | null;
}

export const ONE_THREAD_NOTE = 'one thread for the resamples';

/** The words for a helper that runs the job's parts (the loop's two, HELPER_THREAD_NOTE, in the usual case). */
export function helperThreadNote(job: Pick<ResampleJob, 'entries' | 'model' | 'rollouts'>): string {
  const parts = [job.entries.length > 0 && 'the per-decision cross-checks', job.model && 'the linear-quadratic model', job.rollouts && 'the model rollouts'].filter((p): p is string => !!p);
  const listed = parts.length > 1 ? `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}` : parts[0];
  return `two threads for the resamples: ${listed} on the second`;
}
/** The loop's helper with the per-decision cross-checks and the linear-quadratic model (assessResamples.ts, openResampleRoute). */
export const HELPER_THREAD_NOTE = 'two threads for the resamples: the per-decision cross-checks and the linear-quadratic model on the second';
/** Added to the loop's words when the model rollouts ran on a thread of their own (assessRollouts.ts, openRolloutSimulations). */
export const ROLLOUT_THREAD_NOTE = 'the model rollouts on a second thread while the function classes were fitted';

/** The words for the loop's route and the rollouts' beside it; the rollouts are named only when they did not simply run on this thread. */
export function threadsNote(loop: string, rollouts: string | null): string {
  if (rollouts === null || rollouts === ONE_THREAD_NOTE) return loop;
  return `${loop}; ${rollouts.startsWith(ONE_THREAD_NOTE) ? `the model rollouts on this thread${rollouts.slice(ONE_THREAD_NOTE.length)}` : ROLLOUT_THREAD_NOTE}`;
}

/**
 * The work a helper could take, in logged entries read per resample (the per-decision unit): the
 * per-decision entries and the model's moment values (a third of an entry each) times resamples,
 * plus the rollouts' simulated steps at 200 entries each. Measured on the peer plant
 * (bench/peerBench.ts, 1,000,000 transitions, 1,000 resamples): 2·10^6 entries per resample took the
 * helper about 7 s, 2.8·10^6 moment values (with the candidate's value on each refit) about 3.7 s,
 * 3.3·10^6 simulated steps about 2.7 s.
 */
export function resampleWork(data: readonly PerDecisionData[], model: ModelJob | null, rollouts: RolloutJob | null, resamples: number): number {
  const perResample = data.reduce((total, d) => total + d.scaled.length, 0) + (model ? modelMomentValues(model) / MOMENT_VALUES_PER_ENTRY : 0);
  return perResample * resamples + (rollouts ? rolloutSteps(rollouts) * ENTRIES_PER_SIMULATED_STEP : 0);
}
const MOMENT_VALUES_PER_ENTRY = 3, ENTRIES_PER_SIMULATED_STEP = 200;

/** A value made on first use and kept until reset. */
function kept<T>(make: () => T): { get(): T; reset(): void } {
  let held: { value: T } | null = null;
  return { get: () => (held ??= { value: make() }).value, reset: () => { held = null; } };
}

/**
 * shares: the model's and the rollouts' jobs, made on demand. The first call may hand over arrays
 * the loop already holds; a later one (after a helper was given them) forms them again.
 */
export function openPerDecisionRoute(
  data: readonly PerDecisionData[], job: Omit<ResampleJob, 'entries' | 'model' | 'rollouts'>, helper: ResampleHelper | undefined,
  shares: HelperShares = { model: null, rollouts: null },
): PerDecisionRoute {
  const own = {
    entries: kept((): ResampleEntries[] => data.map((d) => prepareResampleEntries(d, job.discount))), model: kept(() => shares.model && shares.model()),
    rollouts: kept(() => shares.rollouts && shares.rollouts()),
  };
  const ownJob = (): ResampleJob => ({ ...job, entries: own.entries.get(), model: own.model.get(), rollouts: own.rollouts.get() });
  let feed: HelperFeed | null = null, note = ONE_THREAD_NOTE, given: ResampleJob | null = null;
  const keepToOwn = (why: string, first: number | null): void => {
    feed?.close();
    feed = null;
    Object.values(own).forEach((part) => part.reset()); // the helper holds the tables and moments it was given: form them again
    note = `${ONE_THREAD_NOTE} (${first === null ? 'for the model rollouts; ' : first === 0 ? '' : `from resample ${first + 1}; `}the helper thread ${why})`;
  };
  if (helper && (data.length > 0 || shares.model || shares.rollouts)) {
    const formed = ownJob(); // formed here: an error of the data’s arises on this thread, as without a helper
    const lent = lend(helper, formed, data);
    if ('refused' in lent) keepToOwn(`could not start: ${lent.refused}`, 0);
    else [feed, note, given] = [lent.feed, lent.note, lent.feed && formed]; // the job’s policies and counts stay readable here; its large arrays go to the helper
  }
  return {
    async block(first, drawn) {
      if (feed && given) {
        const answer = await feed.next(), taken = takeBlock(answer, first, drawn.length, data.length, given);
        if (typeof taken !== 'string') return taken;
        keepToOwn(taken, first);
      }
      return shareOfBlock({ ...job, entries: own.entries.get(), model: own.model.get() }, drawn);
    },
    async rollouts(cancel) {
      if (!shares.rollouts) return null;
      if (feed && given?.rollouts) {
        const answer = await answerOrStop(feed, cancel);
        if ('rollouts' in answer && answersRollouts(answer.rollouts, given.rollouts)) return answer.rollouts;
        keepToOwn('stopped' in answer ? answer.stopped : 'answered out of turn', null);
      }
      const rollouts = own.rollouts.get();
      return rollouts && rolloutValues(rollouts, cancel);
    },
    get note() {
      return note;
    },
    close() {
      feed?.close();
      feed = null;
    },
  };
}

/** Start the helper on the job where the work is worth a thread: its feed (null: not lent) and the words; or why it could not start. */
function lend(helper: ResampleHelper, formed: ResampleJob, data: readonly PerDecisionData[]): { feed: HelperFeed | null; note: string } | { refused: string } {
  if (resampleWork(data, formed.model, formed.rollouts, formed.resamples) < (helper.minimumWork ?? 0)) return { feed: null, note: `${ONE_THREAD_NOTE} (too little work to be worth a second thread)` };
  try {
    return { feed: helper.start(formed), note: helperThreadNote(formed) };
  } catch (error) {
    return { refused: error instanceof Error ? error.message : String(error) };
  }
}

/** The block's share from the helper's answer, or why the loop must take it itself. */
function takeBlock(answer: HelperAnswer, first: number, count: number, rows: number, given: ResampleJob): BlockShare | string {
  if ('stopped' in answer) return answer.stopped;
  if (!('first' in answer) || !answersBlock(answer, first, rows, count) || !answersModels(answer, given.model?.policies ?? null, count)) {
    return `answered out of turn (resample ${'first' in answer ? answer.first + 1 : '?'})`;
  }
  return { perDecision: answer.outcomes.map((row) => row.map(receiveOutcome)), models: answer.models };
}

/** The answer is the block asked for: its first resample, one row per data, one outcome per resample drawn. */
function answersBlock(answer: SentBlock, first: number, rows: number, count: number): boolean {
  return answer.first === first && answer.outcomes.length === rows && answer.outcomes.every((row) => row.length === count);
}

/** The answer's model values match the job given: none without a model job, else answersModelBlock. */
function answersModels(answer: SentBlock, policies: ModelJob['policies'] | null, count: number): boolean {
  return policies === null ? answer.models === null : answer.models !== null && answersModelBlock(answer.models, { policies }, count);
}
