/**
 * Polynomials in the standardised state z ∈ R^ds of total degree ≤ K, as coefficient vectors over
 * the monomial basis of features/monomials.ts (same order: constant, then z_1 … z_ds, then
 * degree 2, …), with the truncated product: every product formed here has degree ≤ K by
 * construction, so nothing is lost. Used to write the candidate-averaged features of an affine
 * Gaussian policy as ψ(s) = C·χ(s), χ the vector of these monomials (nextFeatureCoefficients.ts).
 */
import { monomialBasis, type MonomialBasis } from '../features/monomials';

/** Product tables above this many entries are not built (the route that needs them is skipped). */
export const MAX_PRODUCT_TABLE = 1 << 20;

export interface StatePolynomialRing {
  readonly basis: MonomialBasis; // over ds variables, degree ≤ K
  readonly size: number; // dχ
  /** index of monomial i × monomial j, or −1 when its degree exceeds K: dχ×dχ. */
  readonly product: Int32Array;
  /** Index of a monomial given its exponents (length ds), or −1. */
  indexOf(exponents: ArrayLike<number>): number;
}

export function statePolynomialRing(stateDim: number, degree: number): StatePolynomialRing | null {
  const basis = monomialBasis(stateDim, degree), size = basis.size, ds = stateDim;
  if (size * size > MAX_PRODUCT_TABLE) return null;
  const index = new Map<string, number>();
  for (let i = 0; i < size; i++) index.set(Array.from(basis.exponents.subarray(i * ds, (i + 1) * ds)).join(','), i);
  const degreeOf = (i: number): number => { let t = 0; for (let v = 0; v < ds; v++) t += basis.exponents[i * ds + v]; return t; };
  const product = new Int32Array(size * size).fill(-1), sum = new Int32Array(ds);
  for (let i = 0; i < size; i++) {
    for (let j = 0; j < size; j++) {
      if (degreeOf(i) + degreeOf(j) > degree) continue;
      for (let v = 0; v < ds; v++) sum[v] = basis.exponents[i * ds + v] + basis.exponents[j * ds + v];
      product[i * size + j] = index.get(sum.join(','))!;
    }
  }
  return {
    basis, size, product,
    indexOf: (exponents) => index.get(Array.from(exponents).join(',')) ?? -1,
  };
}

/** out = p·q (truncated at degree K; exact for the degrees used). out must not alias p or q. */
export function multiplyPolynomials(ring: StatePolynomialRing, p: Float64Array, q: Float64Array, out: Float64Array): void {
  const n = ring.size, table = ring.product;
  out.fill(0);
  for (let i = 0; i < n; i++) {
    const pi = p[i];
    if (pi === 0) continue;
    for (let j = 0; j < n; j++) {
      const k = table[i * n + j];
      if (k >= 0 && q[j] !== 0) out[k] += pi * q[j];
    }
  }
}

/** χ(z): every monomial of the ring at the point z (ds), written to out (dχ). */
export function evaluateMonomials(ring: StatePolynomialRing, z: ArrayLike<number>, out: Float64Array, outOffset = 0): void {
  const { parent, variable } = ring.basis;
  out[outOffset] = 1;
  for (let j = 1; j < ring.size; j++) out[outOffset + j] = out[outOffset + parent[j]] * z[variable[j]];
}
