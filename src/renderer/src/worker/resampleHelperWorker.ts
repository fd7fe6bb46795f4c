/**
 * The app's helper thread (helperWorker.ts starts it from the evaluation worker): takes the one job
 * it is sent and runs the share of the resample loop on it
 * (src/pipeline/helperFeed.ts, serveHelperJob), posting each block as soon as it is done. The
 * loop's side ends it with Worker.terminate().
 */
/// <reference lib="webworker" />
import { serveHelperJob } from '../../../pipeline/helperFeed';
import type { ResampleJob } from '../../../pipeline/perDecisionBlocks';

const scope = self as unknown as DedicatedWorkerGlobalScope;

scope.onmessage = (event: MessageEvent<ResampleJob>) => {
  scope.onmessage = null; // one job per thread
  serveHelperJob(event.data, (answer) => scope.postMessage(answer));
};
