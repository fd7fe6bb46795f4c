/**
 * Replicates → the intervals and comparisons of an assessment, and the turn from reward terms
 * (the engine's) into the project's sense: with a cost, values, intervals and differences change
 * sign, and an interval's ends swap.
 */
import { bootstrapInterval } from '../core/bootstrap/bootstrapInterval';
import type { IntervalEstimate, PairedDifference, Ranking } from './assessment';
import type { Replicates } from './assessResamples';

/** What a bootstrap interval over runs covers, unless said otherwise. */
export const SAMPLING_ONLY = 'sampling of the logged runs only, with the function class held fixed';

/** sign = −1 for a cost project, 1 for a reward project. */
export function intervalEstimate(point: number, replicates: Replicates, level: number, sign: number, covers: string = SAMPLING_ONLY): IntervalEstimate {
  const values = replicates.filter((v): v is number => v !== null && Number.isFinite(v));
  const failedReplicates = replicates.length - values.length;
  if (values.length < 2) {
    return { value: sign * point, standardError: null, percentile: null, basic: null, replicates: values.length, failedReplicates, covers };
  }
  const iv = bootstrapInterval(point, values, level);
  const flip = ([lo, hi]: readonly [number, number]): [number, number] => (sign > 0 ? [lo, hi] : [-hi, -lo]);
  return { value: sign * point, standardError: iv.standardError, percentile: flip(iv.percentile), basic: flip(iv.basic), replicates: values.length, failedReplicates, covers };
}

/** a_b − b_b on the resamples where both have a value (one side with fewer replicates — none, for a fit that was not resampled — has none past its end). */
export function pairedReplicates(a: Replicates, b: Replicates): Replicates {
  return a.map((v, i) => {
    const w = b[i];
    return v === null || w === null || w === undefined ? null : v - w;
  });
}

export interface Estimator {
  name: string;
  point: number; // reward terms
  replicates: Replicates;
  /**
   * A bound of unknown sign on this estimate's error that its replicates do not carry (value units,
   * ≥ 0): a network's stopping-rule drift and class-error allowance (networkRunResamples.ts). Added
   * to both ends of a difference's interval, as the network's own interval adds it.
   */
  allowance?: number;
}

/** What a difference's interval covers where a network's bounds widen it. */
export const NETWORK_DIFFERENCE_COVERS =
  'sampling of the logged runs and the randomness of each network’s training, widened on both sides by how far each network’s stopping rule lets J still move '
  + '(and by the class-error allowance where a network and the linear estimate disagree)';

export function pairedDifference(a: Estimator, b: Estimator, level: number, sign: number): PairedDifference {
  const differences = pairedReplicates(a.replicates, b.replicates);
  const usable = differences.filter((d): d is number => d !== null);
  const estimate = intervalEstimate(a.point - b.point, differences, level, sign), allowance = (a.allowance ?? 0) + (b.allowance ?? 0);
  return {
    a: a.name, b: b.name,
    difference: allowance > 0 ? widened(estimate, allowance) : estimate,
    probabilityBetter: usable.length ? usable.filter((d) => d > 0).length / usable.length : null, // reward terms: higher is better
  };
}

/** Both ends moved out by `allowance`; its standard error counts it as one more independent part (networkValueEstimate.ts). */
function widened(e: IntervalEstimate, allowance: number): IntervalEstimate {
  const out = ([lo, hi]: [number, number]): [number, number] => [lo - allowance, hi + allowance];
  return {
    ...e, standardError: e.standardError === null ? null : Math.hypot(e.standardError, allowance),
    percentile: e.percentile && out(e.percentile), basic: e.basic && out(e.basic), covers: NETWORK_DIFFERENCE_COVERS,
  };
}

/** Order by point estimate (best first) and how often that order holds across the resamples. */
export function ranking(estimators: Estimator[]): Ranking {
  const order = [...estimators].sort((x, y) => y.point - x.point);
  const resamples = estimators[0]?.replicates.length ?? 0;
  let whole = 0;
  const neighbourCounts = new Array<number>(Math.max(0, order.length - 1)).fill(0);
  let usable = 0;
  for (let b = 0; b < resamples; b++) {
    const values = order.map((e) => e.replicates[b]);
    if (values.some((v) => v === null || v === undefined)) continue; // an estimate not resampled has no replicate b
    usable++;
    let holds = true;
    for (let i = 0; i + 1 < values.length; i++) {
      if ((values[i] as number) > (values[i + 1] as number)) neighbourCounts[i]++;
      else holds = false;
    }
    if (holds) whole++;
  }
  // With fewer than two policies there is no order to hold.
  const share = (count: number) => (usable && estimators.length > 1 ? count / usable : null);
  return {
    order: order.map((e) => e.name),
    frequency: share(whole),
    neighbours: neighbourCounts.map((count, i) => ({ better: order[i].name, worse: order[i + 1].name, frequency: share(count) })),
  };
}
