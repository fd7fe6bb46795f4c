/**
 * The monomials of total degree ≤ k in n variables, listed once as a recurrence so that each is
 * one product of an earlier monomial and one variable.
 *
 * Order: graded (constant, then degree 1 in variable order, then degree 2, ...). Within a degree
 * a monomial is a non-decreasing list of variable indices v₁ ≤ … ≤ v_t; its parent drops v_t.
 * There are C(n+t−1, t) monomials of degree t and C(n+k, k) in all (stars and bars; common
 * practice).
 */
export interface MonomialBasis {
  readonly variableCount: number; // n
  readonly degree: number; // k
  readonly size: number; // d = C(n+k, k)
  /** parent[j] < j: monomial j = monomial parent[j] × variable[j]; parent[0] = −1 (the constant). */
  readonly parent: Int32Array; // d
  readonly variable: Int32Array; // d; −1 for the constant
  /** Exponent of each variable in each monomial. */
  readonly exponents: Int32Array; // d×n row-major
}

/** C(n+k, k) in floating point (exact for every size a dense solve could handle). */
export function monomialCount(variableCount: number, degree: number): number {
  let c = 1;
  for (let t = 1; t <= degree; t++) c = (c * (variableCount + t)) / t;
  return Math.round(c);
}

export function monomialBasis(variableCount: number, degree: number): MonomialBasis {
  const n = variableCount, d = monomialCount(n, degree);
  const parent = new Int32Array(d), variable = new Int32Array(d), exponents = new Int32Array(d * n);
  parent[0] = -1;
  variable[0] = -1;
  let size = 1, degreeStart = 0, degreeEnd = 1; // [degreeStart, degreeEnd) = monomials of the previous degree
  for (let t = 1; t <= degree; t++) {
    for (let p = degreeStart; p < degreeEnd; p++) {
      // Children append a variable no smaller than the parent's last, so each monomial appears once.
      for (let v = Math.max(variable[p], 0); v < n; v++) {
        parent[size] = p;
        variable[size] = v;
        for (let c = 0; c < n; c++) exponents[size * n + c] = exponents[p * n + c];
        exponents[size * n + v] += 1;
        size++;
      }
    }
    degreeStart = degreeEnd;
    degreeEnd = size;
  }
  return { variableCount: n, degree, size, parent, variable, exponents };
}
