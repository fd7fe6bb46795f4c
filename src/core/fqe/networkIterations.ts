/**
 * The outer loop of network FQE: per iteration k, freeze Q_{k−1}, compute its targets once,
 * check its values, train Q_k on them, measure the held-out Bellman error, report, and decide
 * whether to stop. See networkFqe.ts for the method and the meaning of each outcome.
 */
import * as tf from '@tensorflow/tfjs';
import { FqeCancelledError } from './fqeErrors';
import type { FitSession } from './networkFitSession';
import type { NetworkFqeInput, NetworkIterationRecord } from './networkFqe';
import { networkOutput } from './networkForward';
import { frozenTargets, type FrozenTargets } from './networkNextInputs';
import { createPacer, trainSteps, type TrainingGuard } from './networkTrainer';
import { valueReach } from './networkValueReach';
import { requireActiveBackend, type TfBackendName } from './tfBackend';

export interface IterationStop {
  readonly kind: 'converged' | 'maxIterations' | 'diverged' | 'cancelled';
  readonly message: string;
}

export interface IterationRun {
  readonly history: NetworkIterationRecord[];
  readonly stop: IterationStop;
  /** The newest Q_j (j ≥ 1) whose values passed the check, owned by the caller; null if none yet. */
  readonly lastGood: { readonly theta: tf.Tensor1D; readonly iteration: number } | null;
}

interface LoopState {
  readonly history: NetworkIterationRecord[];
  lastGood: { theta: tf.Tensor1D; iteration: number } | null;
  best: { error: number; iteration: number } | null;
  sinceBest: number;
}

/** Yield to the event loop about this often, so cancellation and progress can get through. */
const PACE_MS = 50;

export async function runOuterIterations(s: FitSession, input: NetworkFqeInput, backend: TfBackendName): Promise<IterationRun> {
  const { outerIterations, patience } = input.settings;
  const state: LoopState = { history: [], lastGood: null, best: null, sinceBest: 0 };
  const guard: TrainingGuard = {
    lossLimit: ((2 * s.valueLimit) / s.output.scale) ** 2, cancel: input.isCancelled, pace: createPacer(PACE_MS),
    checkBackend: () => requireActiveBackend(backend, 'network FQE'),
  };
  const run = (stop: IterationStop): IterationRun => ({ history: state.history, stop, lastGood: state.lastGood });
  const started = performance.now();
  try {
    for (let k = 1; k <= outerIterations; k++) {
      const stop = await outerIteration(s, k, state, guard, input.settings.stepsPerIteration);
      if (stop) return run(stop);
      const record = state.history[k - 1];
      const remainingSeconds = ((performance.now() - started) / 1000 / k) * (outerIterations - k);
      input.onProgress?.({ ...record, outerIterations, remainingSeconds });
      if (patience > 0 && state.best && state.sinceBest >= patience) {
        return run({ kind: 'converged', message: `Stopped early after outer iteration ${k} of ${outerIterations}: the held-out Bellman error has not improved for ${patience} iterations (best ${state.best.error.toPrecision(4)} at iteration ${state.best.iteration}).` });
      }
    }
    return run({ kind: 'maxIterations', message: `Ran all ${outerIterations} outer iterations${bestSummary(state)}.` });
  } catch (error) {
    if (error instanceof FqeCancelledError) return run({ kind: 'cancelled', message: `Cancelled during outer iteration ${state.history.length + 1}.` });
    state.lastGood?.theta.dispose();
    throw error;
  }
}

/** One outer iteration; returns why to stop, or null to go on. */
async function outerIteration(s: FitSession, k: number, state: LoopState, guard: TrainingGuard, steps: number): Promise<IterationStop | null> {
  const frozen = tf.clone(s.net.theta); // Q_{k−1}
  let kept = false, targets: FrozenTargets | null = null, trainingTargets: tf.Tensor1D | null = null;
  try {
    guard.checkBackend();
    targets = frozenTargets(frozen, s.layout, s.net.activation, s.next, s.training.base);
    const reach = valueReach(s.output, targets.smallestNextOutput, targets.largestNextOutput);
    if (!(reach <= s.valueLimit)) {
      return diverged(k, `the network of iteration ${k - 1} predicts |Q| up to ${reach.toPrecision(4)} at next states, beyond the limit ${s.valueLimit.toPrecision(4)} (2·max|r|/(1−γ) plus one output-scale unit) that no policy's value can reach`);
    }
    if (k > 1) {
      state.lastGood?.theta.dispose();
      state.lastGood = { theta: frozen, iteration: k - 1 };
      kept = true;
    }
    trainingTargets = tf.slice(targets.targets, 0, s.training.trainingCount);
    s.batches.setTargets(trainingTargets);
    const outcome = await trainSteps(s.net, s.batches, steps, guard);
    if (outcome.kind !== 'completed') {
      const what = outcome.kind === 'nonFinite' ? 'not finite' : `above ${guard.lossLimit.toPrecision(3)} (exploding)`;
      return diverged(k, `the minibatch loss at step ${outcome.step} was ${outcome.loss} in network units, ${what}`);
    }
    s.average.add(s.net.theta);
    record(state, k, outcome.meanLoss * s.output.scale ** 2, heldOutError(s, targets.targets));
    return null;
  } finally {
    tf.dispose([targets?.targets, trainingTargets].filter((t): t is tf.Tensor1D => !!t));
    if (!kept) frozen.dispose();
  }
}

function diverged(k: number, reason: string): IterationStop {
  return { kind: 'diverged', message: `Stopped at outer iteration ${k}: ${reason}.` };
}

/** Mean of (Q_k − y_k)² over the held-out transitions, reward units²; null without hold-out. */
function heldOutError(s: FitSession, targets: tf.Tensor1D): number | null {
  const { trainingCount, heldOutCount, inputs } = s.training;
  if (heldOutCount === 0) return null;
  const meanSquare = tf.tidy(() => {
    const q = networkOutput(s.net.theta, s.layout, s.net.activation, tf.slice(inputs, [trainingCount, 0], [heldOutCount, -1]));
    return tf.mean(tf.squaredDifference(tf.reshape(q, [heldOutCount]), tf.slice(targets, trainingCount, heldOutCount))).dataSync()[0];
  });
  return meanSquare * s.output.scale ** 2;
}

function record(state: LoopState, iteration: number, loss: number, heldOutBellmanError: number | null): void {
  state.history.push({ iteration, loss, heldOutBellmanError });
  if (heldOutBellmanError === null) return;
  if (!state.best || heldOutBellmanError < state.best.error) {
    state.best = { error: heldOutBellmanError, iteration };
    state.sinceBest = 0;
  } else {
    state.sinceBest++;
  }
}

function bestSummary(state: LoopState): string {
  const last = state.history[state.history.length - 1]?.heldOutBellmanError;
  if (last === null || last === undefined || !state.best) return '';
  return `; held-out Bellman error ${last.toPrecision(4)} at the end, best ${state.best.error.toPrecision(4)} at iteration ${state.best.iteration}`;
}
