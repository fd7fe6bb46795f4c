/**
 * Questions answered from the last run's retained fits: V^π over any two state axes with the
 * other states held (core valueSurface, visits from the pipeline's grid), and the action-value
 * slice Q(s, ·) with the policy's marginal action density and the quadrature nodes at s (the
 * other actions held at the policy's median action there, limits included: core/policy/medianAction.ts).
 * Values leave in the project's sense (a cost stays a cost).
 */
import { quadratureNodesAt } from '../../../core/actionQuadrature';
import { actionStd, createGaussianPolicy, logDensity, policyMean, type GaussianPolicy } from '../../../core/policy';
import { medianAction } from '../../../core/policy/medianAction';
import { actionValueSlice, valueSurface } from '../../../core/value';
import type { ValueSurface } from '../../../pipeline/estimates';
import type { CandidateModel } from '../../../pipeline/model/candidateModel';
import { surfaceGridFor, surfaceVisits } from '../../../pipeline/plan/surfaceGrid';
import type { ActionSliceReply, SliceQuery, SurfaceQuery } from '../../../shared/workerMessages';
import { WorkerQueryError, type EvaluatedRun } from './workerMemory';

/** Half-width of the slice around the policy mean, in standard deviations (covers all but ~6e-5 of the mass; common practice). */
const SLICE_HALF_WIDTH_STD = 4;

function retained(evaluated: EvaluatedRun, index: number): CandidateModel {
  const model = evaluated.run.models[index];
  if (!model) throw new WorkerQueryError(`candidate ${index + 1}: no fitted action-value function from the last run`);
  return model;
}

export function surfaceFromFit(run: EvaluatedRun, query: SurfaceQuery): ValueSurface {
  const model = retained(run, query.candidateIndex);
  const names = run.project.columns.states.map((s) => s.column);
  const xState = names[query.xAxis], yState = names[query.yAxis];
  if (xState === undefined || yState === undefined) throw new WorkerQueryError(`surface axes: expected state indices below ${names.length}`);
  if (query.heldState.length !== names.length) throw new WorkerQueryError(`surface held state: expected ${names.length} values, got ${query.heldState.length}`);
  const dataset = run.opened.dataset;
  const grid = surfaceGridFor({ ...run.project, surface: { xState, yState, resolution: query.resolution } }, dataset);
  if (!grid) throw new WorkerQueryError('a value surface needs at least two state columns');
  const options = { ...grid, heldState: query.heldState };
  const values = valueSurface(model.fit.q, model.policy, model.quadrature, options);
  const sign = run.run.plan.sign;
  return {
    xState, yState, x: values.x, y: values.y, values: values.values.map((v) => sign * v),
    heldState: [...query.heldState], visits: surfaceVisits(dataset, options),
  };
}

export function sliceFromFit(run: EvaluatedRun, query: SliceQuery): ActionSliceReply {
  const { fit, policy, name } = retained(run, query.candidateIndex);
  const { state, actionIndex: i } = query;
  if (state.length !== policy.stateDim) throw new WorkerQueryError(`slice state: expected ${policy.stateDim} values, got ${state.length}`);
  const mean = new Float64Array(policy.actionDim);
  policyMean(policy, state, mean);
  const marginal = marginalPolicy(policy, mean[i], i);
  const range = sliceRange(mean[i], actionStd(policy, i), policy, i);
  const held = new Float64Array(policy.actionDim); // the other actions at the candidate’s median, limits included
  medianAction(policy, state, held);
  const slice = actionValueSlice(fit.q, state, i, range, query.points, held);
  const sign = run.run.plan.sign;
  const density = slice.actions.map((a) => (a < range[0] || a > range[1] ? 0 : Math.exp(logDensity(marginal, zeros(policy.stateDim), [a]))));
  return {
    actions: slice.actions, actionValues: slice.values.map((v) => sign * v), density,
    nodes: marginalNodes(quadratureNodesAt(policy, state, run.project.quadratureNodes), policy.actionDim, i),
    state: [...state], policyName: name,
  };
}

/**
 * The law of action i alone, as a one-action policy with a constant mean. Truncation keeps its
 * bounds (the density is renormalised); clipping puts point masses at the bounds, which the nodes
 * show, so its density inside the bounds is the plain Gaussian's.
 */
function marginalPolicy(policy: GaussianPolicy, mean: number, i: number): GaussianPolicy {
  const b = policy.bounds;
  const bounds = b && b.mode === 'truncate' ? { lo: [b.lo[i]], hi: [b.hi[i]], mode: b.mode } : undefined;
  return createGaussianPolicy({ offset: [mean], gain: [zeros(policy.stateDim)], std: [actionStd(policy, i)], bounds }, policy.stateDim);
}

function sliceRange(mean: number, std: number, policy: GaussianPolicy, i: number): [number, number] {
  let lo = mean - SLICE_HALF_WIDTH_STD * std, hi = mean + SLICE_HALF_WIDTH_STD * std;
  if (policy.bounds) {
    const bLo = policy.bounds.lo[i], bHi = policy.bounds.hi[i];
    lo = Math.max(lo, bLo);
    hi = Math.min(hi, bHi);
    // A mean far outside the bounds leaves nothing of the ±4σ window: show the whole bounded range.
    if (!(lo < hi)) [lo, hi] = [Number.isFinite(bLo) ? bLo : bHi - 2 * SLICE_HALF_WIDTH_STD * std, Number.isFinite(bHi) ? bHi : bLo + 2 * SLICE_HALF_WIDTH_STD * std];
  }
  return [lo, hi];
}

/** Nodes along action i: the product rule's points projected on that axis, equal points merged. */
function marginalNodes(rule: { count: number; points: Float64Array; weights: Float64Array }, m: number, i: number): { points: Float64Array; weights: Float64Array } {
  const merged = new Map<number, number>();
  for (let j = 0; j < rule.count; j++) {
    const a = rule.points[j * m + i];
    merged.set(a, (merged.get(a) ?? 0) + rule.weights[j]);
  }
  const sorted = [...merged.entries()].sort((p, q) => p[0] - q[0]);
  return { points: Float64Array.from(sorted, (e) => e[0]), weights: Float64Array.from(sorted, (e) => e[1]) };
}

function zeros(n: number): number[] {
  return new Array<number>(n).fill(0);
}
