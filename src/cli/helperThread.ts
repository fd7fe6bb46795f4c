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
import { HELPER_MINIMUM_WORK, helperFeed } from '../pipeline/helperFeed';
import type { HelperAnswer, HelperFeed, ResampleHelper } from '../pipeline/helperFeed';

const fromSource = import.meta.url.endsWith('.ts');
const threadModule = new URL(fromSource ? './resampleThread.ts' : './resampleThread.js', import.meta.url).href;

/** The thread's first module, as code: with tsx's loader registered first when running from source. */
function bootCode(): string {
  if (!fromSource) return `import(${JSON.stringify(threadModule)});`;
  const tsx = import.meta.resolve('tsx/esm/api');
  return `import(${JSON.stringify(tsx)}).then((tsx) => { tsx.register(); return import(${JSON.stringify(threadModule)}); });`;
}

export function helperThread(minimumWork = HELPER_MINIMUM_WORK): ResampleHelper {
  return { minimumWork, start: startHelper };
}

function startHelper(job: ResampleJob): HelperFeed {
  const worker = new Worker(bootCode(), { eval: true, workerData: job, transferList: transferables(job) });
  return helperFeed({
    listen(heard) {
      worker.on('message', (answer: HelperAnswer) => heard.answer(answer));
      worker.on('error', (error: Error) => heard.stopped(`stopped: ${error.message}`));
      worker.on('exit', (code) => heard.stopped(code === 0 ? 'ended before the last block' : `ended (exit code ${code})`));
    },
    terminate: () => void worker.terminate(),
  });
}
