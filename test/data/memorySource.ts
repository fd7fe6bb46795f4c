import type { PieceSource } from '../../src/data/pieceSource';

/** The bytes as a file read by position, at most `chunk` bytes a read (a short read, as read(2) may give). */
export function memorySource(bytes: Uint8Array, chunk = Infinity): PieceSource {
  return {
    byteLength: bytes.length,
    read: (into, offset, length, position) => {
      const n = Math.max(0, Math.min(length, chunk, bytes.length - position));
      into.set(bytes.subarray(position, position + n), offset);
      return n;
    },
  };
}
