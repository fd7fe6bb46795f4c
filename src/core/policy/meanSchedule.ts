/**
 * Piecewise-linear interpolation for a schedule term of a policy mean (gaussianPolicyTypes.ts):
 * S(x) = v_0 for x ≤ b_0, v_{k−1} for x ≥ b_{k−1}, and between b_i ≤ x ≤ b_{i+1}
 *   S(x) = v_i + (v_{i+1} − v_i)·(x − b_i)/(b_{i+1} − b_i)
 * (linear interpolation in a table, the usual reading of a reset schedule; common practice).
 * Held constant beyond the table rather than extrapolated, as a controller's schedule block does.
 */
import type { MeanSchedule } from './gaussianPolicyTypes';

export class ScheduleError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ScheduleError';
  }
}

/** S(x) for one schedule. Binary search, so long tables cost O(log k). */
export function scheduleValue(schedule: MeanSchedule, x: number): number {
  const b = schedule.breakpoints, v = schedule.values, k = b.length;
  if (x <= b[0]) return v[0];
  if (x >= b[k - 1]) return v[k - 1];
  let lo = 0, hi = k - 1; // invariant b[lo] < x < b[hi]
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (b[mid] <= x) lo = mid;
    else hi = mid;
  }
  const t = (x - b[lo]) / (b[lo + 1] - b[lo]);
  return v[lo] + t * (v[lo + 1] - v[lo]);
}

/** Check a schedule's shape; `where` names it in messages (e.g. "schedules[0]"). */
export function checkSchedule(schedule: MeanSchedule, stateDim: number, actionDim: number, where: string): void {
  const { breakpoints: b, values: v } = schedule;
  if (!Number.isInteger(schedule.action) || schedule.action < 0 || schedule.action >= actionDim) {
    throw new ScheduleError(`${where}.action: expected an action index from 0 to ${actionDim - 1}, got ${schedule.action}`);
  }
  if (!Number.isInteger(schedule.state) || schedule.state < 0 || schedule.state >= stateDim) {
    throw new ScheduleError(`${where}.state: expected a state index from 0 to ${stateDim - 1}, got ${schedule.state}`);
  }
  if (b.length < 1) throw new ScheduleError(`${where}.breakpoints: expected at least one breakpoint`);
  if (v.length !== b.length) throw new ScheduleError(`${where}.values: expected ${b.length} values, one per breakpoint, got ${v.length}`);
  for (let i = 0; i < b.length; i++) {
    if (!Number.isFinite(b[i])) throw new ScheduleError(`${where}.breakpoints[${i}]: expected a finite number, got ${b[i]}`);
    if (!Number.isFinite(v[i])) throw new ScheduleError(`${where}.values[${i}]: expected a finite number, got ${v[i]}`);
    if (i > 0 && !(b[i] > b[i - 1])) {
      throw new ScheduleError(`${where}.breakpoints[${i}]: breakpoints must increase strictly, but ${b[i]} follows ${b[i - 1]}`);
    }
  }
}
