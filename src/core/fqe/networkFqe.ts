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
  const kept = run.stop.kind === 'diverged' ? lastGoodNetwork(run, run.stop.message) : finalNetwork(session, run);
  const actionValue = createNetworkActionValue({
    theta: kept.theta, layout: session.layout, activation: input.settings.activation, standardiser: session.standardiser,
    output: session.output, backend: selection.backend, stateDim: input.data.stateDim, actionDim: input.data.actionDim,
  });
  return {
    actionValue, status: kept.status, message: kept.message, history: run.history,
    backend: selection.backend, backendNote: selection.note, seed: input.seed,
    dispose: () => actionValue.dispose(),
  };
}

interface KeptNetwork {
  readonly theta: tf.Tensor1D; // a new tensor, handed to the action-value function
  readonly status: NetworkFitStatus;
  readonly message: string;
}

/** The average of the last completed iterations, if its values stay within the limit. */
function finalNetwork(session: FitSession, run: IterationRun): KeptNetwork {
  const { average } = session;
  if (average.count === 0) {
    throw new FqeCancelledError('network FQE was cancelled before its first outer iteration completed, so there is no network to keep');
  }
  const theta = average.mean();
  const reach = valueReachOnInputs(theta, session);
  if (!(reach <= session.valueLimit)) {
    theta.dispose();
    const reason = `Stopped after the last iteration: the final network predicts |Q| up to ${reach.toPrecision(4)} on the data, beyond the limit ${session.valueLimit.toPrecision(4)} that no policy's value can reach.`;
    return lastGoodNetwork(run, reason);
  }
  const averaged = average.count > 1 ? ` Weights averaged over the last ${average.count} outer iterations.` : '';
  return { theta, status: run.stop.kind, message: run.stop.message + averaged };
}

/** After divergence: the newest network that passed the checks, or NetworkDivergedError if there is none. */
function lastGoodNetwork(run: IterationRun, reason: string): KeptNetwork {
  if (!run.lastGood) {
    throw new NetworkDivergedError(`network FQE diverged before any network passed its checks. ${reason} Lower learningRate (e.g. by 10×) or check the rewards for outliers.`);
  }
  const advice = 'a lower learningRate may avoid the divergence';
  return {
    theta: tf.clone(run.lastGood.theta), status: 'diverged',
    message: `${reason} Kept the network of iteration ${run.lastGood.iteration}, the last that passed the checks; ${advice}.`,
  };
}
