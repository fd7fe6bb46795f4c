/**
 * Where the resample loop's per-decision cross-checks are computed: on a helper thread the host
 * lends (the CLI's is built on node:worker_threads, src/cli/helperThread.ts), which runs every block
 * ahead of the loop while the loop's own thread takes the other estimators of each block — a
 * pipeline over two cores — or, without one, on the loop's own thread, block by block. Both routes
 * run perDecisionBlocks.ts's functions on the same inputs, so the replicates are the same to the
 * last bit; the route only changes which core does the work.
 *
 * Any trouble with the helper (it cannot start, stops, answers out of turn) sends the loop back to
 * its own route from the block in question, never to a failure: the entries are ranked again from
 * the data (the helper holds the transferred tables), and an error of the numerics themselves then
 * arises on the loop's thread exactly as without a helper. `note` says which route ran, and why.
 */
import type { PerDecisionData } from '../core/offPolicy/perDecisionEstimators';
import { prepareResampleEntries } from '../core/offPolicy/perDecisionResamples';
import { perDecisionBlock, receiveOutcome, type PerDecisionJob, type PerDecisionOutcome, type SentBlock } from './perDecisionBlocks';

/** What a host's helper thread answers for the next block, in order; `stopped` when it can answer no more. */
export type HelperAnswer = SentBlock | { stopped: string };

/** A running helper: its answers one block at a time, and its end. */
export interface HelperFeed {
  next(): Promise<HelperAnswer>;
  /** End the thread now (it may be busy); safe to call more than once. */
  close(): void;
}

/** A host's helper thread for the resample loop. start may throw; the loop then keeps to its own thread. */
export interface ResampleHelper {
  /** Lend the thread only when the per-decision work (logged entries × resamples) is at least this: below it a thread costs more to start than it saves. Default 0. */
  readonly minimumWork?: number;
  /** Runs perDecisionBlocks(job) on the helper; the job's ranked tables are transferred there (unusable here afterwards). */
  start(job: PerDecisionJob): HelperFeed;
}

export interface PerDecisionRoute {
  /** Per data (in the order given), the outcomes of resamples first … first + drawn.length − 1. */
  block(first: number, drawn: readonly Uint32Array[]): Promise<PerDecisionOutcome[][]>;
  /** Which thread computed the per-decision resamples, in words for the details of a result. */
  readonly note: string;
  close(): void;
}

export const ONE_THREAD_NOTE = 'one thread for the resamples';
export const HELPER_THREAD_NOTE = 'two threads for the resamples: the per-decision cross-checks on the second';

export function openPerDecisionRoute(
  data: readonly PerDecisionData[], job: Omit<PerDecisionJob, 'entries'>, helper: ResampleHelper | undefined,
): PerDecisionRoute {
  let own: PerDecisionJob | null = null, feed: HelperFeed | null = null, note = ONE_THREAD_NOTE;
  const ownJob = (): PerDecisionJob => (own ??= { ...job, entries: data.map(prepareResampleEntries) });
  const keepToOwn = (why: string, first: number): void => {
    feed?.close();
    feed = null;
    own = null; // the helper holds the tables it was given: rank again
    note = `${ONE_THREAD_NOTE} (${first === 0 ? '' : `from resample ${first + 1}; `}the helper thread ${why})`;
  };
  const work = data.reduce((total, d) => total + d.scaled.length, 0) * job.resamples;
  if (helper && data.length > 0 && work < (helper.minimumWork ?? 0)) note = `${ONE_THREAD_NOTE} (too little per-decision work to be worth a second thread)`;
  else if (helper && data.length > 0) {
    const given = ownJob(); // ranked here: an error of the data's arises on this thread, as without a helper
    try {
      feed = helper.start(given);
      note = HELPER_THREAD_NOTE;
    } catch (error) {
      keepToOwn(`could not start: ${error instanceof Error ? error.message : String(error)}`, 0);
    }
  }
  return {
    async block(first, drawn) {
      if (feed) {
        const answer = await feed.next();
        if ('stopped' in answer) keepToOwn(answer.stopped, first);
        else if (!answersBlock(answer, first, data.length, drawn.length)) keepToOwn(`answered out of turn (resample ${answer.first + 1})`, first);
        else return answer.outcomes.map((row) => row.map(receiveOutcome));
      }
      return perDecisionBlock(ownJob(), drawn);
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

/** The answer is the block asked for: its first resample, one row per data, one outcome per resample drawn. */
function answersBlock(answer: SentBlock, first: number, rows: number, count: number): boolean {
  return answer.first === first && answer.outcomes.length === rows && answer.outcomes.every((row) => row.length === count);
}
