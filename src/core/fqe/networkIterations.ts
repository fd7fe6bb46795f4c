/**
 * The outer loop of network FQE. Iteration k, on the current network θ_k:
 *   1. hidden features of the training rows and their next-state averages (networkHiddenFeatures.ts);
 *   2. the last layer: by the LSTD-Q fixed point over [quadratic part, hidden features]
 *      (networkLastLayer.ts), or, with method.lastLayer = 'gradient', as Adam left it on top of the
 *      fixed linear fixed point;
 *   3. J_k over the start states and Q_k on the probe rows, the divergence checks, and the
 *      stopping rule (networkConvergence.ts);
 *   4. unless stopping: Adam steps on the regression of the Bellman targets of Q_k,
 *      y = r + γ E_{a'~π} Q_k(s', a'), which move the features (and give θ_{k+1}).
 * See networkFqe.ts for the outcomes.
 */
import * as tf from '@tensorflow/tfjs';
import { throwIfCancelled } from './cancellation';
import { FqeCancelledError } from './fqeErrors';
import { convergenceRule, hasConverged, iterationChange, type ConvergenceRule, type IterationValues } from './networkConvergence';
import type { FitSession } from './networkFitSession';
import type { NetworkIterationRecord } from './networkFqe';
import { hiddenFeatureRows, type HiddenFeatureRows } from './networkHiddenFeatures';
import { lastLayerTotals } from './networkLastLayerSums';
import { currentWeights, setOutputLayer, type LastLayer } from './networkOutputLayer';
import { createPacer, trainSteps, type TrainingGuard } from './networkTrainer';
import { adamStepFlop, featurePassFlop, lastLayerSumsFlop, newWork, type NetworkWork } from './networkWork';
import { measureIterate, regressionTargets, heldOutBellmanError, type MeasuredIterate } from './networkIterateValues';
import { climbRidgeLadder, RIDGE_LADDER_FACTOR, RIDGE_LADDER_RUNGS } from './networkRidgeLadder';
import { requireActiveBackend, type TfBackendName } from './tfBackend';
import { shareText } from '../shareText';

export interface IterationStop {
  readonly kind: 'converged' | 'maxIterations' | 'diverged' | 'cancelled';
  readonly message: string;
}

/** A measured iterate: hidden layers θ (a tensor owned by whoever holds this) and its last layer. */
export interface KeptIterate {
  readonly theta: tf.Tensor1D;
  readonly lastLayer: LastLayer;
  readonly iteration: number;
  /** The hidden ridge its last layer was solved with (networkRidgeLadder.ts); the default unless raised. */
  readonly hiddenRidge: number;
}

/**
 * An iterate solved with a raised hidden ridge, and why: its values at the ridge it started from lay
 * beyond reach, or its parts cancelled (networkPartCancellation.ts), or the ridge was held where an
 * earlier iterate had raised it (the ratchet, with the cancellation limit on).
 */
export interface RaisedRidge {
  readonly iteration: number;
  readonly hiddenRidge: number;
  readonly why: 'reach' | 'cancellation' | 'held';
}

export interface IterationRun {
  readonly history: NetworkIterationRecord[];
  readonly stop: IterationStop;
  /** The newest iterate that passed the checks (the final one unless diverged), owned by the caller; null if none. */
  readonly kept: KeptIterate | null;
  readonly rule: ConvergenceRule;
  readonly work: NetworkWork;
  /** The last iterate measured at the full step size (the decay began after it); null if it never began. */
  readonly decayFrom: number | null;
  /** Iterates solved with a raised hidden ridge (networkRidgeLadder.ts); empty when none needed it. */
  readonly raisedRidge: readonly RaisedRidge[];
}

export interface LoopInput {
  readonly startStates: Float64Array;
  readonly stateDim: number;
  readonly tolerance: number;
  readonly outerIterations: number;
  readonly patience: number;
  readonly stepsPerIteration: number;
  readonly learningRate: number;
  /**
   * Go on past the iteration where the rule was first met, to this one (within outerIterations), and
   * stop there as converged: a fit compared with another that stopped later is run to the same
   * iteration, so their difference's drift is read on aligned iterates (networkPairedDifference.ts).
   * The iterates before are the same numbers as without it (the seed fixes them). Default: stop when met.
   */
  readonly runTo?: number;
  readonly onProgress?: (record: NetworkIterationRecord, remainingSeconds: number) => void;
  readonly isCancelled?: TrainingGuard['cancel'];
}

interface LoopState {
  readonly history: NetworkIterationRecord[];
  kept: KeptIterate | null;
  readonly iterates: IterationValues[];
  readonly work: NetworkWork;
  /** Mean minibatch loss of the last Adam steps (reward units²), reported with the iterate they produced. */
  lastLoss: number | null;
  /** The iterate after which the step size began to decay; null while it is constant. */
  decayFrom: number | null;
  /** The quadratic part's weights the gradient mode keeps fixed (the linear fixed point). */
  readonly linearStart: Float64Array;
  /** performance.now() at the start of the outer loop. */
  readonly started: number;
  /** Iterates whose last layer needed a larger hidden ridge to stay within the possible values (networkRidgeLadder.ts). */
  readonly raisedRidge: RaisedRidge[];
  /** The first iterate at which the stopping rule was met; null until then. */
  convergedAt: number | null;
}

/** Yield to the event loop about this often, so cancellation and progress can get through. */
const PACE_MS = 50;

export async function runOuterIterations(s: FitSession, input: LoopInput, backend: TfBackendName, linearStart: Float64Array): Promise<IterationRun> {
  const rule = convergenceRule(s.discount, input.tolerance, input.patience);
  const started = performance.now();
  const state: LoopState = { history: [], kept: null, iterates: [], linearStart, work: newWork(), lastLoss: null, decayFrom: null, started, raisedRidge: [], convergedAt: null };
  const guard: TrainingGuard = {
    lossLimit: ((2 * s.valueLimit) / s.output.scale) ** 2, cancel: input.isCancelled, pace: createPacer(PACE_MS),
    checkBackend: () => requireActiveBackend(backend, 'network FQE'),
  };
  const run = (stop: IterationStop): IterationRun => ({ history: state.history, stop, kept: state.kept, rule, work: state.work, decayFrom: state.decayFrom, raisedRidge: state.raisedRidge });
  try {
    for (let k = 1; k <= input.outerIterations; k++) {
      throwIfCancelled(input.isCancelled);
      const report = () => input.onProgress?.(state.history[k - 1], ((performance.now() - started) / 1000 / k) * (input.outerIterations - k));
      const stop = await outerIteration(s, k, state, guard, input, rule, report);
      if (stop) return run(stop);
    }
    throw new Error('network FQE: the outer loop ended without a stopping decision'); // unreachable: the last iteration stops
  } catch (error) {
    if (error instanceof FqeCancelledError) return run({ kind: 'cancelled', message: `Cancelled during outer iteration ${state.history.length + 1}.` });
    state.kept?.theta.dispose();
    throw error;
  }
}

/** One outer iteration; returns why to stop, or null to go on. */
async function outerIteration(
  s: FitSession, k: number, state: LoopState, guard: TrainingGuard, input: LoopInput, rule: ConvergenceRule, report: () => void,
): Promise<IterationStop | null> {
  guard.checkBackend();
  const features = hiddenFeatureRows(s.net.theta, s.layout, s.net.activation, s.rows.training.inputs, s.next.training);
  countFeatureWork(s, state.work);
  try {
    const measured = measure(s, k, state, features, input, rule);
    if ('stop' in measured) return measured.stop;
    report();
    if (state.convergedAt === null && hasConverged(rule, state.history.map((h) => h.remainingBound))) state.convergedAt = k;
    if (state.convergedAt !== null && (k >= (input.runTo ?? 0) || k === input.outerIterations)) return { kind: 'converged', message: convergedMessage(rule, state.convergedAt, k) };
    if (k === input.outerIterations) return { kind: 'maxIterations', message: notConvergedMessage(rule, state.history) };
    state.decayFrom ??= decayStart(s.method, rule, k, measured.remainingBound);
    setLearningRate(s, input.learningRate * learningRateFactor(s.method, k, state.decayFrom));
    return await train(s, k, state, features, measured.lastLayer, guard, input.stepsPerIteration);
  } finally {
    features.dispose();
  }
}

/** Steps 2–3: the last layer of θ_k, its values and checks, the history record and the kept iterate. */
function measure(
  s: FitSession, k: number, state: LoopState, features: HiddenFeatureRows, input: LoopInput, rule: ConvergenceRule,
): { stop: IterationStop } | { lastLayer: LastLayer; remainingBound: number | null } {
  const solved = possibleIterate(s, k, state, features, input);
  if ('stop' in solved) return solved;
  const { lastLayer, values, hiddenRidge } = solved;
  if (s.method.lastLayer === 'leastSquares') setOutputLayer(s.net.theta, s.layout, lastLayer, s.output.scale);
  state.iterates.push({ policyValue: values.policyValue, probe: values.probe });
  const change = iterationChange(rule, state.iterates);
  state.history.push({
    iteration: k, loss: state.lastLoss, heldOutBellmanError: heldOutBellmanError(s, lastLayer),
    policyValue: values.policyValue, relativeChange: change.relativeChange, remainingBound: change.remainingBound,
    elapsedSeconds: (performance.now() - state.started) / 1000,
  });
  state.kept?.theta.dispose();
  state.kept = { theta: tf.clone(s.net.theta), lastLayer, iteration: k, hiddenRidge };
  return { lastLayer, remainingBound: change.remainingBound };
}

/** Step 4: Adam steps on the Bellman targets of Q_k; null to go on, or why to stop. */
async function train(
  s: FitSession, k: number, state: LoopState, features: HiddenFeatureRows, lastLayer: LastLayer, guard: TrainingGuard, steps: number,
): Promise<IterationStop | null> {
  const targets = regressionTargets(s, features, lastLayer, s.method.lastLayer === 'gradient' ? state.linearStart : lastLayer.linear);
  try {
    s.batches.setTargets(targets);
    const started = performance.now();
    const outcome = await trainSteps(s.net, s.batches, steps, guard);
    state.work.stepSeconds += (performance.now() - started) / 1000;
    state.work.adamSteps += steps;
    state.work.flop += steps * adamStepFlop(s.layout, s.batches.batchSize);
    if (outcome.kind !== 'completed') {
      const what = outcome.kind === 'nonFinite' ? 'not finite' : `above ${guard.lossLimit.toPrecision(3)} (exploding)`;
      return diverged(k, `the minibatch loss at step ${outcome.step} was ${outcome.loss} in network units, ${what}`);
    }
    state.lastLoss = outcome.meanLoss * s.output.scale ** 2;
    s.average.add(s.net.theta);
    return null;
  } finally {
    targets.dispose();
  }
}

function countFeatureWork(s: FitSession, work: NetworkWork): void {
  const n = s.rows.training.transitions.length, dh = s.layout.layers[s.layout.layers.length - 1].inputs;
  work.flop += featurePassFlop(s.layout, n * (1 + s.next.training.pointsPerState));
  if (s.method.lastLayer === 'leastSquares') work.flop += lastLayerSumsFlop(n, s.linearTotal.dim, dh);
}

/** The last layer of this iterate: solved (least squares) or read from θ on top of the fixed linear start (gradient). */
/**
 * The last layer of this iterate with its values, when they pass the value check: read from θ on top
 * of the fixed linear start (gradient), or solved by least squares, raising the hidden ridge where
 * the default gives values no policy can have (networkRidgeLadder.ts).
 */
function possibleIterate(
  s: FitSession, k: number, state: LoopState, features: HiddenFeatureRows, input: LoopInput,
): { lastLayer: LastLayer; values: MeasuredIterate; hiddenRidge: number } | { stop: IterationStop } {
  let atDefault: MeasuredIterate | null = null; // the ladder measures its first rung first (when it can be solved)
  const measureAt = (lastLayer: LastLayer) => {
    const values = measureIterate(s, lastLayer, input.startStates, input.stateDim);
    atDefault ??= values;
    return values;
  };
  const passes = (values: MeasuredIterate) => values.reach <= s.valueLimit;
  const limit = s.method.cancellationLimit, settled = (values: MeasuredIterate) => passes(values) && values.cancellation <= limit;
  if (s.method.lastLayer === 'gradient') {
    const lastLayer = currentWeights(s.net.theta, s.layout, state.linearStart, s.output.scale), values = measureAt(lastLayer);
    return passes(values) ? { lastLayer, values, hiddenRidge: s.method.hiddenRidge } : { stop: beyondReach(k, s, values) };
  }
  const sums = lastLayerTotals(s.linear.training.tensors, features, s.linearTotal);
  // With the cancellation limit on, the ridge only ratchets up within a fit: a direction the data hardly
  // determine stays so as the features move, and stepping back down let J wander with it (steam drum, seed 1).
  const floor = limit > 0 ? Math.max(s.method.hiddenRidge, ...state.raisedRidge.map((r) => r.hiddenRidge)) : s.method.hiddenRidge;
  const rungsLeft = RIDGE_LADDER_RUNGS - Math.round(Math.log10(floor / s.method.hiddenRidge) / Math.log10(RIDGE_LADDER_FACTOR));
  const strict = limit > 0 ? climbRidgeLadder(sums, floor, measureAt, settled, s.higherTermRidge, rungsLeft) : null;
  const step = strict && 'lastLayer' in strict ? strict : climbRidgeLadder(sums, s.method.hiddenRidge, measureAt, passes, s.higherTermRidge);
  if ('failure' in step) return { stop: diverged(k, step.failure) };
  if ('failing' in step) return { stop: beyondReach(k, s, step.failing.values) };
  if (step.hiddenRidge !== s.method.hiddenRidge) {
    const measuredAtFloor = atDefault as MeasuredIterate | null, raisedHere = step.hiddenRidge > floor;
    const why: RaisedRidge['why'] = !raisedHere ? 'held' : measuredAtFloor !== null && passes(measuredAtFloor) ? 'cancellation' : 'reach';
    state.raisedRidge.push({ iteration: k, hiddenRidge: step.hiddenRidge, why });
  }
  return step;
}

function beyondReach(k: number, s: FitSession, values: MeasuredIterate): IterationStop {
  return diverged(k, `the values reach |Q| = ${values.reach.toPrecision(4)}, beyond the limit ${s.valueLimit.toPrecision(4)} (2·max|r|/(1−γ) plus one output-scale unit) that no policy’s value can reach`);
}

/** The iterate after which the step size starts to decay (networkMethod.ts), or null: not yet. */
function decayStart(method: FitSession['method'], rule: ConvergenceRule, k: number, bound: number | null): number | null {
  const { plateau, latest } = method.learningRateDecay;
  return (bound !== null && bound <= plateau * rule.tolerance) || k >= latest ? k : null;
}

/** The Adam step size after iterate k as a share of learningRate: 1 until the decay starts at iterate `from`, then factor^(k − from + 1) down to the floor. */
export function learningRateFactor(method: FitSession['method'], k: number, from: number | null): number {
  const { factor, floor } = method.learningRateDecay;
  return from === null ? 1 : Math.max(floor, factor ** (k - from + 1));
}

function setLearningRate(s: FitSession, rate: number): void {
  (s.net.optimizer as unknown as { learningRate: number }).learningRate = rate;
}

function diverged(k: number, reason: string): IterationStop {
  return { kind: 'diverged', message: `Stopped at outer iteration ${k}: ${reason}.` };
}

function convergedMessage(rule: ConvergenceRule, k: number, last: number): string {
  const ranOn = last > k ? ` Run on to iteration ${last}, where the fit it is compared with stopped.` : '';
  return `Converged at outer iteration ${k}: between the last two windows of ${rule.window} iterations, J and Q on the probe rows drifted so little ` +
    `that, for a contraction at γ = ${rule.discount}, at most ${percent(rule.tolerance)} of the value can still be moving.${ranOn}`;
}

function notConvergedMessage(rule: ConvergenceRule, history: readonly NetworkIterationRecord[]): string {
  const last = history[history.length - 1];
  if (rule.window === 0) return `Ran all ${history.length} outer iterations (stopping rule off: patience 0), so convergence was not judged.`;
  if (last.remainingBound === null) {
    return `Not converged: stopped at the limit of ${history.length} outer iterations, before the rule could judge the drift ` +
      `(it compares two full windows of ${rule.window} iterations, so it needs at least ${rule.minimumIterations}). Allow more outer iterations.`;
  }
  const bound = percent(last.remainingBound);
  return `Not converged: stopped at the limit of ${history.length} outer iterations while J and Q were still changing ` +
    `(the last drift allows up to ${bound} of further movement; the rule asks at most ${percent(rule.tolerance)}, judged on windows of ${rule.window} iterations). ` +
    'More outer iterations, or a smaller learning rate, may settle it.';
}

function percent(x: number): string {
  return shareText(x);
}
