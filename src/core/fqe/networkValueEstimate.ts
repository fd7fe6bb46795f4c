/**
 * The network's J over a start set with everything a reader needs to judge it: its interval, the
 * linear estimate it started from (the quadratic part alone, by LSTD-Q on the same data) with its
 * own interval, and the paired difference of the two (networkInterval.ts). Values in reward terms.
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
}

export const INTERVAL_COVERS =
  'episode-resampling interval of the last-layer solve on the learned features: it covers which episodes happened to be logged, ' +
  'not the randomness of the network training nor the error of the function class';

export function valueInterval(b: BootstrapInterval): ValueInterval {
  return { level: b.level, lower: b.percentile[0], upper: b.percentile[1], standardError: b.standardError };
}
