/**
 * The user's choices for an assessment: how many bootstrap resamples, at what confidence level,
 * with which seed, and whether to run the sensitivity sweeps. Read from the project document's
 * optional `bootstrap` block and overridden by the host (CLI flags, the app's form).
 */
import { BOOTSTRAP_RESAMPLES, CONFIDENCE_LEVEL, SEED, type PerDecisionResampling } from '../core/limits';
import { failure, success, type Problem, type Result } from '../core/result';
import type { ProjectDocument } from '../project/schema';

export interface AssessmentSettings {
  resamples: number; // B
  level: number; // e.g. 0.9
  seed: number;
  sensitivity: boolean;
  /** The per-decision checks' route through the resamples; PER_DECISION_RESAMPLING.default when omitted (a comparison setting, not offered to users). */
  perDecision?: PerDecisionResampling;
}

/** The defaults and ranges of core/limits.ts (BOOTSTRAP_RESAMPLES, CONFIDENCE_LEVEL), where the schema reads them too. */
export const DEFAULT_RESAMPLES = BOOTSTRAP_RESAMPLES.default;
export const DEFAULT_LEVEL = CONFIDENCE_LEVEL.default;

/** The optional block of the project document (schema field `bootstrap`). */
export interface BootstrapBlock {
  resamples?: number;
  level?: number;
}

export type AssessmentOverrides = Partial<AssessmentSettings>;

export function assessmentSettingsFor(project: ProjectDocument & { bootstrap?: BootstrapBlock }, overrides: AssessmentOverrides = {}): Result<AssessmentSettings> {
  const settings: AssessmentSettings = {
    resamples: overrides.resamples ?? project.bootstrap?.resamples ?? DEFAULT_RESAMPLES,
    level: overrides.level ?? project.bootstrap?.level ?? DEFAULT_LEVEL,
    seed: overrides.seed ?? project.seed,
    // Each sensitivity point of a network is a new network fit, so the sweep is opt-in there (the report asks for it).
    sensitivity: overrides.sensitivity ?? project.approximator.kind === 'linear',
  };
  const problems: Problem[] = [];
  const { min, max } = BOOTSTRAP_RESAMPLES, level = CONFIDENCE_LEVEL;
  if (!Number.isInteger(settings.resamples) || settings.resamples < min || settings.resamples > max) {
    problems.push({ where: 'bootstrap.resamples', message: `expected a whole number from ${min} to ${max.toLocaleString('en-US')}, got ${settings.resamples}` });
  }
  if (!(settings.level >= level.min && settings.level < level.below)) {
    problems.push({ where: 'bootstrap.level', message: `expected a confidence level from ${level.min} to below ${level.below} (e.g. ${level.default}), got ${settings.level}` });
  }
  if (!Number.isInteger(settings.seed) || settings.seed < SEED.min || settings.seed > SEED.max) {
    problems.push({ where: 'seed', message: `expected a whole number from ${SEED.min} to ${SEED.max.toLocaleString('en-US')}, got ${settings.seed}` });
  }
  return problems.length ? failure(...problems) : success(settings);
}
