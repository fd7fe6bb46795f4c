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
  const top = summary.states.reduce<StateMemory | null>((a, s) => (!a || s.adjustedPartialRSquared > a.adjustedPartialRSquared ? s : a), null);
  if (!top) return null;
  return `Plant memory: the ${summary.rowsBack} rows before explain at most ${memoryPercent(top.adjustedPartialRSquared)} (adjusted for chance) of what the one-step model leaves unexplained, in ${top.state} ` +
    `(${summary.rowsUsed.toLocaleString('en-US')} rows read; a caution above ${memoryPercent(MEMORY_CAUTION)}, serious above ${memoryPercent(MEMORY_SERIOUS)}).`;
}
