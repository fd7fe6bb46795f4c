/**
 * Checks the pipeline runs once it knows more than the file: the candidate's actuator bounds,
 * and the size of the feature map the approximator will fit.
 */
import { failure, success, type Result } from '../core/result';
import { importProblem, type ImportProblem } from './importProblem';
import type { TransitionSet } from '../core/transitions';
import { formatCount, plural } from './reportFormat';

/** Limits per action dimension; null (or a missing entry) means "no limit on this side". */
export interface ActionLimits {
  readonly lo: readonly (number | null)[];
  readonly hi: readonly (number | null)[];
}

const LISTED_LINES = 5;

/**
 * A warning per action dimension whose logged values fall outside [lo, hi]: how many, and the
 * first lines. Logged actions outside the actuator range mean the log and the declared bounds
 * disagree (wrong units, a changed actuator), which the evaluation would silently extrapolate over.
 */
export function checkActionBounds(transitions: TransitionSet, limits: ActionLimits): ImportProblem[] {
  const m = transitions.actionDim;
  const warnings: ImportProblem[] = [];
  for (let j = 0; j < m; j++) {
    const lo = limits.lo[j] ?? -Infinity, hi = limits.hi[j] ?? Infinity;
    let outside = 0;
    const lines: number[] = [];
    for (let k = 0; k < transitions.count; k++) {
      const a = transitions.actions[k * m + j];
      if (a >= lo && a <= hi) continue;
      outside++;
      if (lines.length < LISTED_LINES) lines.push(transitions.sourceLine[k]);
    }
    if (outside === 0) continue;
    const more = outside > LISTED_LINES ? ', …' : '';
    warnings.push(importProblem('actions-outside-bounds', `action ${transitions.actionNames[j]}`,
      `${plural(outside, 'logged action')} of ${formatCount(transitions.count)} lie outside the actuator bounds [${lo}, ${hi}] (lines ${lines.join(', ')}${more}); check the units of the column and the bounds`));
  }
  return warnings;
}

/** Transitions per feature below which a linear fit is poorly determined (rule of thumb, common practice). */
export const TRANSITIONS_PER_FEATURE = 10;

/**
 * Least squares in d features needs at least d transitions to be determined at all, and in
 * practice about ten per feature for stable coefficients; fewer than d fails, fewer than 10·d warns.
 */
export function checkEnoughTransitions(count: number, featureDim: number): Result<null> {
  const where = 'transitions';
  if (count < featureDim) {
    return failure(importProblem('too-few-transitions', where,
      `${plural(count, 'transition')} cannot determine ${plural(featureDim, 'feature')}; expected at least ${formatCount(featureDim)} (better ${formatCount(TRANSITIONS_PER_FEATURE * featureDim)}): use more data or fewer features`));
  }
  if (count < TRANSITIONS_PER_FEATURE * featureDim) {
    return success(null, [importProblem('few-transitions', where,
      `${plural(count, 'transition')} for ${plural(featureDim, 'feature')} is fewer than the ${TRANSITIONS_PER_FEATURE} per feature usually needed for stable estimates; expect wide uncertainty`)]);
  }
  return success(null);
}
