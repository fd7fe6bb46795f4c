/**
 * The reward/cost expression language: precedence and associativity follow the conventions of
 * mathematics (common practice: ^ right-associative and above unary minus, so -2^2 = -4; + − * /
 * left-associative), functions are the usual ones (values checked against Math, the JavaScript
 * standard library), and every syntax error points at its character.
 */
import { describe, expect, it } from 'vitest';
import { evaluateExpression } from '../../src/data/expressionEvaluation';
import { ExpressionError } from '../../src/data/expressionError';
import { expressionColumns, parseExpression } from '../../src/data/expressionSyntax';

const value = (source: string, columns: Record<string, number[]> = {}, n = 1): number[] => {
  const tree = parseExpression(source);
  return Array.from(evaluateExpression(tree, (name) => Float64Array.from(columns[name]), n));
};

describe('expression values', () => {
  it.each([
    ['1 + 2 * 3', 7],
    ['(1 + 2) * 3', 9],
    ['10 - 4 - 3', 3],
    ['12 / 3 / 2', 2],
    ['2^3^2', 512],
    ['-2^2', -4],
    ['(-2)^2', 4],
    ['2^-1', 0.5],
    ['- -3', 3],
    ['+4', 4],
    ['3 − 1', 2], // U+2212 minus sign, as printed in specifications
    ['1.5e2 + .5', 150.5],
    ['abs(-3)', 3],
    ['min(3, 1, 2)', 1],
    ['max(3, 1, 2)', 3],
    ['clamp(5, 0, 2)', 2],
    ['clamp(-5, 0, 2)', 0],
    ['exp(0)', 1],
    ['sqrt(16)', 4],
  ])('%s = %d', (source, expected) => {
    expect(value(source)[0]).toBe(expected);
  });

  it('log is the natural logarithm', () => {
    expect(value('log(2)')[0]).toBe(Math.log(2));
  });

  it('evaluates column-wise and matches the same formula written row by row', () => {
    const level = [1.2, 2.5, 1.9], valve = [40, 55, 61];
    const rows = level.map((l, i) => -((l - 2) ** 2) - 0.01 * Math.abs(valve[i] - 50));
    expect(value('-(level - 2)^2 - 0.01*abs(valve - 50)', { level, valve }, 3)).toEqual(rows);
  });

  it('reads odd column names in backticks, a doubled backtick standing for one', () => {
    const columns = { 'inlet flow (m³/h)': [2, 3], 'a`b': [10, 20] };
    expect(value('`inlet flow (m³/h)` * 2 + `a``b`', columns, 2)).toEqual([14, 26]);
    expect(expressionColumns(parseExpression('`x y` + z * `x y`'))).toEqual([{ name: 'x y', index: 0 }, { name: 'z', index: 8 }]);
  });

  it('a name is a function only when followed by "(" and unquoted: `abs` and abs are columns', () => {
    expect(value('`abs` * 2', { abs: [3] })).toEqual([6]);
    expect(value('abs + 1', { abs: [3] })).toEqual([4]);
  });
});

describe('expression errors point at the character', () => {
  const errorOf = (source: string): ExpressionError => {
    try {
      parseExpression(source);
    } catch (error) {
      if (error instanceof ExpressionError) return error;
      throw error;
    }
    throw new Error(`expected "${source}" to be rejected`);
  };

  it.each([
    ['1 + * 2', 4, 'unexpected "*"; expected a number, a column name or "("'],
    ['(1 + 2', 6, 'the expression ends too early; expected a closing parenthesis ")"'],
    ['(1 + 2))', 7, 'unexpected ")"; expected an operator or the end of the expression'],
    ['level $ 2', 6, 'unexpected character "$"'],
    ['foo(1)', 0, 'unknown function "foo"; expected one of abs, exp, log, sqrt, min, max, clamp'],
    ['clamp(1, 2)', 0, 'clamp takes 3 arguments, got 2'],
    ['min(1)', 0, 'min takes at least 2 arguments, got 1'],
    ['sqrt(1, 2)', 0, 'sqrt takes 1 argument, got 2'],
    ['2 * `open name', 4, 'this quoted column name is not closed'],
    ['``', 0, 'empty column name between backticks'],
    ['   ', 0, 'the expression is empty'],
    ['2 3', 2, 'unexpected "3"; expected an operator or the end of the expression'],
    ['`abs`(2)', 5, 'unexpected "("; expected an operator or the end of the expression'],
  ])('%j → character %i', (source, index, reason) => {
    const error = errorOf(source);
    expect(error.index).toBe(index);
    expect(error.reason).toContain(reason);
    expect(error.message).toBe(`${error.reason} (character ${index + 1})\n  ${source}\n  ${' '.repeat(index)}^`);
  });

  it('code is not an expression: property access and calls of unknown names are refused, never run', () => {
    expect(errorOf('process.exit(1)').reason).toBe('unexpected character "."; expected a number, a column name, an operator (+ - * / ^) or a parenthesis');
    expect(errorOf('constructor(1)').reason).toContain('unknown function "constructor"');
  });
});
