/**
 * The candidates of a project compiled to the engine's Gaussian policies, and checked against the
 * quadrature's limits (src/core/limits.ts): with actuator limits the bounded-normal rule allows at
 * most MAX_BOUNDED_NORMAL_NODES nodes per action, and no rule may put more than MAX_QUADRATURE_POINTS
 * points on one state. A candidate that breaks either is refused with its name and the setting.
 */
import { MAX_BOUNDED_NORMAL_NODES, MAX_QUADRATURE_POINTS } from '../../core/limits';
import { hasActionLimits, PolicyError, type GaussianPolicy } from '../../core/policy';
import { failure, success, type Problem, type Result } from '../../core/result';
import type { TransitionSet } from '../../core/transitions';
import type { ProjectDocument } from '../../project/schema';
import { candidatePolicy } from '../candidatePolicy';
import type { PlannedPolicy } from './planTypes';

export function planPolicies(project: ProjectDocument, data: TransitionSet): Result<PlannedPolicy[]> {
  const planned: PlannedPolicy[] = [], problems: Problem[] = [];
  project.candidates.forEach((candidate, index) => {
    const where = `candidates[${index}] "${candidate.name}"`;
    let policy: GaussianPolicy;
    try {
      policy = candidatePolicy(candidate, data);
    } catch (error) {
      if (!(error instanceof PolicyError)) throw error;
      problems.push({ where, field: ['candidates', index], message: error.message });
      return;
    }
    const quadrature = quadratureProblem(policy, project.quadratureNodes);
    if (quadrature) problems.push({ where: `quadratureNodes (for ${where})`, field: ['quadratureNodes'], message: quadrature });
    else planned.push({ index, name: candidate.name, policy });
  });
  return problems.length ? failure(...problems) : success(planned);
}

/** Why the action quadrature cannot be built for this policy with n nodes per action, or null. */
export function quadratureProblem(policy: GaussianPolicy, n: number): string | null {
  const bounded = hasActionLimits(policy);
  if (bounded && n > MAX_BOUNDED_NORMAL_NODES) {
    return `${n} nodes per action: with actuator limits at most ${MAX_BOUNDED_NORMAL_NODES} are supported (the bounded-normal rule keeps its accuracy up to there); use ${MAX_BOUNDED_NORMAL_NODES} or fewer`;
  }
  const points = (bounded ? n + 2 : n) ** policy.actionDim;
  if (points > MAX_QUADRATURE_POINTS) {
    const largest = Math.floor(MAX_QUADRATURE_POINTS ** (1 / policy.actionDim) + 1e-9) - (bounded ? 2 : 0);
    return `${n} nodes per action on ${policy.actionDim} actions make ${points.toLocaleString('en-US')} points per state, above the ` +
      `${MAX_QUADRATURE_POINTS.toLocaleString('en-US')} a data pass can afford; use at most ${largest} nodes per action`;
  }
  return null;
}
