/**
 * Column-wise evaluation of a parsed reward/cost expression: each node yields either a scalar
 * (constants stay scalars) or a Float64Array over all rows, so a million-row file costs one pass
 * per operator and no per-row tree walks.
 */
import type { ExpressionNode } from './expressionSyntax';

type Values = number | Float64Array;

/**
 * Evaluate `tree` over n rows. `column(name)` returns that column (length n). The result may hold
 * NaN or ±Infinity (log of 0, division by zero); the caller checks and reports those rows.
 */
export function evaluateExpression(tree: ExpressionNode, column: (name: string) => Float64Array, n: number): Float64Array {
  const value = evaluate(tree, column, n);
  return typeof value === 'number' ? new Float64Array(n).fill(value) : value;
}

function evaluate(node: ExpressionNode, column: (name: string) => Float64Array, n: number): Values {
  switch (node.kind) {
    case 'number':
      return node.value;
    case 'column':
      return column(node.name);
    case 'negate':
      return map1(evaluate(node.operand, column, n), (x) => -x);
    case 'binary':
      return map2(evaluate(node.left, column, n), evaluate(node.right, column, n), n, BINARY[node.operator]);
    case 'call': {
      const args = node.args.map((arg) => evaluate(arg, column, n));
      if (node.name === 'min' || node.name === 'max') {
        const pick = node.name === 'min' ? Math.min : Math.max;
        return args.reduce((a, b) => map2(a, b, n, pick));
      }
      if (node.name === 'clamp') {
        // Crossed limits (lo > hi, possible only when a limit is a column) give NaN, reported per row.
        const crossed = map2(args[1], args[2], n, (lo, hi) => (lo <= hi ? 0 : NaN));
        return map2(map2(map2(args[0], args[1], n, Math.max), args[2], n, Math.min), crossed, n, (x, c) => x + c);
      }
      return map1(args[0], UNARY[node.name]);
    }
  }
}

const BINARY: Record<string, (a: number, b: number) => number> = {
  '+': (a, b) => a + b,
  '-': (a, b) => a - b,
  '*': (a, b) => a * b,
  '/': (a, b) => a / b,
  '^': (a, b) => a ** b,
};

const UNARY: Record<string, (x: number) => number> = { abs: Math.abs, exp: Math.exp, log: Math.log, sqrt: Math.sqrt };

function map1(a: Values, f: (x: number) => number): Values {
  if (typeof a === 'number') return f(a);
  const out = new Float64Array(a.length);
  for (let i = 0; i < a.length; i++) out[i] = f(a[i]);
  return out;
}

function map2(a: Values, b: Values, n: number, f: (x: number, y: number) => number): Values {
  if (typeof a === 'number' && typeof b === 'number') return f(a, b);
  const out = new Float64Array(n);
  if (typeof a === 'number') for (let i = 0; i < n; i++) out[i] = f(a, (b as Float64Array)[i]);
  else if (typeof b === 'number') for (let i = 0; i < n; i++) out[i] = f(a[i], b);
  else for (let i = 0; i < n; i++) out[i] = f(a[i], b[i]);
  return out;
}
