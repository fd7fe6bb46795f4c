/**
 * A reward expression written with a decimal comma, when the data file uses one: "0,5" is a half
 * and ";" separates function arguments, as in spreadsheets of decimal-comma locales (common
 * practice). With a decimal point, the same text keeps its old meaning.
 */
import { describe, expect, it } from 'vitest';
import { evaluateExpression } from '../../src/data/expressionEvaluation';
import { parseExpression } from '../../src/data/expressionSyntax';
import { importDataset } from '../../src/data/importDataset';

const at = (source: string, decimalMark: '.' | ',') => evaluateExpression(parseExpression(source, { decimalMark }), () => Float64Array.of(2), 1)[0];

describe('decimal comma in expressions', () => {
  it('reads 0,5 as a half and ; as the argument separator', () => {
    expect(at('0,5 * x', ',')).toBe(1);
    expect(at('max(x; 2,5)', ',')).toBe(2.5);
    expect(at('min(x, 1,5)', ',')).toBe(1.5); // a comma and a space still separate
    expect(at('1.25 + x', ',')).toBe(3.25); // a point still works
  });

  it('keeps the comma as a separator with a decimal point', () => {
    expect(at('max(x,3)', '.')).toBe(3);
    expect(() => parseExpression('0,5 * x', { decimalMark: '.' })).toThrow();
  });

  it('imports a decimal-comma file whose cost is an expression with a decimal comma', () => {
    const text = 'run;level;valve\n1;1,0;40\n1;1,5;41\n1;2,0;42\n';
    const result = importDataset(text, 'comma.csv', { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' }, {
      states: [{ column: 'level', unit: 'm' }], actions: [{ column: 'valve', unit: '%' }],
      reward: { kind: 'expression', expression: '(level - 1,5)^2 + 0,01 * valve', sense: 'cost' },
      nextState: { kind: 'nextRow' }, episode: { kind: 'single' },
    });
    expect(result.ok).toBe(true);
    if (result.ok) expect(result.value.summary.reward.max).toBeCloseTo(-0.41, 12); // costs are negated into rewards: −(0 + 0.41) at level 1.5
  });
});
