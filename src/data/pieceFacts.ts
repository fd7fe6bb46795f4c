/**
 * The first pass over a file read in pieces (pieceSource.ts): what the whole-file import learns
 * from holding every byte, learnt a window at a time — whether the bytes are UTF-8 as they are
 * (sourceBytes.ts: ASCII without a zero byte, or valid UTF-8 without one, and no UTF-16 mark),
 * whether the file is blank, and how many line breaks it has (LF, and a CR not before an LF;
 * lineBreakScan.ts, one pass over each piece for these and the ASCII test), so the columns can be
 * sized once before the records are read.
 */
import type { PassSteps } from '../core/fqe/cancellation';
import { isBlank } from './cellText';
import { lineBreakScan } from './lineBreakScan';
import { readFully, type PieceSource } from './pieceSource';

export interface PieceFacts {
  /** The bytes are read as UTF-8 as they are (else the whole-file reader decodes them). */
  readonly plainUtf8: boolean;
  /** A UTF-8 byte-order mark opens the file. */
  readonly marked: boolean;
  /** Every byte after the mark is blank (cellText.ts isBlank). */
  readonly blank: boolean;
  /** Line breaks in the whole file, counted as recordBound counts them. */
  readonly lineBreaks: number;
}

const CR = 0x0d, LF = 0x0a;

/**
 * One pass over the file in pieces of `pieceBytes`, yielding after each, read into `piece` (a caller
 * that reads the file again in pieces passes the buffer it will use then, so the memory is filled once).
 */
export function* pieceFactsSteps(source: PieceSource, pieceBytes: number, scratch?: Uint8Array): PassSteps<PieceFacts> {
  const length = Math.min(pieceBytes, source.byteLength);
  const piece = scratch && scratch.length >= length ? scratch.subarray(0, length) : new Uint8Array(length);
  const decoder = new TextDecoder('utf-8', { fatal: true });
  let ascii = true, zero = false, valid = true, blank = true, lineBreaks = 0, marked = false, utf16Mark = false, lastWasCr = false;
  for (let at = 0; at < source.byteLength; at += piece.length) {
    const bytes = piece.subarray(0, Math.min(piece.length, source.byteLength - at));
    readFully(source, bytes, 0, bytes.length, at);
    if (at === 0) {
      marked = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf;
      utf16Mark = (bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff);
    }
    const scan = lineBreakScan(bytes);
    if (!scan.asciiWithoutZero) {
      ascii = false; // from here on every piece goes through the decoder; the ASCII pieces before leave it with nothing pending
      zero ||= bytes.indexOf(0) >= 0;
      valid &&= decodes(decoder, bytes);
    } else if (!ascii) valid &&= decodes(decoder, bytes);
    if (blank) blank = isBlank(bytes, at === 0 && marked ? 3 : 0, bytes.length);
    // A CR at the end of a piece is counted as lone; it is not when the next piece opens with an LF.
    lineBreaks += scan.lineBreaks - (lastWasCr && bytes[0] === LF ? 1 : 0);
    lastWasCr = bytes[bytes.length - 1] === CR;
    yield;
  }
  if (!ascii) valid &&= decodes(decoder, undefined);
  return { plainUtf8: !utf16Mark && (ascii || (!zero && valid)), marked, blank, lineBreaks };
}

function decodes(decoder: TextDecoder, bytes: Uint8Array | undefined): boolean {
  try {
    if (bytes) decoder.decode(bytes, { stream: true });
    else decoder.decode();
    return true;
  } catch {
    return false;
  }
}
