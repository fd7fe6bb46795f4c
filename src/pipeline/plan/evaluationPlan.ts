/**
 * The project boundary: a project document and its transitions resolved, once, into the plan every
 * host runs — start states, compiled policies, the feature map, the surface grid, the episode index
 * — checked against the engine's limits (src/core/limits.ts) so that what the schema accepts either
 * runs or is refused here with the field named. Nothing after the plan re-reads the document's
 * settings or re-derives what the plan holds.
 */
import { absorbingEndCount } from '../../core/absorbingEnds';
import { indexEpisodes, type EpisodeIndex } from '../../core/bootstrap/episodeTransitions';
import type { FeatureMap } from '../../core/features/featureMap';
import { loggedDiscountedReturn, type LoggedReturn } from '../../core/loggedReturn';
import { failure, success, type Problem, type Result } from '../../core/result';
import type { TransitionSet } from '../../core/transitions';
import type { ApproximatorSettings } from '../../project/approximatorSchema';
import type { ProjectDocument } from '../../project/schema';
import { declaredActionBounds } from './declaredBounds';
import { planFeatures } from './featureMapFor';
import { planPolicies } from './planPolicies';
import { planPresentController, type PlannedPresentController } from './presentController';
import { dataWarnings, discountProblems, polynomialPartProblems } from './planChecks';
import { surfaceGridFor } from './surfaceGrid';
import type { PlannedPolicy, StartStates, SurfaceGrid } from './planTypes';

export type { PlannedPolicy, StartStates, SurfaceGrid } from './planTypes';

export interface EvaluationPlan {
  readonly project: ProjectDocument;
  readonly data: TransitionSet;
  readonly episodes: EpisodeIndex;
  readonly discount: number;
  readonly quadratureNodes: number;
  readonly seed: number;
  readonly sense: 'reward' | 'cost';
  /** −1 for a cost project (the engine works with rewards), 1 for a reward project. */
  readonly sign: 1 | -1;
  readonly starts: StartStates;
  readonly candidates: readonly PlannedPolicy[];
  /** Today's controller as a policy (presentController.ts), evaluated like the candidates as the comparable baseline. */
  readonly presentController: PlannedPresentController;
  readonly approximator: ApproximatorSettings;
  /** The linear approximator's feature map, built once from the data for every candidate; null for a network. */
  readonly features: FeatureMap | null;
  readonly surface: SurfaceGrid | null;
  /** Transitions into an end state (terminal 1): where there are any, runs end, which changes the possible values and which cross-checks apply (../../core/absorbingEnds.ts). */
  readonly absorbingEnds: number;
  /** The logs' own discounted return per episode at the project's discount (what the plant did). */
  readonly loggedReturn: LoggedReturn;
  /** Things the user should know that do not stop the evaluation (few transitions per feature, constant columns…). */
  readonly warnings: readonly Problem[];
}

export function planEvaluation(project: ProjectDocument, data: TransitionSet): Result<EvaluationPlan> {
  const starts = startStatesFor(project, data);
  if (!starts.ok) return starts;
  const policies = planPolicies(project, data);
  const features = project.approximator.kind === 'linear' ? planFeatures(project.approximator, data) : success(null);
  const problems = [...discountProblems(project.discount, data.count), ...polynomialPartProblems(project.approximator, data.stateDim + data.actionDim), ...(policies.ok ? [] : policies.problems), ...(features.ok ? [] : features.problems)];
  if (!policies.ok || !features.ok || problems.length > 0) return failure(...problems);
  const sense = project.columns.reward.sense;
  return success({
    project, data, episodes: indexEpisodes(data), discount: project.discount, quadratureNodes: project.quadratureNodes, seed: project.seed,
    sense, sign: sense === 'cost' ? -1 : 1, starts: starts.value, candidates: policies.value, presentController: planPresentController(data, project.quadratureNodes, declaredActionBounds(project, data.actionDim)), approximator: project.approximator,
    features: features.value, surface: surfaceGridFor(project, data), absorbingEnds: absorbingEndCount(data.terminal), loggedReturn: loggedDiscountedReturn(data, project.discount), warnings: [...features.warnings, ...dataWarnings(data)],
  });
}

function startStatesFor(project: ProjectDocument, data: TransitionSet): Result<StartStates> {
  const ds = data.stateDim;
  if (project.startStates.kind === 'episodeStarts') {
    if (data.episodeCount < 1) return failure({ where: 'startStates', field: ['startStates'], message: 'the data has no runs, so there are no start states' });
    if (data.startStates.length === 0) {
      return failure({ where: 'startStates', field: ['startStates'], message: 'no run of the data keeps its first row (each was excluded), so there are no start states; fix those rows or give start states in the project' });
    }
    return success({ states: data.startStates, count: data.startStates.length / ds, followEpisodes: true, episode: data.startEpisode });
  }
  const states = Float64Array.from(project.startStates.states.flat());
  return success({ states, count: states.length / ds, followEpisodes: false });
}
