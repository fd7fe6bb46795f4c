/**
 * What the pipeline needs from any approximator's fit of one candidate, whatever its kind.
 * Values here are in reward terms (the engine's sense); the pipeline converts for display.
 */
import type { ActionValueFunction } from '../core/actionValue';
import type { Agreement } from '../core/fqe/approximatorAgreement';
import type { NetworkValueEstimate, ValueInterval } from '../core/fqe/networkValueEstimate';
import type { CancellationCheck } from '../core/fqe/cancellation';
import type { GaussianPolicy } from '../core/policy';
import type { TransitionSet } from '../core/transitions';
import type { ApproximatorSettings } from '../project/approximatorSchema';
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
  /**
   * Network fits: how the stopping rule judged the fit (src/core/fqe/networkConvergence.ts).
   * converged is true exactly when status is 'converged'; remainingBound is the share of the value
   * that may still be moving by the rule (null before two full windows); window 0 = rule off.
   */
  convergence?: { converged: boolean; iterations: number; remainingBound: number | null; tolerance: number; window: number; discount: number; fullStepIterations?: number };
  /**
   * Network fits: the interval of policyValue (reward sense), by episode resamples of the last-layer
   * solve; intervalCovers says in one sentence what it covers and what it does not.
   */
  interval?: ValueInterval;
  intervalCovers?: string;
  /**
   * Network fits: the linear estimate beside the network (degree-2 polynomial LSTD-Q on the same data
   * and start states, src/core/fqe/networkComparator.ts; the network started from it, or from the
   * degree-4 part where the degree choice took 4 or the project fixed it) with its interval, the paired difference network − linear, and the
   * agreement verdict with its message (src/core/fqe/approximatorAgreement.ts). Reward sense.
   */
  linearComparison?: {
    value: number;
    interval: ValueInterval;
    difference: { value: number; interval: ValueInterval };
    agreement: Agreement;
  };
  /**
   * Network fits: the degree of the polynomial part the fit used, and the sentence that says why —
   * the guarded choice's own (src/core/fqe/networkDegreeChoice.ts) or, where the project fixed the
   * degree, that it was set (src/core/fqe/polynomialPartSetting.ts).
   */
  polynomialPart?: { degree: number; sentence: string };
  /**
   * Network fits: J on the assessment's own resamples of the runs (src/core/fqe/networkInterval.ts,
   * `runs`), with its interval at the assessment's level, so the network pairs with the present
   * controller's and the other candidates' replicates (networkRunResamples.ts). Reward sense.
   */
  resampleByRuns?(options: { runs: number; resamples: number; seed: number; level: number }): NetworkValueEstimate;
}
