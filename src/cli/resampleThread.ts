/**
 * The CLI's helper thread (helperThread.ts starts it): runs the share of
 * the resample loop on the job it was given (src/pipeline/helperFeed.ts, serveHelperJob), posting
 * each block as soon as it is done, ahead of the loop. It listens for nothing: the loop's side ends
 * it with Worker.terminate(), which stops it even inside a block.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { serveHelperJob } from '../pipeline/helperFeed';
import type { ResampleJob } from '../pipeline/perDecisionBlocks';

const port = parentPort;
if (port) serveHelperJob(workerData as ResampleJob, (answer) => port.postMessage(answer));
