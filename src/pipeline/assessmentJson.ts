/**
 * The assessment as plain JSON for `--json` output and files. An Assessment is already plain data
 * (numbers, strings, arrays); this fixes the published field order. Field names are a published
 * interface of the CLI: add fields, do not rename them. The record below is typed over every field
 * of Assessment, so a field added there and forgotten here fails the type check (the present
 * controller's assessment — its interval, cross-checks and confirmation — was once left out).
 */
import type { Assessment } from './assessment';
import { TRIAL_RULE, trialChoice } from './trialChoice';

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
    warnings: a.warnings,
    method: a.method,
  };
  return { ...fields, trial: trialJson(a) };
}

/**
 * The answer the text, the app and the report give (trialChoice.ts), for a program: the candidate to
 * trial first (null when none qualifies), the best J's candidate and why it is not named where it is not, and the rule.
 */
function trialJson(a: Assessment): { pick: string | null; best: string | null; bestNotNamedBecause: readonly string[]; rule: string } {
  const choice = trialChoice(a);
  return { pick: choice.pick?.candidate.name ?? null, best: choice.best?.candidate.name ?? null, bestNotNamedBecause: choice.best?.reasons ?? [], rule: TRIAL_RULE };
}
