/**
 * The one evaluation pipeline: a project document and its transitions in, an Evaluation out.
 * The CLI, the app's worker and the tests all call this function; nothing here knows its host.
 *
 * Per candidate: build the Gaussian policy, fit Q^π (linear features or a network), take
 * J(π) = mean of V^π over the start states, and V^π on a grid; then the logged behaviour's own
 * discounted return. Numbers leave in the project's sense (a cost stays a cost).
 */
import { createActionQuadrature } from '../core/actionQuadrature';
import { FqeCancelledError } from '../core/fqe/fqeErrors';
import type { CancellationCheck } from '../core/fqe/cancellation';
import { loggedDiscountedReturn } from '../core/loggedReturn';
import { failure, success, type Problem, type Result } from '../core/result';
import type { TransitionSet } from '../core/transitions';
import { valueSurface } from '../core/value';
import type { CandidateSpec, ProjectDocument } from '../project/schema';
import { CAUTIONS } from './cautions';
import type { CandidateFit } from './candidateFit';
import { candidatePolicy } from './candidatePolicy';
import { describeApproximator } from './featureMapFor';
import { fitCandidate } from './fitCandidate';
import type { Evaluation, FitIteration, PolicyEstimate, ValueSurface } from './estimates';
import { isEngineError } from './engineErrors';
import { surfaceGridFor, surfaceVisits } from './surfaceGrid';
import type { GaussianPolicy } from '../core/policy';

export interface EvaluationProgress {
  candidate: string;
  candidateIndex: number; // 0-based
  candidateCount: number;
  iteration: FitIteration | null;
}

export interface EvaluateOptions {
  project: ProjectDocument;
  dataset: TransitionSet;
  /** Warnings from opening the project (changed data file, excluded rows) to carry into the result. */
  warnings?: string[];
  onProgress?: (progress: EvaluationProgress) => void;
  cancel?: CancellationCheck;
  /** Clock for the evaluation time stamp (tests pass a fixed one). */
  now?: () => Date;
  /**
   * Take ownership of each candidate's fitted Q (the app's worker keeps them to redraw surfaces
   * and slices); the caller must dispose them. Without it the pipeline disposes every fit.
   */
  retainFit?: (candidateIndex: number, fit: CandidateFit, policy: GaussianPolicy) => void;
  /** Where TensorFlow.js's wasm backend finds its .wasm files, for hosts that must say (the CLI). */
  wasmPath?: string;
}

export async function evaluateProject(options: EvaluateOptions): Promise<Result<Evaluation>> {
  const { project, dataset } = options;
  const starts = startStatesFor(project, dataset);
  if (!starts.ok) return starts;
  const sign = project.columns.reward.sense === 'cost' ? -1 : 1;
  const policies: PolicyEstimate[] = [];
  const problems: Problem[] = [];
  const warnings = [...(options.warnings ?? [])];
  for (const [index, candidate] of project.candidates.entries()) {
    try {
      const estimate = await estimateCandidate(options, candidate, index, starts.value, sign);
      policies.push(estimate.estimate);
      warnings.push(...estimate.warnings.map((w) => `${candidate.name}: ${w}`));
    } catch (e) {
      if (e instanceof FqeCancelledError) return failure({ where: 'evaluation', message: 'cancelled before it finished; no results were kept' });
      if (!isEngineError(e)) throw e;
      problems.push({ where: `candidates[${index}] "${candidate.name}"`, message: (e as Error).message });
    }
  }
  if (problems.length > 0) return failure(...problems);
  const behaviour = loggedDiscountedReturn(dataset, project.discount);
  return success({
    project: project.name,
    evaluatedAt: (options.now ?? (() => new Date()))().toISOString(),
    policies,
    behaviour: { value: sign * behaviour.value, standardError: behaviour.standardError, episodes: behaviour.episodes, largestTruncationWeight: behaviour.largestTruncationWeight },
    settings: {
      discount: project.discount, approximator: describeApproximator(project.approximator), quadratureNodes: project.quadratureNodes,
      seed: project.seed, transitions: dataset.count, episodes: dataset.episodeCount, startStates: starts.value.length / dataset.stateDim,
    },
    valueSense: project.columns.reward.sense,
    warnings,
    cautions: CAUTIONS,
  });
}

async function estimateCandidate(
  options: EvaluateOptions, candidate: CandidateSpec, index: number, startStates: Float64Array, sign: number,
): Promise<{ estimate: PolicyEstimate; warnings: string[] }> {
  const { project, dataset } = options;
  const policy = candidatePolicy(candidate, dataset.stateDim);
  const report = (iteration: FitIteration | null) => options.onProgress?.({ candidate: candidate.name, candidateIndex: index, candidateCount: project.candidates.length, iteration });
  report(null);
  const fit: CandidateFit = await fitCandidate({
    data: dataset, policy, approximator: project.approximator, discount: project.discount, quadratureNodes: project.quadratureNodes,
    seed: project.seed, startStates, onIteration: report, cancel: options.cancel, wasmPath: options.wasmPath,
  });
  let retained = false;
  try {
    const grid = surfaceGridFor(project, dataset);
    let surface: ValueSurface | null = null;
    if (grid) {
      const values = valueSurface(fit.q, policy, createActionQuadrature(policy, project.quadratureNodes), grid);
      surface = {
        xState: grid.xState, yState: grid.yState, x: values.x, y: values.y, values: values.values.map((v) => sign * v),
        heldState: Array.from(grid.heldState), visits: surfaceVisits(dataset, grid),
      };
    }
    const estimate: PolicyEstimate = {
      name: candidate.name,
      policyValue: sign * fit.policyValue,
      standardError: fit.standardError ?? 0,
      fixedPointValue: fit.fixedPointValue === null ? null : sign * fit.fixedPointValue,
      status: fit.status,
      message: fit.message,
      iterations: fit.history.length,
      history: fit.history.map((h) => ({ ...h, policyValue: h.policyValue === null ? null : sign * h.policyValue })),
      surface,
      featureCount: fit.featureCount,
      backend: fit.backend,
    };
    if (options.retainFit) {
      options.retainFit(index, fit, policy);
      retained = true;
    }
    return { estimate, warnings: fit.warnings };
  } finally {
    if (!retained) fit.dispose();
  }
}

function startStatesFor(project: ProjectDocument, dataset: TransitionSet): Result<Float64Array> {
  if (project.startStates.kind === 'episodeStarts') {
    if (dataset.startStates.length === 0) return failure({ where: 'startStates', message: 'no episode of the data keeps its first row (each was excluded), so there are no start states; fix those rows or give start states in the project' });
    return success(dataset.startStates);
  }
  return success(Float64Array.from(project.startStates.states.flat()));
}
