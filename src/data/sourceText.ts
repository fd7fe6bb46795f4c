/**
 * File bytes → text, with the encoding detected and named. Historians and spreadsheets export
 * UTF-8 (with or without a byte-order mark), UTF-16 (with a mark, or without one: then every other
 * byte of ASCII text is zero) or the Windows "ANSI" code page 1252. The rules, in order:
 *   1. a byte-order mark decides: EF BB BF UTF-8, FF FE UTF-16LE, FE FF UTF-16BE (Unicode §23.8);
 *   2. no mark, but zero bytes in most odd (or even) positions of the first 4 KiB: UTF-16LE (BE);
 *   3. bytes that are valid UTF-8 (RFC 3629) are UTF-8 — pure ASCII included;
 *   4. otherwise Windows-1252 (WHATWG Encoding Standard's "windows-1252", which also covers
 *      ISO-8859-1 text), the usual code page of such exports (common practice).
 * A zero byte left in text read as UTF-8 or Windows-1252 is refused with its offset, since a CSV
 * never holds one and decoding it would only surface later as puzzling "not a number" cells.
 */
export type TextEncodingName = 'UTF-8' | 'UTF-16LE' | 'UTF-16BE' | 'Windows-1252';

export type TextReading =
  | { ok: true; text: string; encoding: TextEncodingName; how: 'byte-order mark' | 'detected' }
  | { ok: false; reason: string };

/** Share of zero bytes in alternate positions that marks UTF-16 without a byte-order mark (a choice). */
const UTF16_ZERO_SHARE = 0.6;
const SNIFF_BYTES = 4096;

export function sourceText(source: string | Uint8Array): TextReading {
  if (typeof source === 'string') return { ok: true, text: stripByteOrderMark(source), encoding: 'UTF-8', how: 'detected' };
  const marked = byteOrderMark(source);
  if (marked) return decode(source, marked, 'byte-order mark');
  const utf16 = utf16WithoutMark(source);
  if (utf16) return decode(source, utf16, 'detected');
  const zero = source.indexOf(0);
  if (zero >= 0) return { ok: false, reason: `the file holds a zero byte at byte ${zero + 1}, which no text CSV has; is it a spreadsheet or binary file? Save it as CSV and import again` };
  return isUtf8(source) ? decode(source, 'UTF-8', 'detected') : decode(source, 'Windows-1252', 'detected');
}

/** The encoding a byte-order mark at the start names, or null where there is none. */
export function byteOrderMark(b: Uint8Array): TextEncodingName | null {
  if (b[0] === 0xef && b[1] === 0xbb && b[2] === 0xbf) return 'UTF-8';
  if (b[0] === 0xff && b[1] === 0xfe) return 'UTF-16LE';
  if (b[0] === 0xfe && b[1] === 0xff) return 'UTF-16BE';
  return null;
}

function utf16WithoutMark(b: Uint8Array): TextEncodingName | null {
  const n = Math.min(b.length, SNIFF_BYTES) & ~1;
  if (n < 4) return null;
  let evenZeros = 0, oddZeros = 0;
  for (let i = 0; i < n; i += 2) {
    if (b[i] === 0) evenZeros++;
    if (b[i + 1] === 0) oddZeros++;
  }
  const pairs = n / 2;
  if (oddZeros / pairs >= UTF16_ZERO_SHARE && evenZeros / pairs < 0.1) return 'UTF-16LE';
  if (evenZeros / pairs >= UTF16_ZERO_SHARE && oddZeros / pairs < 0.1) return 'UTF-16BE';
  return null;
}

function isUtf8(b: Uint8Array): boolean {
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(b);
    return true;
  } catch {
    return false;
  }
}

const DECODER_LABEL: Record<TextEncodingName, string> = { 'UTF-8': 'utf-8', 'UTF-16LE': 'utf-16le', 'UTF-16BE': 'utf-16be', 'Windows-1252': 'windows-1252' };

function decode(b: Uint8Array, encoding: TextEncodingName, how: 'byte-order mark' | 'detected'): TextReading {
  try {
    const text = new TextDecoder(DECODER_LABEL[encoding], { fatal: encoding !== 'Windows-1252' }).decode(b);
    return { ok: true, text: stripByteOrderMark(text), encoding, how };
  } catch {
    return { ok: false, reason: `the file starts like ${encoding} text but is not valid ${encoding}; save it as UTF-8 CSV and import again` };
  }
}

export function stripByteOrderMark(text: string): string {
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

/** Offset of the first byte that does not fit the UTF-8 encoding scheme (RFC 3629 §4). */
export function firstInvalidUtf8Byte(bytes: Uint8Array): number {
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i];
    const length = b < 0x80 ? 1 : b >= 0xc2 && b <= 0xdf ? 2 : b >= 0xe0 && b <= 0xef ? 3 : b >= 0xf0 && b <= 0xf4 ? 4 : 0;
    if (length === 0) return i;
    for (let k = 1; k < length; k++) {
      if (i + k >= bytes.length || (bytes[i + k] & 0xc0) !== 0x80) return i;
    }
    if (length > 2 && !decodesAlone(bytes.subarray(i, i + length))) return i; // overlong or surrogate
    i += length;
  }
  return Math.max(0, bytes.length - 1);
}

function decodesAlone(sequence: Uint8Array): boolean {
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(sequence);
    return true;
  } catch {
    return false;
  }
}
