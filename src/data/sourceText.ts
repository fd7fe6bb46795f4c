/**
 * File bytes → text. Logs arrive as UTF-8 with or without a byte-order mark; anything else is
 * refused with the offset of the first bad byte rather than decoded into replacement characters
 * that would later surface as puzzling "not a number" cells.
 */
export type TextReading = { ok: true; text: string } | { ok: false; reason: string };

export function sourceText(source: string | Uint8Array): TextReading {
  if (typeof source === 'string') return { ok: true, text: stripByteOrderMark(source) };
  if ((source[0] === 0xff && source[1] === 0xfe) || (source[0] === 0xfe && source[1] === 0xff)) {
    return { ok: false, reason: 'the file is UTF-16 text (it starts with a UTF-16 byte-order mark); save it as UTF-8 CSV and import again' };
  }
  try {
    const text = new TextDecoder('utf-8', { fatal: true, ignoreBOM: false }).decode(source);
    return { ok: true, text: stripByteOrderMark(text) };
  } catch {
    const offset = firstInvalidUtf8Byte(source);
    return {
      ok: false,
      reason: `the file is not UTF-8 text (byte ${offset + 1} is 0x${source[offset].toString(16).padStart(2, '0')}); save it as UTF-8 CSV and import again`,
    };
  }
}

function stripByteOrderMark(text: string): string {
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
