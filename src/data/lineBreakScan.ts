/**
 * One pass over bytes for what the import learns before it reads records: how many line breaks
 * they hold (LF, and a CR not before an LF; csvScanner.ts recordBound) and whether every byte is
 * ASCII and none is zero (sourceBytes.ts isAsciiWithoutZero). Both tests look at 32-bit words, so
 * a file read in pieces makes its first pass over each piece once instead of twice (pieceFacts.ts).
 *
 * LFs are counted four bytes at a time: for x = word XOR 0x0A0A0A0A,
 * ~(((x & 0x7F7F7F7F) + 0x7F7F7F7F) | x | 0x7F7F7F7F) has the high bit of exactly the bytes of x
 * that are zero, with no carry between bytes (Anderson, "Bit Twiddling Hacks", "Determine if a word
 * has a zero byte"; common practice). The same test for CR only says whether the bytes hold one;
 * then each lone CR is counted byte by byte. A zero byte anywhere is found by
 * (v − 0x01010101) & ~v & 0x80808080 ≠ 0 (same source), a byte of 0x80 or more by OR-ing the words.
 */
const LF = 0x0a, CR = 0x0d;

export interface LineBreakScan {
  readonly lineBreaks: number;
  readonly asciiWithoutZero: boolean;
}

/** Line breaks in bytes[start, end) and whether those bytes are ASCII without a zero byte. */
export function lineBreakScan(bytes: Uint8Array, start = 0, end = bytes.length): LineBreakScan {
  const head = Math.min(end, start + ((4 - ((bytes.byteOffset + start) % 4)) % 4));
  const words = Math.max(0, (end - head) >> 2);
  const tally: Tally = { breaks: 0, anyCr: 0, high: 0, zero: 0 };
  tallyBytes(tally, bytes, start, head);
  if (words > 0) tallyWords(tally, new Int32Array(bytes.buffer, bytes.byteOffset + head, words));
  tallyBytes(tally, bytes, head + 4 * words, end);
  const lineBreaks = tally.breaks + (tally.anyCr ? loneCrs(bytes, start, end) : 0);
  return { lineBreaks, asciiWithoutZero: (tally.high & 0x80808080) === 0 && tally.zero === 0 };
}

/** LFs so far, and (as non-zero bits) whether a CR, a byte of 0x80 or more, or a zero byte was seen. */
interface Tally {
  breaks: number;
  anyCr: number;
  high: number;
  zero: number;
}

/**
 * The aligned middle, a word at a time. Each loop of the scan is a function of its own: an
 * optimised function entered in one loop had no type feedback for the next and fell back to the
 * interpreter there, once per piece.
 */
function tallyWords(tally: Tally, view: Int32Array): void {
  let breaks = 0, anyCr = 0, high = 0, zero = 0;
  for (let w = 0; w < view.length; w++) {
    const v = view[w], lf = zeroBytes(v ^ 0x0a0a0a0a);
    anyCr |= zeroBytes(v ^ 0x0d0d0d0d);
    high |= v;
    zero |= (v - 0x01010101) & ~v & 0x80808080;
    if (lf !== 0) breaks += (lf >>> 7 & 1) + (lf >>> 15 & 1) + (lf >>> 23 & 1) + (lf >>> 31);
  }
  tally.breaks += breaks;
  tally.anyCr |= anyCr;
  tally.high |= high;
  tally.zero |= zero;
}

/** The unaligned bytes at either end, one at a time. */
function tallyBytes(tally: Tally, bytes: Uint8Array, from: number, to: number): void {
  for (let i = from; i < to; i++) {
    const c = bytes[i];
    tally.breaks += c === LF ? 1 : 0;
    tally.anyCr |= c === CR ? 1 : 0;
    tally.high |= c;
    tally.zero |= c === 0 ? 1 : 0;
  }
}

/** CRs not before an LF (an old spreadsheet's line ends), byte by byte: only bytes that hold a CR get here. */
function loneCrs(bytes: Uint8Array, start: number, end: number): number {
  let count = 0;
  for (let i = start; i < end; i++) if (bytes[i] === CR && bytes[i + 1] !== LF) count++;
  return count;
}

/** The high bit of each byte of x that is zero, and no other bit. */
function zeroBytes(x: number): number {
  return ~(((x & 0x7f7f7f7f) + 0x7f7f7f7f) | x | 0x7f7f7f7f);
}
