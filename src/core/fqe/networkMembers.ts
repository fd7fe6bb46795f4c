/**
 * Several network fits of the same data from different starting weights and minibatch orders
 * (members), read as one: a small ensemble (Lakshminarayanan, Pritzel & Blundell, "Simple and
 * scalable predictive uncertainty estimation using deep ensembles", NeurIPS 2017).
 *
 * Why: the interval of one fit (networkInterval.ts) covers which episodes were logged and the
 * wander of J over the training's iterates, but not where the training lands from another start.
 * On the battery's saturating pendulum that difference was the larger one: four fits of one log
 * from four seeds gave J −0.2, −3.8, −0.7 and −0.5 % off the truth (steady starts), against
 * single-fit intervals of about ±1 %. Averaging K members divides that part of the error's
 * variance by K, and their spread shows it to the reader.
 *
 * Combination: Q and J are the members' means. The interval is the hull of the members' intervals
 * (lowest lower end, highest upper end), so it holds every member's value and each one's own
 * interval; a member far from the others widens it by exactly that distance. With two members the
 * spread is one number, too few to estimate a variance from, so the hull is used rather than a
 * t-interval with one degree of freedom. The paired difference from the linear estimate is
 * combined the same way (every member is resampled with the same seed, so resample b draws the
 * same episodes in each). How often the hull holds the truth is measured on the battery
 * (`npm run bench -- battery`).
 */
import type { ActionValueFunction } from '../actionValue';
import type { NetworkFit, NetworkFitStatus } from './networkFqe';
import type { EstimateOptions, NetworkValueEstimate, ValueInterval } from './networkValueEstimate';
import type { NetworkWork } from './networkWork';

/** Seed of member k (0-based): member 0 keeps the fit's seed, so one member is the single fit of before. */
export function memberSeed(seed: number, k: number): number {
  return k === 0 ? seed : (seed + 7919 * k) % 2 ** 32;
}

/** Worst first: the combined fit carries the least settled member's status. */
const STATUS_ORDER: readonly NetworkFitStatus[] = ['diverged', 'cancelled', 'maxIterations', 'converged'];

export function combinedStatus(members: readonly NetworkFit[]): NetworkFitStatus {
  return STATUS_ORDER.find((s) => members.some((m) => m.status === s)) ?? 'converged';
}

/** One fit standing for the members (≥ 2); disposing it disposes them all. */
export function combineMembers(members: readonly NetworkFit[]): NetworkFit {
  const first = members[0], status = combinedStatus(members);
  const least = members.find((m) => m.status === status) ?? first;
  return {
    actionValue: meanActionValue(members.map((m) => m.actionValue)),
    linearStart: first.linearStart,
    linearPartDegree: first.linearPartDegree, // the same for every member: settled before them (networkFqe.ts)
    status,
    message: `${least.message} ${membersSentence(members)}`,
    history: first.history,
    convergence: {
      rule: first.convergence.rule, converged: members.every((m) => m.convergence.converged),
      iterations: members.reduce((n, m) => n + m.convergence.iterations, 0),
      remainingBound: maxOrNull(members.map((m) => m.convergence.remainingBound)),
      fullStepIterations: first.convergence.fullStepIterations, // of the first member, whose history the fit carries
    },
    backend: first.backend, backendNote: first.backendNote, backendFallback: first.backendFallback, seed: first.seed,
    work: summedWork(members.map((m) => m.work)),
    members: members.length,
    estimate: (startStates: Float64Array, options: EstimateOptions = {}) => combineEstimates(members.map((m) => m.estimate(startStates, { seed: first.seed, ...options }))),
    dispose: () => members.forEach((m) => m.dispose()),
  };
}

/** Mean, hull of the intervals, and the members' values and spread kept in parts. */
export function combineEstimates(estimates: readonly NetworkValueEstimate[]): NetworkValueEstimate {
  const first = estimates[0], values = estimates.map((e) => e.value);
  const value = mean(values), differenceValue = mean(estimates.map((e) => e.difference.value));
  // A member whose interval carries the class-error allowance says so (classErrorAllowance.ts).
  const widest = estimates.find((e) => e.parts.classErrorAllowance > 0) ?? first;
  return {
    ...first,
    value,
    interval: hull(estimates.map((e) => e.interval), values),
    difference: { value: differenceValue, interval: hull(estimates.map((e) => e.difference.interval), estimates.map((e) => e.difference.value)) },
    failedResamples: Math.max(...estimates.map((e) => e.failedResamples)),
    // Resample by resample, the members' mean (they share the draws): null where any member had none.
    ...(estimates.every((e) => e.replicates) ? { replicates: memberMeans(estimates.map((e) => e.replicates!)) } : {}),
    ...(estimates.every((e) => e.linearReplicates) ? { linearReplicates: memberMeans(estimates.map((e) => e.linearReplicates!)) } : {}),
    covers: `${widest.covers}; the span of ${estimates.length} fits from different starting weights, so it also covers where the training lands`,
    parts: {
      ...first.parts, iterateSpread: Math.max(...estimates.map((e) => e.parts.iterateSpread)),
      driftAllowance: Math.max(...estimates.map((e) => e.parts.driftAllowance)), classErrorAllowance: Math.max(...estimates.map((e) => e.parts.classErrorAllowance)),
      memberValues: values,
    },
  };
}

/**
 * Lowest lower end and highest upper end. Standard error: the members' mean standard error and the
 * standard deviation of their values added as independent variances (common practice).
 */
function hull(intervals: readonly ValueInterval[], values: readonly number[]): ValueInterval {
  const lower = Math.min(...intervals.map((i) => i.lower)), upper = Math.max(...intervals.map((i) => i.upper));
  const m = mean(values), spread = Math.sqrt(values.reduce((a, v) => a + (v - m) ** 2, 0) / Math.max(1, values.length - 1));
  return { level: intervals[0].level, lower, upper, standardError: Math.hypot(mean(intervals.map((i) => i.standardError)), spread) };
}

function meanActionValue(qs: readonly ActionValueFunction[]): ActionValueFunction {
  const first = qs[0];
  return {
    stateDim: first.stateDim, actionDim: first.actionDim,
    evaluate(inputs, count, out) {
      const part = new Float64Array(count);
      out.fill(0, 0, count);
      for (const q of qs) {
        q.evaluate(inputs, count, part);
        for (let i = 0; i < count; i++) out[i] += part[i] / qs.length;
      }
    },
  };
}

function membersSentence(members: readonly NetworkFit[]): string {
  const words = members.map((m) => (m.status === 'converged' ? `converged after ${m.convergence.iterations}` : `${m.status} after ${m.convergence.iterations}`));
  return `${members.length} fits from different starting weights, averaged (${words.join('; ')} outer iterations).`;
}

function summedWork(works: readonly NetworkWork[]): NetworkWork {
  return works.reduce((a, w) => ({ seconds: a.seconds + w.seconds, adamSteps: a.adamSteps + w.adamSteps, stepSeconds: a.stepSeconds + w.stepSeconds, flop: a.flop + w.flop }),
    { seconds: 0, adamSteps: 0, stepSeconds: 0, flop: 0 });
}

function maxOrNull(xs: readonly (number | null)[]): number | null {
  const known = xs.filter((x): x is number => x !== null);
  return known.length ? Math.max(...known) : null;
}

function mean(xs: readonly number[]): number {
  return xs.reduce((a, b) => a + b, 0) / xs.length;
}

function memberMeans(replicates: readonly (readonly (number | null)[])[]): (number | null)[] {
  return replicates[0].map((_, b) => {
    let total = 0;
    for (const r of replicates) {
      const v = r[b];
      if (v === null) return null;
      total += v;
    }
    return total / replicates.length;
  });
}
