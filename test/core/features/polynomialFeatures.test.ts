import { Matrix, QrDecomposition } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { createFeatureMap, featureLabels } from '../../../src/core/features/featureMap';
import { FeatureSpecError } from '../../../src/core/features/featureSpecError';
import { monomialBasis, monomialCount } from '../../../src/core/features/monomials';
import { polynomialFeatureSpec } from '../../../src/core/features/polynomialFeatures';
import { fitStandardiser } from '../../../src/core/features/standardiser';
import { createRandom } from '../../../src/core/random';

/** Binomial coefficient by Pascal's rule, independent of the product formula under test. */
function pascal(n: number, k: number): number {
  const row = [1];
  for (let i = 1; i <= n; i++) {
    for (let j = i; j >= 1; j--) row[j] = (row[j] ?? 0) + row[j - 1];
  }
  return row[k];
}

describe('polynomial features', () => {
  it('has C(n+k, k) features, each monomial of degree ≤ k exactly once', () => {
    // Number of monomials of total degree ≤ k in n variables is C(n+k, k) (stars and bars; common practice).
    for (let n = 1; n <= 6; n++) {
      for (let k = 0; k <= 4; k++) {
        const basis = monomialBasis(n, k);
        expect(monomialCount(n, k)).toBe(pascal(n + k, k));
        expect(basis.size).toBe(pascal(n + k, k));
        const seen = new Set<string>();
        for (let j = 0; j < basis.size; j++) {
          const e = Array.from(basis.exponents.subarray(j * n, (j + 1) * n));
          expect(e.reduce((a, b) => a + b, 0)).toBeLessThanOrEqual(k);
          seen.add(e.join(','));
        }
        expect(seen.size).toBe(basis.size);
      }
    }
    // Worked values: ds=2, m=1, degree 2 gives C(5,2) = 10 (common practice).
    expect(createFeatureMap(polynomialFeatureSpec({ mean: [0, 0, 0], scale: [1, 1, 1] }, 2)).dim).toBe(10);
  });

  it('evaluates every monomial of the standardised inputs', () => {
    const spec = polynomialFeatureSpec({ mean: [1, -2, 0.5], scale: [2, 0.5, 4] }, 3);
    const map = createFeatureMap(spec);
    const x = [3.1, -1.7, 2.2];
    const z = x.map((v, i) => (v - spec.standardiser.mean[i]) / spec.standardiser.scale[i]);
    const out = new Float64Array(map.dim + 2);
    map.evaluate([9, ...x], 1, out, 2); // offsets are honoured
    const { exponents } = monomialBasis(3, 3);
    for (let j = 0; j < map.dim; j++) {
      const expected = z.reduce((p, zv, v) => p * zv ** exponents[j * 3 + v], 1);
      expect(out[2 + j]).toBeCloseTo(expected, 13);
    }
    expect(featureLabels(spec, ['h', 'q', 'u']).slice(0, 5)).toEqual(['1', 'h', 'q', 'u', 'h^2']);
  });

  it('reproduces an exact cubic with cross terms: least squares (ml-matrix QR) recovers its coefficients', () => {
    // Independent check: ml-matrix's Householder QR least squares on the explicit feature matrix.
    const rng = createRandom(11);
    const n = 3, k = 3, rows = 200;
    const map = createFeatureMap(polynomialFeatureSpec({ mean: [0, 0, 0], scale: [1, 1, 1] }, k));
    const truth = Array.from({ length: map.dim }, () => rng.normal());
    const phi = new Float64Array(rows * map.dim), y: number[] = [], inputs = new Float64Array(rows * n);
    for (let i = 0; i < rows; i++) {
      for (let v = 0; v < n; v++) inputs[i * n + v] = 2 * rng.normal();
      map.evaluate(inputs, i * n, phi, i * map.dim);
      y.push(truth.reduce((s, c, j) => s + c * phi[i * map.dim + j], 0));
    }
    const design = new Matrix(Array.from({ length: rows }, (_, i) => Array.from(phi.subarray(i * map.dim, (i + 1) * map.dim))));
    const coef = new QrDecomposition(design).solve(Matrix.columnVector(y)).getColumn(0);
    coef.forEach((c, j) => expect(c).toBeCloseTo(truth[j], 10));
  });

  it('with a fitted standardiser still represents a raw-unit polynomial exactly', () => {
    // A polynomial in raw x is a polynomial of the same degree in z = (x − mean)/scale (common practice).
    const rng = createRandom(12);
    const rows = 300, n = 2;
    const inputs = new Float64Array(rows * n);
    for (let i = 0; i < rows; i++) {
      inputs[i * n] = 50 + 10 * rng.normal(); // a level in cm
      inputs[i * n + 1] = 0.02 * rng.normal(); // a valve move
    }
    const f = (x0: number, x1: number): number => 3 - 0.2 * x0 + 0.004 * x0 * x0 + 150 * x0 * x1 - 900 * x1 * x1;
    const fit = fitStandardiser(inputs, rows, n);
    const map = createFeatureMap(polynomialFeatureSpec(fit.spec, 2));
    const design: number[][] = [], y: number[] = [];
    const phi = new Float64Array(map.dim);
    for (let i = 0; i < rows; i++) {
      map.evaluate(inputs, i * n, phi, 0);
      design.push(Array.from(phi));
      y.push(f(inputs[i * n], inputs[i * n + 1]));
    }
    const coef = new QrDecomposition(new Matrix(design)).solve(Matrix.columnVector(y)).getColumn(0);
    for (const [x0, x1] of [[40, 0.01], [65, -0.03], [52, 0]]) {
      map.evaluate([x0, x1], 0, phi, 0);
      const predicted = coef.reduce((s, c, j) => s + c * phi[j], 0);
      expect(Math.abs(predicted - f(x0, x1))).toBeLessThan(1e-9 * Math.max(1, Math.abs(f(x0, x1))));
    }
  });

  it('round-trips through JSON and rejects bad specs by field', () => {
    const map = createFeatureMap(polynomialFeatureSpec({ mean: [1, 2], scale: [3, 4] }, 2));
    const again = createFeatureMap(JSON.parse(JSON.stringify(map.toSpec())));
    const a = new Float64Array(map.dim), b = new Float64Array(map.dim);
    map.evaluate([0.3, -7], 0, a, 0);
    again.evaluate([0.3, -7], 0, b, 0);
    expect(Array.from(b)).toEqual(Array.from(a));
    const bad = (spec: unknown, field: RegExp): void => {
      expect(() => createFeatureMap(spec as never)).toThrow(FeatureSpecError);
      expect(() => createFeatureMap(spec as never)).toThrow(field);
    };
    bad({ kind: 'polynomial', degree: 1.5, standardiser: { mean: [0], scale: [1] } }, /degree/);
    bad({ kind: 'polynomial', degree: 2, standardiser: { mean: [0], scale: [0] } }, /scale\[0\]/);
    bad({ kind: 'polynomial', degree: 2, standardiser: { mean: [0, 1], scale: [1] } }, /mean has 2/);
    bad({ kind: 'polynomial', degree: 12, standardiser: { mean: [0, 0, 0, 0, 0], scale: [1, 1, 1, 1, 1] } }, /at most/);
    bad({ kind: 'spline', degree: 2 }, /features.kind/);
  });
});
