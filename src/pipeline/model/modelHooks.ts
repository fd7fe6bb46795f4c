/** What a host may hear and say while a model is built: iterations, data-pass progress and cancellation. */
import type { CancellationCheck } from '../../core/fqe/cancellation';
import type { FitIteration } from '../estimates';

export interface ModelHooks {
  readonly onIteration?: (iteration: FitIteration) => void;
  readonly onDataPass?: (rowsDone: number, rowsTotal: number) => void;
  readonly cancel?: CancellationCheck;
  /** Awaited between slices of a long data pass so the host's cancel can arrive; default: a pacer yielding about every PACE_INTERVAL_MS. */
  readonly pace?: () => Promise<void>;
  /** Where TensorFlow.js's wasm backend finds its .wasm files, for hosts that must say (the CLI). */
  readonly wasmPath?: string;
}
