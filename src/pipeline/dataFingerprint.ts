/**
 * The content hash of a data file, stored in the project so that a changed or replaced file is
 * noticed when the project is reopened. SHA-256 (FIPS 180-4), by default from @noble/hashes, which
 * runs the same in Node, a worker and the renderer; a host with a native SHA-256 may hand its own
 * (the CLI hands Node's, src/cli/nativeSha256.ts: some ten times faster on a 90 MB log).
 */
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex } from '@noble/hashes/utils.js';
import type { PassSteps } from '../core/fqe/cancellation';
import { readFully, type PieceSource } from '../data/pieceSource';

/** SHA-256 fed in pieces: update with each piece in order, then the digest as lowercase hex. */
export interface Sha256Stream {
  update(piece: Uint8Array): void;
  hex(): string;
}

/** Starts a fresh SHA-256 stream. */
export type Sha256Factory = () => Sha256Stream;

/** The SHA-256 every host can run (pure JavaScript, @noble/hashes). */
export const portableSha256: Sha256Factory = () => {
  const hash = sha256.create();
  return { update: (piece) => void hash.update(piece), hex: () => bytesToHex(hash.digest()) };
};

/** Bytes hashed between two yields of dataFingerprintSteps (a choice: tens of milliseconds on the portable hash). */
const BYTES_PER_STEP = 4 << 20;

/** The SHA-256 of the data file's bytes (hex), as a pass that yields after every BYTES_PER_STEP bytes; SHA-256 fed in pieces is the same hash (FIPS 180-4 §6.2: the blocks are processed in order either way). */
export function* dataFingerprintSteps(bytes: Uint8Array, create: Sha256Factory = portableSha256): PassSteps<string> {
  const hash = create();
  for (let at = 0; at < bytes.length; at += BYTES_PER_STEP) {
    hash.update(bytes.subarray(at, Math.min(bytes.length, at + BYTES_PER_STEP)));
    yield;
  }
  return hash.hex();
}

/**
 * The same hash taken while a file read in pieces (data/pieceSource.ts) is read for the import, so
 * the fingerprint costs no read of its own: every read passes through `source`, and the bytes of a
 * read that reach past the part hashed so far extend it, in file order (FIPS 180-4 §6.2, as above).
 * The import reads the file's head, then every piece from the start (pieceFacts.ts), so the hash is
 * whole after its first pass; `hex()` is null while some byte was never read. A read from byte 0 starts
 * the hash afresh, so the digest is that of one pass from the start (the first pass, or the whole-file
 * read after it), never of the head as first read joined to the rest of a file rewritten in between.
 * A rewrite at the same length between the passes leaves no trace in the bytes; the host's fstat does
 * (PieceSource.unchangedSinceOpened, asked after the last read in openProject.ts).
 */
export interface HashedPieces {
  readonly source: PieceSource;
  hex(): string | null;
}

export function hashedWhileRead(file: PieceSource, create: Sha256Factory = portableSha256): HashedPieces {
  let hash = create();
  let hashed = 0; // file bytes [0, hashed) are in the hash
  const read = (into: Uint8Array, offset: number, length: number, position: number): number => {
    const n = file.read(into, offset, length, position);
    if (n > 0 && position === 0 && hashed > 0) [hash, hashed] = [create(), 0]; // a pass from the start: hash what it reads
    if (n > 0 && position <= hashed && position + n > hashed) {
      hash.update(into.subarray(offset + hashed - position, offset + n));
      hashed = position + n;
    }
    return n;
  };
  let digest: string | null = null; // a hash gives its digest once
  const hex = () => (digest ??= hashed >= file.byteLength ? hash.hex() : null);
  return { source: { byteLength: file.byteLength, read }, hex };
}

/** The same hash of a file read in pieces, read a piece at a time into one buffer: where the import left bytes unread (hashedWhileRead). */
export function* pieceFingerprintSteps(source: PieceSource, create: Sha256Factory = portableSha256): PassSteps<string> {
  const hash = create();
  const piece = new Uint8Array(Math.min(BYTES_PER_STEP, source.byteLength));
  for (let at = 0; at < source.byteLength; at += piece.length) {
    const bytes = piece.subarray(0, Math.min(piece.length, source.byteLength - at));
    readFully(source, bytes, 0, bytes.length, at);
    hash.update(bytes);
    yield;
  }
  return hash.hex();
}
