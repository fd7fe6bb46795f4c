/**
 * The evaluation: per candidate its J(π) = mean of V^π over the start states, the fit behind it and
 * V^π on the surface grid, read from the run's models (projectRun.ts); and the logged discounted
 * return. Numbers leave in the project's sense (a cost stays a cost). `evaluateProject` runs a
 * project start to finish for hosts that need nothing else; hosts that also assess keep the run.
 */
import { meanActionAtMeanState } from '../core/behaviourModel';
import { success, type Result } from '../core/result';
import type { TransitionSet } from '../core/transitions';
import { valueSurface } from '../core/value';
import type { ProjectDocument } from '../project/schema';
import { CAUTIONS } from './cautions';
import type { Evaluation, EvaluationSettings, NetworkCheck, PolicyEstimate, PresentControllerEstimate, ValueSurface } from './estimates';
import { completedReturnOf } from './model/completedReturn';
import type { CandidateModel } from './model/candidateModel';
import { describeApproximator } from './plan/approximatorLabel';
import type { EvaluationPlan } from './plan/evaluationPlan';
import { heldRowsLeftOut } from './heldActionsCheck';
import { surfaceVisits } from './plan/surfaceGrid';
import { startRun, type ProjectRun, type RunHooks } from './projectRun';

export type { EvaluationProgress } from './projectRun';

export interface EvaluateOptions extends RunHooks {
  project: ProjectDocument;
  dataset: TransitionSet;
  /** Warnings from opening the project (changed data file, excluded rows) to carry into the result. */
  warnings?: string[];
  /** Clock for the evaluation time stamp (tests pass a fixed one). */
  now?: () => Date;
  /** Take over the run (its models) instead of releasing it: the host must dispose it. */
  keepRun?: (run: ProjectRun) => void;
}

export async function evaluateProject(options: EvaluateOptions): Promise<Result<Evaluation>> {
  const started = await startRun(options.project, options.dataset, options);
  if (!started.ok) return started;
  const run = started.value;
  try {
    const evaluation = evaluationOf(run, [...(options.warnings ?? []), ...started.warnings.map((w) => `${w.where}: ${w.message}`)], options.now);
    if (options.keepRun) options.keepRun(run);
    return success(evaluation);
  } finally {
    if (!options.keepRun) run.dispose();
  }
}

export function evaluationOf(run: ProjectRun, warnings: string[] = [], now: () => Date = () => new Date()): Evaluation {
  const { plan } = run, { project, data } = plan;
  const logged = plan.loggedReturn;
  return {
    project: project.name,
    evaluatedAt: now().toISOString(),
    policies: run.models.map((m) => policyEstimate(plan, m)),
    behaviour: { value: plan.sign * logged.value, standardError: logged.standardError, episodes: logged.episodes, largestTruncationWeight: logged.largestTruncationWeight, meanTruncationWeight: logged.meanTruncationWeight },
    presentController: run.presentController && presentControllerEstimate(run, run.presentController),
    presentControllerReason: run.presentControllerReason,
    settings: {
      discount: plan.discount, approximator: describeApproximator(plan.approximator), quadratureNodes: plan.quadratureNodes,
      seed: plan.seed, transitions: data.count, episodes: data.episodeCount, startStates: plan.starts.count,
      ...polynomialPartOf(run),
    },
    valueSense: plan.sense,
    warnings: [...warnings, ...run.models.flatMap((m) => m.fit.warnings.map((w) => `${m.name}: ${w}`))],
    cautions: CAUTIONS,
  };
}

/** The network's polynomial part as its fits used it: the first fit's, the same for all (the choice reads the log, never the candidate). */
function polynomialPartOf(run: ProjectRun): Pick<EvaluationSettings, 'polynomialPart'> {
  const { approximator } = run.plan, used = [run.presentController, ...run.models].find((m) => m?.fit.polynomialPart)?.fit.polynomialPart;
  if (approximator.kind !== 'network' || !used) return {};
  return { polynomialPart: { setting: approximator.polynomialDegree, degree: used.degree, reason: used.sentence } };
}

function policyEstimate(plan: EvaluationPlan, model: CandidateModel): PolicyEstimate {
  const { fit } = model, sign = plan.sign;
  return {
    name: model.name,
    policyValue: sign * fit.policyValue,
    standardError: fit.standardError ?? 0,
    fixedPointValue: fit.fixedPointValue === null ? null : sign * fit.fixedPointValue,
    status: fit.status,
    message: fit.message,
    iterations: fit.history.length,
    history: fit.history.map((h) => ({ ...h, policyValue: h.policyValue === null ? null : sign * h.policyValue })),
    surface: surfaceOf(plan, model),
    featureCount: fit.featureCount,
    backend: fit.backend,
    ...(fit.interval && fit.linearComparison ? { network: networkCheck(fit, sign) } : {}),
  };
}

/** The network's interval and its linear comparison in the project's sense (a cost flips the interval's ends). */
function networkCheck(fit: CandidateModel['fit'], sign: number): NetworkCheck {
  const iv = (i: { lower: number; upper: number }): [number, number] => (sign > 0 ? [i.lower, i.upper] : [-i.upper, -i.lower]);
  const c = fit.linearComparison!;
  return {
    level: fit.interval!.level, interval: iv(fit.interval!), covers: fit.intervalCovers ?? '',
    linear: { value: sign * c.value, interval: iv(c.interval) },
    difference: { value: sign * c.difference.value, interval: iv(c.difference.interval) },
    agreement: { verdict: c.agreement.verdict, message: c.agreement.message },
    remainingShare: fit.convergence?.remainingBound ?? null, tolerance: fit.convergence?.tolerance ?? 0,
  };
}

function presentControllerEstimate(run: ProjectRun, model: CandidateModel): PresentControllerEstimate {
  const { plan } = run, { surface: _surface, ...estimate } = policyEstimate({ ...plan, surface: null }, model);
  const fitted = plan.presentController.fitted!.model;
  const completed = completedReturnOf(plan, model);
  return {
    estimate,
    model: {
      offset: [...fitted.offset], gain: fitted.gain.map((row) => [...row]), std: [...fitted.std],
      lo: fitted.offset.map((_, j) => finiteOrNull(fitted.limits.lo[j])), hi: fitted.offset.map((_, j) => finiteOrNull(fitted.limits.hi[j])),
      actions: [...plan.data.actionNames],
      units: plan.data.actionNames.map((name) => plan.project.columns.actions.find((c) => c.column === name)?.unit ?? ''),
      limitEvidence: { lo: [...fitted.limits.evidence.lo], hi: [...fitted.limits.evidence.hi] },
      meanAtMeanState: meanActionAtMeanState(fitted),
      ...heldRowsField(plan.presentController),
    },
    completedReturn: { value: plan.sign * completed.value, standardError: completed.standardError, tailShare: completed.tailShare },
  };
}

const finiteOrNull = (v: number): number | null => (Number.isFinite(v) ? v : null);

/** The held rows the present controller's law was fitted without, where the held-actions repair applied; nothing otherwise. */
function heldRowsField(pc: EvaluationPlan['presentController']): { heldRowsLeftOut?: number } {
  const rows = heldRowsLeftOut(pc.held, pc.lawFit);
  return rows > 0 ? { heldRowsLeftOut: rows } : {};
}

function surfaceOf(plan: EvaluationPlan, model: CandidateModel): ValueSurface | null {
  const grid = plan.surface;
  if (!grid) return null;
  const values = valueSurface(model.fit.q, model.policy, model.quadrature, grid);
  return {
    xState: grid.xState, yState: grid.yState, x: values.x, y: values.y, values: values.values.map((v) => plan.sign * v),
    heldState: Array.from(grid.heldState), visits: surfaceVisits(plan.data, grid),
  };
}
