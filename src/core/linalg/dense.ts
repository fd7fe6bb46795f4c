/**
 * Small dense linear algebra on row-major Float64Arrays (d up to a few hundred).
 *
 * Least squares and the Lyapunov equation are solved here in double precision. Algorithms are
 * the textbook ones (Golub & Van Loan, "Matrix Computations", 4th ed.: Cholesky §4.2, LU with
 * partial pivoting §3.4); they are short enough to verify against an independent library.
 */
export class SingularMatrixError extends Error {
  /** The 0-based pivot where a factorization stopped, when it is known. */
  readonly pivot?: number;
  constructor(message: string, pivot?: number) {
    super(message);
    if (pivot !== undefined) this.pivot = pivot;
    this.name = 'SingularMatrixError';
  }
}

/** A row-major n×n matrix. */
export interface SquareMatrix {
  readonly n: number;
  readonly data: Float64Array; // n×n row-major
}

export function identity(n: number): Float64Array {
  const m = new Float64Array(n * n);
  for (let i = 0; i < n; i++) m[i * n + i] = 1;
  return m;
}

/** C = A·B with A: r×k, B: k×c (row-major). */
export function multiply(a: ArrayLike<number>, b: ArrayLike<number>, r: number, k: number, c: number): Float64Array {
  const out = new Float64Array(r * c);
  for (let i = 0; i < r; i++) {
    for (let p = 0; p < k; p++) {
      const aip = a[i * k + p];
      if (aip === 0) continue;
      for (let j = 0; j < c; j++) out[i * c + j] += aip * b[p * c + j];
    }
  }
  return out;
}

/** Aᵀ for A: r×c. */
export function transpose(a: ArrayLike<number>, r: number, c: number): Float64Array {
  const out = new Float64Array(r * c);
  for (let i = 0; i < r; i++) for (let j = 0; j < c; j++) out[j * r + i] = a[i * c + j];
  return out;
}

/**
 * Lower Cholesky factor L with A = L·Lᵀ for a symmetric positive-definite n×n A.
 * Throws SingularMatrixError when a pivot is not positive (A not SPD to working precision).
 */
export function cholesky(a: ArrayLike<number>, n: number): Float64Array {
  const l = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    let diag = a[j * n + j];
    for (let k = 0; k < j; k++) diag -= l[j * n + k] * l[j * n + k];
    if (!(diag > 0)) throw new SingularMatrixError(`matrix is not positive definite (pivot ${j} = ${diag})`, j);
    const ljj = Math.sqrt(diag);
    l[j * n + j] = ljj;
    for (let i = j + 1; i < n; i++) {
      let s = a[i * n + j];
      for (let k = 0; k < j; k++) s -= l[i * n + k] * l[j * n + k];
      l[i * n + j] = s / ljj;
    }
  }
  return l;
}

/** Solve (L·Lᵀ) x = b given the lower Cholesky factor L (n×n). */
export function choleskySolve(l: Float64Array, n: number, b: ArrayLike<number>): Float64Array {
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = b[i];
    for (let k = 0; k < i; k++) s -= l[i * n + k] * y[k];
    y[i] = s / l[i * n + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = y[i];
    for (let k = i + 1; k < n; k++) s -= l[k * n + i] * y[k];
    y[i] = s / l[i * n + i];
  }
  return y;
}

/** An LU factorisation P·A = L·U with partial pivoting, stored compactly. */
export interface LuFactors {
  readonly n: number;
  readonly lu: Float64Array;
  readonly pivot: Int32Array;
}

export function luFactor(a: ArrayLike<number>, n: number): LuFactors {
  const lu = Float64Array.from(a as ArrayLike<number>);
  const pivot = new Int32Array(n);
  let scale = 0;
  for (let i = 0; i < n * n; i++) scale = Math.max(scale, Math.abs(lu[i]));
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(lu[i * n + k]) > Math.abs(lu[p * n + k])) p = i;
    pivot[k] = p;
    if (Math.abs(lu[p * n + k]) <= 1e-14 * scale || lu[p * n + k] === 0) {
      throw new SingularMatrixError(`matrix is singular to working precision (column ${k})`);
    }
    if (p !== k) for (let j = 0; j < n; j++) [lu[k * n + j], lu[p * n + j]] = [lu[p * n + j], lu[k * n + j]];
    const pkk = lu[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const f = (lu[i * n + k] /= pkk);
      if (f === 0) continue;
      for (let j = k + 1; j < n; j++) lu[i * n + j] -= f * lu[k * n + j];
    }
  }
  return { n, lu, pivot };
}

export function luSolve({ n, lu, pivot }: LuFactors, b: ArrayLike<number>): Float64Array {
  const x = Float64Array.from(b as ArrayLike<number>);
  for (let k = 0; k < n; k++) {
    const p = pivot[k];
    if (p !== k) [x[k], x[p]] = [x[p], x[k]];
  }
  for (let i = 0; i < n; i++) for (let k = 0; k < i; k++) x[i] -= lu[i * n + k] * x[k];
  for (let i = n - 1; i >= 0; i--) {
    for (let k = i + 1; k < n; k++) x[i] -= lu[i * n + k] * x[k];
    x[i] /= lu[i * n + i];
  }
  return x;
}

/**
 * Solve Aᵀ x = b with the factors of A: P·A = L·U gives Aᵀ = Uᵀ·Lᵀ·P, so solve Uᵀy = b (forward),
 * Lᵀw = y (backward, unit diagonal) and x = Pᵀw by undoing the row swaps in reverse order
 * (Golub & Van Loan, "Matrix Computations", 4th ed., ch. 3). Lets one factorisation serve a system
 * and its adjoint.
 */
export function luSolveTransposed({ n, lu, pivot }: LuFactors, b: ArrayLike<number>): Float64Array {
  const x = Float64Array.from(b as ArrayLike<number>);
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < i; k++) x[i] -= lu[k * n + i] * x[k];
    x[i] /= lu[i * n + i];
  }
  for (let i = n - 1; i >= 0; i--) for (let k = i + 1; k < n; k++) x[i] -= lu[k * n + i] * x[k];
  for (let k = n - 1; k >= 0; k--) {
    const p = pivot[k];
    if (p !== k) [x[k], x[p]] = [x[p], x[k]];
  }
  return x;
}

/** Solve A x = b for a general square A (LU with partial pivoting). */
export function solve(a: ArrayLike<number>, n: number, b: ArrayLike<number>): Float64Array {
  return luSolve(luFactor(a, n), b);
}

export function dot(a: ArrayLike<number>, b: ArrayLike<number>, length = a.length): number {
  let s = 0;
  for (let i = 0; i < length; i++) s += a[i] * b[i];
  return s;
}

/** Euclidean norm. */
export function norm2(a: ArrayLike<number>): number {
  return Math.sqrt(dot(a, a));
}
