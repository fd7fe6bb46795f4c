/**
 * The CLI's helper thread (helperThread.ts starts it): runs the share of the resample loop a
 * second core can take (the per-decision cross-checks and the linear-quadratic model:
 * src/pipeline/perDecisionBlocks.ts) on the job it was given, posting each block as soon as it is
 * done, ahead of the loop. It listens for nothing: the loop's side ends it with
 * Worker.terminate(), which stops it even inside a block. An error is posted once, as words.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { helperBlocks, type ResampleJob } from '../pipeline/perDecisionBlocks';

const port = parentPort;
if (port) {
  try {
    for (const block of helperBlocks(workerData as ResampleJob)) port.postMessage(block);
  } catch (error) {
    port.postMessage({ stopped: `stopped: ${error instanceof Error ? error.message : String(error)}` });
  }
}
