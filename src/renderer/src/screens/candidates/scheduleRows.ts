/**
 * Rows of a schedule's breakpoint table: a new row continues the last step (breakpoint spacing as
 * between the last two, 1 after a single row) at the last output; a removed row takes its
 * breakpoint and value together, and the last row cannot be removed.
 */
import type { ScheduleLoop } from './formDrafts';

export function withRowAdded(loop: ScheduleLoop): ScheduleLoop {
  const b = loop.breakpoints, n = b.length;
  const step = n >= 2 && b[n - 1] > b[n - 2] ? b[n - 1] - b[n - 2] : 1;
  const last = n > 0 ? b[n - 1] : 0;
  const value = loop.values[loop.values.length - 1] ?? 0;
  return { ...loop, breakpoints: [...b, Number((last + step).toPrecision(12))], values: [...loop.values, value] };
}

export function withRowRemoved(loop: ScheduleLoop, k: number): ScheduleLoop {
  if (loop.breakpoints.length <= 1) return loop;
  return { ...loop, breakpoints: loop.breakpoints.filter((_, i) => i !== k), values: loop.values.filter((_, i) => i !== k) };
}
