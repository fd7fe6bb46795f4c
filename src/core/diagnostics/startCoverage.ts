/**
 * Whether start states given in a project lie among the logged states. J over such starts is an
 * average of V̂ there, and where no run was logged nearby V̂ is the fitted Q extrapolated: every
 * function class may then agree and all be wrong.
 *
 * Score: a state's distance to its k-th nearest logged state (states scaled by their logged standard
 * deviations, Euclidean; the k-nearest-neighbour distance score of Ramaswamy, Rastogi & Shim,
 * SIGMOD 2000), searched among the evenly spaced reference sample the action-support check uses
 * (actionSupport.ts; the same k). Yardstick: the largest score among `calibrationStates` logged
 * states, each scored against the reference states of other runs only (so neither the state itself
 * nor its neighbours in time stand in for the log around it). A given start scoring above the
 * yardstick is outside the logs. For a start drawn like the logged states, the chance of scoring
 * above the largest of q exchangeable scores is at most 1/(q + 1) (the conformal p-value; Vovk,
 * Gammerman & Shafer, "Algorithmic learning in a random world", 2005): 0.05 % with q = 2000. That
 * is an average over logs; on one log the rate is Beta(1, q)-distributed (the share of the law
 * above the largest of q draws), below 0.35 % in 999 logs of 1000 — so a start flagged is far from
 * the logs, not merely in their thin tail.
 *
 * Shapes: starts count×ds row-major.
 */
import type { TransitionSet } from '../transitions';
import { DEFAULT_ACTION_SUPPORT, evenlySpaced, nearestNeighbours, stateScales } from './actionSupport';

export interface StartCoverageOptions {
  readonly neighbours: number; // k
  readonly referenceStates: number;
  readonly calibrationStates: number; // q
}

export const DEFAULT_START_COVERAGE: StartCoverageOptions = {
  neighbours: DEFAULT_ACTION_SUPPORT.neighbours, referenceStates: DEFAULT_ACTION_SUPPORT.referenceStates, calibrationStates: 2000,
};

export interface StartCoverage {
  readonly starts: number;
  /** Starts scoring above the yardstick. */
  readonly outside: number;
  /** The yardstick, and the largest start score, in standardised units. */
  readonly yardstick: number;
  readonly largestScore: number;
}

type LoggedStates = Pick<TransitionSet, 'count' | 'stateDim' | 'states' | 'episode'>;

export function startCoverage(data: LoggedStates, starts: Float64Array, options: StartCoverageOptions = DEFAULT_START_COVERAGE): StartCoverage {
  const ds = data.stateDim, count = starts.length / ds, scale = stateScales(data);
  const reference = evenlySpaced(data.count, options.referenceStates), k = Math.min(options.neighbours, reference.length);
  const nearest = new Int32Array(k), distance = new Float64Array(k);
  /** Distance to the k-th nearest reference state not in run `skipRun` (−1: none skipped); Infinity when fewer than k remain. */
  const kthDistance = (query: ArrayLike<number>, skipRun: number): number => {
    nearestNeighbours(data, reference, scale, query, nearest, distance, skipRun);
    return Math.sqrt(distance[k - 1]);
  };
  let yardstick = 0;
  for (const i of evenlySpaced(data.count, options.calibrationStates)) {
    yardstick = Math.max(yardstick, kthDistance(data.states.subarray(i * ds, (i + 1) * ds), data.episode[i]));
  }
  let outside = 0, largestScore = 0;
  for (let s = 0; s < count; s++) {
    const score = kthDistance(starts.subarray(s * ds, (s + 1) * ds), -1);
    largestScore = Math.max(largestScore, score);
    if (score > yardstick) outside++;
  }
  return { starts: count, outside, yardstick, largestScore };
}
