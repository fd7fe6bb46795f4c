import { describe, expect, it } from 'vitest';
import { crc32 as zlibCrc32 } from 'node:zlib';
import { adler32 } from '../../src/figures/writers/adler32';
import { crc32 } from '../../src/figures/writers/crc32';
import { createRandom } from '../../src/core/random';

const ascii = (text: string) => new TextEncoder().encode(text);

describe('crc32', () => {
  it('check value CRC-32("123456789") = 0xCBF43926', () => {
    // The standard check value of CRC-32/ISO-HDLC (the PNG CRC): Williams, "A painless guide to
    // CRC error detection algorithms" (1993), and the CRC catalogues that follow it (from memory).
    expect(crc32(ascii('123456789'))).toBe(0xcbf43926);
  });

  it('the IEND chunk CRC every PNG ends with is AE 42 60 82', () => {
    // CRC over the chunk type "IEND" with no data: the last four bytes of any PNG file (common practice).
    expect(crc32(ascii('IEND'))).toBe(0xae426082);
  });

  it('agrees with Node’s zlib.crc32 on random data, also when continued across pieces', () => {
    const rng = createRandom(20250115);
    for (const length of [0, 1, 7, 256, 5000]) {
      const bytes = Uint8Array.from({ length }, () => rng.integer(256));
      expect(crc32(bytes)).toBe(zlibCrc32(bytes));
      const half = Math.floor(length / 2);
      expect(crc32(bytes, half, length, crc32(bytes, 0, half))).toBe(zlibCrc32(bytes));
    }
  });
});

describe('adler32', () => {
  it('Adler-32("Wikipedia") = 0x11E60398 (the worked example of the Adler-32 article, from memory)', () => {
    expect(adler32(ascii('Wikipedia'))).toBe(0x11e60398);
  });
  it('of nothing is 1 (RFC 1950 §8.2: A starts at 1, B at 0)', () => {
    expect(adler32(new Uint8Array(0))).toBe(1);
  });
});
