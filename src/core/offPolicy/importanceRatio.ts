/**
 * The importance ratio ρ = π(a|s)/b(a|s) of one logged action under a target and a behaviour
 * policy, both Gaussian (policy.ts logDensity), including actuator limits.
 *
 * With clip limits an action exactly at a limit has a point mass (probability Φ((lo − μ)/σ) or its
 * upper tail), elsewhere a density. The ratio is the Radon–Nikodym derivative dπ/db, which exists
 * per action dimension as (Billingsley, "Probability and Measure", 3rd ed., §32):
 *   both point masses → mass ratio;  both densities → density ratio;
 *   π a density where b has a point mass → 0 (π gives that exact value probability 0);
 *   π a point mass where b has only a density → undefined: b could not have logged this value
 *   with positive probability, so π is not absolutely continuous with respect to b
 *   (ImportanceRatioError, naming the action).
 */
import { actionLimitsAt, limitModeOf, logDensity, type GaussianPolicy } from '../policy';

export class ImportanceRatioError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ImportanceRatioError';
  }
}

/**
 * Bit j set when action dimension j sits exactly at a clip limit the policy has at this state (a
 * point mass; with a rate limit the limits move with the previous action, policy/actionLimits.ts).
 */
export function pointMassMask(policy: GaussianPolicy, state: ArrayLike<number>, action: ArrayLike<number>, actionOffset = 0): number {
  if (limitModeOf(policy) !== 'clip') return 0; // what actionLimitsAt would say, without its arrays (this runs per logged transition)
  const m = policy.actionDim, lo = new Float64Array(m), hi = new Float64Array(m);
  if (actionLimitsAt(policy, state, 0, lo, hi) !== 'clip') return 0;
  let mask = 0;
  for (let j = 0; j < m; j++) {
    const a = action[actionOffset + j];
    if (a === lo[j] || a === hi[j]) mask |= 1 << j;
  }
  return mask;
}

/** log ρ at one state (ds) and logged action (m); −Infinity when ρ = 0. mean: scratch of length m (logDensity). */
export function logImportanceRatio(
  target: GaussianPolicy, behaviour: GaussianPolicy, state: Float64Array, action: Float64Array, mean = new Float64Array(target.actionDim),
): number {
  const same = target === behaviour; // the present controller weighed against itself: every number below is formed once
  const targetMask = pointMassMask(target, state, action), behaviourMask = same ? targetMask : pointMassMask(behaviour, state, action);
  const unmatched = targetMask & ~behaviourMask;
  if (unmatched !== 0) {
    let j = 0;
    while (!(unmatched & (1 << j))) j++;
    throw new ImportanceRatioError(
      `action ${j + 1} = ${action[j]} sits at the candidate’s limit, where the candidate has a point mass but the present ` +
        'controller’s model has none: the logs cannot represent that point mass, so the importance ratio does not exist',
    );
  }
  if (targetMask !== behaviourMask) return -Infinity; // π continuous where b has an atom
  const logTarget = logDensity(target, state, action, mean);
  return logTarget - (same ? logTarget : logDensity(behaviour, state, action, mean));
}
