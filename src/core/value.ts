/**
 * Values of a policy from a fitted action-value function Q:
 *   V^π(s) = E_{a~π(·|s)} Q(s, a) ≈ Σ_j w_j Q(s, a_j)   (quadrature nodes a_j, weights w_j; common practice)
 *   J(π)  = E_{s0} V^π(s0), estimated by the mean over logged start states.
 * Q is always evaluated in batches (one call per block of states), so a 100×100 surface is one
 * pass of a few hundred thousand rows rather than ten thousand small calls.
 *
 * Shapes: ds state dimensions, m action dimensions, K ≤ quadrature.maxPoints nodes per state.
 */
import type { ActionQuadrature } from './actionQuadrature';
import type { ActionValueFunction } from './actionValue';
import type { GaussianPolicy } from './policy';

export class ValueQueryError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ValueQueryError';
  }
}

/** States per batched Q call: large enough to amortise the call, small enough to stay in cache. */
const STATES_PER_BLOCK = 512;

/** V^π(s) for one state (length ds). */
export function stateValue(q: ActionValueFunction, policy: GaussianPolicy, state: ArrayLike<number>, quadrature: ActionQuadrature): number {
  if (state.length !== q.stateDim) throw new ValueQueryError(`state: expected ${q.stateDim} values, got ${state.length}`);
  return stateValues(q, policy, state, 1, quadrature)[0];
}

/** V^π(s_i) for states: count×ds row-major; written to out (length ≥ count) and returned. */
export function stateValues(
  q: ActionValueFunction, policy: GaussianPolicy, states: ArrayLike<number>, count: number,
  quadrature: ActionQuadrature, out = new Float64Array(count),
): Float64Array {
  checkCompatible(q, policy, quadrature);
  const ds = q.stateDim, m = q.actionDim, p = ds + m, kMax = quadrature.maxPoints;
  if (states.length < count * ds) throw new ValueQueryError(`states: expected ${count}×${ds} values, got ${states.length}`);
  if (out.length < count) throw new ValueQueryError(`stateValues: output has room for ${out.length} values, need ${count}`);
  const block = Math.min(STATES_PER_BLOCK, Math.max(count, 1));
  const inputs = new Float64Array(block * kMax * p), qOut = new Float64Array(block * kMax);
  const weights = new Float64Array(block * kMax), nodeCounts = new Int32Array(block);
  const points = new Float64Array(kMax * m), nodeWeights = new Float64Array(kMax);
  for (let start = 0; start < count; start += block) {
    const size = Math.min(block, count - start);
    let rows = 0;
    for (let b = 0; b < size; b++) {
      const so = (start + b) * ds;
      const k = quadrature.at(states, so, points, nodeWeights);
      nodeCounts[b] = k;
      for (let j = 0; j < k; j++, rows++) {
        weights[rows] = nodeWeights[j];
        for (let c = 0; c < ds; c++) inputs[rows * p + c] = states[so + c];
        for (let c = 0; c < m; c++) inputs[rows * p + ds + c] = points[j * m + c];
      }
    }
    q.evaluate(inputs, rows, qOut);
    for (let b = 0, row = 0; b < size; b++) {
      let v = 0;
      for (let j = 0; j < nodeCounts[b]; j++, row++) v += weights[row] * qOut[row];
      if (!Number.isFinite(v)) throw new ValueQueryError(`state value is ${v} at state ${start + b + 1} [${Array.from({ length: ds }, (_, c) => states[(start + b) * ds + c]).join(', ')}]`);
      out[start + b] = v;
    }
  }
  return out;
}

export interface PolicyValueEstimate {
  /** J = mean of V^π over the start states. */
  readonly value: number;
  /**
   * sd/√e over the e start states: only the start-state sampling part of the uncertainty — it
   * says nothing about the error of the fitted Q itself. null when e < 2 (cannot be estimated).
   */
  readonly standardError: number | null;
  readonly count: number; // e
}

/** J(π) over startStates: e×ds row-major. */
export function policyValue(
  q: ActionValueFunction, policy: GaussianPolicy, startStates: ArrayLike<number>, quadrature: ActionQuadrature,
): PolicyValueEstimate {
  const ds = q.stateDim, e = Math.floor(startStates.length / ds);
  if (e < 1 || startStates.length !== e * ds) {
    throw new ValueQueryError(`start states: expected a whole number (≥ 1) of rows of ${ds} values, got ${startStates.length} values`);
  }
  const v = stateValues(q, policy, startStates, e, quadrature);
  let sum = 0;
  for (let i = 0; i < e; i++) sum += v[i];
  const mean = sum / e;
  if (e < 2) return { value: mean, standardError: null, count: e };
  let squares = 0; // two-pass sample variance (Chan, Golub & LeVeque, 1983)
  for (let i = 0; i < e; i++) squares += (v[i] - mean) ** 2;
  return { value: mean, standardError: Math.sqrt(squares / (e - 1) / e), count: e };
}

export interface ValueSurfaceOptions {
  xAxis: number; // state index on the x axis
  yAxis: number; // state index on the y axis
  xRange: [number, number];
  yRange: [number, number];
  resolution: [number, number]; // [nx, ny], each ≥ 2
  /** Values of all ds states; the two axis entries are replaced by the grid. */
  heldState: ArrayLike<number>;
}

export interface ValueSurface {
  readonly x: Float64Array; // nx grid values of state xAxis (endpoints included)
  readonly y: Float64Array; // ny
  readonly values: Float64Array; // ny×nx row-major: values[iy·nx + ix] = V^π at (x[ix], y[iy])
}

/** V^π over a grid in two state dimensions with the others held. */
export function valueSurface(
  q: ActionValueFunction, policy: GaussianPolicy, quadrature: ActionQuadrature, options: ValueSurfaceOptions,
): ValueSurface {
  const ds = q.stateDim, { xAxis, yAxis, heldState } = options;
  for (const [name, axis] of [['xAxis', xAxis], ['yAxis', yAxis]] as const) {
    if (!Number.isInteger(axis) || axis < 0 || axis >= ds) throw new ValueQueryError(`${name}: expected a state index from 0 to ${ds - 1}, got ${axis}`);
  }
  if (xAxis === yAxis) throw new ValueQueryError(`xAxis and yAxis: must be different states, both are ${xAxis}`);
  if (heldState.length !== ds) throw new ValueQueryError(`heldState: expected ${ds} values, got ${heldState.length}`);
  const [nx, ny] = options.resolution;
  const x = gridLine('xRange', options.xRange, nx, 'resolution[0]'), y = gridLine('yRange', options.yRange, ny, 'resolution[1]');
  const states = new Float64Array(nx * ny * ds);
  for (let iy = 0; iy < ny; iy++) {
    for (let ix = 0; ix < nx; ix++) {
      const o = (iy * nx + ix) * ds;
      for (let c = 0; c < ds; c++) states[o + c] = heldState[c];
      states[o + xAxis] = x[ix];
      states[o + yAxis] = y[iy];
    }
  }
  return { x, y, values: stateValues(q, policy, states, nx * ny, quadrature) };
}

export interface ActionValueSlice {
  readonly actions: Float64Array; // points values of action actionIndex
  readonly values: Float64Array; // Q(s, a) at each
}

/**
 * Q(s, ·) along action dimension actionIndex over range (points ≥ 2, endpoints included).
 * With more than one action, heldAction (length m) gives the other action values.
 */
export function actionValueSlice(
  q: ActionValueFunction, state: ArrayLike<number>, actionIndex: number, range: [number, number], points: number,
  heldAction?: ArrayLike<number>,
): ActionValueSlice {
  const ds = q.stateDim, m = q.actionDim, p = ds + m;
  if (state.length !== ds) throw new ValueQueryError(`state: expected ${ds} values, got ${state.length}`);
  if (!Number.isInteger(actionIndex) || actionIndex < 0 || actionIndex >= m) {
    throw new ValueQueryError(`actionIndex: expected an action index from 0 to ${m - 1}, got ${actionIndex}`);
  }
  if (m > 1 && heldAction?.length !== m) throw new ValueQueryError(`heldAction: with ${m} actions, give all ${m} action values to hold`);
  const actions = gridLine('range', range, points, 'points');
  const inputs = new Float64Array(points * p);
  for (let i = 0; i < points; i++) {
    for (let c = 0; c < ds; c++) inputs[i * p + c] = state[c];
    for (let c = 0; c < m; c++) inputs[i * p + ds + c] = heldAction ? heldAction[c] : 0;
    inputs[i * p + ds + actionIndex] = actions[i];
  }
  const values = new Float64Array(points);
  q.evaluate(inputs, points, values);
  return { actions, values };
}

/** n equally spaced values from lo to hi inclusive. */
function gridLine(name: string, [lo, hi]: [number, number], n: number, countName: string): Float64Array {
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || !(lo < hi)) throw new ValueQueryError(`${name}: expected finite [lo, hi] with lo < hi, got [${lo}, ${hi}]`);
  if (!Number.isInteger(n) || n < 2) throw new ValueQueryError(`${countName}: expected a whole number ≥ 2, got ${n}`);
  return Float64Array.from({ length: n }, (_, i) => (i === n - 1 ? hi : lo + ((hi - lo) * i) / (n - 1)));
}

function checkCompatible(q: ActionValueFunction, policy: GaussianPolicy, quadrature: ActionQuadrature): void {
  if (policy.stateDim !== q.stateDim || policy.actionDim !== q.actionDim) {
    throw new ValueQueryError(`policy: has ${policy.stateDim} states and ${policy.actionDim} actions, but Q takes ${q.stateDim} and ${q.actionDim}`);
  }
  if (quadrature.actionDim !== q.actionDim) {
    throw new ValueQueryError(`quadrature: built for ${quadrature.actionDim} actions, but Q takes ${q.actionDim}`);
  }
}
