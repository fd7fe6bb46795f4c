import { describe, expect, it } from 'vitest';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { gaussHermiteRule, standardNormalRule } from '../../../src/core/quadrature/gaussHermite';

const SQRT_PI = Math.sqrt(Math.PI);

function expectRelative(actual: number, expected: number, tolerance: number): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tolerance * Math.abs(expected));
}

/** (2k−1)!! with (−1)!! = 1. */
function doubleFactorial(odd: number): number {
  let p = 1;
  for (let j = odd; j > 1; j -= 2) p *= j;
  return p;
}

function factorial(n: number): number {
  let p = 1;
  for (let j = 2; j <= n; j++) p *= j;
  return p;
}

/** Non-negative half of a symmetric rule: nodes ≥ 0 ascending with their weights. */
function upperHalf(rule: { nodes: Float64Array; weights: Float64Array }) {
  const n = rule.nodes.length, from = n >> 1;
  return { nodes: Array.from(rule.nodes.slice(from)), weights: Array.from(rule.weights.slice(from)) };
}

describe('Gauss–Hermite, physicists\' weight e^{−x²}', () => {
  it('n = 2: x = ±1/√2, w = √π/2 (closed form, zeros of H_2 = 4x² − 2)', () => {
    const r = upperHalf(gaussHermiteRule(2));
    expectRelative(r.nodes[0], Math.SQRT1_2, 1e-15);
    expectRelative(r.weights[0], SQRT_PI / 2, 1e-15);
  });

  it('n = 3: x = 0, ±√(3/2), w = 2√π/3, √π/6 (closed form, zeros of H_3)', () => {
    const r = upperHalf(gaussHermiteRule(3));
    expect(r.nodes[0]).toBe(0);
    expectRelative(r.nodes[1], Math.sqrt(1.5), 1e-15);
    expectRelative(r.weights[0], (2 * SQRT_PI) / 3, 1e-15);
    expectRelative(r.weights[1], SQRT_PI / 6, 1e-15);
  });

  it('n = 4: x² = (3 ∓ √6)/2, w = √π/(4(3 ∓ √6)) (closed form, zeros of H_4 = 16x⁴ − 48x² + 12)', () => {
    const r = upperHalf(gaussHermiteRule(4));
    const s6 = Math.sqrt(6);
    expectRelative(r.nodes[0], Math.sqrt((3 - s6) / 2), 1e-14);
    expectRelative(r.nodes[1], Math.sqrt((3 + s6) / 2), 1e-14);
    expectRelative(r.weights[0], SQRT_PI / (4 * (3 - s6)), 1e-14);
    expectRelative(r.weights[1], SQRT_PI / (4 * (3 + s6)), 1e-14);
    // Abramowitz & Stegun, Table 25.10, n = 4 (from memory): 0.524647623275290, 1.650680123885785;
    // weights 0.804914090005513, 0.081312835447245.
    [0.52464762327529, 1.650680123885785].forEach((x, i) => expectRelative(r.nodes[i], x, 1e-12));
    [0.804914090005513, 0.081312835447245].forEach((w, i) => expectRelative(r.weights[i], w, 1e-12));
  });

  it('n = 5 matches A&S Table 25.10 and the weight formula 25.4.46 with H_4(0) = 12', () => {
    const r = upperHalf(gaussHermiteRule(5));
    // A&S 25.4.46: w_i = 2^{n−1} n! √π / (n² H_{n−1}(x_i)²); at x = 0, H_4(0) = 12 gives 8√π/15.
    expectRelative(r.weights[0], (8 * SQRT_PI) / 15, 1e-14);
    // Zeros of H_5 = 32x⁵ − 160x³ + 120x: x² = (5 ∓ √10)/2 (closed form).
    expectRelative(r.nodes[1], Math.sqrt((5 - Math.sqrt(10)) / 2), 1e-14);
    expectRelative(r.nodes[2], Math.sqrt((5 + Math.sqrt(10)) / 2), 1e-14);
    // A&S Table 25.10, n = 5 (from memory).
    [0, 0.958572464613819, 2.020182870456086].forEach((x, i) => (x === 0 ? expect(r.nodes[i]).toBe(0) : expectRelative(r.nodes[i], x, 1e-12)));
    [0.945308720482942, 0.393619323152241, 0.019953242059046].forEach((w, i) => expectRelative(r.weights[i], w, 1e-12));
  });

  it('n = 10 matches A&S Table 25.10 (from memory)', () => {
    const r = upperHalf(gaussHermiteRule(10));
    const nodes = [0.342901327223705, 1.036610829789514, 1.756683649299882, 2.53273167423279, 3.436159118837738];
    const weights = [0.610862633735326, 0.240138611082315, 0.033874394455481, 0.001343645746781, 7.64043285523e-6];
    nodes.forEach((x, i) => expectRelative(r.nodes[i], x, 1e-12));
    // The printed weights carry 15 decimals, so the smallest ones have fewer significant digits.
    weights.forEach((w, i) => expect(Math.abs(r.weights[i] - w)).toBeLessThan(1e-15 + 1e-12 * w));
  });

  it('n = 20 matches A&S Table 25.10 (from memory), down to the weight 2.2e−13', () => {
    const r = upperHalf(gaussHermiteRule(20));
    const nodes = [
      0.245340708300901, 0.737473728545394, 1.234076215395323, 1.738537712116586, 2.254974002089276,
      2.788806058428131, 3.347854567383216, 3.944764040115625, 4.603682449550744, 5.387480890011233,
    ];
    const weights = [
      4.622436696006e-1, 2.866755053628e-1, 1.090172060200e-1, 2.481052088746e-2, 3.243773342238e-3,
      2.283386360163e-4, 7.802556478532e-6, 1.086069370769e-7, 4.399340992273e-10, 2.229393645534e-13,
    ];
    nodes.forEach((x, i) => expectRelative(r.nodes[i], x, 1e-12));
    weights.forEach((w, i) => expectRelative(r.weights[i], w, 2e-12)); // 13 significant digits printed
  });

  it('is exact for x^{2k}, k < n, and misses x^{2n} by exactly n!√π/2^n (A&S 25.4.46 remainder)', () => {
    for (const n of [1, 2, 5, 10, 20, 40, 64]) {
      const { nodes, weights } = gaussHermiteRule(n);
      const moment = (k: number) => nodes.reduce((s, x, i) => s + weights[i] * x ** k, 0);
      // ∫ x^{2k} e^{−x²} dx = Γ(k + ½) = (2k−1)!! √π / 2^k (A&S 6.1.12; common practice).
      const exact = (k: number) => (doubleFactorial(2 * k - 1) * SQRT_PI) / 2 ** k;
      for (let k = 0; k < n; k++) expectRelative(moment(2 * k), exact(k), 1e-13);
      // Odd moments vanish; compare against the size of the terms being summed.
      const scale = nodes.reduce((s, x, i) => s + weights[i] * Math.abs(x) ** (2 * n - 1), 0);
      expect(Math.abs(moment(2 * n - 1))).toBeLessThanOrEqual(1e-14 * scale);
      // The miss is a small difference of large numbers for large n; check it where it is resolvable.
      const miss = (factorial(n) * SQRT_PI) / 2 ** n;
      if (n <= 20) expect(Math.abs(exact(n) - moment(2 * n) - miss)).toBeLessThan(1e-13 * exact(n));
    }
  });

  it('n = 64: weights keep full relative accuracy down to 5.5e−49 (A&S 25.4.46 weight formula)', () => {
    const n = 64;
    const { nodes, weights } = gaussHermiteRule(n);
    // H_{n−1}(x) by its recurrence H_{k+1} = 2x H_k − 2k H_{k−1} (A&S 22.7.13); no overflow for n = 64.
    const hermite = (k: number, x: number) => {
      let prev = 1, h = 2 * x;
      if (k === 0) return prev;
      for (let j = 1; j < k; j++) [prev, h] = [h, 2 * x * h - 2 * j * prev];
      return h;
    };
    const logConstant = (n - 1) * Math.LN2 + Math.log(factorial(n)) + 0.5 * Math.log(Math.PI) - 2 * Math.log(n);
    for (let i = 0; i < n; i++) {
      const formula = Math.exp(logConstant - 2 * Math.log(Math.abs(hermite(n - 1, nodes[i]))));
      expectRelative(weights[i], formula, 1e-12);
    }
    expect(weights[n - 1]).toBeLessThan(1e-48);
  });

  it('nodes agree with the eigenvalues of the Jacobi matrix from ml-matrix (independent library)', () => {
    for (const n of [7, 33, 64]) {
      const jacobi = Matrix.zeros(n, n);
      for (let k = 1; k < n; k++) {
        jacobi.set(k - 1, k, Math.sqrt(k / 2));
        jacobi.set(k, k - 1, Math.sqrt(k / 2));
      }
      const eigen = new EigenvalueDecomposition(jacobi, { assumeSymmetric: true }).realEigenvalues.sort((a, b) => a - b);
      const { nodes } = gaussHermiteRule(n);
      eigen.forEach((x, i) => expect(Math.abs(nodes[i] - x)).toBeLessThan(1e-12));
    }
  });

  it('rejects node counts outside 1..64', () => {
    for (const bad of [0, 65, 2.5, NaN]) expect(() => gaussHermiteRule(bad)).toThrow(RangeError);
  });

  it('hands out copies, so the memoised rule cannot be altered', () => {
    gaussHermiteRule(6).nodes[0] = 99;
    expect(gaussHermiteRule(6).nodes[0]).toBeLessThan(0);
  });
});

describe('standard-normal Gauss–Hermite rule', () => {
  it('is the physicists\' rule with z = √2 x and weights w/√π', () => {
    for (const n of [1, 4, 9, 20, 64]) {
      const phys = gaussHermiteRule(n), std = standardNormalRule(n);
      for (let i = 0; i < n; i++) {
        expect(Math.abs(std.nodes[i] - Math.SQRT2 * phys.nodes[i])).toBeLessThan(1e-14 * Math.max(1, Math.abs(std.nodes[i])));
        expectRelative(std.weights[i], phys.weights[i] / SQRT_PI, 1e-13);
      }
    }
  });

  it('gives E[Z^{2k}] = (2k−1)!! for k < n and E[Z^{2n}] short by exactly n! (common practice)', () => {
    for (const n of [1, 2, 3, 8, 16, 32, 64]) {
      const { nodes, weights } = standardNormalRule(n);
      const moment = (k: number) => nodes.reduce((s, z, i) => s + weights[i] * z ** k, 0);
      expectRelative(moment(0), 1, 1e-15);
      for (let k = 1; k < n; k++) expectRelative(moment(2 * k), doubleFactorial(2 * k - 1), 1e-13);
      expect(Math.abs(moment(1))).toBeLessThan(1e-15);
      const exact = doubleFactorial(2 * n - 1);
      if (n <= 20) expect(Math.abs(exact - moment(2 * n) - factorial(n))).toBeLessThan(1e-13 * exact);
    }
  });
});
