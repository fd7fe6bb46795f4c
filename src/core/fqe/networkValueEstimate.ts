/**
 * The network's J over a start set with everything a reader needs to judge it: its interval, the
 * linear estimate beside it (the linear approximator's default class by LSTD-Q on the same data;
 * networkComparator.ts) with its own interval, and the paired difference of the two (networkInterval.ts). Values in reward terms.
 */
import type { BootstrapInterval } from '../bootstrap/bootstrapInterval';

export interface ValueInterval {
  readonly level: number; // e.g. 0.9
  readonly lower: number;
  readonly upper: number;
  /** Standard deviation of the replicates. */
  readonly standardError: number;
}

export interface NetworkValueEstimate {
  readonly value: number;
  readonly interval: ValueInterval;
  readonly linear: { readonly value: number; readonly interval: ValueInterval };
  /** network − linear. */
  readonly difference: { readonly value: number; readonly interval: ValueInterval };
  /** Start states the value is over. */
  readonly startCount: number;
  readonly resamples: number;
  /** Resamples whose last-layer system had no solution (left out). */
  readonly failedResamples: number;
  /** One sentence: what the interval covers and what it does not. */
  readonly covers: string;
  /**
   * With EstimateOptions.runs: the network's J on each of the assessment's resamples of the runs, in
   * order (null where the resample had no solution), before any widening; they pair with the linear
   * bootstrap's replicates of the same seed. Absent otherwise.
   */
  readonly replicates?: readonly (number | null)[];
  /** With EstimateOptions.runs: the linear comparator's J on the same resamples (null where either had no solution). Absent otherwise. */
  readonly linearReplicates?: readonly (number | null)[];
  /** The parts the interval is built from (for the battery's choice of method). */
  readonly parts: {
    readonly percentile: readonly [number, number];
    readonly basic: readonly [number, number];
    readonly bootstrapStandardError: number;
    /** Standard deviation of J over a window of iterates at the full step size, relative to |J| (the training's randomness). */
    readonly iterateSpread: number;
    /** How far the stopping rule allows J still to move, relative to |J|, added to both ends of the interval. */
    readonly driftAllowance: number;
    /**
     * Added to both ends for the function class's error where the network and the linear estimate
     * disagree beyond resampling, relative to |J| (classErrorAllowance.ts); 0 where they do not.
     */
    readonly classErrorAllowance: number;
    /** J of each member when several fits were averaged (networkMembers.ts). */
    readonly memberValues?: readonly number[];
  };
}

export interface EstimateOptions {
  /** Interval level (default 0.9). */
  readonly level?: number;
  /** Resample start state k with episode k (default: when the start states are the data's own episode starts). */
  readonly startsFollowEpisodes?: boolean;
  /** Episode resamples (default: the method's intervalResamples). */
  readonly resamples?: number;
  /** Seed of the resamples (default: the fit's seed). */
  readonly seed?: number;
  /** The data's run count: draw the resamples over every run, as the assessment does, and return them (networkInterval.ts). */
  readonly runs?: number;
}

export const INTERVAL_COVERS =
  'resampling whole runs and re-solving the last layer on the learned features, widened by the spread of J over the training’s iterates: ' +
  'it covers which runs happened to be logged, the randomness of the training and how far the stopping rule lets J still move, not the error of the function class outside the logged states';

export function valueInterval(b: BootstrapInterval): ValueInterval {
  return { level: b.level, lower: b.percentile[0], upper: b.percentile[1], standardError: b.standardError };
}

/**
 * The network's interval: the bootstrap percentile interval, each side stretched by
 * √(SE_b² + SE_it²)/SE_b where SE_it (refitError, value units) is the spread of J over a window of
 * iterates at the full step size (networkFitResult.ts) — the training's own randomness, which
 * resampling the last-layer solve does not see (the two added as independent variances; common
 * practice) — and then widened on both sides by `drift` (value units): how far the stopping rule
 * allows J still to move (networkConvergence.ts), a bound on an error of unknown sign, so it is
 * added to the ends rather than as a variance. The standard error reported counts it as one more
 * independent part, √(SE_b² + SE_it² + drift²).
 */
export function networkValueInterval(b: BootstrapInterval, refitError: number, drift = 0): ValueInterval {
  const se = Math.hypot(b.standardError, refitError);
  const stretch = b.standardError > 0 ? se / b.standardError : 1;
  return {
    level: b.level, standardError: Math.hypot(se, drift),
    lower: b.estimate - stretch * (b.estimate - b.percentile[0]) - drift, upper: b.estimate + stretch * (b.percentile[1] - b.estimate) + drift,
  };
}
