/**
 * How much of a candidate's action probability falls outside the actions the logs hold near a
 * state. "Near" is defined as the k nearest logged states in standardised state space (each state
 * divided by its logged standard deviation, Euclidean distance; k-nearest neighbours, common
 * practice), searched among a reference sample of logged states taken evenly through the log.
 * The logged range near a query state is [min, max] of those neighbours' logged actions, per
 * action; outside(s) = 1 − P_π(every action inside its range | s).
 *
 * With independent action noise the per-action probabilities multiply. With correlated noise
 * (no limits) the per-action outside probabilities are summed (the union bound), an upper bound.
 *
 * Shapes: queries q×ds row-major; ranges q×m.
 */
import { limitsAtState, policyMean, type GaussianPolicy } from '../policy';
import type { TransitionSet } from '../transitions';
import { actionIntervalProbability } from './actionProbability';

export interface ActionSupportOptions {
  readonly neighbours: number; // k
  readonly referenceStates: number; // at most this many logged states are searched
  readonly queryStates: number; // at most this many logged states are queried
}

export const DEFAULT_ACTION_SUPPORT: ActionSupportOptions = { neighbours: 50, referenceStates: 20_000, queryStates: 400 };

export interface LoggedActionRanges {
  readonly queries: Float64Array; // q×ds
  readonly lo: Float64Array; // q×m
  readonly hi: Float64Array; // q×m
  readonly neighbours: number;
  readonly referenceCount: number;
}

/**
 * The logged action range near each query state: by default logged states spread evenly through
 * the log (the data's own state distribution); queries (q×ds) to ask about chosen states instead.
 */
export function loggedActionRanges(
  data: TransitionSet, options: ActionSupportOptions = DEFAULT_ACTION_SUPPORT, queries?: Float64Array,
): LoggedActionRanges {
  const { count: n, stateDim: ds, actionDim: m } = data;
  const reference = evenlySpaced(n, options.referenceStates);
  const queryStates = queries ?? gatherStates(data, evenlySpaced(n, options.queryStates)), count = queryStates.length / ds;
  const k = Math.min(options.neighbours, reference.length), scale = stateScales(data);
  const lo = new Float64Array(count * m), hi = new Float64Array(count * m);
  const nearest = new Int32Array(k), distance = new Float64Array(k);
  for (let q = 0; q < count; q++) {
    nearestNeighbours(data, reference, scale, queryStates.subarray(q * ds, (q + 1) * ds), nearest, distance);
    for (let j = 0; j < m; j++) {
      let min = Infinity, max = -Infinity;
      for (let r = 0; r < k; r++) {
        const a = data.actions[nearest[r] * m + j];
        min = Math.min(min, a);
        max = Math.max(max, a);
      }
      lo[q * m + j] = min;
      hi[q * m + j] = max;
    }
  }
  return { queries: queryStates, lo, hi, neighbours: k, referenceCount: reference.length };
}

/** outside(s) per query state (q). */
export function probabilityOutsideLoggedActions(policy: GaussianPolicy, ranges: LoggedActionRanges): Float64Array {
  const m = policy.actionDim, ds = policy.stateDim, q = ranges.queries.length / ds;
  const out = new Float64Array(q), mean = new Float64Array(m), limits = limitsAtState(policy);
  for (let s = 0; s < q; s++) {
    policyMean(policy, ranges.queries, mean, s * ds, 0);
    const mode = limits.at(ranges.queries, s * ds);
    const at = mode === null ? undefined : { lo: limits.lo, hi: limits.hi, mode };
    let inside = 1, outsideSum = 0;
    for (let j = 0; j < m; j++) {
      const p = actionIntervalProbability(policy, j, mean[j], ranges.lo[s * m + j], ranges.hi[s * m + j], at);
      inside *= p;
      outsideSum += 1 - p;
    }
    out[s] = policy.independent ? 1 - inside : Math.min(1, outsideSum);
  }
  return out;
}

/** Indices of count (or fewer) transitions spread evenly through 0 … n−1. */
export function evenlySpaced(n: number, count: number): Int32Array {
  const c = Math.min(n, count);
  return Int32Array.from({ length: c }, (_, j) => Math.floor(((j + 0.5) * n) / c));
}

/** Each state's logged (population) standard deviation, 1 where it does not vary: the scale of the neighbour searches. */
export function stateScales(data: Pick<TransitionSet, 'count' | 'stateDim' | 'states'>): Float64Array {
  const { count: n, stateDim: ds, states } = data, scale = new Float64Array(ds);
  for (let c = 0; c < ds; c++) {
    let sum = 0;
    for (let i = 0; i < n; i++) sum += states[i * ds + c];
    const mean = sum / n;
    let squares = 0;
    for (let i = 0; i < n; i++) squares += (states[i * ds + c] - mean) ** 2;
    scale[c] = Math.sqrt(squares / n) || 1;
  }
  return scale;
}

function gatherStates(data: TransitionSet, rows: Int32Array): Float64Array {
  const ds = data.stateDim, out = new Float64Array(rows.length * ds);
  rows.forEach((i, q) => out.set(data.states.subarray(i * ds, (i + 1) * ds), q * ds));
  return out;
}

/**
 * The k reference transitions nearest to the query state, kept sorted by squared distance
 * (insertion); those of run `skipRun` are passed over (−1: none). Fewer than k found leave
 * distance Infinity at the end.
 */
export function nearestNeighbours(
  data: Pick<TransitionSet, 'stateDim' | 'states' | 'episode'>, reference: Int32Array, scale: Float64Array, query: ArrayLike<number>,
  nearest: Int32Array, distance: Float64Array, skipRun = -1,
): void {
  const ds = data.stateDim, k = nearest.length, s = data.states;
  distance.fill(Infinity);
  for (const r of reference) {
    if (skipRun >= 0 && data.episode[r] === skipRun) continue;
    let d2 = 0;
    for (let c = 0; c < ds; c++) d2 += ((s[r * ds + c] - query[c]) / scale[c]) ** 2;
    if (d2 >= distance[k - 1]) continue;
    let p = k - 1;
    while (p > 0 && distance[p - 1] > d2) {
      distance[p] = distance[p - 1];
      nearest[p] = nearest[p - 1];
      p--;
    }
    distance[p] = d2;
    nearest[p] = r;
  }
}
