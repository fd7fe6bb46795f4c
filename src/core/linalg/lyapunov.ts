/**
 * The discrete Lyapunov (Stein) equation  X = Q + s·AᵀXA  for a square A (n×n) and a scale s > 0.
 *
 * Its solution, when s·ρ(A)² < 1, is the convergent series X = Σ_{j≥0} (√s·Aᵀ)^j Q (√s·A)^j
 * (Kailath, "Linear Systems", 1980; Anderson & Moore, "Optimal Control: Linear Quadratic Methods", 1990).
 * Two uses in this project:
 *   - discounted cost-to-go of a linear policy:   P = Qc + γ·FᵀPF          (a = F,  s = γ)
 *   - stationary covariance of a stable loop:     Σ = FΣFᵀ + C            (a = Fᵀ, s = 1)
 *
 * Method: the squared Smith (doubling) iteration (Smith, "Matrix equation XA + BX = C",
 * SIAM J. Appl. Math. 16, 1968):
 *     X₀ = Q, M₀ = √s·A;   X_{k+1} = X_k + M_kᵀ X_k M_k,   M_{k+1} = M_k².
 * After k steps X_k holds the first 2^k terms of the series, and the remainder is exactly
 * M_kᵀ X_∞ M_k, so ‖M_k‖² bounds the relative error. Chosen over the vectorised Kronecker solve
 * (an n²×n² linear system) because (1) it costs O(n³ log(terms)) rather than O(n⁶), (2) it
 * detects the case with no finite series for free — M_k → 0 exactly when s·ρ(A)² < 1, whereas the
 * Kronecker system stays solvable for most unstable A and would return a meaningless,
 * indefinite "solution", and (3) for symmetric positive semi-definite Q every partial sum is a
 * sum of PSD terms, so the result is PSD by construction. Tests cross-check it against the
 * Kronecker form solved by an independent library.
 */
import { multiply, transpose } from './dense';
import { ASCII_MINUS, exponentText } from '../exponentText';

/** X = Q + s·AᵀXA has no convergent-series solution: s·ρ(A)² ≥ 1 (to working precision). */
export class LyapunovStabilityError extends Error {
  /** Estimate of s·ρ(A)² by Gelfand's formula ρ = lim ‖A^k‖^{1/k}; Infinity when unknown. */
  readonly scaledSpectralRadiusSquared: number;
  constructor(message: string, scaledSpectralRadiusSquared: number) {
    super(message);
    this.name = 'LyapunovStabilityError';
    this.scaledSpectralRadiusSquared = scaledSpectralRadiusSquared;
  }
}

/** Bad arguments (shape, non-finite entries, scale ≤ 0). */
export class LyapunovInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'LyapunovInputError';
  }
}

// 2^64 series terms: enough for s·ρ² up to 1 − 1e-17 in exact arithmetic; past that the
// problem is numerically indistinguishable from the unstable one.
const MAX_DOUBLINGS = 64;
// Remainder ‖M_kᵀ X M_k‖ ≤ ‖M_k‖_F² ‖X‖: stop once that is far below double-precision epsilon.
const REMAINDER_TOLERANCE = 1e-20;
// Acceptance test on the final residual, relative to ‖Q‖ + s‖A‖²‖X‖ (backward-error style).
const RESIDUAL_TOLERANCE = 1e-10;

/**
 * Solve X = Q + scale·AᵀXA.
 * a: n×n row-major; q: n×n row-major; scale > 0 (a discount γ, or 1 for a covariance).
 * Returns X: n×n row-major. Throws LyapunovStabilityError when scale·ρ(A)² ≥ 1.
 */
export function solveDiscreteLyapunov(
  a: ArrayLike<number>, q: ArrayLike<number>, n: number, scale = 1,
): Float64Array {
  checkInputs(a, q, n, scale);
  let m: Float64Array = Float64Array.from(a as ArrayLike<number>, (v) => v * Math.sqrt(scale));
  const x = Float64Array.from(q as ArrayLike<number>);
  let lastFiniteNormSq = frobeniusSquared(m), lastPower = 1;
  for (let step = 0; step < MAX_DOUBLINGS; step++) {
    const normSq = frobeniusSquared(m);
    if (!Number.isFinite(normSq) || !x.every(Number.isFinite)) break;
    lastFiniteNormSq = normSq;
    lastPower = 2 ** step;
    if (normSq < REMAINDER_TOLERANCE) {
      checkResidual(a, q, n, scale, x);
      return x;
    }
    const xm = multiply(x, m, n, n, n);
    const mtxm = multiply(transpose(m, n, n), xm, n, n, n);
    for (let i = 0; i < n * n; i++) x[i] += mtxm[i];
    m = multiply(m, m, n, n, n);
  }
  // Gelfand: ‖M₀^p‖^{1/p} → ρ(M₀) = √s·ρ(A), so ρ(M₀)² ≈ (‖M₀^p‖_F²)^{1/p}.
  const estimate = lastFiniteNormSq > 0 ? lastFiniteNormSq ** (1 / lastPower) : Infinity;
  throw new LyapunovStabilityError(
    `the discrete Lyapunov equation X = Q + s·AᵀXA has no finite solution: s·ρ(A)² ≈ ${estimate.toPrecision(4)}` +
      ` is not below 1 (scale s = ${scale}); the series Σ (√s·Aᵀ)^j Q (√s·A)^j diverges`,
    estimate,
  );
}

function checkInputs(a: ArrayLike<number>, q: ArrayLike<number>, n: number, scale: number): void {
  if (!Number.isInteger(n) || n < 1) throw new LyapunovInputError(`n: expected a positive integer dimension, got ${n}`);
  if (a.length !== n * n) throw new LyapunovInputError(`a: expected ${n}×${n} = ${n * n} entries, got ${a.length}`);
  if (q.length !== n * n) throw new LyapunovInputError(`q: expected ${n}×${n} = ${n * n} entries, got ${q.length}`);
  if (!(scale > 0) || !Number.isFinite(scale)) throw new LyapunovInputError(`scale: expected a positive finite number, got ${scale}`);
  for (let i = 0; i < n * n; i++) {
    if (!Number.isFinite(a[i])) throw new LyapunovInputError(`a: entry (${Math.floor(i / n) + 1}, ${(i % n) + 1}) is ${a[i]}`);
    if (!Number.isFinite(q[i])) throw new LyapunovInputError(`q: entry (${Math.floor(i / n) + 1}, ${(i % n) + 1}) is ${q[i]}`);
  }
}

/** Guard against a silently wrong answer (e.g. severe cancellation near s·ρ² = 1). */
function checkResidual(a: ArrayLike<number>, q: ArrayLike<number>, n: number, scale: number, x: Float64Array): void {
  const atxa = multiply(transpose(a, n, n), multiply(x, a, n, n, n), n, n, n);
  let residualSq = 0;
  for (let i = 0; i < n * n; i++) residualSq += (x[i] - q[i] - scale * atxa[i]) ** 2;
  const size = Math.sqrt(frobeniusSquared(q)) + scale * frobeniusSquared(a) * Math.sqrt(frobeniusSquared(x));
  if (Math.sqrt(residualSq) > RESIDUAL_TOLERANCE * size) {
    throw new LyapunovStabilityError(
      `the discrete Lyapunov equation is too ill-conditioned to solve in double precision ` +
        `(relative residual ${exponentText(Math.sqrt(residualSq) / size, 2, ASCII_MINUS, true)}); s·ρ(A)² is too close to 1`,
      1,
    );
  }
}

function frobeniusSquared(m: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < m.length; i++) s += m[i] * m[i];
  return s;
}
