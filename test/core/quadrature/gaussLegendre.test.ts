import { describe, expect, it } from 'vitest';
import { gaussLegendreOnInterval, gaussLegendreRule } from '../../../src/core/quadrature/gaussLegendre';

function expectRelative(actual: number, expected: number, tolerance: number): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tolerance * Math.abs(expected));
}

function upperHalf(rule: { nodes: Float64Array; weights: Float64Array }) {
  const n = rule.nodes.length, from = n >> 1;
  return { nodes: Array.from(rule.nodes.slice(from)), weights: Array.from(rule.weights.slice(from)) };
}

function factorial(n: number): number {
  let p = 1;
  for (let j = 2; j <= n; j++) p *= j;
  return p;
}

describe('Gauss–Legendre on [−1, 1]', () => {
  it('n = 2, 3: ±1/√3 with weights 1; 0, ±√(3/5) with 8/9, 5/9 (closed forms, A&S Table 25.4)', () => {
    const two = upperHalf(gaussLegendreRule(2)), three = upperHalf(gaussLegendreRule(3));
    expectRelative(two.nodes[0], 1 / Math.sqrt(3), 1e-15);
    expectRelative(two.weights[0], 1, 1e-15);
    expect(three.nodes[0]).toBe(0);
    expectRelative(three.nodes[1], Math.sqrt(0.6), 1e-15);
    expectRelative(three.weights[0], 8 / 9, 1e-15);
    expectRelative(three.weights[1], 5 / 9, 1e-15);
  });

  it('n = 4, 5 match the closed forms and A&S Table 25.4 (printed values from memory)', () => {
    const four = upperHalf(gaussLegendreRule(4)), five = upperHalf(gaussLegendreRule(5));
    // n = 4: t² = 3/7 ∓ (2/7)√(6/5), w = (18 ± √30)/36 (closed form from P_4).
    const r65 = Math.sqrt(6 / 5), s30 = Math.sqrt(30);
    expectRelative(four.nodes[0], Math.sqrt(3 / 7 - (2 / 7) * r65), 1e-14);
    expectRelative(four.nodes[1], Math.sqrt(3 / 7 + (2 / 7) * r65), 1e-14);
    expectRelative(four.weights[0], (18 + s30) / 36, 1e-14);
    expectRelative(four.weights[1], (18 - s30) / 36, 1e-14);
    [0.339981043584856, 0.861136311594053].forEach((t, i) => expectRelative(four.nodes[i], t, 1e-12));
    [0.652145154862546, 0.347854845137454].forEach((w, i) => expectRelative(four.weights[i], w, 1e-12));
    // n = 5: t = 0, (1/3)√(5 ∓ 2√(10/7)); w = 128/225, (322 ± 13√70)/900 (closed form from P_5).
    const r107 = Math.sqrt(10 / 7), s70 = Math.sqrt(70);
    expect(five.nodes[0]).toBe(0);
    expectRelative(five.nodes[1], Math.sqrt(5 - 2 * r107) / 3, 1e-14);
    expectRelative(five.nodes[2], Math.sqrt(5 + 2 * r107) / 3, 1e-14);
    expectRelative(five.weights[0], 128 / 225, 1e-14);
    expectRelative(five.weights[1], (322 + 13 * s70) / 900, 1e-14);
    expectRelative(five.weights[2], (322 - 13 * s70) / 900, 1e-14);
    [0.538469310105683, 0.906179845938664].forEach((t, i) => expectRelative(five.nodes[i + 1], t, 1e-12));
  });

  it('n = 10 matches A&S Table 25.4 (from memory)', () => {
    const r = upperHalf(gaussLegendreRule(10));
    const nodes = [0.148874338981631, 0.433395394129247, 0.679409568299024, 0.865063366688985, 0.973906528517172];
    const weights = [0.295524224714753, 0.269266719309996, 0.219086362515982, 0.149451349150581, 0.066671344308688];
    nodes.forEach((t, i) => expectRelative(r.nodes[i], t, 1e-12));
    weights.forEach((w, i) => expectRelative(r.weights[i], w, 1e-12));
  });

  it('is exact for t^k, k ≤ 2n−1, and misses t^{2n} by 2^{2n+1}(n!)^4/((2n+1)((2n)!)^2) (A&S 25.4.29 remainder)', () => {
    for (const n of [1, 2, 3, 6, 12, 24, 48, 64]) {
      const { nodes, weights } = gaussLegendreRule(n);
      const moment = (k: number) => nodes.reduce((s, t, i) => s + weights[i] * t ** k, 0);
      // ∫_{−1}^{1} t^k dt = 2/(k+1) for even k, 0 for odd k.
      for (let k = 0; k <= 2 * n - 1; k++) {
        if (k % 2 === 0) expectRelative(moment(k), 2 / (k + 1), 1e-13);
        else expect(Math.abs(moment(k))).toBeLessThan(1e-15);
      }
      const miss = (2 ** (2 * n + 1) * factorial(n) ** 4) / ((2 * n + 1) * factorial(2 * n) ** 2);
      if (n <= 12) expectRelative(2 / (2 * n + 1) - moment(2 * n), miss, 1e-8);
    }
  });

  it('maps to [a, b]: ∫_1^3 x^5 dx = (3^6 − 1)/6 with n = 3, and the weights sum to b − a', () => {
    const { nodes, weights } = gaussLegendreOnInterval(3, 1, 3);
    const integral = nodes.reduce((s, x, i) => s + weights[i] * x ** 5, 0);
    expectRelative(integral, (3 ** 6 - 1) / 6, 1e-14);
    expectRelative(weights.reduce((s, w) => s + w, 0), 2, 1e-15);
    expect(nodes[0]).toBeGreaterThan(1);
    expect(nodes[2]).toBeLessThan(3);
  });

  it('rejects bad node counts and intervals', () => {
    for (const bad of [0, 65, 1.5]) expect(() => gaussLegendreRule(bad)).toThrow(RangeError);
    expect(() => gaussLegendreOnInterval(4, 2, 1)).toThrow(RangeError);
    expect(() => gaussLegendreOnInterval(4, 0, Infinity)).toThrow(RangeError);
  });
});
