import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { gaussRuleFromRecurrence, tridiagonalEigenInPlace } from '../../../src/core/quadrature/tridiagonalEigen';

function eigenOf(diagonal: number[], off: number[]) {
  const n = diagonal.length;
  const d = Float64Array.from(diagonal), e = new Float64Array(n), z = new Float64Array(n);
  e.set(off);
  tridiagonalEigenInPlace(d, e, z, n);
  return { values: d, first: z };
}

describe('tridiagonal eigenproblem (implicit QL)', () => {
  it('solves the 2×2 case in closed form', () => {
    // [[a, c], [c, b]]: λ = (a+b)/2 ∓ √(((a−b)/2)² + c²) (common practice).
    const a = 1, b = 4, c = 2;
    const { values, first } = eigenOf([a, b], [c]);
    const half = Math.hypot((a - b) / 2, c);
    expect(values[0]).toBeCloseTo((a + b) / 2 - half, 14);
    expect(values[1]).toBeCloseTo((a + b) / 2 + half, 14);
    // First components of the unit eigenvectors: v = (c, λ − a)/‖·‖.
    for (let i = 0; i < 2; i++) {
      const v0 = c / Math.hypot(c, values[i] - a);
      expect(Math.abs(first[i])).toBeCloseTo(v0, 14);
    }
  });

  it('agrees with ml-matrix EigenvalueDecomposition on random symmetric tridiagonal matrices', () => {
    // Independent general-purpose library (ml-matrix, Householder tridiagonalisation + QL).
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 24 }).chain((n) => fc.tuple(
          fc.array(fc.double({ min: -5, max: 5, noNaN: true }), { minLength: n, maxLength: n }),
          fc.array(fc.double({ min: 0.01, max: 5, noNaN: true }), { minLength: n - 1, maxLength: n - 1 }),
        )),
        ([diagonal, off]) => {
          const n = diagonal.length;
          const full = Matrix.zeros(n, n);
          for (let i = 0; i < n; i++) full.set(i, i, diagonal[i]);
          for (let i = 0; i + 1 < n; i++) { full.set(i, i + 1, off[i]); full.set(i + 1, i, off[i]); }
          const reference = new EigenvalueDecomposition(full, { assumeSymmetric: true });
          const order = reference.realEigenvalues.map((v, i) => [v, i] as const).sort((x, y) => x[0] - y[0]);
          const { values, first } = eigenOf(diagonal, off);
          const scale = Math.max(1, ...diagonal.map(Math.abs), ...off);
          order.forEach(([value, column], i) => {
            expect(Math.abs(values[i] - value)).toBeLessThan(1e-12 * scale);
            // Eigenvectors of well-separated eigenvalues are determined up to sign.
            const gap = Math.min(i > 0 ? value - order[i - 1][0] : Infinity, i + 1 < n ? order[i + 1][0] - value : Infinity);
            if (gap > 1e-3 * scale) {
              expect(Math.abs(Math.abs(first[i]) - Math.abs(reference.eigenvectorMatrix.get(0, column)))).toBeLessThan(1e-9);
            }
          });
          let sum = 0;
          for (let i = 0; i < n; i++) sum += first[i] * first[i];
          expect(sum).toBeCloseTo(1, 12); // the first row of an orthogonal matrix has unit norm
        },
      ),
      { seed: 20240611, numRuns: 200 },
    );
  });

  it('handles a diagonal matrix (all couplings zero) and sorts it', () => {
    const { values, first } = eigenOf([3, -1, 2], [0, 0]);
    expect(Array.from(values)).toEqual([-1, 2, 3]);
    expect(Array.from(first).map(Math.abs)).toEqual([0, 0, 1]);
  });
});

describe('Gauss rule from a three-term recurrence (Golub & Welsch 1969)', () => {
  it('reproduces the 2-point Gauss–Legendre rule ±1/√3, weights 1 (Abramowitz & Stegun, Table 25.4)', () => {
    const rule = gaussRuleFromRecurrence({ a: () => 0, b: (k) => (k * k) / (4 * k * k - 1), mu0: 2, symmetric: true }, 2);
    expect(rule.nodes[1]).toBeCloseTo(1 / Math.sqrt(3), 15);
    expect(rule.nodes[0]).toBe(-rule.nodes[1]);
    expect(rule.weights[0]).toBeCloseTo(1, 15);
  });

  it('builds the Gauss–Laguerre rule of a non-symmetric weight: n = 2 nodes 2 ∓ √2 (A&S, Table 25.9)', () => {
    // Laguerre weight e^{−x} on [0, ∞): a_k = 2k+1, b_k = k², μ0 = 1 (Szegő §5.1). For n = 2 the
    // nodes are the zeros of L_2 = x² − 4x + 2, weights (2 ± √2)/4 (closed form, A&S 25.4.45).
    const rule = gaussRuleFromRecurrence({ a: (k) => 2 * k + 1, b: (k) => k * k, mu0: 1, symmetric: false }, 2);
    expect(rule.nodes[0]).toBeCloseTo(2 - Math.SQRT2, 14);
    expect(rule.nodes[1]).toBeCloseTo(2 + Math.SQRT2, 14);
    expect(rule.weights[0]).toBeCloseTo((2 + Math.SQRT2) / 4, 14);
    expect(rule.weights[1]).toBeCloseTo((2 - Math.SQRT2) / 4, 14);
  });
});
