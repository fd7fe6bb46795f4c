/**
 * A host's helper thread as the resample loop sees it (perDecisionRoute.ts's HelperFeed), written
 * once for every kind of thread: the CLI's node:worker_threads Worker (src/cli/helperThread.ts) and
 * the app's nested Web Worker (src/renderer/src/worker/helperWorker.ts). The thread posts its
 * answers in order; they are handed out one `next()` at a time. A failure or an early end answers
 * `stopped` with the reason to whoever waits and to every later `next()`, and the loop carries on by
 * itself. close() ends the thread whatever it is doing; it is safe to call more than once.
 */
import { throwIfCancelled, type CancellationCheck } from '../core/fqe/cancellation';
import { helperBlocks, type ResampleJob, type SentBlock, type SentRollouts } from './perDecisionBlocks';

/** What a host's helper thread answers for the next block (then the rollouts), in order; `stopped` when it can answer no more. */
export type HelperAnswer = SentBlock | SentRollouts | { stopped: string };

/** A running helper: its answers one block at a time, and its end. */
export interface HelperFeed {
  next(): Promise<HelperAnswer>;
  /** End the thread now (it may be busy); safe to call more than once. */
  close(): void;
}

/** A host's helper thread for the resample loop. start may throw; the loop then keeps to its own thread. */
export interface ResampleHelper {
  /** Lend the thread only when the work it could take (resampleWork) is at least this: below it a thread costs more to start than it saves. Default 0. */
  readonly minimumWork?: number;
  /** Runs helperBlocks(job) on the helper; the job's ranked tables are transferred there (unusable here afterwards). */
  start(job: ResampleJob): HelperFeed;
}

/**
 * Work a helper could take (resampleWork in perDecisionRoute.ts: logged entries × resamples, a
 * linear-quadratic model's moment value counted at a third of an entry and a simulated rollout step
 * at 200) below which a host keeps the loop to one thread. Measured on the peer plant's logs
 * (bench/peerBench.ts, Node) for the per-decision share: 10^8 (100,000 transitions, 1,000
 * resamples) is about 0.9 s of the helper's CPU against about 0.3 s to start a thread and 20–50 MiB
 * more memory; 10^9, about 7 s. Our choice: lend it from 3·10^8, where the work is some ten times
 * the start. The app's worker uses the same figure (a module worker's start is of the same order).
 */
export const HELPER_MINIMUM_WORK = 3e8;

/** What the feed needs of a host's thread: to hear it, and to end it. */
export interface HelperPort {
  /** Called once, right away: `answer` per message the thread posts; `stopped` when it fails or ends before its last answer. */
  listen(heard: { answer(answer: HelperAnswer): void; stopped(why: string): void }): void;
  /** End the thread now. */
  terminate(): void;
}

export function helperFeed(port: HelperPort): HelperFeed {
  const answers: HelperAnswer[] = [];
  let waiting: ((answer: HelperAnswer) => void) | null = null, ended: string | null = null;
  const deliver = (answer: HelperAnswer): void => {
    const w = waiting;
    waiting = null;
    if (w) w(answer);
    else answers.push(answer);
  };
  const end = (why: string): void => {
    ended ??= why;
    if (waiting) deliver({ stopped: ended });
  };
  port.listen({ answer: deliver, stopped: end });
  return {
    next: () => {
      const answer = answers.shift() ?? (ended === null ? null : { stopped: ended });
      return answer ? Promise.resolve(answer) : new Promise((resolve) => { waiting = resolve; });
    },
    close: () => {
      end('was closed');
      port.terminate();
    },
  };
}

/** What a helper thread runs on the job it was given (its blocks, then its rollouts): each answer posted as soon as it is ready, an error once, as words. */
export function serveHelperJob(job: ResampleJob, post: (answer: HelperAnswer) => void): void {
  try {
    for (const block of helperBlocks(job)) post(block);
  } catch (error) {
    post({ stopped: `stopped: ${error instanceof Error ? error.message : String(error)}` });
  }
}

/** How often a reader waiting on the helper looks for a stop request (answerOrStop). */
const STOP_POLL_MS = 50;

/**
 * The feed's next answer, looking for a stop request every STOP_POLL_MS while it waits, so that a
 * stop (Ctrl+C, the app's Stop) is heard even while the helper is busy with a long share (the model
 * rollouts); then it throws FqeCancelledError (throwIfCancelled), and the caller's close() ends
 * the thread.
 */
export async function answerOrStop(feed: HelperFeed, cancel?: CancellationCheck): Promise<HelperAnswer> {
  const answer = feed.next();
  if (!cancel) return answer;
  for (;;) {
    let timer: ReturnType<typeof setTimeout> | undefined;
    const waited = new Promise<null>((resolve) => { timer = setTimeout(() => resolve(null), STOP_POLL_MS); });
    const got = await Promise.race([answer, waited]);
    clearTimeout(timer);
    if (got !== null) return got;
    throwIfCancelled(cancel);
  }
}
