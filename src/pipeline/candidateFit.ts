/**
 * What the pipeline needs from any approximator's fit of one candidate, whatever its kind.
 * Values here are in reward terms (the engine's sense); the pipeline converts for display.
 */
import type { ActionValueFunction } from '../core/actionValue';
import type { CancellationCheck } from '../core/fqe/cancellation';
import type { GaussianPolicy } from '../core/policy';
import type { TransitionSet } from '../core/transitions';
import type { ApproximatorSettings } from '../project/schema';
import type { FitIteration, FitStatus } from './estimates';

export interface CandidateFitRequest {
  data: TransitionSet;
  policy: GaussianPolicy;
  approximator: ApproximatorSettings;
  discount: number;
  quadratureNodes: number;
  seed: number;
  startStates: Float64Array; // e×ds
  onIteration?: (iteration: FitIteration) => void;
  cancel?: CancellationCheck;
  /** Where TensorFlow.js's wasm backend finds its .wasm files (the CLI passes node_modules; the app registers its own). */
  wasmPath?: string;
}

export interface CandidateFit {
  q: ActionValueFunction;
  status: FitStatus;
  message: string;
  history: FitIteration[];
  policyValue: number;
  standardError: number | null;
  fixedPointValue: number | null;
  featureCount: number;
  /** What computed the fit: "linear least squares" or "TensorFlow.js wasm" / "TensorFlow.js cpu". */
  backend: string;
  warnings: string[];
  /** Release resources the fit holds (tensors); a no-op for linear fits. */
  dispose(): void;
}
