/**
 * One run of a project: the plan (evaluationPlan.ts) and every candidate's model, built once
 * (model/buildModels.ts). The evaluation reads it, the assessment extends it, and the host that
 * started it releases it. Engine errors of one candidate become problems naming that candidate;
 * cancellation becomes one "cancelled" problem; anything else is a bug and propagates.
 */
import { FqeCancelledError } from '../core/fqe/fqeErrors';
import { failure, success, type Problem, type Result } from '../core/result';
import type { TransitionSet } from '../core/transitions';
import type { ProjectDocument } from '../project/schema';
import { isEngineError } from './engineErrors';
import type { FitIteration } from './estimates';
import type { CandidateModel } from './model/candidateModel';
import { buildModel } from './model/buildModel';
import type { ModelHooks } from './model/modelHooks';
import { planEvaluation, type EvaluationPlan } from './plan/evaluationPlan';
import { CANCELLED_PROBLEM } from './cancelledProblem';

export interface EvaluationProgress {
  candidate: string;
  candidateIndex: number; // 0-based
  candidateCount: number;
  iteration: FitIteration | null;
  /** The pass over the data that forms a linear fit's sums: transitions done of all; null outside it. */
  dataPass: { done: number; total: number } | null;
}

export interface RunHooks extends Omit<ModelHooks, 'onIteration'> {
  readonly onProgress?: (progress: EvaluationProgress) => void;
}

export interface ProjectRun {
  readonly plan: EvaluationPlan;
  readonly models: readonly CandidateModel[];
  /** Today's controller modelled and fitted like a candidate: the comparable baseline; null with a reason when it cannot be. */
  readonly presentController: CandidateModel | null;
  readonly presentControllerReason: string;
  /** Releases every model (a network's tensors). */
  dispose(): void;
}

export { CANCELLED_PROBLEM } from './cancelledProblem';

export async function startRun(project: ProjectDocument, dataset: TransitionSet, hooks: RunHooks = {}): Promise<Result<ProjectRun>> {
  const planned = planEvaluation(project, dataset);
  if (!planned.ok) return planned;
  const plan = planned.value, models: CandidateModel[] = [], problems: Problem[] = [];
  // Every fit is counted in the progress, the present controller's last.
  const count = plan.candidates.length, total = count + (plan.presentController.planned ? 1 : 0);
  try {
    for (const [i, candidate] of plan.candidates.entries()) {
      const report = (iteration: FitIteration | null, dataPass: EvaluationProgress['dataPass'] = null) =>
        hooks.onProgress?.({ candidate: candidate.name, candidateIndex: i, candidateCount: total, iteration, dataPass });
      report(null);
      try {
        models.push(await buildModel(plan, candidate, { ...hooks, onIteration: report, onDataPass: (done, total) => report(null, { done, total }) }, models));
      } catch (error) {
        if (!isEngineError(error)) throw error;
        problems.push({ where: `candidates[${candidate.index}] "${candidate.name}"`, field: ['candidates', candidate.index], message: error.message });
      }
    }
  } catch (error) {
    for (const m of models) m.dispose();
    if (error instanceof FqeCancelledError) return failure(CANCELLED_PROBLEM);
    throw error;
  }
  if (problems.length > 0) {
    for (const m of models) m.dispose();
    return failure(...problems);
  }
  let baseline: { model: CandidateModel | null; reason: string };
  try {
    baseline = await presentControllerModel(plan, hooks, count, models);
  } catch (error) {
    for (const m of models) m.dispose();
    if (error instanceof FqeCancelledError) return failure(CANCELLED_PROBLEM);
    throw error;
  }
  const all = baseline.model ? [...models, baseline.model] : models;
  return success({
    plan, models, presentController: baseline.model, presentControllerReason: baseline.reason, dispose: () => all.forEach((m) => m.dispose()),
  }, [...plan.warnings]);
}

/** The present controller's model, fitted after the candidates; an engine error leaves it out with the reason. */
async function presentControllerModel(plan: EvaluationPlan, hooks: RunHooks, count: number, built: readonly CandidateModel[]): Promise<{ model: CandidateModel | null; reason: string }> {
  const planned = plan.presentController.planned;
  if (!planned) return { model: null, reason: plan.presentController.reason };
  const report = (iteration: FitIteration | null, dataPass: EvaluationProgress['dataPass'] = null) =>
    hooks.onProgress?.({ candidate: planned.name, candidateIndex: count, candidateCount: count + 1, iteration, dataPass });
  report(null);
  try {
    return { model: await buildModel(plan, planned, { ...hooks, onIteration: report, onDataPass: (done, total) => report(null, { done, total }) }, built), reason: '' };
  } catch (error) {
    if (!isEngineError(error)) throw error;
    return { model: null, reason: `the present controller’s model could not be fitted (${error.message})` };
  }
}
