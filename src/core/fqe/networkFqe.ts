/**
 * Fitted Q-evaluation with a neural network, started from what the linear path already knows.
 *
 * Q(s, a) = φ(z)ᵀ·v₁ + h_θ(z)ᵀ·v₂, z the standardised (s, a): φ the polynomial features of degree
 * linearPartDegree (networkLinearPart.ts, networkMethod.ts), h_θ the last hidden layer of a fully connected network. Before any
 * network training, v₂ = 0 and v₁ is the linear LSTD-Q fixed point, solved in milliseconds: the
 * fit starts at the linear estimate. Each outer iteration then (networkIterations.ts) solves the
 * last layer [v₁; v₂] by the LSTD-Q fixed point on the current features (Levine et al., "Shallow
 * updates for deep reinforcement learning", NeurIPS 2017), which carries value over the whole
 * horizon at once, and takes Adam steps on the regression of the Bellman targets
 * y = r + γ E_{a'~π} Q(s', a') (fitted Q-iteration: Ernst, Geurts & Wehenkel, JMLR 2005; Riedmiller,
 * ECML 2005), which moves the hidden features towards what the quadratic part misses.
 *
 * Outcomes: 'converged' (the stopping rule of networkConvergence.ts was met), 'maxIterations'
 * (not converged: the iteration limit came first — the message says how far from settled),
 * 'diverged' (values beyond what any policy can earn, a singular last-layer system, or an
 * exploding loss: the last iterate that passed the checks is kept) and 'cancelled' (the last
 * measured iterate is kept). With nothing measured to keep, cancellation throws
 * FqeCancelledError and divergence NetworkDivergedError.
 *
 * Every value comes with an interval (estimate(); networkInterval.ts) and with the linear estimate
 * of the linear approximator's default class (networkComparator.ts: the polynomial part's own fixed
 * point when its degree is the default), on the same resamples, so the two can be compared
 * (approximatorAgreement.ts).
 */
import type { ActionValueFunction } from '../actionValue';
import type { GaussianPolicy } from '../policy';
import type { TransitionSet } from '../transitions';
import type { CancellationCheck } from './cancellation';
import { FqeDataError } from './fqeErrors';
import type { LinearActionValue } from './linearActionValue';
import type { ConvergenceRule } from './networkConvergence';
import { createFitSession } from './networkFitSession';
import { checkNetworkFqeInput } from './networkFqeInput';
import { runOuterIterations } from './networkIterations';
import { COMPARATOR_DEGREE } from './comparatorDegree';
import { solveLastLayer } from './networkLastLayer';
import { defaultNetworkMethod, type NetworkMethod, type SettledNetworkMethod } from './networkMethod';
import { chooseLinearPartDegreeOnce } from './networkDegreeChoice';
import { linearPartDegreeOf } from './polynomialPartSetting';
import { guardDegreeChoice, startGuard, type GuardedDegreeChoice } from './degreeChoiceStartGuard';
import { finishNetworkFit, sameValues } from './networkFitResult';
import type { NetworkValueEstimate, EstimateOptions } from './networkValueEstimate';
import type { NetworkFqeSettings } from './networkSettings';
import { combineMembers, memberSeed } from './networkMembers';
import { selectBackend, type BackendSelection, type TfBackendName } from './tfBackend';
import type { NetworkWork } from './networkWork';

export type { NetworkFqeSettings } from './networkSettings';

export interface NetworkIterationRecord {
  readonly iteration: number; // 1-based
  /** Mean minibatch squared error of the Adam steps that produced this iterate's hidden layers, reward units²; null for the first. */
  readonly loss: number | null;
  /** Mean squared Bellman residual of this iterate on held-out episodes, reward units²; null without hold-out. A diagnostic, not a stopping criterion. */
  readonly heldOutBellmanError: number | null;
  /** J of this iterate over the fit's start states (reward sense). */
  readonly policyValue: number;
  /** δ_k of networkConvergence.ts: relative change between the last two windows; null before two full windows. */
  readonly relativeChange: number | null;
  /** γ^W/(1 − γ^W)·δ_k (networkConvergence.ts): how much of the value may still be moving; null before two full windows. */
  readonly remainingBound: number | null;
  /** Wall-clock seconds from the start of the outer loop to this iterate's measurement. */
  readonly elapsedSeconds: number;
}

export interface NetworkProgress extends NetworkIterationRecord {
  /** Which of the fit's members (networkMembers.ts) is iterating, 1-based, and how many there are. */
  readonly member: number;
  readonly members: number;
  readonly outerIterations: number;
  /** Mean iteration time × iterations left (an upper estimate when the stopping rule ends the fit early). */
  readonly remainingSeconds: number;
}

export type NetworkFitStatus = 'converged' | 'maxIterations' | 'diverged' | 'cancelled';

export interface NetworkConvergence {
  readonly rule: ConvergenceRule;
  readonly converged: boolean;
  /** Outer iterations measured. */
  readonly iterations: number;
  /** remainingBound of the kept iterate (null when only one was measured). */
  readonly remainingBound: number | null;
  /** Outer iterations at the full step size: up to where the step's decay began, all of them when it never did (networkIterations.ts). */
  readonly fullStepIterations: number;
}

export interface NetworkFit {
  /** Q(s, a) in reward units; evaluate runs the network in batches. */
  readonly actionValue: ActionValueFunction;
  /** The LSTD-Q fixed point of the polynomial part (degree linearPartDegree) the fit started from. */
  readonly linearStart: LinearActionValue;
  /** The degree of the polynomial part the fit used: the one fixed, or the one the guarded choice took (degreeChoice). */
  readonly linearPartDegree: number;
  readonly status: NetworkFitStatus;
  readonly message: string;
  readonly convergence: NetworkConvergence;
  readonly history: readonly NetworkIterationRecord[];
  readonly backend: TfBackendName;
  readonly backendNote: string;
  /** Why WebAssembly was not used although preferred (tfBackend.ts); null when it was, or plain JavaScript was asked for. */
  readonly backendFallback: string | null;
  readonly seed: number;
  /** Fits from different starting weights averaged into this one (networkMembers.ts); history and backend are the first's. */
  readonly members: number;
  /** Time, Adam steps and FLOPs of the fit (networkWork.ts). */
  readonly work: NetworkWork;
  /**
   * How the polynomial part's degree was chosen from the log (networkDegreeChoice.ts), with its numbers,
   * and the start guard that may have kept the default (degreeChoiceStartGuard.ts); absent unless
   * linearPartDegree is 'choose'. Its sentence ends the fit's message where the degree is not simply 2 (choiceWorthSaying).
   */
  readonly degreeChoice?: GuardedDegreeChoice;
  /** J over startStates (count×ds) with its interval, the linear estimate (networkComparator.ts) and their paired difference. */
  estimate(startStates: Float64Array, options?: EstimateOptions): NetworkValueEstimate;
  /** Frees the network's tensors; actionValue.evaluate and estimate throw afterwards. */
  dispose(): void;
}

export interface NetworkFqeInput {
  readonly data: TransitionSet;
  readonly policy: GaussianPolicy;
  readonly discount: number; // γ ∈ [0, 1)
  readonly quadratureNodes: number; // per action dimension
  readonly seed: number;
  readonly settings: NetworkFqeSettings;
  /** e×ds start states of J for progress and the stopping rule; default data.startStates. */
  readonly startStates?: Float64Array;
  /** Method choices (networkMethod.ts); the defaults were chosen on the battery. */
  readonly method?: Partial<NetworkMethod>;
  readonly onProgress?: (progress: NetworkProgress) => void;
  /** Polled between gradient steps: a function or an AbortSignal-like { aborted }. */
  readonly isCancelled?: CancellationCheck;
  /** Directory or URL prefix of the wasm backend's .wasm files (Node: node_modules/@tensorflow/tfjs-backend-wasm/dist/). */
  readonly wasmPath?: string;
  /** Run a fit that converges before this outer iteration on to it (networkIterations.ts's LoopInput.runTo). */
  readonly runTo?: number;
}

export async function fitNetworkFqe(input: NetworkFqeInput): Promise<NetworkFit> {
  checkNetworkFqeInput(input);
  // The degree from the project's setting unless a method (a bench, a test) asks for one.
  const asked: NetworkMethod = { ...defaultNetworkMethod, ...input.method, linearPartDegree: input.method?.linearPartDegree ?? linearPartDegreeOf(input.settings.polynomialDegree) };
  const degreeChoice = asked.linearPartDegree === 'choose' ? guardedDegreeChoice(input) : undefined;
  const method: SettledNetworkMethod = { ...asked, linearPartDegree: degreeChoice?.chosen ?? (asked.linearPartDegree as number) };
  const selection = await selectBackend(input.settings.backend, input.wasmPath);
  const fits: NetworkFit[] = [];
  try {
    for (let k = 0; k < method.members; k++) {
      const fit = await fitMember({ ...input, seed: memberSeed(input.seed, k) }, method, selection, { member: k + 1, members: method.members });
      fits.push(fit);
      if (fit.status === 'cancelled' || fit.status === 'diverged') break;
    }
  } catch (error) {
    fits.forEach((f) => f.dispose());
    throw error;
  }
  const fit = fits.length === 1 ? fits[0] : combineMembers(fits);
  if (!degreeChoice) return fit;
  return Object.assign(fit, { degreeChoice, ...(choiceWorthSaying(degreeChoice) ? { message: `${fit.message} ${degreeChoice.sentence}` } : {}) });
}

/**
 * The choice's sentence ends the fit's message when the degree is not simply the long-standing 2:
 * degree 4 used, 4 picked but kept at 2 by the start guard, or the choice skipped for its cost. Where
 * the criterion kept 2 (or the log was too short to compare), the message is the degree-2 fit's, and
 * the sentence is in `degreeChoice`.
 */
function choiceWorthSaying(choice: GuardedDegreeChoice): boolean {
  const base = choice.degrees[0];
  return choice.chosen !== base || choice.criterionChose !== base || choice.overFeatureLimit;
}

/**
 * The degree by the held-out criterion, kept above the default only when J's start states lie inside
 * the logs (degreeChoiceStartGuard.ts). The fit's start states are the data's run starts unless given;
 * given ones equal to them, value for value, are run starts too (as the estimate treats them).
 */
function guardedDegreeChoice(input: NetworkFqeInput): GuardedDegreeChoice {
  const choice = chooseLinearPartDegreeOnce({ data: input.data, discount: input.discount, seed: input.seed });
  const starts = input.startStates ?? input.data.startStates;
  return guardDegreeChoice(choice, () => startGuard(input.data, starts, sameValues(starts, input.data.startStates)));
}

/** One member: the linear start, the outer iterations and the kept network. */
async function fitMember(input: NetworkFqeInput, method: SettledNetworkMethod, selection: BackendSelection, place: { member: number; members: number }): Promise<NetworkFit> {
  const started = performance.now();
  const session = createFitSession({ ...input, method });
  try {
    const linearStart = solveLastLayer(session.linearTotal.sums, session.linearTotal.dim, session.linearTotal.dim, 0, session.higherTermRidge);
    if ('failure' in linearStart) throw new FqeDataError(`the linear (degree-${method.linearPartDegree}) fixed point the network starts from does not exist: ${linearStart.failure}`);
    const { total } = session.comparator, comparator = total.dim === session.linearTotal.dim ? linearStart : solveLastLayer(total.sums, total.dim, total.dim, 0);
    if ('failure' in comparator) throw new FqeDataError(`the linear (degree-${COMPARATOR_DEGREE}) estimate to compare the network with does not exist: ${comparator.failure}`);
    const { settings } = input;
    const run = await runOuterIterations(session, {
      startStates: input.startStates ?? input.data.startStates, stateDim: input.data.stateDim, tolerance: settings.tolerance,
      outerIterations: settings.outerIterations, patience: settings.patience, stepsPerIteration: settings.stepsPerIteration, learningRate: settings.learningRate, runTo: input.runTo,
      isCancelled: input.isCancelled,
      onProgress: input.onProgress && ((record, remainingSeconds) => input.onProgress!({ ...record, ...place, outerIterations: settings.outerIterations, remainingSeconds })),
    }, selection.backend, linearStart.weights);
    const fit = finishNetworkFit(session, run, { input, selection, linearWeights: linearStart.weights, comparatorWeights: comparator.weights });
    run.work.seconds = (performance.now() - started) / 1000;
    return fit;
  } finally {
    session.dispose();
  }
}
