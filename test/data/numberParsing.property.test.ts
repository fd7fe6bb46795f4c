/**
 * Every way the import reads a plain decimal — the cell reader (numericBytes.ts) and the fast path
 * of whole records (plainRecord.ts, through readColumns) — gives the double that JavaScript's own
 * Number() gives for the same text (ECMA-262 §7.1.4.1.1, StringToNumber: the correctly rounded
 * value), bit for bit (Object.is, so −0 too), on random decimal strings: signs, up to 25 integer and
 * 25 fraction digits (beyond the 15 of the exact fast path, so the general route is exercised),
 * leading zeros on both sides of the mark, exponents of either case and sign, and the decimal comma (turned into a point for Number()).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readColumns } from '../../src/data/columnReader';
import { numberFromBytes } from '../../src/data/numericBytes';
import { RowProblems } from '../../src/data/rowProblems';

const digits = (max: number) => fc.array(fc.constantFrom(...'0123456789'), { maxLength: max }).map((d) => d.join(''));
const exponent = fc.option(fc.tuple(fc.constantFrom('e', 'E'), fc.constantFrom('', '+', '-'), fc.integer({ min: 0, max: 400 })).map(([e, s, n]) => `${e}${s}${n}`), { nil: '' });

/** A decimal in the import's grammar with "." as its mark: [+-]digits[.digits][(e|E)[+-]digits]. */
const DECIMAL = fc.tuple(fc.constantFrom('', '+', '-'), digits(25), fc.option(digits(25), { nil: undefined }), exponent)
  .filter(([, whole, fraction]) => whole.length + (fraction ?? '').length > 0)
  .map(([sign, whole, fraction, e]) => `${sign}${whole}${fraction === undefined ? '' : `.${fraction}`}${e}`);

/** Short mantissas, the fast path's own ground (at most 15 digits, small exponents). */
const SHORT = fc.tuple(fc.constantFrom('', '-'), digits(8), digits(7), fc.integer({ min: -25, max: 25 }))
  .filter(([, whole, fraction]) => whole.length + fraction.length > 0)
  .map(([sign, whole, fraction, e]) => `${sign}${whole}.${fraction}${e === 0 ? '' : `e${e}`}`);

/** Leading zeros before and after the mark, then up to 16 digits: the fast path counts significant digits only. */
const LEADING_ZEROS = fc.tuple(fc.constantFrom('', '-'), fc.nat(20), fc.nat(20), digits(16))
  .map(([sign, before, after, rest]) => `${sign}${'0'.repeat(before)}.${'0'.repeat(after)}${rest}`)
  .filter((text) => /\d/.test(text));

const encode = (text: string) => new TextEncoder().encode(text);

/** The column of one number field read by readColumns (fast path on), for cells written with `mark`. */
function readColumn(cells: string[], mark: '.' | ','): Float64Array {
  const text = `x;y\n${cells.map((c) => `${mark === ',' ? c.replace('.', ',') : c};0`).join('\n')}\n`;
  const bytes = encode(text);
  const requests = [{ name: 'x', field: 0, kind: 'number' as const }, { name: 'y', field: 1, kind: 'number' as const }];
  return readColumns({ bytes, start: 4, firstLine: 2 }, ';', mark, 2, requests, new RowProblems()).numbers.get('x')!;
}

describe('plain decimals are read as Number() reads them', () => {
  it('numberFromBytes, with "." and with ",", on 20,000 random decimals', () => {
    fc.assert(
      fc.property(fc.oneof(DECIMAL, SHORT, LEADING_ZEROS), (text) => {
        const expected = Number(text);
        expect(Object.is(numberFromBytes(encode(text), 0, text.length, '.'), expected)).toBe(true);
        const comma = text.replace('.', ',');
        expect(Object.is(numberFromBytes(encode(comma), 0, comma.length, ','), expected)).toBe(true);
      }),
      { seed: 5, numRuns: 20_000 },
    );
  });

  it('the whole-record fast path, with "." and with ",", on 2,000 random columns of decimals', () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(DECIMAL, SHORT, LEADING_ZEROS), { minLength: 1, maxLength: 20 }), fc.constantFrom<'.' | ','>('.', ','), (cells, mark) => {
        const column = readColumn(cells, mark);
        cells.forEach((cell, r) => {
          const expected = Number(cell);
          // A value too large for a double is refused as a cell ("not finite"), and NaN stands in its slot.
          expect(Object.is(column[r], Number.isFinite(expected) ? expected : NaN)).toBe(true);
        });
      }),
      { seed: 6, numRuns: 2_000 },
    );
  });
});
