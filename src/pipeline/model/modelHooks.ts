/** What a host may hear and say while a model is built: iterations, data-pass progress and cancellation. */
import type { CancellationCheck } from '../../core/fqe/cancellation';
import type { FitIteration } from '../estimates';

export interface ModelHooks {
  readonly onIteration?: (iteration: FitIteration) => void;
  readonly onDataPass?: (rowsDone: number, rowsTotal: number) => void;
  readonly cancel?: CancellationCheck;
  /** Where TensorFlow.js's wasm backend finds its .wasm files, for hosts that must say (the CLI). */
  readonly wasmPath?: string;
}
