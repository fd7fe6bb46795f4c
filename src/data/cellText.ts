/**
 * The text of one CSV cell, decoded from the file's bytes only when it is needed (a label, a
 * timestamp that is not a plain number, a message about a bad cell). A quoted cell's doubled
 * quotes ("") are undone (RFC 4180 §2.7). `limit` caps the bytes decoded, so a message about a
 * cell that swallowed megabytes costs only the few characters it shows.
 */
import { QUOTE } from './csvScanner';

const decoder = new TextDecoder('utf-8');

export function cellText(bytes: Uint8Array, start: number, end: number, escaped: number, limit = Infinity): string {
  const stop = Math.min(end, start + limit);
  if (!escaped) return decoder.decode(bytes.subarray(start, stop));
  const out = new Uint8Array(stop - start);
  let n = 0;
  for (let i = start; i < stop; i++) {
    out[n++] = bytes[i];
    if (bytes[i] === QUOTE && bytes[i + 1] === QUOTE) i++;
  }
  return decoder.decode(out.subarray(0, n));
}

/** True when every byte of [start, end) is a blank (space, tab, or another control below 0x21). */
export function isBlank(bytes: Uint8Array, start: number, end: number): boolean {
  for (let i = start; i < end; i++) if (bytes[i] > 0x20) return false;
  return true;
}

/** True when bytes[a, a+length) equals bytes[b, b+length). */
export function sameBytes(bytes: Uint8Array, a: number, b: number, length: number): boolean {
  for (let k = 0; k < length; k++) if (bytes[a + k] !== bytes[b + k]) return false;
  return true;
}
