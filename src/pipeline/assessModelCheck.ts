/**
 * Whether the model-based cross-check applies: a linear-quadratic model is fitted to the logs
 * (src/core/offPolicy/linearQuadraticModel.ts) and used only when it describes them well. Our
 * thresholds, stated in the report:
 *   - each next-state component: R² ≥ 0.5 of the linear dynamics, and the quadratic terms in
 *     (s, a) explain at most 5 % of its residual sum of squares (no visible curvature). R² alone
 *     cannot judge linearity — process noise lowers it on a perfectly linear plant, and the closed
 *     form accounts for that noise — so its threshold only asks that the model explain most of the
 *     next state; the curvature share is the test of linearity;
 *   - the reward (or cost): R² ≥ 0.9 of the quadratic fit;
 *   - the candidate has no actuator limits (a clipped action is not linear-Gaussian);
 *   - no run in the log ends in an end state (the closed form is for a plant that goes on;
 *     ../core/absorbingEnds.ts).
 * With more than 8 states and actions together the quadratic regressions are not formed.
 */
import { absorbingEndCount, absorbingEndsReason } from '../core/absorbingEnds';
import type { EpisodeIndex } from '../core/bootstrap/episodeTransitions';
import { LyapunovStabilityError } from '../core/linalg/lyapunov';
import { LqModelError, UnstableClosedLoopError } from '../core/lq';
import {
  dynamicsNonlinearity, fitLinearQuadraticModel, ModelFitError, modelRegressions,
  type LinearQuadraticModelFit, type ModelRegressions,
} from '../core/offPolicy/linearQuadraticModel';
import { ModelValueError } from '../core/offPolicy/modelBasedValue';
import { notAffineReason, type GaussianPolicy } from '../core/policy';
import type { TransitionSet } from '../core/transitions';
import { shareText, sharesText } from '../core/shareText';

export const MODEL_THRESHOLDS = { dynamicsRSquared: 0.5, curvatureShare: 0.05, rewardRSquared: 0.9, maxInputs: 8 } as const;

export interface ModelCheck {
  regressions: ModelRegressions | null;
  fit: LinearQuadraticModelFit | null;
  /** True when the fitted model passes the thresholds above. */
  fitsData: boolean;
  /** What was found, in words (R² values, or why no model was fitted). */
  summary: string;
}

/** ends: the log's transitions into an end state (the plan's count; counted here when not given). */
export function checkLinearQuadraticModel(data: TransitionSet, index: EpisodeIndex, ends = absorbingEndCount(data.terminal)): ModelCheck {
  const inputs = data.stateDim + data.actionDim;
  if (inputs > MODEL_THRESHOLDS.maxInputs) {
    return { regressions: null, fit: null, fitsData: false, summary: `not formed for ${inputs} states and actions (at most ${MODEL_THRESHOLDS.maxInputs})` };
  }
  if (ends > 0) return { regressions: null, fit: null, fitsData: false, summary: absorbingEndsReason(ends) };
  let regressions: ModelRegressions, fit: LinearQuadraticModelFit, curvature: number[];
  try {
    regressions = modelRegressions(data, index);
    fit = fitLinearQuadraticModel(regressions);
    curvature = dynamicsNonlinearity(data, regressions);
  } catch (error) {
    if (error instanceof ModelFitError) return { regressions: null, fit: null, fitsData: false, summary: error.message };
    throw error;
  }
  const t = MODEL_THRESHOLDS, names = data.stateNames;
  const failures: string[] = [];
  fit.dynamicsRSquared.forEach((r2, j) => {
    if (r2 < t.dynamicsRSquared) failures.push(`${names[j]}: linear dynamics R² ${r2.toFixed(3)} < ${t.dynamicsRSquared}`);
    if (curvature[j] > t.curvatureShare) failures.push(`${names[j]}: quadratic terms explain ${shareText(curvature[j])} of the linear model’s residual (> ${shareText(t.curvatureShare)})`);
  });
  if (fit.costRSquared < t.rewardRSquared) failures.push(`reward: quadratic fit R² ${fit.costRSquared.toFixed(3)} < ${t.rewardRSquared}`);
  const found = `linear dynamics R² ${fit.dynamicsRSquared.map((r) => r.toFixed(3)).join(', ')}; curvature share ${sharesText(Array.from(curvature)).join(', ')}; quadratic reward R² ${fit.costRSquared.toFixed(4)}`;
  return { regressions, fit, fitsData: failures.length === 0, summary: failures.length ? `the model does not fit the data well enough (${failures.join('; ')})` : found };
}

/** Why the model check cannot be used for this candidate, or null when it can. */
export function modelInapplicability(check: ModelCheck, policy: GaussianPolicy): string | null {
  if (!check.fitsData) return check.summary;
  const reason = notAffineReason(policy, 'noLimits');
  return reason === null ? null : `not applicable to this candidate: ${reason}`;
}

/** The errors by which a fitted model or a candidate fails the closed form on one resample. */
export function isModelValueFailure(error: unknown): boolean {
  return [ModelValueError, UnstableClosedLoopError, LqModelError, LyapunovStabilityError, ModelFitError].some((type) => error instanceof type);
}
