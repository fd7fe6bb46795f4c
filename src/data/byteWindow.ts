/**
 * The bytes of a file read in pieces (pieceSource.ts) that the record reader sees at once: a
 * window that slides along the file. advance() keeps the bytes from the record being read onwards,
 * moves them to the front and fills the rest from the file; only a record longer than the whole
 * window makes it grow (doubling, up to the rest of the file: a quote never closed runs there).
 */
import { readFully, type PieceSource } from './pieceSource';

export class ByteWindow {
  /** The bytes held, window-relative: view[0] is file byte `fileOffset`. */
  view: Uint8Array;
  /** True once the view reaches the end of the file. */
  final = false;
  private buffer: Uint8Array;
  /** File offset of the byte after the view. */
  private next: number;

  /** `scratch`, when at least a window long, is used as the window's memory (a buffer an earlier pass over the file filled already). */
  constructor(private readonly source: PieceSource, from: number, windowBytes: number, scratch?: Uint8Array) {
    const length = Math.max(1, Math.min(windowBytes, source.byteLength - from));
    this.buffer = scratch && scratch.length >= length ? scratch.subarray(0, length) : new Uint8Array(length);
    this.next = from;
    this.view = this.buffer.subarray(0, 0);
    this.advance(0);
  }

  /** Keep view[keepFrom…] (moved to the front), fill the rest from the file; the new view. */
  advance(keepFrom: number): Uint8Array {
    const keep = this.view.length - keepFrom;
    if (keep === this.buffer.length) {
      const larger = new Uint8Array(Math.min(2 * this.buffer.length, keep + this.source.byteLength - this.next));
      larger.set(this.view.subarray(keepFrom));
      this.buffer = larger;
    } else this.buffer.copyWithin(0, keepFrom, this.view.length);
    const length = Math.min(this.buffer.length - keep, this.source.byteLength - this.next);
    readFully(this.source, this.buffer, keep, length, this.next);
    this.next += length;
    this.final = this.next === this.source.byteLength;
    this.view = this.buffer.subarray(0, keep + length);
    return this.view;
  }
}
