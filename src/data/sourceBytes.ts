/**
 * The data file's bytes, checked to be UTF-8 text before any record is read: a UTF-16 file, a byte
 * that does not fit UTF-8, or a NUL byte (no text file holds one; a binary or device file does) is
 * refused with its offset, never with the file's content. A UTF-8 byte-order mark is skipped.
 *
 * One pass: pure ASCII (the common case for logs) needs no decoding at all; otherwise the bytes
 * from the first non-ASCII one are checked by a fatal TextDecoder in 1 MiB pieces, so a large file
 * is never held twice (as bytes and as a string).
 */
import { firstInvalidUtf8Byte } from './sourceText';

export type SourceBytes = { ok: true; bytes: Uint8Array; start: number } | { ok: false; kind: 'not-utf8' | 'not-text'; reason: string };

const CHUNK = 1 << 20;

export function sourceBytes(source: string | Uint8Array): SourceBytes {
  const bytes = typeof source === 'string' ? new TextEncoder().encode(source) : source;
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    return { ok: false, kind: 'not-utf8', reason: 'the file is UTF-16 text (it starts with a UTF-16 byte-order mark); save it as UTF-8 CSV and import again' };
  }
  const nul = bytes.indexOf(0);
  if (nul >= 0) return { ok: false, kind: 'not-text', reason: `byte ${nul + 1} is a NUL byte, which no CSV text holds; this is not a text file (choose the CSV export of the log)` };
  if (!isAscii(bytes) && !validUtf8(bytes)) {
    const offset = firstInvalidUtf8Byte(bytes);
    return {
      ok: false, kind: 'not-utf8',
      reason: `the file is not UTF-8 text (byte ${offset + 1} is 0x${bytes[offset].toString(16).padStart(2, '0')}); save it as UTF-8 CSV and import again`,
    };
  }
  const start = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
  return { ok: true, bytes, start };
}

/** No byte has its high bit set: four bytes at a time over the aligned middle. */
function isAscii(bytes: Uint8Array): boolean {
  const head = Math.min(bytes.length, (4 - (bytes.byteOffset % 4)) % 4);
  const words = (bytes.length - head) >> 2;
  let high = 0;
  for (let i = 0; i < head; i++) high |= bytes[i];
  const view = new Uint32Array(bytes.buffer, bytes.byteOffset + head, words);
  for (let i = 0; i < words; i++) high |= view[i];
  for (let i = head + 4 * words; i < bytes.length; i++) high |= bytes[i];
  return (high & 0x80808080) === 0;
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

/** The first records as text, for sniffing the dialect: at most `limit` bytes, cut after the last whole line. */
export function sampleText(bytes: Uint8Array, start: number, limit = 64 * 1024): string {
  let end = Math.min(bytes.length, start + limit);
  if (end < bytes.length) {
    let cut = end;
    while (cut > start && bytes[cut - 1] !== 0x0a && bytes[cut - 1] !== 0x0d) cut--;
    if (cut > start) end = cut;
    else while (end > start && (bytes[end] & 0xc0) === 0x80) end--; // never split a UTF-8 sequence
  }
  return new TextDecoder('utf-8').decode(bytes.subarray(start, end));
}
