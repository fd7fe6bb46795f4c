import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { spectralRadiusBound } from '../../../src/core/fqe/spectralRadiusBound';
import { createRandom } from '../../../src/core/random';

/** max |λ| from ml-matrix's general (non-symmetric) eigenvalue decomposition: an independent value. */
function spectralRadius(a: Float64Array, n: number): number {
  const evd = new EigenvalueDecomposition(new Matrix(Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, (i + 1) * n)))));
  return Math.max(...evd.realEigenvalues.map((re, i) => Math.hypot(re, evd.imaginaryEigenvalues[i])));
}

describe('spectral radius bound (Gelfand)', () => {
  it('is never below the spectral radius and converges to it when squaring is not stopped early', () => {
    const rng = createRandom(5);
    for (const n of [2, 5, 12]) {
      for (let trial = 0; trial < 4; trial++) {
        const a = Float64Array.from({ length: n * n }, () => rng.normal() / Math.sqrt(n));
        const rho = spectralRadius(a, n);
        expect(spectralRadiusBound(a, n)).toBeGreaterThanOrEqual(rho * (1 - 1e-12)); // ρ ≤ ‖T^k‖^(1/k) (Horn & Johnson, Cor. 5.6.14)
        expect(Math.abs(spectralRadiusBound(a, n, 0) - rho) / rho).toBeLessThan(1e-6);
      }
    }
  });

  it('handles complex eigenvalues, a Jordan block and a nilpotent matrix', () => {
    // 0.9 × rotation by 1 rad: eigenvalues 0.9·e^(±i), so ρ = 0.9 exactly (common practice);
    // the bound's excess after 30 squarings is about 1e-9·ln‖·‖ constants.
    const c = 0.9 * Math.cos(1), s = 0.9 * Math.sin(1);
    expect(spectralRadiusBound(Float64Array.from([c, -s, s, c]), 2, 0)).toBeCloseTo(0.9, 8);
    // Jordan block [[1.05, 1], [0, 1.05]]: ρ = 1.05 despite ‖T^k‖ growing like k·1.05^k.
    expect(spectralRadiusBound(Float64Array.from([1.05, 1, 0, 1.05]), 2, 0)).toBeCloseTo(1.05, 7);
    expect(spectralRadiusBound(Float64Array.from([0, 1, 0, 0]), 2)).toBe(0);
  });
});
