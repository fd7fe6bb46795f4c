/**
 * The user's choices for an assessment: how many bootstrap resamples, at what confidence level,
 * with which seed, and whether to run the sensitivity sweeps. Read from the project document's
 * optional `bootstrap` block and overridden by the host (CLI flags, the app's form).
 */
import { failure, success, type Problem, type Result } from '../core/result';
import type { ProjectDocument } from '../project/schema';

export interface AssessmentSettings {
  resamples: number; // B
  level: number; // e.g. 0.9
  seed: number;
  sensitivity: boolean;
}

/**
 * 1000 resamples keep the Monte Carlo error of a 90 % percentile endpoint near 0.03 standard
 * errors of the estimate (Efron & Tibshirani 1993, §19.3, recommend B ≥ 1000 for percentile
 * intervals; common practice).
 */
export const DEFAULT_RESAMPLES = 1000;
export const DEFAULT_LEVEL = 0.9;
export const MIN_RESAMPLES = 20;
export const MAX_RESAMPLES = 100_000;

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
  if (!Number.isInteger(settings.resamples) || settings.resamples < MIN_RESAMPLES || settings.resamples > MAX_RESAMPLES) {
    problems.push({ where: 'bootstrap.resamples', message: `expected a whole number from ${MIN_RESAMPLES} to ${MAX_RESAMPLES.toLocaleString('en-US')}, got ${settings.resamples}` });
  }
  if (!(settings.level >= 0.5 && settings.level < 1)) {
    problems.push({ where: 'bootstrap.level', message: `expected a confidence level from 0.5 to below 1 (e.g. 0.9), got ${settings.level}` });
  }
  if (!Number.isInteger(settings.seed) || settings.seed < 0) problems.push({ where: 'seed', message: `expected a whole number ≥ 0, got ${settings.seed}` });
  return problems.length ? failure(...problems) : success(settings);
}
