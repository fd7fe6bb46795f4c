/**
 * The assessment as plain JSON for `--json` output and files. An Assessment is already plain data
 * (numbers, strings, arrays); this fixes the published field order. Field names are a published
 * interface of the CLI: add fields, do not rename them.
 */
import type { Assessment } from './assessment';

export function assessmentToJson(a: Assessment): Record<string, unknown> {
  return {
    settings: a.settings,
    valueSense: a.valueSense,
    behaviour: a.behaviour,
    candidates: a.candidates,
    comparison: a.comparison,
    sensitivity: a.sensitivity,
    unvisitedShare: a.unvisitedShare,
    plantMemory: a.plantMemory ?? null,
    warnings: a.warnings,
    method: a.method,
  };
}
