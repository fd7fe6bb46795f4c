/**
 * The CLI's second thread for the resample loop (src/pipeline/perDecisionRoute.ts), on
 * node:worker_threads: the job's ranked tables are transferred to it, not copied; it answers block
 * by block in order, and close() terminates it whatever it is doing, so the process never waits on
 * it at exit. A thread that fails to start, throws or exits early answers `stopped` with the reason,
 * and the loop carries on by itself.
 *
 * The CLI runs TypeScript through tsx. On Node 20 a worker started from a .ts file fails with
 * ERR_UNKNOWN_FILE_EXTENSION even though it inherits tsx's `--import` in process.execArgv (seen here
 * on Node 20.20; tsx issue #354), so the thread's first module is a line of code that registers
 * tsx's loader through its API and then imports the thread module.
 */
import { Worker } from 'node:worker_threads';
import { transferables, type ResampleJob } from '../pipeline/perDecisionBlocks';
import type { HelperAnswer, HelperFeed, ResampleHelper } from '../pipeline/perDecisionRoute';

const fromSource = import.meta.url.endsWith('.ts');
const threadModule = new URL(fromSource ? './resampleThread.ts' : './resampleThread.js', import.meta.url).href;

/** The thread's first module, as code: with tsx's loader registered first when running from source. */
function bootCode(): string {
  if (!fromSource) return `import(${JSON.stringify(threadModule)});`;
  const tsx = import.meta.resolve('tsx/esm/api');
  return `import(${JSON.stringify(tsx)}).then((tsx) => { tsx.register(); return import(${JSON.stringify(threadModule)}); });`;
}

/**
 * Work the helper could take (resampleWork in src/pipeline/perDecisionRoute.ts: logged entries ×
 * resamples, the linear-quadratic model's moment values counted at a third of an entry each) below
 * which the CLI keeps to one thread. Measured on the peer plant's logs (bench/peerBench.ts) for the
 * per-decision share alone: 10^8 (100,000 transitions, 1,000 resamples) is about 0.9 s of the
 * helper's CPU against about 0.3 s to start a thread and 20–50 MiB more memory; 10^9, about 7 s.
 * Our choice: lend it from 3·10^8, where the work is some ten times the start.
 */
export const HELPER_MINIMUM_WORK = 3e8;

export function helperThread(minimumWork = HELPER_MINIMUM_WORK): ResampleHelper {
  return { minimumWork, start: startHelper };
}

function startHelper(job: ResampleJob): HelperFeed {
  const worker = new Worker(bootCode(), { eval: true, workerData: job, transferList: transferables(job) });
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
  worker.on('message', (answer: HelperAnswer) => deliver(answer));
  worker.on('error', (error: Error) => end(`stopped: ${error.message}`));
  worker.on('exit', (code) => end(code === 0 ? 'ended before the last block' : `ended (exit code ${code})`));
  return {
    next: () => {
      const answer = answers.shift() ?? (ended === null ? null : { stopped: ended });
      return answer ? Promise.resolve(answer) : new Promise((resolve) => { waiting = resolve; });
    },
    close: () => {
      end('was closed');
      void worker.terminate();
    },
  };
}
