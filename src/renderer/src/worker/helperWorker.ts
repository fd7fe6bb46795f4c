/**
 * The app's second thread for the resample loop (src/pipeline/perDecisionRoute.ts): a Web Worker
 * that the evaluation worker starts (a nested dedicated worker), lent from the same amount of work
 * as the CLI's (HELPER_MINIMUM_WORK). The job's ranked tables are transferred to it, not copied.
 * A worker that cannot load, throws or sends what cannot be read answers `stopped` with the reason,
 * and the loop carries on by itself with the same numbers. Where the scope cannot start a worker
 * at all (Node, in the unit tests) there is no helper.
 */
import { HELPER_MINIMUM_WORK, helperFeed } from '../../../pipeline/helperFeed';
import { transferables, type ResampleJob } from '../../../pipeline/perDecisionBlocks';
import type { HelperAnswer, HelperFeed, ResampleHelper } from '../../../pipeline/helperFeed';

export function helperWorker(minimumWork = HELPER_MINIMUM_WORK): ResampleHelper | undefined {
  return typeof Worker === 'undefined' ? undefined : { minimumWork, start: startNested };
}

function startNested(job: ResampleJob): HelperFeed {
  const worker = new Worker(new URL('./resampleHelperWorker.ts', import.meta.url), { type: 'module', name: 'resample helper' });
  const feed = helperFeed({
    listen(heard) {
      worker.onmessage = (event: MessageEvent<HelperAnswer>) => heard.answer(event.data);
      worker.onerror = (event: ErrorEvent) => {
        event.preventDefault();
        heard.stopped(`stopped: ${event.message || 'it could not be loaded'}`);
      };
      worker.onmessageerror = () => heard.stopped('stopped: an answer could not be read');
    },
    terminate: () => worker.terminate(),
  });
  worker.postMessage(job, transferables(job));
  return feed;
}
