/**
 * What a log's held valves leave behind (probe40, descriptive only — no rule reads it): the share of rows whose
 * every action equals the previous row's exactly within the same run, and the longest such streak of repeated
 * rows. A continuous Gaussian law repeats an action exactly only where it clips (at a valve's end); an operator
 * holding the valve in manual repeats it for the whole stretch. Printed by bench/holdoutCliRows.ts.
 */
import type { TransitionSet } from '../src/core/transitions';

export function repeatedActions(data: TransitionSet): { share: number; longest: number } {
  const m = data.actionDim;
  let repeats = 0, streak = 0, longest = 0;
  for (let i = 1; i < data.count; i++) {
    let same = data.episode[i] === data.episode[i - 1];
    for (let j = 0; same && j < m; j++) same = data.actions[i * m + j] === data.actions[(i - 1) * m + j];
    streak = same ? streak + 1 : 0;
    if (same) repeats++;
    longest = Math.max(longest, streak);
  }
  return { share: data.count ? repeats / data.count : 0, longest };
}
