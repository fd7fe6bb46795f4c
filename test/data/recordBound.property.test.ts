/**
 * recordBound (csvScanner.ts) counts LFs four bytes at a time; it must give exactly what the
 * definition gives byte by byte: line breaks (LF, CRLF, lone CR; the scanner's rule, as Python's csv
 * module reads them) + 1, over any slice of any buffer, whatever its alignment. lineBreakScan, which
 * also tells whether the bytes are ASCII without a zero byte in the same pass (the first pass of a
 * file read in pieces), must agree with the definitions byte by byte too.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { recordBound } from '../../src/data/csvScanner';
import { lineBreakScan } from '../../src/data/lineBreakScan';

/** The definition, one byte at a time. */
function breaksPlusOne(bytes: Uint8Array, start: number, end: number): number {
  let breaks = 0;
  for (let i = start; i < end; i++) if (bytes[i] === 0x0a || (bytes[i] === 0x0d && bytes[i + 1] !== 0x0a)) breaks++;
  return breaks + 1;
}

/** Every byte below 0x80 and none zero, one byte at a time. */
function asciiWithoutZero(bytes: Uint8Array, start: number, end: number): boolean {
  for (let i = start; i < end; i++) if (bytes[i] === 0 || bytes[i] >= 0x80) return false;
  return true;
}

const BYTE = fc.oneof({ weight: 4, arbitrary: fc.constantFrom(0x0a, 0x0d, 0x41, 0x3b, 0x0b, 0x09) }, fc.constantFrom(0x00, 0x01, 0x7f, 0x80, 0x8a, 0x8d), fc.integer({ min: 0, max: 255 }));

describe('recordBound', () => {
  it('equals line breaks + 1 counted byte by byte, on 20,000 random slices at every alignment', () => {
    fc.assert(
      fc.property(fc.array(BYTE, { maxLength: 70 }), fc.nat(7), fc.nat(9), fc.nat(9), (content, offset, cutStart, cutEnd) => {
        const buffer = new Uint8Array(content.length + offset);
        buffer.set(content, offset);
        const bytes = buffer.subarray(offset);
        const start = Math.min(cutStart, bytes.length), end = Math.max(start, bytes.length - cutEnd);
        expect(recordBound(bytes, start, end)).toBe(breaksPlusOne(bytes, start, end));
        expect(lineBreakScan(bytes, start, end)).toEqual({ lineBreaks: breaksPlusOne(bytes, start, end) - 1, asciiWithoutZero: asciiWithoutZero(bytes, start, end) });
      }),
      { seed: 11, numRuns: 20_000 },
    );
  });
});
