/**
 * J(π) of an affine Gaussian policy on a fitted linear-quadratic model (linearQuadraticModel.ts),
 * in closed form by ../lq.ts. The fitted model is more general than lq.ts's form (x' = Ax + Bv + w,
 * cost xᵀQx + vᵀRv), so it is brought into that form exactly:
 *
 * 1. Affine terms: the augmented state z = [x; 1] turns the intercept c, the linear cost terms and
 *    the constant into matrix entries (z' = A_z z + B_z v with A_z = [[A, c], [0, 1]], B_z = [B; 0];
 *    common practice for affine LQ problems, Anderson & Moore, "Optimal Control: Linear Quadratic
 *    Methods", 1990, §2.4). The constant state has eigenvalue 1, and γ·1² < 1, so the discounted
 *    Lyapunov equation still has its convergent solution.
 * 2. Cross terms: cost = zᵀQ_z z + 2zᵀNv + vᵀRv with R ≻ 0 becomes zᵀ(Q_z − NR⁻¹Nᵀ)z + ṽᵀRṽ in
 *    ṽ = v + R⁻¹Nᵀz, with dynamics A_z − B_zR⁻¹Nᵀ and feedback K + R⁻¹Nᵀ (completing the square;
 *    Bertsekas, "Dynamic Programming and Optimal Control", Vol. I, §4.1, exercise on cross terms).
 * 3. A constant κ added to every stage cost adds κ/(1 − γ) to every value; it is used to make the
 *    constant-state weight non-negative, as lq.ts requires, and taken off again.
 *
 * Everything inside is in cost terms (lq.ts); the result is returned in reward terms.
 */
import { cholesky, choleskySolve, multiply, SingularMatrixError, transpose } from '../linalg/dense';
import { feedbackCostToGo, stateCostToGo, type LinearQuadraticPlant } from '../lq';
import { notAffineReason, type GaussianPolicy } from '../policy';
import type { LinearQuadraticModelFit } from './linearQuadraticModel';

export class ModelValueError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ModelValueError';
  }
}

/**
 * J(π) in reward terms = −mean over start states (count×ds) of the model's cost-to-go, weighted
 * by weights (count; e.g. a resample's episode multiplicities) when given.
 */
export function modelPolicyValue(
  model: LinearQuadraticModelFit, policy: GaussianPolicy, discount: number, startStates: Float64Array, weights?: ArrayLike<number>,
): number {
  const ds = model.stateCentre.length, m = model.actionCentre.length, nz = ds + 1;
  const reason = notAffineReason(policy, 'noLimits');
  if (reason !== null) throw new ModelValueError(`the closed form is not applicable to this candidate: ${reason}`);
  const { plant, rInverseNt, shift } = equivalentPlant(model);
  const gain = affineFeedback(model, policy); // v = G_z z + e
  const feedbackGain = Float64Array.from(gain, (g, i) => -(g + rInverseNt[i])); // lq.ts: ṽ = −K̃z + e
  const l = policy.covarianceFactor;
  const costToGo = feedbackCostToGo(plant, { feedbackGain, bias: new Float64Array(m), noiseCovariance: multiply(l, transpose(l, m, m), m, m, m) }, discount);
  const count = startStates.length / ds, z = new Float64Array(nz);
  z[ds] = 1;
  let total = 0, weightSum = 0;
  for (let s = 0; s < count; s++) {
    const w = weights ? weights[s] : 1;
    if (w === 0) continue;
    for (let c = 0; c < ds; c++) z[c] = startStates[s * ds + c] - model.stateCentre[c];
    total += w * stateCostToGo(costToGo, z);
    weightSum += w;
  }
  if (!(weightSum > 0)) throw new ModelValueError('start states: none has a positive weight');
  return -(total / weightSum - shift / (1 - discount));
}

/** Steps 1–3 above: the lq.ts plant in z with the cross terms removed, R⁻¹Nᵀ (m×nz) and the shift κ. */
function equivalentPlant(model: LinearQuadraticModelFit): { plant: LinearQuadraticPlant; rInverseNt: Float64Array; shift: number } {
  const ds = model.stateCentre.length, m = model.actionCentre.length, nz = ds + 1;
  const { qz, n, r } = augmentedCost(model);
  const rInverseNt = solveColumns(r, m, transpose(n, nz, m), nz);
  const az = augmentedDynamics(model), bz = new Float64Array(nz * m);
  bz.set(model.inputGain);
  const bRn = multiply(bz, rInverseNt, nz, m, nz), nRn = multiply(n, rInverseNt, nz, m, nz);
  const stateWeight = Float64Array.from(qz, (v, i) => v - nRn[i]);
  symmetrise(stateWeight, nz);
  const shift = Math.max(0, -stateWeight[nz * nz - 1]);
  stateWeight[nz * nz - 1] += shift;
  for (let i = 0; i < ds; i++) {
    if (stateWeight[i * nz + i] < 0) throw new ModelValueError(`the fitted cost is not convex in state ${i + 1} (after the action is accounted for), so the closed form does not apply`);
  }
  const plant: LinearQuadraticPlant = {
    stateDim: nz, actionDim: m, dynamics: Float64Array.from(az, (v, i) => v - bRn[i]), inputGain: bz,
    processNoiseCovariance: augmentedNoise(model), stateWeight, actionWeight: r,
  };
  return { plant, rInverseNt, shift };
}

/** Q_z (nz×nz), N (nz×m) and R (m×m) of the cost in z = [x; 1]. */
function augmentedCost(model: LinearQuadraticModelFit): { qz: Float64Array; n: Float64Array; r: Float64Array } {
  const ds = model.stateCentre.length, m = model.actionCentre.length, nz = ds + 1, c = model.cost;
  const qz = new Float64Array(nz * nz), n = new Float64Array(nz * m);
  for (let i = 0; i < ds; i++) {
    for (let j = 0; j < ds; j++) qz[i * nz + j] = c.stateQuadratic[i * ds + j];
    qz[i * nz + ds] = qz[ds * nz + i] = c.stateLinear[i] / 2;
    for (let j = 0; j < m; j++) n[i * m + j] = c.cross[i * m + j];
  }
  qz[nz * nz - 1] = c.constant;
  for (let j = 0; j < m; j++) n[ds * m + j] = c.actionLinear[j] / 2;
  return { qz, n, r: Float64Array.from(c.actionQuadratic) };
}

function augmentedDynamics(model: LinearQuadraticModelFit): Float64Array {
  const ds = model.stateCentre.length, nz = ds + 1, az = new Float64Array(nz * nz);
  for (let i = 0; i < ds; i++) {
    for (let j = 0; j < ds; j++) az[i * nz + j] = model.dynamics[i * ds + j];
    az[i * nz + ds] = model.intercept[i];
  }
  az[nz * nz - 1] = 1;
  return az;
}

function augmentedNoise(model: LinearQuadraticModelFit): Float64Array {
  const ds = model.stateCentre.length, nz = ds + 1, w = new Float64Array(nz * nz);
  for (let i = 0; i < ds; i++) for (let j = 0; j < ds; j++) w[i * nz + j] = model.noiseCovariance[i * ds + j];
  return w;
}

/** a = offset + G s + e in v = a − ā, x = s − s̄: v = G x + (offset + G s̄ − ā) + e, as [G, d] (m×nz). */
function affineFeedback(model: LinearQuadraticModelFit, policy: GaussianPolicy): Float64Array {
  const ds = model.stateCentre.length, m = model.actionCentre.length, nz = ds + 1, out = new Float64Array(m * nz);
  for (let j = 0; j < m; j++) {
    let d = policy.offset[j] - model.actionCentre[j];
    for (let c = 0; c < ds; c++) {
      out[j * nz + c] = policy.gain[j * ds + c];
      d += policy.gain[j * ds + c] * model.stateCentre[c];
    }
    out[j * nz + ds] = d;
  }
  return out;
}

/** R⁻¹X for X: m×cols, by Cholesky of R (which must be positive definite). */
function solveColumns(r: Float64Array, m: number, x: Float64Array, cols: number): Float64Array {
  let factor: Float64Array;
  try {
    factor = cholesky(r, m);
  } catch (error) {
    if (!(error instanceof SingularMatrixError)) throw error;
    throw new ModelValueError('the fitted cost does not grow with the action (its action weight is not positive definite), so the closed form does not apply');
  }
  const out = new Float64Array(m * cols), column = new Float64Array(m);
  for (let c = 0; c < cols; c++) {
    for (let i = 0; i < m; i++) column[i] = x[i * cols + c];
    const y = choleskySolve(factor, m, column);
    for (let i = 0; i < m; i++) out[i * cols + c] = y[i];
  }
  return out;
}

function symmetrise(a: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) a[i * n + j] = a[j * n + i] = 0.5 * (a[i * n + j] + a[j * n + i]);
}
