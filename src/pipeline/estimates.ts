/**
 * What one evaluation returns: per candidate policy its value and the fit behind it, and the
 * logged behaviour's own return, plus the settings used so a result can be reproduced. Plain data
 * (numbers, arrays, typed arrays) so it can cross a worker boundary as transferables.
 */
export type { FitStatus } from '../core/fqe/fitStatus';
import type { FitStatus } from '../core/fqe/fitStatus';
import type { LimitEvidence } from '../core/loggedActionLimits';
import type { PolynomialPartSetting } from '../core/fqe/polynomialPartSetting';

export interface FitIteration {
  iteration: number; // 1-based
  /** Relative weight change of the linear iteration; null for a network. */
  weightChange: number | null;
  /** Mean squared Bellman (temporal-difference) error over the data (linear) or the held-out episodes (network). */
  bellmanResidual: number | null;
  /** J of this iterate over the start states, in the project's sense; null when not computed. */
  policyValue: number | null;
  /** Training loss of a network's regression step; null for the linear fit. */
  loss: number | null;
  /** A network fit of several members (core/fqe/networkMembers.ts): which one this iterate belongs to, 1-based; absent otherwise. */
  member?: { index: number; count: number };
}

export interface ValueSurface {
  xState: string;
  yState: string;
  x: Float64Array; // nx
  y: Float64Array; // ny
  /** V^π on the grid, ny×nx row-major (row j is y[j]). */
  values: Float64Array;
  /** Values of every state dimension used for the dimensions not on an axis. */
  heldState: number[];
  /**
   * Logged states nearest each grid point, ny×nx, projected onto the two axes (the other states
   * are ignored): a zero marks a region the logs never visited, where V is extrapolated.
   */
  visits: Uint32Array;
}

export interface PolicyEstimate {
  name: string;
  /** J(π) = mean of V^π over the start states, from the iterated fit. */
  policyValue: number;
  /** Standard error of that mean over start states (start-state sampling only, not fit uncertainty). */
  standardError: number;
  /** J(π) from the direct fixed-point (LSTD-Q) solve of the same features, when it exists. */
  fixedPointValue: number | null;
  status: FitStatus;
  /** Plain-language account of the fit (converged after N iterations, diverged because …). */
  message: string;
  iterations: number;
  history: FitIteration[];
  surface: ValueSurface | null;
  /** Fitted weights: features of a linear fit, weights and biases of a network. */
  featureCount: number;
  /** What computed the fit (linear least squares, or the TensorFlow.js backend used). */
  backend: string;
  /** Network fits only: J's interval and the linear estimate beside it (NetworkCheck); absent for a linear fit. */
  network?: NetworkCheck;
}

/**
 * What a network fit adds to its J, in the project's sense: the interval by run resamples of the
 * last-layer solve (and what it covers), the linear estimate beside it (the linear approximator's
 * default class; src/core/fqe/networkComparator.ts) with its own interval, their paired difference and the agreement verdict (src/core/fqe/approximatorAgreement.ts).
 */
export interface NetworkCheck {
  level: number;
  interval: [number, number];
  covers: string;
  linear: { value: number; interval: [number, number] };
  difference: { value: number; interval: [number, number] };
  agreement: { verdict: 'agree' | 'inconclusive' | 'disagree'; message: string };
  /** The stopping rule: the share of J that may still be moving (null before two full windows), against its tolerance. */
  remainingShare: number | null;
  tolerance: number;
}

export interface LoggedReturnEstimate {
  /** Mean discounted return of the logged episodes. */
  value: number;
  standardError: number;
  episodes: number;
  largestTruncationWeight: number;
  /** Mean γ^T over the runs (0 after an end state): the share of the mean return's weight missing (core/loggedReturn.ts). */
  meanTruncationWeight: number;
}

/**
 * Today's controller evaluated as the candidates are: its model fitted to the log
 * (plan/presentController.ts) through the same fitted Q-evaluation. This is the baseline that
 * comparisons and the ranking use.
 */
export interface PresentControllerEstimate {
  /** J of the present controller's model by fitted Q-evaluation, with its fit (as for a candidate; surface omitted). */
  estimate: Omit<PolicyEstimate, 'surface'>;
  /** The fitted model in the columns' units: μ(s) = offset + gain·s, dither (std), clip limits (null for none), per action (`actions`: their columns, `units`: their units as the project declares them, `limitEvidence`: how the log showed each limit, core/loggedActionLimits.ts; each absent in results saved before it). */
  model: {
    offset: number[]; gain: number[][]; std: number[]; lo: (number | null)[]; hi: (number | null)[]; actions?: string[]; units?: string[]; limitEvidence?: { lo: LimitEvidence[]; hi: LimitEvidence[] };
    /** offset + gain·s̄ at the mean logged state, before the limits: with limits, the unclipped law's mean, which may lie past one (core/behaviourModel.ts meanActionAtMeanState); absent in results saved before it. */
    meanAtMeanState?: number[];
    /** Rows left out of the fit as held (the held-actions repair, heldActionsCheck.ts); absent where the law was fitted on every row. */
    heldRowsLeftOut?: number;
  };
  /**
   * The logged return with each run that ends on a time limit completed by γ^T·V̂(s_T), V̂ the
   * present controller's fitted value: the check on the estimate that leans least on the fit.
   */
  completedReturn: { value: number; standardError: number; tailShare: number };
}

export interface EvaluationSettings {
  discount: number;
  approximator: string;
  quadratureNodes: number;
  seed: number;
  transitions: number;
  episodes: number;
  startStates: number;
  /**
   * Network projects: the polynomial part's setting ("chosen" or a fixed degree), the degree the fits
   * used (one per log: every fit of a run takes the same; src/core/fqe/networkDegreeChoice.ts) and
   * the fit's own sentence saying which and why. Absent for a linear project and in results saved before it.
   */
  polynomialPart?: { setting: PolynomialPartSetting; degree: number; reason: string };
}

export interface Evaluation {
  project: string;
  /** ISO 8601 time the evaluation finished. */
  evaluatedAt: string;
  policies: PolicyEstimate[];
  /** The logged discounted return (cut short where runs end on a time limit): a check, not the baseline. */
  behaviour: LoggedReturnEstimate;
  /** The comparable baseline; null when today's controller could not be modelled (presentControllerReason says why). */
  presentController: PresentControllerEstimate | null;
  presentControllerReason: string;
  settings: EvaluationSettings;
  /** Sense of the numbers: rewards (higher is better) or costs turned into rewards by sign. */
  valueSense: 'reward' | 'cost';
  warnings: string[];
  cautions: readonly string[];
}
