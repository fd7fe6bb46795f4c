/**
 * The assessment as plain JSON for `--json` output and files. An Assessment is already plain data
 * (numbers, strings, arrays); this fixes the published field order. Field names are a published
 * interface of the CLI: add fields, do not rename them. The record below is typed over every field
 * of Assessment, so a field added there and forgotten here fails the type check (the present
 * controller's assessment — its interval, cross-checks and confirmation — was once left out).
 */
import type { Assessment } from './assessment';

export function assessmentToJson(a: Assessment): Record<string, unknown> {
  const fields: { [K in keyof Required<Assessment>]: unknown } = {
    settings: a.settings,
    valueSense: a.valueSense,
    behaviour: a.behaviour,
    presentController: a.presentController,
    candidates: a.candidates,
    comparison: a.comparison,
    sensitivity: a.sensitivity,
    unvisitedShare: a.unvisitedShare,
    plantMemory: a.plantMemory ?? null,
    runOrder: a.runOrder ?? null,
    heldActions: a.heldActions ?? null,
    warnings: a.warnings,
    method: a.method,
  };
  return fields;
}
