/**
 * The change of J with the discount that bounded rewards allow (src/core/diagnostics/possibleChange.ts),
 * against exact values of finite Markov chains: J(γ) = μᵀ(I − γP)⁻¹r, the policy-evaluation
 * equation solved exactly (Puterman, "Markov Decision Processes", 1994, Thm 6.1.1; from memory),
 * here by Gaussian elimination in double precision. A constant reward c gives J = c/(1 − γ) (the
 * geometric series; common practice), so both ends of the bound are reached.
 */
import { describe, expect, it } from 'vitest';
import { changeIntervalImpossible, fewestWrong, possibleChange } from '../../../src/core/diagnostics/possibleChange';

/** Exact J(γ) = μᵀ(I − γP)⁻¹r of a chain with n states (P row-stochastic, or substochastic for runs that end). */
function exactValue(p: number[][], r: number[], mu: number[], discount: number): number {
  const n = r.length, a = p.map((row, i) => [...row.map((x, j) => (i === j ? 1 : 0) - discount * x), r[i]]);
  for (let k = 0; k < n; k++) {
    let pivot = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(a[i][k]) > Math.abs(a[pivot][k])) pivot = i;
    [a[k], a[pivot]] = [a[pivot], a[k]];
    for (let i = k + 1; i < n; i++) {
      const f = a[i][k] / a[k][k];
      for (let j = k; j <= n; j++) a[i][j] -= f * a[k][j];
    }
  }
  const v = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    let s = a[i][n];
    for (let j = i + 1; j < n; j++) s -= a[i][j] * v[j];
    v[i] = s / a[i][i];
  }
  return mu.reduce((s, m, i) => s + m * v[i], 0);
}

/** A seeded chain: LCG of Numerical Recipes (Press et al., 3rd ed., §7.1; common practice). */
function chain(seed: number, n: number, leak: number): { p: number[][]; r: number[]; mu: number[] } {
  let x = seed >>> 0;
  const u = () => ((x = (Math.imul(1664525, x) + 1013904223) >>> 0) / 2 ** 32);
  const p = Array.from({ length: n }, () => {
    const row = Array.from({ length: n }, () => u()), sum = row.reduce((a, b) => a + b, 0);
    return row.map((v) => (v / sum) * (1 - leak));
  });
  const r = Array.from({ length: n }, () => u() * 3 - 1), mu = Array.from({ length: n }, () => u()), m = mu.reduce((a, b) => a + b, 0);
  return { p, r, mu: mu.map((v) => v / m) };
}

const DISCOUNTS = [0.9, 0.934, 0.95, 0.966, 0.975, 0.99];

describe('the change of J with the discount that bounded rewards allow', () => {
  it('holds every exact change of random chains, with rewards in their range', () => {
    for (let seed = 1; seed <= 40; seed++) {
      const { p, r, mu } = chain(seed, 6, 0);
      const lo = Math.min(...r), hi = Math.max(...r);
      for (const g1 of DISCOUNTS) for (const g2 of DISCOUNTS) {
        if (g1 === g2) continue;
        const change = exactValue(p, r, mu, g2) - exactValue(p, r, mu, g1), range = possibleChange(lo, hi, g1, g2);
        const tol = 1e-9 * (Math.abs(range.lower) + Math.abs(range.upper));
        expect(change).toBeGreaterThanOrEqual(range.lower - tol);
        expect(change).toBeLessThanOrEqual(range.upper + tol);
      }
    }
  });

  it('holds the changes of chains whose runs can end (rows summing to less than 1: an absorbing state of reward 0)', () => {
    for (let seed = 1; seed <= 40; seed++) {
      const { p, r, mu } = chain(seed, 5, 0.2);
      const positive = r.map((v) => Math.abs(v) + 0.1), lo = Math.min(...positive), hi = Math.max(...positive);
      for (const [g1, g2] of [[0.9, 0.99], [0.95, 0.975]]) {
        const change = exactValue(p, positive, mu, g2) - exactValue(p, positive, mu, g1);
        // With ends, J can grow by less than lo·D (the run may stop first): the bound's lower end falls to 0.
        const ending = possibleChange(lo, hi, g1, g2, true), continuing = possibleChange(lo, hi, g1, g2);
        expect(ending.lower).toBe(0);
        expect(change).toBeGreaterThanOrEqual(0);
        expect(change).toBeLessThanOrEqual(ending.upper);
        expect(change).toBeLessThan(continuing.lower); // this chain leaks a fifth per step: less than a continuing one
      }
    }
  });

  it('is reached at both ends by constant rewards, J = c/(1 − γ)', () => {
    const range = possibleChange(0.5, 2, 0.95, 0.975);
    expect(range.lower).toBeCloseTo(0.5 / 0.025 - 0.5 / 0.05, 12);
    expect(range.upper).toBeCloseTo(2 / 0.025 - 2 / 0.05, 12);
    const back = possibleChange(0.5, 2, 0.975, 0.95); // the discounts the other way round: the change's sign turns
    expect(back.lower).toBeCloseTo(-range.upper, 12);
    expect(back.upper).toBeCloseTo(-range.lower, 12);
  });

  it('calls an interval impossible only when it shares no point with the range widened by its slack', () => {
    const range = { lower: 1, upper: 3 }; // slack 1 % of the width: 0.02
    expect(changeIntervalImpossible(-2, -1, range)).toBe(true);
    expect(changeIntervalImpossible(-2, 0.99, range)).toBe(false);
    expect(changeIntervalImpossible(3.03, 4, range)).toBe(true);
    expect(changeIntervalImpossible(3.01, 4, range)).toBe(false);
    expect(() => possibleChange(0, 1, 1, 0.9)).toThrow(RangeError);
  });

  it('takes a discount of exactly 0, where a tiny project discount’s swept γ^2 underflows', () => {
    // A project with γ = 1e−200 (the schema takes any γ above 0) swept to γ^(1/0.5) = 1e−400 = 0 in doubles; the check stopped the
    // command line with an internal error (exit 70). At γ = 0, J = m₀; from 0 to 0.5, D = 1/(1 − 0.5) − 1/(1 − 0) = 1 (by hand).
    expect((1e-200) ** 2).toBe(0);
    expect(possibleChange(2, 5, 0, 0.5)).toEqual({ lower: 2, upper: 5 });
    expect(possibleChange(2, 5, 0.5, 0)).toEqual({ lower: -5, upper: -2 });
  });
});

describe('which swept points are marked when failing pairs do not say which value is wrong', () => {
  it('marks the fewest points that explain every failing pair, away from the project’s own where it can', () => {
    // Five settings, the project's in the middle (index 2).
    expect(fewestWrong([{ earlier: 2, later: 3 }], 5, 2)).toEqual([false, false, false, true, false]);
    expect(fewestWrong([{ earlier: 1, later: 2 }, { earlier: 2, later: 3 }], 5, 2)).toEqual([false, false, true, false, false]);
    // The heating-loop sample's pattern: the two longest horizons fail with everything before them.
    const pairs = [[0, 3], [0, 4], [1, 3], [1, 4], [2, 3], [2, 4], [3, 4]].map(([earlier, later]) => ({ earlier, later }));
    expect(fewestWrong(pairs, 5, 2)).toEqual([false, false, false, true, true]);
    expect(fewestWrong([], 5, 2)).toEqual([false, false, false, false, false]);
  });
});
