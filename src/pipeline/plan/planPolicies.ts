/**
 * The candidates of a project compiled to the engine's Gaussian policies, and checked against the
 * quadrature's limits (src/core/limits.ts): with actuator limits the bounded-normal rule allows at
 * most MAX_BOUNDED_NORMAL_NODES nodes per action, and no rule may put more than MAX_QUADRATURE_POINTS
 * points on one state. A candidate that breaks either is refused with its name and the setting.
 */
import { quadratureProblem } from '../../core/fqe/solveSettingChecks';
import { PolicyError, type GaussianPolicy } from '../../core/policy';
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
