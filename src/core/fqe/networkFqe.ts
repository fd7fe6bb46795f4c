/**
 * Fitted Q-evaluation with a neural network (Ernst, Geurts & Wehenkel, "Tree-based batch mode
 * reinforcement learning", JMLR 2005, with a network as the regressor; Riedmiller, "Neural fitted
 * Q iteration", ECML 2005): Q_k is the least-squares regression of
 *   y_k = r + γ(1 − done)·E_{a'~π(·|s')} Q_{k−1}(s', a')
 * on the standardised (s, a), by stepsPerIteration Adam steps warm-started from Q_{k−1}. Each
 * target is computed once, from a frozen copy of the previous network, with the same action
 * quadrature as the linear path (networkNextInputs.ts).
 *
 * Outcomes: 'maxIterations' (all outer iterations ran), 'converged' (the held-out Bellman error
 * stopped improving for `patience` iterations), 'diverged' (non-finite or exploding loss, or
 * values beyond what any policy can earn: the last network that passed the checks is kept) and
 * 'cancelled' (the last completed network is kept). With nothing completed to keep, cancellation
 * throws FqeCancelledError and divergence NetworkDivergedError.
 */
import * as tf from '@tensorflow/tfjs';
import type { ActionValueFunction } from '../actionValue';
import type { GaussianPolicy } from '../policy';
import type { TransitionSet } from '../transitions';
import type { CancellationCheck } from './cancellation';
import { FqeCancelledError } from './fqeErrors';
import { createNetworkActionValue } from './networkActionValue';
import { createFitSession, type FitSession } from './networkFitSession';
import { checkNetworkFqeInput } from './networkFqeInput';
import { runOuterIterations, type IterationRun } from './networkIterations';
import { valueReachOnInputs } from './networkValueReach';
import type { NetworkFqeSettings } from './networkSettings';
import { selectBackend, type BackendSelection, type TfBackendName } from './tfBackend';
import { NetworkDivergedError } from './networkErrors';

export type { NetworkFqeSettings } from './networkSettings';

export interface NetworkProgress {
  readonly iteration: number; // outer iterations completed, 1-based
  readonly outerIterations: number;
  /** Mean minibatch squared error of the iteration, reward units². */
  readonly loss: number;
  /** Mean squared empirical Bellman residual of Q_k on held-out episodes (networkIterations.ts), reward units²; null without hold-out. */
  readonly heldOutBellmanError: number | null;
  /** Mean iteration time × iterations left (an upper estimate when early stopping is on). */
  readonly remainingSeconds: number;
}

export interface NetworkIterationRecord {
  readonly iteration: number;
  readonly loss: number;
  readonly heldOutBellmanError: number | null;
}

export type NetworkFitStatus = 'converged' | 'maxIterations' | 'diverged' | 'cancelled';

export interface NetworkFit {
  /** Q(s, a) in reward units; evaluate runs the network in batches. */
  readonly actionValue: ActionValueFunction;
  readonly status: NetworkFitStatus;
  readonly message: string;
  readonly history: readonly NetworkIterationRecord[];
  readonly backend: TfBackendName;
  readonly backendNote: string;
  readonly seed: number;
  /** Frees the network's tensors; actionValue.evaluate throws afterwards. */
  dispose(): void;
}

export interface NetworkFqeInput {
  readonly data: TransitionSet;
  readonly policy: GaussianPolicy;
  readonly discount: number; // γ ∈ [0, 1)
  readonly quadratureNodes: number; // per action dimension
  readonly seed: number;
  readonly settings: NetworkFqeSettings;
  readonly onProgress?: (progress: NetworkProgress) => void;
  /** Polled between gradient steps: a function or an AbortSignal-like { aborted }. */
  readonly isCancelled?: CancellationCheck;
  /** Directory or URL prefix of the wasm backend's .wasm files (Node: node_modules/@tensorflow/tfjs-backend-wasm/dist/). */
  readonly wasmPath?: string;
}

export async function fitNetworkFqe(input: NetworkFqeInput): Promise<NetworkFit> {
  checkNetworkFqeInput(input);
  const selection = await selectBackend(input.settings.backend, input.wasmPath);
  const session = createFitSession(input);
  try {
    const run = await runOuterIterations(session, input, selection.backend);
    try {
      return finishFit(session, input, selection, run);
    } finally {
      run.lastGood?.theta.dispose();
    }
  } finally {
    session.dispose();
  }
}

/** Picks the network to keep (averaged, or the last good one), checks it, and wraps it. */
function finishFit(session: FitSession, input: NetworkFqeInput, selection: BackendSelection, run: IterationRun): NetworkFit {
  const { stop } = run;
  let theta: tf.Tensor1D, status = stop.kind, message = stop.message;
  if (stop.kind === 'diverged' || session.average.count === 0) {
    if (!run.lastGood) throw noNetworkError(stop.kind, stop.message);
    theta = tf.clone(run.lastGood.theta);
    if (stop.kind !== 'diverged') message += ` Kept the network of iteration ${run.lastGood.iteration}.`;
  } else {
    theta = session.average.mean();
    if (session.average.count > 1) message += ` Weights averaged over the last ${session.average.count} outer iterations.`;
    const reach = valueReachOnInputs(theta, session);
    if (!(reach <= session.valueLimit)) {
      theta.dispose();
      const reason = `the final network predicts |Q| up to ${reach.toPrecision(4)} on the data, beyond the limit ${session.valueLimit.toPrecision(4)} that no policy's value can reach`;
      if (!run.lastGood) throw new NetworkDivergedError(`network FQE diverged: ${reason}; lower learningRate or use fewer, smaller hidden layers`);
      theta = tf.clone(run.lastGood.theta);
      status = 'diverged';
      message = `Stopped: ${reason}. Kept the network of iteration ${run.lastGood.iteration}, the last that passed the checks.`;
    }
  }
  const actionValue = createNetworkActionValue({
    theta, layout: session.layout, activation: input.settings.activation, standardiser: session.standardiser,
    output: session.output, backend: selection.backend, stateDim: input.data.stateDim, actionDim: input.data.actionDim,
  });
  return {
    actionValue, status, message, history: run.history, backend: selection.backend, backendNote: selection.note, seed: input.seed,
    dispose: () => actionValue.dispose(),
  };
}

function noNetworkError(kind: string, message: string): Error {
  if (kind === 'cancelled') return new FqeCancelledError(`network FQE was cancelled before its first outer iteration completed, so there is no network to keep`);
  return new NetworkDivergedError(`network FQE diverged before any network passed its checks: ${message} Lower learningRate (e.g. by 10×) or check the rewards for outliers.`);
}
