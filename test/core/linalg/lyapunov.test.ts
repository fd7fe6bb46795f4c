import { describe, expect, it } from 'vitest';
import { EigenvalueDecomposition, Matrix, inverse, solve as mlSolve } from 'ml-matrix';
import { LyapunovInputError, LyapunovStabilityError, solveDiscreteLyapunov } from '../../../src/core/linalg/lyapunov';
import { createRandom } from '../../../src/core/random';

/** Spectral radius by ml-matrix's eigenvalue decomposition (independent of the code under test). */
function spectralRadius(a: Float64Array, n: number): number {
  const rows = Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, (i + 1) * n)));
  const evd = new EigenvalueDecomposition(new Matrix(rows));
  return Math.max(...evd.realEigenvalues.map((re, i) => Math.hypot(re, evd.imaginaryEigenvalues[i])));
}

/** X = Q + s·AᵀXA as the n²×n² system (I − s·Aᵀ⊗Aᵀ) vec X = vec Q, solved by ml-matrix (LU). */
function kroneckerSolve(a: Float64Array, q: Float64Array, n: number, scale: number): Float64Array {
  const at = new Matrix(Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => a[j * n + i])));
  // vec(MXN) = (Nᵀ ⊗ M) vec X for column stacking (Magnus & Neudecker, "Matrix Differential
  // Calculus", ch. 2); for row stacking it is (M ⊗ Nᵀ) vec X, so vec(AᵀXA) = (Aᵀ ⊗ Aᵀ) vec X.
  const system = Matrix.eye(n * n).sub(at.kroneckerProduct(at).mul(scale));
  const x = mlSolve(system, Matrix.columnVector(Array.from(q)));
  return Float64Array.from(x.to1DArray());
}

function randomStable(n: number, seed: number, scale: number, targetRadiusSquared: number): Float64Array {
  const rng = createRandom(seed);
  const a = Float64Array.from({ length: n * n }, () => rng.normal());
  // Make A non-normal on purpose (strong upper triangle) so transient growth is exercised.
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) a[i * n + j] *= 3;
  const factor = Math.sqrt(targetRadiusSquared / scale) / spectralRadius(a, n);
  return a.map((v) => v * factor);
}

function randomSpd(n: number, seed: number): Float64Array {
  const rng = createRandom(seed);
  const g = Float64Array.from({ length: n * n }, () => rng.normal());
  const q = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    let s = i === j ? 0.1 : 0;
    for (let k = 0; k < n; k++) s += g[i * n + k] * g[j * n + k];
    q[i * n + j] = s;
  }
  return q;
}

function maxAbs(a: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i]));
  return m;
}

describe('solveDiscreteLyapunov', () => {
  it('reproduces the printed dlyap example of the Altair Compose documentation', () => {
    // Altair Compose OML reference, "dlyap", Lyapunov example (2021.help.altair.com/2021/compose/personal/
    // en_us/topics/reference/oml_language/ControlSystem/dlyap.htm): A = [3 1 1; 1 3 0; 0 0 3],
    // B = [25 24 15; 24 32 8; 15 8 40] solves A·X·Aᵀ − X + B = 0, printed to 5 decimals.
    // A has eigenvalues 2, 3, 4 (no convergent series), so rewrite it with A⁻¹ (stable):
    //   X − A X Aᵀ = B  ⇔  −X = A⁻¹BA⁻ᵀ + A⁻¹(−X)A⁻ᵀ, i.e. our form with a = A⁻ᵀ, q = A⁻¹BA⁻ᵀ.
    const aInv = inverse(new Matrix([[3, 1, 1], [1, 3, 0], [0, 0, 3]]));
    const q = aInv.mmul(new Matrix([[25, 24, 15], [24, 32, 8], [15, 8, 40]])).mmul(aInv.transpose());
    const x = solveDiscreteLyapunov(aInv.transpose().to1DArray(), q.to1DArray(), 3, 1).map((v) => -v);
    const printed = [-1.6, -0.70303, 0.43636, -0.70303, -3.27273, -1.16364, 0.43636, -1.16364, -5.0];
    printed.forEach((p, i) => expect(x[i]).toBeCloseTo(p, 5));
  });

  it('matches the scalar closed form x = q / (1 − s·a²)', () => {
    // Geometric series Σ (s a²)^j q, common practice.
    for (const [a, q, s] of [[0.5, 2, 0.9], [-0.97, 1, 1], [1.2, 3, 0.6]] as const) {
      const x = solveDiscreteLyapunov([a], [q], 1, s);
      expect(x[0]).toBeCloseTo(q / (1 - s * a * a), 12);
    }
  });

  it('agrees with the Kronecker-form solve by ml-matrix to 1e-10 for n = 1..10', () => {
    for (let n = 1; n <= 10; n++) {
      for (const [scale, radiusSq] of [[0.95, 0.9], [1, 0.99], [0.5, 0.3]] as const) {
        const a = randomStable(n, 100 + n, scale, radiusSq);
        const q = randomSpd(n, 200 + n);
        const ours = solveDiscreteLyapunov(a, q, n, scale);
        const reference = kroneckerSolve(a, q, n, scale);
        const error = maxAbs(ours.map((v, i) => v - reference[i])) / maxAbs(reference);
        expect(error).toBeLessThan(1e-10);
      }
    }
  });

  it('throws LyapunovStabilityError when s·ρ(A)² ≥ 1, with an estimate of s·ρ²', () => {
    const n = 4;
    const a = randomStable(n, 7, 0.9, 1.2);
    let caught: unknown;
    try {
      solveDiscreteLyapunov(a, randomSpd(n, 8), n, 0.9);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(LyapunovStabilityError);
    const estimate = (caught as LyapunovStabilityError).scaledSpectralRadiusSquared;
    expect(estimate).toBeGreaterThan(1.1);
    expect(estimate).toBeLessThan(1.35);
    expect((caught as Error).message).toMatch(/no finite solution/);
  });

  it('throws at the boundary s·ρ² = 1 exactly (A = I/√s)', () => {
    const s = 0.81;
    expect(() => solveDiscreteLyapunov([1 / 0.9, 0, 0, 1 / 0.9], [1, 0, 0, 1], 2, s)).toThrow(LyapunovStabilityError);
  });

  it('rejects malformed input with a message naming the argument', () => {
    expect(() => solveDiscreteLyapunov([1, 0, 0], [1, 0, 0, 1], 2)).toThrow(LyapunovInputError);
    expect(() => solveDiscreteLyapunov([0.5, 0, 0, NaN], [1, 0, 0, 1], 2)).toThrow(/a: entry \(2, 2\)/);
    expect(() => solveDiscreteLyapunov([0.5], [1], 1, 0)).toThrow(/scale/);
  });
});
