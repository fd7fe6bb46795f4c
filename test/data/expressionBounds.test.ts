/**
 * Bounds a reward/cost formula keeps whatever its columns hold (src/data/expressionBounds.ts).
 * References: the closed-form ranges of each formula below (a square is never negative, e^x > 0,
 * 1/(1 + x²) ∈ (0, 1], and so on: elementary algebra), and the fundamental theorem of interval
 * arithmetic (Moore, Kearfott & Cloud, "Introduction to Interval Analysis", SIAM 2009, Thm. 5.1, from
 * memory): the interval evaluation of a formula encloses its value at every point of the box, which
 * the last test checks against the row-by-row evaluator on random and extreme column values.
 */
import { describe, expect, it } from 'vitest';
import { CERTAIN_BOUND_SLACK, expressionBounds } from '../../src/data/expressionBounds';
import { evaluateExpression } from '../../src/data/expressionEvaluation';
import { expressionColumns, parseExpression } from '../../src/data/expressionSyntax';
import { certainRewardBounds } from '../../src/data/rewardColumn';
import { createRandom } from '../../src/core/random';

const b = (source: string) => expressionBounds(parseExpression(source));
const near = (v: number) => expect.closeTo(v, 10);

describe('bounds a formula keeps whatever its columns hold', () => {
  it('finds the closed-form range of common cost formulas', () => {
    expect(b('(zone_temp_c - 21)^2')).toEqual([near(0), Infinity]);
    expect(b('abs(level - 2) + 0.5 * abs(flow)')).toEqual([near(0), Infinity]);
    expect(b('-abs(level - 2)')).toEqual([-Infinity, near(0)]);
    expect(b('exp(x)')).toEqual([near(0), Infinity]);
    expect(b('sqrt(x)')).toEqual([near(0), Infinity]);
    expect(b('clamp(x, 0, 1)')).toEqual([near(0), near(1)]);
    expect(b('1 / (1 + x^2)')).toEqual([near(0), near(1)]);
    expect(b('min(x^2, 4)')).toEqual([near(0), near(4)]);
    expect(b('max(x^2, 4)')).toEqual([near(4), Infinity]);
    expect(b('x^3')).toEqual([-Infinity, Infinity]);
    expect(b('x^-2')).toEqual([near(0), Infinity]);
    expect(b('x^0.5')).toEqual([near(0), Infinity]);
    expect(b('2^x')).toEqual([near(0), Infinity]);
    expect(b('0.5^x + 3')).toEqual([near(3), Infinity]);
    expect(b('4 * 2.5')).toEqual([near(10), near(10)]);
  });

  it('takes a product of one subtree with itself as a square, and of two as independent', () => {
    expect(b('(x - 1) * (x - 1)')).toEqual([near(0), Infinity]);
    expect(b('(x - 1) * (y - 1)')).toEqual([-Infinity, Infinity]);
    expect(b('x*x + y*y')).toEqual([near(0), Infinity]);
  });

  it('bounds the heating loop sample\'s cost, (T − 21)² + 0.1·(20^(u/100) − 1)/19, below by −0.1/19', () => {
    const [lo, hi] = b('(zone_temp_c - 21)^2 + 0.1 * (20^(heating_valve_pct / 100) - 1) / 19');
    // 20^(u/100) > 0 for every real u, so the second term exceeds −0.1/19; the first is ≥ 0.
    expect(lo).toBeCloseTo(-0.1 / 19, 10);
    expect(lo).toBeLessThan(-0.1 / 19); // widened outward, never inward
    expect(hi).toBe(Infinity);
  });

  it('knows nothing of log, a column alone or a difference of columns', () => {
    for (const f of ['log(x)', 'x', 'x - y', 'x / y', 'x^y']) expect(b(f)).toEqual([-Infinity, Infinity]);
  });

  it('gives the bounds in reward sense: a cost is negated; a column gives what the project declares, else none', () => {
    const tree = parseExpression('(x - 1)^2 + 2');
    expect(certainRewardBounds({ kind: 'expression', expression: '(x - 1)^2 + 2', sense: 'cost' }, tree)).toEqual({ lower: -Infinity, upper: near(-2), from: 'formula' });
    expect(certainRewardBounds({ kind: 'expression', expression: '(x - 1)^2 + 2', sense: 'reward' }, tree)).toEqual({ lower: near(2), upper: Infinity, from: 'formula' });
    expect(certainRewardBounds({ kind: 'column', column: 'r', sense: 'cost' }, undefined)).toBeUndefined();
    expect(certainRewardBounds({ kind: 'column', column: 'r', sense: 'cost', atLeast: 0 }, undefined)).toEqual({ lower: -Infinity, upper: 0, from: 'declaration' });
    expect(certainRewardBounds({ kind: 'column', column: 'r', sense: 'reward', atLeast: -1, atMost: 4 }, undefined)).toEqual({ lower: -1, upper: 4, from: 'declaration' });
    expect(certainRewardBounds({ kind: 'expression', expression: 'x - y', sense: 'cost' }, parseExpression('x - y'))).toBeUndefined();
  });

  it('encloses every finite value the row evaluator gives, on random and extreme column values (inclusion property)', () => {
    const formulas = [
      '(a - 21)^2 + 0.1 * (20^(b / 100) - 1) / 19', 'abs(a) - 2 * clamp(b, -1, 3)', '1 / (1 + a^2) - exp(-b^2)',
      'min(a, b, 3) + max(a^2, 1)', 'sqrt(abs(a)) * 2 - a^4', '(a + b) * (a + b) - 0.5 * a^-2', '-(a^2)^0.5 + 7',
    ];
    const source = createRandom(7), random = () => source.uniform(), n = 4000;
    const extremes = [0, -0, 1e-300, -1e-300, 1e300, -1e300, 1, -1, 100, -100];
    for (const f of formulas) {
      const tree = parseExpression(f), [lo, hi] = expressionBounds(tree);
      const columns = new Map(expressionColumns(tree).map(({ name }) => [name, Float64Array.from({ length: n }, (_, i) => (
        i < extremes.length * extremes.length ? extremes[name === 'a' ? i % extremes.length : Math.floor(i / extremes.length)] : (random() - 0.5) * 10 ** (6 * random() - 2)
      ))]));
      const values = evaluateExpression(tree, (name) => columns.get(name)!, n);
      for (const v of values) {
        if (!Number.isFinite(v)) continue; // a bad row at import, never a reward
        expect(v, f).toBeGreaterThanOrEqual(lo);
        expect(v, f).toBeLessThanOrEqual(hi);
      }
    }
    expect(CERTAIN_BOUND_SLACK).toBeLessThan(1e-9);
  });

  it('bounds a quotient by dividing the ends, as each row divides, so a cancellation after it cannot step outside', () => {
    // 3·fl(1/17) = 0.1764705882352941 < fl(3/17) = 0.17647058823529413 (IEEE 754 round-to-nearest,
    // checked in node): a bound taken through the reciprocal sat one unit in the last place below the
    // row at c = 3, and subtracting fl(3/17) and scaling by 1e17 turned that into an upper bound of
    // −2.8 where the row gives exactly 0.
    const f = '1e17 * (clamp(c, 0, 3) / 17 - 0.17647058823529413)';
    const tree = parseExpression(f), [, hi] = expressionBounds(tree);
    const row = evaluateExpression(tree, () => Float64Array.of(3), 1)[0];
    expect(row).toBe(0);
    expect(hi).toBeGreaterThanOrEqual(row);
    expect(b('clamp(c, 1, 2) / clamp(d, 4, 8)')).toEqual([near(0.125), near(0.5)]);
    expect(b('clamp(c, 1, 2) / (-1 - x^2)')).toEqual([near(-2), near(0)]);
    expect(b('(1 + x^2) / (1 + y^2)')).toEqual([near(0), Infinity]);
  });

  it('bounds a negative integer power by the power of the ends, as each row takes it, not 1 over the positive power', () => {
    // 9^−3 = 0.0013717421124828533 but 1/9^3 = 0.0013717421124828531 (checked in node): through the
    // reciprocal the upper end sat an ulp below the row at c = 9, and 1e19·(… − 9^−3) made it −2.2.
    const f = '1e19 * (clamp(c, 9, 10)^-3 - 0.0013717421124828533)';
    const tree = parseExpression(f), [, hi] = expressionBounds(tree);
    const row = evaluateExpression(tree, () => Float64Array.of(9), 1)[0];
    expect(row).toBe(0);
    expect(hi).toBeGreaterThanOrEqual(row);
    // Closed forms: x^−1 on [−4, 0] is (−∞, −1/4]; x^−2 on [−2, 3] is [1/9, ∞); x^−1 across 0 is anything.
    expect(b('clamp(x, -4, 0)^-1')).toEqual([-Infinity, near(-0.25)]);
    expect(b('clamp(x, 0, 4)^-1')).toEqual([near(0.25), Infinity]);
    expect(b('clamp(x, -2, 3)^-2')).toEqual([near(1 / 9), Infinity]);
    expect(b('clamp(x, -2, 3)^-1')).toEqual([-Infinity, Infinity]);
    expect(b('clamp(x, -3, -2)^-3')).toEqual([near(-1 / 8), near(-1 / 27)]);
  });
});
