/**
 * The plant-memory check's one line for the app's coverage panel, the report and the command line
 * (its numbers from plantMemoryCheck.ts, its thresholds and their wording from
 * src/core/diagnostics/plantMemoryFinding.ts). Kept apart from the check so that the app's screens
 * import the words without the regression and the plant model behind it.
 */
import { MEMORY_CAUTION, MEMORY_SERIOUS, memoryPercent } from '../core/diagnostics/plantMemoryFinding';
import type { PlantMemorySummary, StateMemory } from './plantMemoryCheck';

/** One line for the app's findings and the report, with the thresholds the rule applies; null for an assessment without the check. */
export function plantMemorySentence(summary: PlantMemorySummary | undefined): string | null {
  if (!summary) return null;
  if ('reason' in summary) return `Plant memory: not checked — ${summary.reason}.`;
  // The state the rule read (the largest share that passed its F guard), as the finding does; else the largest share.
  const largest = summary.states.reduce<StateMemory | null>((a, s) => (!a || s.adjustedPartialRSquared > a.adjustedPartialRSquared ? s : a), null);
  const top = summary.states.find((s) => s.state === summary.read) ?? largest;
  if (!top) return null;
  const unsupported = summary.read === null && top.adjustedPartialRSquared > MEMORY_CAUTION ? ', not supported by its F test on a log this short, so no finding' : '';
  return `Plant memory: the ${summary.rowsBack} rows before explain ${explained(top.adjustedPartialRSquared, top === largest)} (adjusted for chance) of what the one-step model leaves unexplained, in ${top.state}${unsupported} ` +
    `(${summary.rowsUsed.toLocaleString('en-US')} rows read; a caution above ${memoryPercent(MEMORY_CAUTION)}, serious above ${memoryPercent(MEMORY_SERIOUS)}).`;
}

/**
 * The share the earlier rows explain, as the sentence says it: "at most 7 %" for the largest over the
 * states, but "less than 0.01 %" where the share writer gives a bound (not "at most below 0.01 %"), and
 * "0 %" where the share adjusted for chance is at or below zero (it can be: the adjustment subtracts
 * what chance alone would explain), never a negative percentage.
 */
function explained(share: number, largest: boolean): string {
  if (!(share > 0)) return memoryPercent(0);
  const text = memoryPercent(share);
  if (text.startsWith('below ')) return `less than ${text.slice('below '.length)}`;
  return largest ? `at most ${text}` : text;
}
