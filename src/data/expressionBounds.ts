/**
 * Bounds a reward/cost expression keeps for sure, whatever the values of the columns it reads:
 * every column is taken to range over all real numbers, and the tree is evaluated in interval
 * arithmetic (Moore, Kearfott & Cloud, "Introduction to Interval Analysis", SIAM 2009, ch. 2 and 5;
 * the rules for each operation and the elementary functions below are theirs, from memory). The
 * result encloses every value the expression can give on a row the import keeps (a row whose value
 * is not finite — log of 0, sqrt of a negative number, division by zero — is a bad row and never
 * reaches the estimators), so a bound here is a property of the formula, not of the logs:
 * (zone_temp_c − 21)^2 is never below 0, whatever the plant does under any policy.
 *
 * Interval arithmetic is sound but can be loose: x·x is bounded as a product of two independent
 * reals (−∞, ∞) unless both factors are the same subtree, which is taken as a square here (the
 * dependency problem, ibid. §2.4). A looser bound only means less is known; it is never wrong.
 * Endpoints are widened outward by a relative CERTAIN_BOUND_SLACK so that rounding in the
 * row-by-row evaluation (a library's exp or power need not round as the bound's did) cannot step
 * outside them. An end at exactly 0 stays 0: the operations that give it (a square, abs, sqrt, a
 * clamp or min/max at 0, exp of −∞) give 0 or more exactly on every row.
 */
import type { ExpressionNode } from './expressionSyntax';

/** [lower, upper], either end possibly infinite. */
export type Bounds = readonly [number, number];

const ALL: Bounds = [-Infinity, Infinity];

/** Relative outward widening of each end (rounding of a handful of floating-point operations; ours). */
export const CERTAIN_BOUND_SLACK = 1e-12;

/** The bounds of `tree` over all real column values; [−∞, ∞] when nothing is known. */
export function expressionBounds(tree: ExpressionNode): Bounds {
  const [lo, hi] = bounds(tree);
  if (Number.isNaN(lo) || Number.isNaN(hi)) return ALL;
  return [widen(lo, -1), widen(hi, 1)];
}

function widen(v: number, direction: 1 | -1): number {
  if (!Number.isFinite(v)) return v;
  return v + direction * CERTAIN_BOUND_SLACK * Math.abs(v);
}

function bounds(node: ExpressionNode): Bounds {
  switch (node.kind) {
    case 'number':
      return [node.value, node.value];
    case 'column':
      return ALL;
    case 'negate': {
      const [lo, hi] = bounds(node.operand);
      return [-hi, -lo];
    }
    case 'binary':
      return binary(node.operator, node.left, node.right);
    case 'call':
      return call(node.name, node.args.map(bounds));
  }
}

function binary(operator: string, left: ExpressionNode, right: ExpressionNode): Bounds {
  if (operator === '*' && sameTree(left, right)) return evenPower(bounds(left), 2);
  const a = bounds(left), b = bounds(right);
  switch (operator) {
    case '+': return [a[0] + b[0], a[1] + b[1]];
    case '-': return [a[0] - b[1], a[1] - b[0]];
    case '*': return product(a, b);
    case '/': return quotient(a, b);
    default: return power(a, b);
  }
}

/** Extended products of the ends, with 0·∞ = 0 (the ends are limits of finite values; ibid. §2.3). */
function product(a: Bounds, b: Bounds): Bounds {
  const times = (x: number, y: number): number => (x === 0 || y === 0 ? 0 : x * y);
  const p = [times(a[0], b[0]), times(a[0], b[1]), times(a[1], b[0]), times(a[1], b[1])];
  return [Math.min(...p), Math.max(...p)];
}

/**
 * The ends divided as each row divides (not times a reciprocal: 3·fl(1/17) lies one unit in the last
 * place below fl(3/17), and a cancellation after it can make that any size); correctly rounded
 * division is monotone, so the ends enclose every row's quotient. ±∞/±∞ is taken as 0: the other
 * ends give the infinite side, and a row's value is finite.
 */
function quotient(a: Bounds, b: Bounds): Bounds {
  if (b[0] > 0 || b[1] < 0) {
    const over = (x: number, y: number): number => (!Number.isFinite(x) && !Number.isFinite(y) ? 0 : x / y);
    const q = [over(a[0], b[0]), over(a[0], b[1]), over(a[1], b[0]), over(a[1], b[1])];
    return [Math.min(...q), Math.max(...q)];
  }
  // A divisor that can be 0 (a row where it is 0 is a bad row): only a sign survives.
  if (b[0] === 0 && b[1] > 0) return a[0] >= 0 ? [0, Infinity] : a[1] <= 0 ? [-Infinity, 0] : ALL;
  if (b[1] === 0 && b[0] < 0) return a[0] >= 0 ? [-Infinity, 0] : a[1] <= 0 ? [0, Infinity] : ALL;
  return ALL;
}

function power(base: Bounds, exponent: Bounds): Bounds {
  if (exponent[0] === exponent[1]) {
    const p = exponent[0];
    if (Number.isInteger(p) && p > 0) return p % 2 === 0 ? evenPower(base, p) : [base[0] ** p, base[1] ** p];
    if (p === 0) return [1, 1];
    // A negative or fractional power: a negative base gives NaN (a bad row) unless p is an integer.
    if (Number.isInteger(p)) return negativeIntegerPower(base, p);
    const lo = Math.max(base[0], 0), hi = base[1];
    if (hi < 0) return ALL; // every row would be bad; nothing to bound
    return p > 0 ? [lo ** p, hi ** p] : [hi ** p, lo ** p];
  }
  if (base[0] === base[1] && base[0] > 0) {
    const b = base[0], ends = [b ** exponent[0], b ** exponent[1]];
    return [Math.min(...ends), Math.max(...ends)];
  }
  // A real power of a base that is never negative on a kept row is never negative.
  return base[0] >= 0 ? [0, Infinity] : ALL;
}

/**
 * x^p for a negative integer p, from the ends' own powers as each row takes them (not 1 over the
 * positive power: 1/9³ lies an ulp below 9^−3). On one side of 0 x^p is monotone; an end at 0 is
 * taken from its own side (−0 for an interval of negatives, so (−0)^−1 = −∞), and a row at 0 is a
 * bad row. Across 0: an odd power takes every value, an even one every value from its smaller end's up.
 */
function negativeIntegerPower(base: Bounds, p: number): Bounds {
  const [lo, hi] = base;
  if (lo >= 0 || hi <= 0) {
    const a = (lo === 0 && hi > 0 ? 0 : lo) ** p, b = (hi === 0 && lo < 0 ? -0 : hi) ** p;
    return [Math.min(a, b), Math.max(a, b)];
  }
  return p % 2 === 0 ? [Math.min(lo ** p, hi ** p), Infinity] : ALL;
}

function evenPower(base: Bounds, p: number): Bounds {
  const [lo, hi] = base, top = Math.max(lo ** p, hi ** p);
  return lo <= 0 && hi >= 0 ? [0, top] : [Math.min(lo ** p, hi ** p), top];
}

function call(name: string, args: Bounds[]): Bounds {
  const [x] = args;
  switch (name) {
    case 'abs':
      return x[0] >= 0 ? x : x[1] <= 0 ? [-x[1], -x[0]] : [0, Math.max(-x[0], x[1])];
    case 'exp':
      return [Math.exp(x[0]), Math.exp(x[1])];
    case 'log':
      return x[1] <= 0 ? ALL : [Math.log(Math.max(x[0], 0)), Math.log(x[1])];
    case 'sqrt':
      return x[1] < 0 ? ALL : [Math.sqrt(Math.max(x[0], 0)), Math.sqrt(x[1])];
    case 'min':
      return [Math.min(...args.map((a) => a[0])), Math.min(...args.map((a) => a[1]))];
    case 'max':
      return [Math.max(...args.map((a) => a[0])), Math.max(...args.map((a) => a[1]))];
    default: { // clamp(x, lo, hi) = min(max(x, lo), hi)
      const raised = call('max', [args[0], args[1]]);
      return call('min', [raised, args[2]]);
    }
  }
}

/** Structurally the same subtree (same columns, numbers and operations), so one value on every row. */
function sameTree(a: ExpressionNode, b: ExpressionNode): boolean {
  if (a.kind !== b.kind) return false;
  switch (a.kind) {
    case 'number': return a.value === (b as typeof a).value;
    case 'column': return a.name === (b as typeof a).name;
    case 'negate': return sameTree(a.operand, (b as typeof a).operand);
    case 'binary': {
      const o = b as typeof a;
      return a.operator === o.operator && sameTree(a.left, o.left) && sameTree(a.right, o.right);
    }
    case 'call': {
      const o = b as typeof a;
      return a.name === o.name && a.args.length === o.args.length && a.args.every((x, i) => sameTree(x, o.args[i]));
    }
  }
}

