/**
 * The first `headBytes` of a data file as text, read as the whole file would be (sourceText.ts),
 * without decoding the rest: a first look at a 1,000,000-row log needs its header and a few rows,
 * not 92 MB of string. Only plain UTF-8 (isPlainUtf8: found by a word-at-a-time pass, no text
 * made) is read by its head; any other file — UTF-16, Windows-1252, a zero byte, a file no longer
 * than the head — is read whole by sourceText, so its encoding, text and refusals stay the same.
 *
 * The head may end inside a multi-byte character: the decoder reads it as a stream
 * (WHATWG Encoding Standard, decode with `stream: true`), which keeps such a cut sequence back
 * instead of writing U+FFFD for it, so the head's text is a prefix of the whole file's.
 */
import { isPlainUtf8 } from './sourceBytes';
import { byteOrderMark, sourceText, stripByteOrderMark, type TextReading } from './sourceText';

/** The reading, and whether its text is the whole file's or the head's only. */
export type HeadReading = TextReading & { whole: boolean };

export function sourceHead(bytes: Uint8Array, headBytes: number): HeadReading {
  if (bytes.length <= headBytes || !isPlainUtf8(bytes)) return { ...sourceText(bytes), whole: true };
  const marked = byteOrderMark(bytes) === 'UTF-8';
  const text = new TextDecoder('utf-8').decode(bytes.subarray(0, headBytes), { stream: true });
  return { ok: true, text: stripByteOrderMark(text), encoding: 'UTF-8', how: marked ? 'byte-order mark' : 'detected', whole: false };
}
