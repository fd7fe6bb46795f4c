/**
 * The data file's bytes for the scanner, always UTF-8: UTF-8 (the common case) is checked without
 * decoding — pure ASCII by a word-at-a-time test, anything else by a fatal TextDecoder in 1 MiB
 * pieces, so a large file is never held twice — and other encodings (UTF-16, Windows-1252; see
 * sourceText.ts) are decoded there and re-encoded. Refusals give the offset of the first bad
 * byte, never the file's content. A UTF-8 byte-order mark is skipped.
 */
import { sourceText, type TextEncodingName } from './sourceText';

export type SourceBytes =
  | { ok: true; bytes: Uint8Array; start: number; encoding: TextEncodingName; how: 'byte-order mark' | 'detected' }
  | { ok: false; kind: 'not-utf8'; reason: string };

const CHUNK = 1 << 20;

/**
 * UTF-8 (the common case) is read as it is, checked without decoding; any other encoding the
 * text reader knows (sourceText.ts: UTF-16, Windows-1252) is decoded there and re-encoded as
 * UTF-8, so the scanner always sees UTF-8 bytes. A zero byte goes the text reader's way too: it
 * either finds UTF-16 or refuses the file with the byte's offset.
 */
export function sourceBytes(source: string | Uint8Array): SourceBytes {
  if (typeof source === 'string') return { ok: true, bytes: new TextEncoder().encode(source.replace(/^\uFEFF/, '')), start: 0, encoding: 'UTF-8', how: 'detected' };
  const marked = source[0] === 0xef && source[1] === 0xbb && source[2] === 0xbf;
  if (isPlainUtf8(source)) return { ok: true, bytes: source, start: marked ? 3 : 0, encoding: 'UTF-8', how: marked ? 'byte-order mark' : 'detected' };
  const text = sourceText(source);
  if (!text.ok) return { ok: false, kind: 'not-utf8', reason: text.reason };
  return { ok: true, bytes: new TextEncoder().encode(text.text), start: 0, encoding: text.encoding, how: text.how };
}

/**
 * True when the text reader would read these bytes as UTF-8 (sourceText.ts: no UTF-16 mark, no
 * zero byte, valid UTF-8, with or without its mark), found without decoding the whole file.
 */
export function isPlainUtf8(source: Uint8Array): boolean {
  const utf16Mark = (source[0] === 0xff && source[1] === 0xfe) || (source[0] === 0xfe && source[1] === 0xff);
  return !utf16Mark && (isAsciiWithoutZero(source) || (source.indexOf(0) < 0 && validUtf8(source)));
}

/**
 * True when every byte is below 0x80 and none is 0 — one pass over 32-bit words for both tests: a
 * set high bit anywhere, and a zero byte by the word test (v − 0x01010101) & ~v & 0x80808080 ≠ 0,
 * which is non-zero exactly when some byte of v is 0 (Anderson, "Bit Twiddling Hacks", "Determine
 * if a word has a zero byte"; common practice).
 */
export function isAsciiWithoutZero(bytes: Uint8Array): boolean {
  const head = Math.min(bytes.length, (4 - (bytes.byteOffset % 4)) % 4);
  const words = (bytes.length - head) >> 2;
  let high = 0, zero = 0;
  for (let i = 0; i < head; i++) {
    high |= bytes[i];
    if (bytes[i] === 0) zero = 1;
  }
  const view = new Uint32Array(bytes.buffer, bytes.byteOffset + head, words);
  for (let i = 0; i < words; i++) {
    const v = view[i];
    high |= v;
    zero |= (v - 0x01010101) & ~v & 0x80808080;
  }
  for (let i = head + 4 * words; i < bytes.length; i++) {
    high |= bytes[i];
    if (bytes[i] === 0) zero = 1;
  }
  return (high & 0x80808080) === 0 && zero === 0;
}

function validUtf8(bytes: Uint8Array): boolean {
  const decoder = new TextDecoder('utf-8', { fatal: true });
  try {
    for (let i = 0; i < bytes.length; i += CHUNK) decoder.decode(bytes.subarray(i, Math.min(bytes.length, i + CHUNK)), { stream: true });
    decoder.decode();
    return true;
  } catch {
    return false;
  }
}

/** Bytes of the dialect's sample (sampleText). */
export const SAMPLE_BYTES = 64 * 1024;

/** The first records as text, for sniffing the dialect: at most `limit` bytes, cut after the last whole line. */
export function sampleText(bytes: Uint8Array, start: number, limit = SAMPLE_BYTES): string {
  let end = Math.min(bytes.length, start + limit);
  if (end < bytes.length) {
    let cut = end;
    while (cut > start && bytes[cut - 1] !== 0x0a && bytes[cut - 1] !== 0x0d) cut--;
    if (cut > start) end = cut;
    else while (end > start && (bytes[end] & 0xc0) === 0x80) end--; // never split a UTF-8 sequence
  }
  return new TextDecoder('utf-8').decode(bytes.subarray(start, end));
}
