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
import { bellmanTargets, type BellmanTargets } from './networkNextInputs';
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
  let kept = false, targets: BellmanTargets | null = null;
  try {
    guard.checkBackend();
    targets = bellmanTargets(frozen, s.layout, s.net.activation, s.next.training, s.rows.training.base);
    const reach = valueReach(s.output, targets.smallestNextOutput, targets.largestNextOutput);
    if (!(reach <= s.valueLimit)) {
      return diverged(k, `the network of iteration ${k - 1} predicts |Q| up to ${reach.toPrecision(4)} at next states, beyond the limit ${s.valueLimit.toPrecision(4)} (2·max|r|/(1−γ) plus one output-scale unit) that no policy's value can reach`);
    }
    if (k > 1) {
      state.lastGood?.theta.dispose();
      state.lastGood = { theta: frozen, iteration: k - 1 };
      kept = true;
    }
    s.batches.setTargets(targets.targets);
    const outcome = await trainSteps(s.net, s.batches, steps, guard);
    if (outcome.kind !== 'completed') {
      const what = outcome.kind === 'nonFinite' ? 'not finite' : `above ${guard.lossLimit.toPrecision(3)} (exploding)`;
      return diverged(k, `the minibatch loss at step ${outcome.step} was ${outcome.loss} in network units, ${what}`);
    }
    s.average.add(s.net.theta);
    record(state, k, outcome.meanLoss * s.output.scale ** 2, heldOutBellmanError(s));
    return null;
  } finally {
    targets?.targets.dispose();
    if (!kept) frozen.dispose();
  }
}

function diverged(k: number, reason: string): IterationStop {
  return { kind: 'diverged', message: `Stopped at outer iteration ${k}: ${reason}.` };
}

/**
 * Mean over held-out transitions of the empirical Bellman residual of the current network,
 * (Q_k(s, a) − r − γ(1 − done)·E_{a'~π} Q_k(s', a'))², reward units²; null without hold-out.
 * Q_k's own residual, not its error against the frozen target y_k: that error mostly measures
 * the spread of y_k, which grows as the iterates pick up the value's variation, so it rises
 * while the fit improves; the own residual falls as Q_k approaches its fixed point and levels
 * off at the noise of r + γV(s').
 */
function heldOutBellmanError(s: FitSession): number | null {
  const rows = s.rows.heldOut, next = s.next.heldOut;
  if (!rows || !next) return null;
  const { targets } = bellmanTargets(s.net.theta, s.layout, s.net.activation, next, rows.base);
  const meanSquare = tf.tidy(() => {
    const q = networkOutput(s.net.theta, s.layout, s.net.activation, rows.inputs);
    return tf.mean(tf.squaredDifference(tf.reshape(q, [-1]), targets)).dataSync()[0];
  });
  targets.dispose();
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
