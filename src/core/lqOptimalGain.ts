/**
 * The optimal linear feedback of a discounted linear-quadratic problem: minimise
 *   E Σ_t γ^t (x_tᵀQx_t + u_tᵀRu_t),   x_{t+1} = A x_t + B u_t + w_t,
 * whose optimum is u = −K x with P the stabilising solution of the discounted Riccati equation
 *   P = Q + γAᵀPA − γ²AᵀPB (R + γBᵀPB)⁻¹ BᵀPA,     K = γ (R + γBᵀPB)⁻¹ BᵀPA
 * (Bertsekas, "Dynamic Programming and Optimal Control", Vol. I, §4.1, linear systems and
 * quadratic cost; the discounted problem is the undiscounted one with A, B scaled by √γ, which
 * gives the γ factors above — from memory). Process noise does not change K (certainty
 * equivalence, same section). Used as the exact optimum that a retune map's best point is
 * checked against.
 *
 * Method (a choice): Riccati value iteration P_{k+1} = Riccati(P_k) from P₀ = Q, which converges
 * from any P₀ ⪰ 0 when (√γA, √γB) is stabilisable and (√γA, Q^{1/2}) detectable, run until the
 * relative change is below 1e−9; then Newton's method on the same equation (Hewer 1971, IEEE TAC
 * 16: K from P, then P from the Lyapunov equation of the closed loop, lyapunov.ts), which
 * converges quadratically from there, to a relative change below 1e−14. The Newton step also
 * proves the gain stabilising: its Lyapunov solve fails otherwise.
 *
 * Shapes: A n×n, B n×m, Q n×n, R m×m (row-major); K m×n.
 */
import { multiply, solve, transpose } from './linalg/dense';
import { solveDiscreteLyapunov } from './linalg/lyapunov';
import { LqModelError, type LinearQuadraticPlant } from './lq';

export interface DiscountedLqrSolution {
  readonly gain: Float64Array; // K: m×n, u = −K x
  readonly costToGo: Float64Array; // P: n×n
  readonly iterations: number;
}

const VALUE_ITERATION_TOLERANCE = 1e-9;
const NEWTON_TOLERANCE = 1e-14;
const MAX_VALUE_ITERATIONS = 200_000;
const MAX_NEWTON_STEPS = 50;

export function discountedLqrGain(plant: LinearQuadraticPlant, discount: number): DiscountedLqrSolution {
  if (!(discount > 0 && discount < 1)) throw new LqModelError(`discount: expected a number strictly between 0 and 1, got ${discount}`);
  const { stateDim: n, stateWeight: q } = plant;
  let p: Float64Array = Float64Array.from(q), iterations = 0;
  for (; iterations < MAX_VALUE_ITERATIONS; iterations++) {
    const next = riccatiStep(plant, p, discount);
    const change = relativeChange(next, p);
    p = next;
    if (!Number.isFinite(change)) throw new LqModelError('discounted Riccati iteration overflowed: the plant cannot be stabilised at this discount');
    if (change < VALUE_ITERATION_TOLERANCE) break;
  }
  for (let step = 0; step < MAX_NEWTON_STEPS; step++, iterations++) {
    const k = optimalGain(plant, p, discount);
    const next = closedLoopCost(plant, k, discount);
    const change = relativeChange(next, p);
    p = next;
    if (change < NEWTON_TOLERANCE) break;
  }
  return { gain: optimalGain(plant, p, discount), costToGo: symmetric(p, n), iterations };
}

/** K = γ (R + γBᵀPB)⁻¹ BᵀPA, column by column of BᵀPA. */
export function optimalGain(plant: LinearQuadraticPlant, p: Float64Array, discount: number): Float64Array {
  const { stateDim: n, actionDim: m, dynamics: a, inputGain: b, actionWeight: r } = plant;
  const bt = transpose(b, n, m);
  const btp = multiply(bt, p, m, n, n);
  const s = multiply(btp, b, m, n, m).map((v, i) => r[i] + discount * v); // R + γBᵀPB
  const btpa = multiply(btp, a, m, n, n);
  const k = new Float64Array(m * n), column = new Float64Array(m);
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < m; i++) column[i] = discount * btpa[i * n + j];
    const x = solve(s, m, column);
    for (let i = 0; i < m; i++) k[i * n + j] = x[i];
  }
  return k;
}

/** One Riccati step: Q + γAᵀPA − γAᵀPB·K with K from P (the same expression, rearranged). */
function riccatiStep(plant: LinearQuadraticPlant, p: Float64Array, discount: number): Float64Array {
  const { stateDim: n, actionDim: m, dynamics: a, inputGain: b, stateWeight: q } = plant;
  const k = optimalGain(plant, p, discount);
  const at = transpose(a, n, n);
  const atpa = multiply(at, multiply(p, a, n, n, n), n, n, n);
  const atpbk = multiply(at, multiply(p, multiply(b, k, n, m, n), n, n, n), n, n, n);
  return symmetric(q.map((v, i) => v + discount * (atpa[i] - atpbk[i])), n);
}

/** P of the feedback u = −Kx: P = Q + KᵀRK + γ(A − BK)ᵀP(A − BK). */
function closedLoopCost(plant: LinearQuadraticPlant, k: Float64Array, discount: number): Float64Array {
  const { stateDim: n, actionDim: m, dynamics: a, inputGain: b, stateWeight: q, actionWeight: r } = plant;
  const bk = multiply(b, k, n, m, n);
  const f = a.map((v, i) => v - bk[i]);
  const krk = multiply(transpose(k, m, n), multiply(r, k, m, m, n), n, m, n);
  return symmetric(solveDiscreteLyapunov(f, q.map((v, i) => v + krk[i]), n, discount), n);
}

function relativeChange(next: Float64Array, previous: Float64Array): number {
  let diff = 0, size = 0;
  for (let i = 0; i < next.length; i++) {
    diff = Math.max(diff, Math.abs(next[i] - previous[i]));
    size = Math.max(size, Math.abs(next[i]));
  }
  return diff / Math.max(size, Number.MIN_VALUE);
}

function symmetric(x: Float64Array, n: number): Float64Array {
  const out = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out[i * n + j] = 0.5 * (x[i * n + j] + x[j * n + i]);
  return out;
}
