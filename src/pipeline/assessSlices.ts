/**
 * Slices of a candidate's fitted Q along each action at three states — the first state at its
 * 10th, 50th and 90th logged percentile, the others at their logged means — beside the candidate's
 * action distribution there and the range of actions logged near that state. Shows whether the
 * candidate's actions fall where Q was fitted. With several actions the others are held at the
 * candidate's median action there, limits included (core/policy/medianAction.ts): a value it can
 * take, where its unlimited mean may lie beyond a valve's end.
 */
import { loggedActionRanges, DEFAULT_ACTION_SUPPORT } from '../core/diagnostics/actionSupport';
import { actionStd, policyMean } from '../core/policy';
import { medianAction } from '../core/policy/medianAction';
import type { TransitionSet } from '../core/transitions';
import { actionValueSlice } from '../core/value';
import type { ActionSlice } from './assessment';
import type { CandidateModel } from './model/candidateModel';

const SLICE_POINTS = 61;
const PERCENTILES = [0.1, 0.5, 0.9];

/** The three slice states (3×ds) and their labels. */
function sliceStates(data: TransitionSet): { states: Float64Array; labels: string[] } {
  const { count: n, stateDim: ds } = data, mean = new Float64Array(ds);
  for (let i = 0; i < n; i++) for (let c = 0; c < ds; c++) mean[c] += data.states[i * ds + c] / n;
  const first = Float64Array.from({ length: n }, (_, i) => data.states[i * ds]).sort();
  const states = new Float64Array(PERCENTILES.length * ds), labels: string[] = [];
  PERCENTILES.forEach((p, r) => {
    states.set(mean, r * ds);
    states[r * ds] = first[Math.min(n - 1, Math.floor(p * n))];
    labels.push(`${data.stateNames[0]} at its ${Math.round(100 * p)}th percentile`);
  });
  return { states, labels };
}

export function actionSlices(model: CandidateModel, data: TransitionSet, sign: number): ActionSlice[] {
  const { states, labels } = sliceStates(data), ds = data.stateDim, m = data.actionDim;
  const ranges = loggedActionRanges(data, DEFAULT_ACTION_SUPPORT, states);
  const logged = loggedExtent(data);
  const mean = new Float64Array(m), held = new Float64Array(m), slices: ActionSlice[] = [];
  for (let r = 0; r < labels.length; r++) {
    const state = states.subarray(r * ds, (r + 1) * ds);
    policyMean(model.policy, state, mean);
    medianAction(model.policy, state, held);
    for (let j = 0; j < m; j++) {
      // The logged range, widened to the candidate's bulk (μ ± 2.5σ) but not past its actuator limits.
      const std = actionStd(model.policy, j), limits = model.policy.bounds;
      const lo = Math.max(Math.min(logged.lo[j], mean[j] - 2.5 * std), limits ? limits.lo[j] : -Infinity);
      const hi = Math.min(Math.max(logged.hi[j], mean[j] + 2.5 * std), limits ? limits.hi[j] : Infinity);
      const slice = actionValueSlice(model.fit.q, state, j, [lo, hi], SLICE_POINTS, held);
      slices.push({
        label: labels[r], state: Array.from(state), actionIndex: j, actions: Array.from(slice.actions),
        values: Array.from(slice.values, (v) => sign * v), candidateMean: Math.min(hi, Math.max(lo, mean[j])), candidateStd: std,
        loggedRange: [ranges.lo[r * m + j], ranges.hi[r * m + j]],
      });
    }
  }
  return slices;
}

function loggedExtent(data: TransitionSet): { lo: number[]; hi: number[] } {
  const m = data.actionDim, lo = new Array<number>(m).fill(Infinity), hi = new Array<number>(m).fill(-Infinity);
  for (let i = 0; i < data.count; i++) {
    for (let j = 0; j < m; j++) {
      lo[j] = Math.min(lo[j], data.actions[i * m + j]);
      hi[j] = Math.max(hi[j], data.actions[i * m + j]);
    }
  }
  return { lo, hi };
}
