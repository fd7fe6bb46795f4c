/**
 * The Jacobi-matrix eigenproblem behind Gauss quadrature.
 *
 * Golub & Welsch ("Calculation of Gauss quadrature rules", Math. Comp. 23, 1969): the n nodes of
 * the Gauss rule for a weight whose orthonormal polynomials satisfy
 *   √b_{k+1} p_{k+1}(x) = (x − a_k) p_k(x) − √b_k p_{k−1}(x)
 * are the eigenvalues of the symmetric tridiagonal Jacobi matrix J (diagonal a_0..a_{n−1},
 * off-diagonal √b_1..√b_{n−1}); the weights are μ0·v_{0,i}², v_{0,i} the first component of the
 * i-th normalised eigenvector and μ0 = ∫ w. Only that first row of the eigenvector matrix is
 * needed, so the rotations of the implicit QL sweep are applied to one row vector.
 *
 * The QL iteration with implicit Wilkinson shifts is the textbook one (Bowdler, Martin, Reinsch
 * & Wilkinson, "The QR and QL algorithms for symmetric matrices", Numer. Math. 11, 1968, the
 * EISPACK routine imtql2; Press et al., "Numerical Recipes", 3rd ed., §11.4, tqli).
 */

export class EigenvalueConvergenceError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'EigenvalueConvergenceError';
  }
}

const MAX_SWEEPS_PER_EIGENVALUE = 60;

/**
 * In-place implicit QL on a symmetric tridiagonal matrix of order n; allocates nothing.
 * diagonal: n (overwritten with the eigenvalues, ascending); offDiagonal: n, entries 0..n−2 are
 * T[i][i+1] (destroyed); firstRow: n (overwritten with the first eigenvector components, sign
 * arbitrary, same order as the eigenvalues).
 */
export function tridiagonalEigenInPlace(
  diagonal: Float64Array, offDiagonal: Float64Array, firstRow: Float64Array, n: number,
): void {
  firstRow.fill(0, 0, n);
  firstRow[0] = 1;
  offDiagonal[n - 1] = 0;
  for (let l = 0; l < n; l++) {
    for (let sweep = 0; ; sweep++) {
      const m = firstNegligibleCoupling(diagonal, offDiagonal, l, n);
      if (m === l) break;
      if (sweep === MAX_SWEEPS_PER_EIGENVALUE) {
        throw new EigenvalueConvergenceError(`tridiagonal QL: eigenvalue ${l + 1} of ${n} did not converge in ${sweep} sweeps`);
      }
      qlSweep(diagonal, offDiagonal, firstRow, l, m);
    }
  }
  sortByEigenvalue(diagonal, firstRow, n);
}

/** Smallest m ≥ l whose coupling e[m] is negligible next to its neighbours (Numerical Recipes §11.4). */
function firstNegligibleCoupling(d: Float64Array, e: Float64Array, l: number, n: number): number {
  let m = l;
  for (; m < n - 1; m++) {
    const dd = Math.abs(d[m]) + Math.abs(d[m + 1]);
    if (Math.abs(e[m]) <= Number.EPSILON * dd) break;
  }
  return m;
}

/** One implicit QL step with Wilkinson shift on the block l..m (imtql2; tqli). */
function qlSweep(d: Float64Array, e: Float64Array, z: Float64Array, l: number, m: number): void {
  let g = (d[l + 1] - d[l]) / (2 * e[l]);
  let r = pythag(g, 1);
  g = d[m] - d[l] + e[l] / (g + (g >= 0 ? r : -r));
  let s = 1, c = 1, p = 0;
  for (let i = m - 1; i >= l; i--) {
    const f = s * e[i], b = c * e[i];
    r = pythag(f, g);
    e[i + 1] = r;
    if (r === 0) {
      // Underflow: the block splits here; deflate and let the caller resweep.
      d[i + 1] -= p;
      e[m] = 0;
      return;
    }
    s = f / r;
    c = g / r;
    g = d[i + 1] - p;
    r = (d[i] - g) * s + 2 * c * b;
    p = s * r;
    d[i + 1] = g + p;
    g = c * r - b;
    const zNext = z[i + 1];
    z[i + 1] = s * z[i] + c * zNext;
    z[i] = c * z[i] - s * zNext;
  }
  d[l] -= p;
  e[l] = g;
  e[m] = 0;
}

/**
 * √(a² + b²). Math.hypot guards against overflow but is several times slower than a square root
 * in V8, and the QL sweep calls this once per rotation; the guard is only needed at extremes.
 */
function pythag(a: number, b: number): number {
  const big = Math.max(Math.abs(a), Math.abs(b));
  return big < 1e150 && big > 1e-150 ? Math.sqrt(a * a + b * b) : Math.hypot(a, b);
}

/** Insertion sort of eigenvalues with their first components (n ≤ a few hundred). */
function sortByEigenvalue(d: Float64Array, z: Float64Array, n: number): void {
  for (let i = 1; i < n; i++) {
    const di = d[i], zi = z[i];
    let j = i - 1;
    for (; j >= 0 && d[j] > di; j--) {
      d[j + 1] = d[j];
      z[j + 1] = z[j];
    }
    d[j + 1] = di;
    z[j + 1] = zi;
  }
}

/** Recurrence coefficients of orthonormal polynomials for a weight w: a_k, b_k (b_0 unused) and μ0 = ∫ w. */
export interface ThreeTermRecurrence {
  readonly a: (k: number) => number;
  readonly b: (k: number) => number;
  readonly mu0: number;
  /** True when w is even about 0 (a_k = 0): the rule is then made exactly symmetric. */
  readonly symmetric: boolean;
}

/** An n-point Gauss rule: nodes ascending, positive weights summing to μ0. */
export interface GaussRule {
  readonly nodes: Float64Array; // n
  readonly weights: Float64Array; // n
}

/**
 * The n-point Gauss rule of a weight given by its recurrence. Golub–Welsch gives starting
 * nodes; each is then polished by Newton's method on p_n (evaluated by the recurrence), and the
 * weight is the Christoffel number λ_i = 1 / Σ_{k<n} p_k(x_i)² (Szegő, "Orthogonal Polynomials",
 * §3.4), a sum of positive terms that keeps full relative accuracy even for weights near 1e-300,
 * where μ0·v_{0,i}² from the eigenvector has only absolute accuracy.
 */
export function gaussRuleFromRecurrence(recurrence: ThreeTermRecurrence, n: number): GaussRule {
  const nodes = new Float64Array(n), offDiagonal = new Float64Array(n), firstRow = new Float64Array(n);
  for (let k = 0; k < n; k++) nodes[k] = recurrence.a(k);
  for (let k = 0; k + 1 < n; k++) offDiagonal[k] = Math.sqrt(recurrence.b(k + 1));
  tridiagonalEigenInPlace(nodes, offDiagonal, firstRow, n);
  const weights = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    nodes[i] = newtonPolish(recurrence, n, nodes[i]);
    weights[i] = christoffelNumber(recurrence, n, nodes[i]);
  }
  if (recurrence.symmetric) mirrorSymmetric(nodes, weights, n);
  return { nodes, weights };
}

/** For an even weight, x_{n−1−i} = −x_i and λ_{n−1−i} = λ_i exactly, so odd moments vanish to rounding. */
function mirrorSymmetric(nodes: Float64Array, weights: Float64Array, n: number): void {
  for (let i = 0; i < n >> 1; i++) {
    const j = n - 1 - i;
    const x = 0.5 * (nodes[j] - nodes[i]), w = 0.5 * (weights[i] + weights[j]);
    nodes[i] = -x; nodes[j] = x;
    weights[i] = w; weights[j] = w;
  }
  if (n % 2 === 1) nodes[n >> 1] = 0;
}

/** Newton steps x ← x − p_n(x)/p_n'(x) until the step is at rounding level (quadratic convergence). */
function newtonPolish(rec: ThreeTermRecurrence, n: number, start: number): number {
  let x = start;
  for (let step = 0; step < 6; step++) {
    const { value, slope } = orthonormalValueAndSlope(rec, n, x);
    if (slope === 0) break;
    const dx = value / slope;
    x -= dx;
    if (Math.abs(dx) <= 2 * Number.EPSILON * Math.max(Math.abs(x), Number.MIN_VALUE)) break;
  }
  return x;
}

/** p_n(x) and p_n'(x) from the recurrence and its derivative. */
function orthonormalValueAndSlope(rec: ThreeTermRecurrence, n: number, x: number): { value: number; slope: number } {
  let pPrev = 0, p = 1 / Math.sqrt(rec.mu0), dPrev = 0, d = 0;
  for (let k = 0; k < n; k++) {
    const sqrtNext = Math.sqrt(rec.b(k + 1)), sqrtThis = k > 0 ? Math.sqrt(rec.b(k)) : 0;
    const pNext = ((x - rec.a(k)) * p - sqrtThis * pPrev) / sqrtNext;
    const dNext = (p + (x - rec.a(k)) * d - sqrtThis * dPrev) / sqrtNext;
    pPrev = p; p = pNext;
    dPrev = d; d = dNext;
  }
  return { value: p, slope: d };
}

/** λ(x) = 1 / Σ_{k<n} p_k(x)² (Christoffel function of the weight). */
function christoffelNumber(rec: ThreeTermRecurrence, n: number, x: number): number {
  let pPrev = 0, p = 1 / Math.sqrt(rec.mu0), sum = 0;
  for (let k = 0; k < n; k++) {
    sum += p * p;
    const sqrtThis = k > 0 ? Math.sqrt(rec.b(k)) : 0;
    const pNext = ((x - rec.a(k)) * p - sqrtThis * pPrev) / Math.sqrt(rec.b(k + 1));
    pPrev = p; p = pNext;
  }
  return 1 / sum;
}
