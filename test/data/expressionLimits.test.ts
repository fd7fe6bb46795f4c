/**
 * Expressions the schema accepts but no plant needs: too long, too deep, too many operations, and
 * clamp limits that cross. Each gets a clear ExpressionError (never a stack overflow, exit 70), and
 * a long expression is shown only around the caret. Zone offsets outside RFC 3339 §5.6 (hours
 * 00–23, minutes 00–59) are no timestamps.
 */
import { describe, expect, it } from 'vitest';
import { MAX_EXPRESSION_DEPTH, MAX_EXPRESSION_LENGTH, MAX_EXPRESSION_OPERATIONS } from '../../src/core/limits';
import { evaluateExpression } from '../../src/data/expressionEvaluation';
import { ExpressionError } from '../../src/data/expressionError';
import { parseExpression } from '../../src/data/expressionSyntax';
import { readTimestamp } from '../../src/data/timestampCell';

function refusal(source: string): ExpressionError {
  try {
    parseExpression(source);
  } catch (e) {
    if (e instanceof ExpressionError) return e;
    throw e;
  }
  throw new Error(`accepted: ${source.slice(0, 40)}`);
}

describe('expression limits', () => {
  it('6,250 terms: refused for length, and the message shows at most a window of the text', () => {
    const source = Array.from({ length: 6250 }, (_, i) => `x${i % 10}`).join(' + ');
    const e = refusal(source);
    expect(e.reason).toContain(`at most ${MAX_EXPRESSION_LENGTH} are allowed`);
    expect(e.message.length).toBeLessThan(400);
  });

  it('2,343 nested parentheses and 1,927 nested abs( are refused, as is a deep nest that fits the length', () => {
    expect(refusal(`${'('.repeat(2343)}1${')'.repeat(2343)}`).reason).toContain('characters long');
    expect(refusal(`${'abs('.repeat(1927)}1${')'.repeat(1927)}`).reason).toContain('characters long');
    const deep = `${'('.repeat(MAX_EXPRESSION_DEPTH + 1)}1${')'.repeat(MAX_EXPRESSION_DEPTH + 1)}`;
    expect(refusal(deep).reason).toContain(`nests more than ${MAX_EXPRESSION_DEPTH} levels`);
    expect(refusal(`${'-'.repeat(MAX_EXPRESSION_DEPTH + 1)}1`).reason).toContain('nests more than');
    expect(refusal(`2${'^2'.repeat(MAX_EXPRESSION_DEPTH + 1)}`).reason).toContain('nests more than');
    expect(() => parseExpression(`${'('.repeat(MAX_EXPRESSION_DEPTH - 1)}1${')'.repeat(MAX_EXPRESSION_DEPTH - 1)}`)).not.toThrow();
  });

  it('more operations than the limit are refused; the limit itself is accepted', () => {
    expect(refusal(Array.from({ length: MAX_EXPRESSION_OPERATIONS + 2 }, () => 'a').join('+')).reason).toContain(`more than ${MAX_EXPRESSION_OPERATIONS} operations`);
    expect(() => parseExpression(Array.from({ length: MAX_EXPRESSION_OPERATIONS + 1 }, () => 'a').join('+'))).not.toThrow();
  });

  it('clamp(r, 5, 1): constant limits that cross are refused at the clamp', () => {
    const e = refusal('clamp(r, 5, 1)');
    expect(e.reason).toBe("clamp’s lower limit 5 is above its upper limit 1; write clamp(x, lower, upper)");
    expect(e.index).toBe(0);
    expect(refusal('clamp(r, -(1), -2)').reason).toContain('lower limit -1 is above its upper limit -2');
    expect(() => parseExpression('clamp(r, 1, 1)')).not.toThrow();
  });

  it('clamp with column limits: rows where they cross give NaN (reported per row by the importer)', () => {
    const tree = parseExpression('clamp(x, lo, hi)');
    const columns: Record<string, number[]> = { x: [5, 5], lo: [0, 3], hi: [2, 1] };
    const values = Array.from(evaluateExpression(tree, (name) => Float64Array.from(columns[name]), 2));
    expect(values[0]).toBe(2);
    expect(values[1]).toBeNaN();
  });
});

describe('zone offsets (RFC 3339 §5.6)', () => {
  it('+99:99 and +24:00 are no valid offset; +14:00 and -05:30 are', () => {
    for (const cell of ['2024-03-01T12:00:00+99:99', '2024-03-01T12:00:00+24:00', '2024-03-01T12:00:00+0160']) {
      const reading = readTimestamp(cell, '.');
      expect(reading && Number.isNaN(reading.dayFirst) && Number.isNaN(reading.monthFirst)).toBe(true);
    }
    expect(readTimestamp('1970-01-01T14:00:00+14:00', '.')?.dayFirst).toBe(0);
    expect(readTimestamp('1970-01-01T00:00:00-05:30', '.')?.dayFirst).toBe(5.5 * 3600);
  });
});
