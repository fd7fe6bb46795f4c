/**
 * Closed-form policy evaluation for a linear plant with quadratic cost and a linear-Gaussian
 * policy: the reference answer the fitted estimators are checked against.
 *
 * Everything here is in COST terms (lower is better). The engine maximises reward, and the data
 * importer stores reward = −cost, so compare with `rewardFromCost(...)` (Q, V and J all flip sign;
 * nothing else changes because the discount is linear).
 *
 * Model, in deviation coordinates x = s − x_sp (n), v = a − u_sp (m) around an operating point:
 *   x' = A x + B v + w,  w ~ N(0, W);   cost c(x, v) = xᵀQx + vᵀRv;
 *   policy v = −K x + d + e,  e ~ N(0, S)  (d ≠ 0: the policy is not centred on the operating point).
 * With F = A − BK and 0 < γ < 1, the cost-to-go is quadratic, V(x) = xᵀPx + 2pᵀx + c, where
 * (Bertsekas, "Dynamic Programming and Optimal Control", Vol. I, ch. 4, linear-quadratic problems; matching the
 * quadratic, linear and constant parts of V(x) = E[c(x, v)] + γ E[V(x')]):
 *   P = Q + KᵀRK + γ FᵀPF                                      (discrete Lyapunov equation)
 *   (I − γFᵀ) p = γ FᵀPB d − KᵀR d
 *   c = [tr(RS) + dᵀRd + γ(tr(P(BSBᵀ + W)) + dᵀBᵀPBd + 2pᵀBd)] / (1 − γ)
 * Derivation of c: E[c(x,v)] = xᵀ(Q + KᵀRK)x − 2dᵀRKx + dᵀRd + tr(RS), since E[eᵀRe] = tr(RS);
 * x' has mean Fx + Bd and covariance BSBᵀ + W, so E[x'ᵀPx'] = (Fx+Bd)ᵀP(Fx+Bd) + tr(P(BSBᵀ + W));
 * the x-free terms give c = dᵀRd + tr(RS) + γ(dᵀBᵀPBd + tr(P(BSBᵀ + W)) + 2pᵀBd + c). For a
 * centred policy (d = 0) this is p = 0 and c = [tr(RS) + γ tr(P(BSBᵀ + W))]/(1 − γ).
 * The action-value function follows in one step (the first action is given, not drawn):
 *   Q(x, v) = xᵀQx + vᵀRv + γ[(Ax+Bv)ᵀP(Ax+Bv) + 2pᵀ(Ax+Bv) + tr(PW) + c].
 *
 * Mapping the engine's affine policy a = offset + G·s + e (src/core/policy.ts) to these
 * coordinates: substituting s = x_sp + x and a = u_sp + v gives
 *   v = G x + (offset + G x_sp − u_sp) + e,  so  K = −G,  d = offset + G·x_sp − u_sp.
 * The policy is centred exactly when offset = u_sp − G·x_sp.
 */
import { notAffineReason, type GaussianPolicy } from './policy';
import type { ActionValueFunction } from './actionValue';
import { multiply, solve, transpose } from './linalg/dense';
import { LyapunovStabilityError, solveDiscreteLyapunov } from './linalg/lyapunov';

/** Plant in deviation coordinates. Shapes: n states, m actions. */
export interface LinearQuadraticPlant {
  readonly stateDim: number; // n
  readonly actionDim: number; // m
  readonly dynamics: Float64Array; // A: n×n row-major
  readonly inputGain: Float64Array; // B: n×m row-major
  readonly processNoiseCovariance: Float64Array; // W: n×n, symmetric PSD
  readonly stateWeight: Float64Array; // Q: n×n, symmetric PSD
  readonly actionWeight: Float64Array; // R: m×m, symmetric PSD
}

/** v = −K x + d + e, e ~ N(0, S), in deviation coordinates. */
export interface LinearFeedbackPolicy {
  readonly feedbackGain: Float64Array; // K: m×n row-major
  readonly bias: Float64Array; // d: m
  readonly noiseCovariance: Float64Array; // S: m×m, symmetric PSD
}

/** V(x) = xᵀPx + 2pᵀx + c, in deviation coordinates. */
export interface QuadraticCostToGo {
  readonly quadratic: Float64Array; // P: n×n symmetric
  readonly linear: Float64Array; // p: n
  readonly constant: number; // c
}

/** The setpoint (x_sp, u_sp) the deviation coordinates are measured from, in absolute units. */
export interface OperatingPoint {
  readonly state: Float64Array; // x_sp: n
  readonly action: Float64Array; // u_sp: m
}

export class LqModelError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'LqModelError';
  }
}

/** γ·ρ(A − BK)² ≥ 1: the expected discounted cost of the policy is infinite. */
export class UnstableClosedLoopError extends Error {
  readonly discountedSpectralRadiusSquared: number;
  constructor(message: string, discountedSpectralRadiusSquared: number) {
    super(message);
    this.name = 'UnstableClosedLoopError';
    this.discountedSpectralRadiusSquared = discountedSpectralRadiusSquared;
  }
}

/** reward = −cost. The engine reports rewards; this module reports costs. */
export function rewardFromCost(cost: number): number {
  return -cost;
}

/** Solve for V = (P, p, c) of a linear-Gaussian feedback policy under discount γ ∈ (0, 1). */
export function feedbackCostToGo(plant: LinearQuadraticPlant, policy: LinearFeedbackPolicy, discount: number): QuadraticCostToGo {
  checkPlant(plant);
  checkFeedback(plant, policy);
  if (!(discount > 0 && discount < 1)) throw new LqModelError(`discount: expected a number strictly between 0 and 1, got ${discount}`);
  const { stateDim: n, actionDim: m, inputGain: b, actionWeight: r } = plant;
  const { feedbackGain: k, bias: d, noiseCovariance: s } = policy;
  const f = closedLoopDynamics(plant, k);
  const kt = transpose(k, m, n);
  const qc = addMatrices(plant.stateWeight, multiply(kt, multiply(r, k, m, m, n), n, m, n));
  const pMat = symmetrised(solveCostLyapunov(f, qc, n, discount), n);
  const ft = transpose(f, n, n);
  const pb = multiply(pMat, b, n, n, m); // n×m
  const bd = multiply(b, d, n, m, 1); // n
  const rd = multiply(r, d, m, m, 1); // m
  const rhs = multiply(ft, multiply(pb, d, n, m, 1), n, n, 1).map((v, i) => discount * v - dotRow(kt, i, m, rd));
  const lhs = identityMinus(ft, n, discount);
  const p = solve(lhs, n, rhs);
  const bsbt = multiply(b, multiply(s, transpose(b, n, m), m, m, n), n, m, n);
  const stepNoise = traceOfProduct(pMat, addMatrices(bsbt, plant.processNoiseCovariance), n);
  const future = stepNoise + quadraticForm(pMat, bd, n) + 2 * dotRow(p, 0, n, bd);
  const constant = (traceOfProduct(r, s, m) + dotRow(d, 0, m, rd) + discount * future) / (1 - discount);
  return { quadratic: pMat, linear: p, constant };
}

/** V(x) = xᵀPx + 2pᵀx + c; x read from x[offset .. offset+n). */
export function stateCostToGo(v: QuadraticCostToGo, x: ArrayLike<number>, offset = 0): number {
  const n = v.linear.length;
  let total = v.constant;
  for (let i = 0; i < n; i++) {
    const xi = x[offset + i];
    let row = 0;
    for (let j = 0; j < n; j++) row += v.quadratic[i * n + j] * x[offset + j];
    total += xi * row + 2 * v.linear[i] * xi;
  }
  return total;
}

/** Q(x, v) = c(x, v) + γ E[V(Ax + Bv + w)] for a given first action v (deviation coordinates). */
export function actionCostToGo(
  plant: LinearQuadraticPlant, v: QuadraticCostToGo, discount: number, x: ArrayLike<number>, u: ArrayLike<number>,
): number {
  const { stateDim: n, actionDim: m } = plant;
  const next = addMatrices(multiply(plant.dynamics, x, n, n, 1), multiply(plant.inputGain, u, n, m, 1));
  const stageCost = quadraticForm(plant.stateWeight, x, n) + quadraticForm(plant.actionWeight, u, m);
  const noise = traceOfProduct(v.quadratic, plant.processNoiseCovariance, n);
  return stageCost + discount * (stateCostToGo(v, next) + noise);
}

/** E V(x0) for x0 ~ N(mean, covariance): tr(PΣ0) + μᵀPμ + 2pᵀμ + c. mean: n, covariance: n×n. */
export function gaussianStartCostToGo(v: QuadraticCostToGo, mean: ArrayLike<number>, covariance: ArrayLike<number>): number {
  const n = v.linear.length;
  if (mean.length !== n || covariance.length !== n * n) {
    throw new LqModelError(`start distribution: expected a mean of ${n} and a ${n}×${n} covariance`);
  }
  return traceOfProduct(v.quadratic, covariance, n) + stateCostToGo(v, mean);
}

/** Deviation-coordinate feedback of an unbounded affine Gaussian policy (see the mapping above). */
export function deviationFeedback(policy: GaussianPolicy, point: OperatingPoint): LinearFeedbackPolicy {
  const { stateDim: n, actionDim: m } = policy;
  if (point.state.length !== n || point.action.length !== m) {
    throw new LqModelError(`operating point: expected ${n} state and ${m} action setpoints, got ${point.state.length} and ${point.action.length}`);
  }
  const reason = notAffineReason(policy, 'noLimits');
  if (reason !== null) {
    throw new LqModelError(`policy: the linear-quadratic closed form is not applicable (it needs an affine mean and an unbounded actuator): ${reason}`);
  }
  const gx = multiply(policy.gain, point.state, m, n, 1);
  const l = policy.covarianceFactor;
  return {
    feedbackGain: policy.gain.map((g) => -g),
    bias: policy.offset.map((o, i) => o + gx[i] - point.action[i]),
    noiseCovariance: multiply(l, transpose(l, m, m), m, m, m),
  };
}

/** Closed-form Q, V and J of an affine Gaussian policy, all in absolute coordinates and cost terms. */
export interface LqClosedForm {
  readonly plant: LinearQuadraticPlant;
  readonly operatingPoint: OperatingPoint;
  readonly discount: number;
  readonly feedback: LinearFeedbackPolicy;
  /** V in deviation coordinates (x = s − x_sp). */
  readonly costToGo: QuadraticCostToGo;
}

export function lqClosedForm(
  plant: LinearQuadraticPlant, point: OperatingPoint, policy: GaussianPolicy, discount: number,
): LqClosedForm {
  if (policy.stateDim !== plant.stateDim || policy.actionDim !== plant.actionDim) {
    throw new LqModelError(`policy: expected ${plant.stateDim} states and ${plant.actionDim} actions, got ${policy.stateDim} and ${policy.actionDim}`);
  }
  const feedback = deviationFeedback(policy, point);
  return { plant, operatingPoint: point, discount, feedback, costToGo: feedbackCostToGo(plant, feedback, discount) };
}

/** V(s) for an absolute state s (n). */
export function closedFormStateCost(form: LqClosedForm, state: ArrayLike<number>, offset = 0): number {
  const x = Float64Array.from(form.operatingPoint.state, (sp, i) => state[offset + i] - sp);
  return stateCostToGo(form.costToGo, x);
}

/** Q(s, a) for an absolute state s (n) and action a (m). */
export function closedFormActionCost(form: LqClosedForm, state: ArrayLike<number>, action: ArrayLike<number>): number {
  const x = Float64Array.from(form.operatingPoint.state, (sp, i) => state[i] - sp);
  const u = Float64Array.from(form.operatingPoint.action, (sp, i) => action[i] - sp);
  return actionCostToGo(form.plant, form.costToGo, form.discount, x, u);
}

/** J = mean of V over a set of absolute start states. starts: count×n row-major. */
export function closedFormPolicyCost(form: LqClosedForm, starts: ArrayLike<number>, count: number): number {
  const n = form.plant.stateDim;
  if (!(count >= 1) || starts.length < count * n) throw new LqModelError(`start states: expected ${count}×${n} values, got ${starts.length}`);
  let total = 0;
  for (let i = 0; i < count; i++) total += closedFormStateCost(form, starts, i * n);
  return total / count;
}

/** J for an absolute Gaussian start N(mean, covariance). */
export function closedFormGaussianStartCost(form: LqClosedForm, mean: ArrayLike<number>, covariance: ArrayLike<number>): number {
  const x = Float64Array.from(form.operatingPoint.state, (sp, i) => mean[i] - sp);
  return gaussianStartCostToGo(form.costToGo, x, covariance);
}

/** The closed form as an ActionValueFunction in REWARD terms (−Q), to compare with fitted Q directly. */
export function closedFormRewardActionValue(form: LqClosedForm): ActionValueFunction {
  const { stateDim: n, actionDim: m } = form.plant;
  return {
    stateDim: n,
    actionDim: m,
    evaluate(inputs: Float64Array, count: number, out: Float64Array): void {
      for (let i = 0; i < count; i++) {
        const row = inputs.subarray(i * (n + m), (i + 1) * (n + m));
        out[i] = rewardFromCost(closedFormActionCost(form, row, row.subarray(n)));
      }
    },
  };
}

function solveCostLyapunov(f: Float64Array, qc: Float64Array, n: number, discount: number): Float64Array {
  try {
    return solveDiscreteLyapunov(f, qc, n, discount);
  } catch (error) {
    if (!(error instanceof LyapunovStabilityError)) throw error;
    const v = error.scaledSpectralRadiusSquared;
    throw new UnstableClosedLoopError(
      `policy gain: the closed loop A − B·K is not stable enough for discount ${discount} ` +
        `(γ·ρ(A − B·K)² ≈ ${v.toPrecision(4)}, needs to be below 1), so the expected discounted cost is infinite`,
      v,
    );
  }
}

function closedLoopDynamics(plant: LinearQuadraticPlant, k: Float64Array): Float64Array {
  const { stateDim: n, actionDim: m } = plant;
  const bk = multiply(plant.inputGain, k, n, m, n);
  return plant.dynamics.map((a, i) => a - bk[i]);
}

function checkPlant(p: LinearQuadraticPlant): void {
  const { stateDim: n, actionDim: m } = p;
  if (!Number.isInteger(n) || n < 1 || !Number.isInteger(m) || m < 1) {
    throw new LqModelError(`plant: state and action dimensions must be positive integers, got ${n} and ${m}`);
  }
  checkMatrix('plant dynamics A', p.dynamics, n, n, false);
  checkMatrix('plant input gain B', p.inputGain, n, m, false);
  checkMatrix('plant process noise covariance W', p.processNoiseCovariance, n, n, true);
  checkMatrix('plant state weight Q', p.stateWeight, n, n, true);
  checkMatrix('plant action weight R', p.actionWeight, m, m, true);
}

function checkFeedback(p: LinearQuadraticPlant, f: LinearFeedbackPolicy): void {
  checkMatrix('policy feedback gain K', f.feedbackGain, p.actionDim, p.stateDim, false);
  checkMatrix('policy bias d', f.bias, p.actionDim, 1, false);
  checkMatrix('policy noise covariance S', f.noiseCovariance, p.actionDim, p.actionDim, true);
}

function checkMatrix(name: string, a: ArrayLike<number>, rows: number, cols: number, symmetric: boolean): void {
  if (a.length !== rows * cols) throw new LqModelError(`${name}: expected ${rows}×${cols} = ${rows * cols} entries, got ${a.length}`);
  let scale = 0;
  for (let i = 0; i < a.length; i++) {
    if (!Number.isFinite(a[i])) throw new LqModelError(`${name}: entry (${Math.floor(i / cols) + 1}, ${(i % cols) + 1}) is ${a[i]}`);
    scale = Math.max(scale, Math.abs(a[i]));
  }
  if (!symmetric) return;
  for (let i = 0; i < rows; i++) {
    if (a[i * cols + i] < 0) throw new LqModelError(`${name}: diagonal entry ${i + 1} is negative (${a[i * cols + i]}); a weight or covariance must be positive semi-definite`);
    for (let j = 0; j < i; j++) {
      if (Math.abs(a[i * cols + j] - a[j * cols + i]) > 1e-12 * scale) throw new LqModelError(`${name}: must be symmetric, entry (${i + 1}, ${j + 1}) differs from (${j + 1}, ${i + 1})`);
    }
  }
}

function addMatrices(a: ArrayLike<number>, b: ArrayLike<number>): Float64Array {
  return Float64Array.from(a as ArrayLike<number>, (v, i) => v + b[i]);
}

/** ½(X + Xᵀ): removes the rounding-level asymmetry of the iteration so P is exactly symmetric. */
function symmetrised(x: Float64Array, n: number): Float64Array {
  const out = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out[i * n + j] = 0.5 * (x[i * n + j] + x[j * n + i]);
  return out;
}

/** I − γ·M for M: n×n. */
function identityMinus(mat: Float64Array, n: number, discount: number): Float64Array {
  return mat.map((v, i) => (i % (n + 1) === 0 ? 1 : 0) - discount * v);
}

/** tr(X·Y) for n×n X, Y. */
function traceOfProduct(x: ArrayLike<number>, y: ArrayLike<number>, n: number): number {
  let t = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) t += x[i * n + j] * y[j * n + i];
  return t;
}

/** zᵀMz for M: n×n. */
function quadraticForm(mat: ArrayLike<number>, z: ArrayLike<number>, n: number): number {
  let t = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) t += z[i] * mat[i * n + j] * z[j];
  return t;
}

/** Σ_j M[row, j]·z[j] for a row of M with `cols` columns. */
function dotRow(mat: ArrayLike<number>, row: number, cols: number, z: ArrayLike<number>): number {
  let t = 0;
  for (let j = 0; j < cols; j++) t += mat[row * cols + j] * z[j];
  return t;
}
