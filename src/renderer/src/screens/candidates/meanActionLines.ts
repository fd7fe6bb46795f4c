/**
 * What the candidate chart draws: the logged (s_axis, a_action) pairs, and each policy's mean
 * action μ(s) = offset + gain·s along one state axis with the other states held at their logged
 * means. μ is affine in s, so its line is exact from the two ends of the axis range.
 */
import type { LoggedSample } from '../../../../shared/workerMessages';

export interface Point {
  x: number;
  y: number;
}

export interface AffinePolicyMean {
  offset: readonly number[]; // m
  gain: readonly (readonly number[])[]; // m×ds
}

export function loggedPoints(sample: LoggedSample, stateDim: number, actionDim: number, axis: number, action: number): Point[] {
  return Array.from({ length: sample.count }, (_, k) => ({ x: sample.states[k * stateDim + axis], y: sample.actions[k * actionDim + action] }));
}

/** μ_action along state `axis` over range, others at heldMeans; null when the policy's shape does not fit. */
export function meanActionLine(policy: AffinePolicyMean, axis: number, action: number, range: [number, number], heldMeans: readonly number[]): Point[] | null {
  const row = policy.gain[action];
  const offset = policy.offset[action];
  if (row === undefined || offset === undefined || row.length !== heldMeans.length) return null;
  const at = (x: number): number => row.reduce((sum, g, j) => sum + g * (j === axis ? x : heldMeans[j]), offset);
  return [{ x: range[0], y: at(range[0]) }, { x: range[1], y: at(range[1]) }];
}
