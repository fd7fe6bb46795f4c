/**
 * The fingerprint taken while a file is read in pieces (pipeline/dataFingerprint.ts hashedWhileRead)
 * is the SHA-256 of the whole file, checked against Node's crypto (OpenSSL) over the bytes at once,
 * whatever the readers' order: the import's head, then its first pass from byte 0 (overlapping the
 * head), then its records' pass; reads of random lengths that go back and overlap; a read from byte 0
 * starting the hash afresh (a file rewritten after its head was read); and it says nothing (null) while
 * a byte was never read.
 */
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { createRandom } from '../../src/core/random';
import { hashedWhileRead } from '../../src/pipeline/dataFingerprint';
import { nativeSha256 } from '../../src/cli/nativeSha256';
import type { PieceSource } from '../../src/data/pieceSource';
import { memorySource } from '../data/memorySource';

const rng = createRandom(11);
const bytes = Uint8Array.from({ length: 100_003 }, () => Math.floor(256 * rng.uniform()));
const openssl = createHash('sha256').update(bytes).digest('hex');

/** The bytes as a file that gives at most `most` bytes a read. */
const fileOf = (most: number): PieceSource => memorySource(bytes, most);

function readAt(source: PieceSource, position: number, length: number): void {
  source.read(new Uint8Array(length + 5), 5, length, position);
}

describe('hashedWhileRead', () => {
  it('the import’s order (head, first pass from 0, records): the file’s SHA-256, complete after the first pass', () => {
    const hashed = hashedWhileRead(fileOf(4096), nativeSha256);
    for (let at = 0; at < 20_000; at += 4096) readAt(hashed.source, at, 4096); // the head
    for (let at = 0; at < bytes.length; at += 4096) {
      expect(hashed.hex()).toBeNull();
      readAt(hashed.source, at, 4096);
    }
    expect(hashed.hex()).toBe(openssl);
    for (let at = 300; at < bytes.length; at += 4096) readAt(hashed.source, at, 4096); // the records' pass changes nothing
    expect(hashed.hex()).toBe(openssl);
  });

  it('reads of random lengths that go back and overlap: the same digest, by either SHA-256', () => {
    for (const create of [nativeSha256, undefined]) {
      const hashed = hashedWhileRead(fileOf(7001), create);
      let frontier = 0;
      while (frontier < bytes.length) {
        const position = frontier === 0 ? 0 : Math.max(1, frontier - Math.floor(3000 * rng.uniform())); // back to byte 0 would start afresh (below)
        const length = 1 + Math.floor(9000 * rng.uniform());
        readAt(hashed.source, position, Math.min(length, bytes.length - position));
        frontier = Math.max(frontier, Math.min(position + Math.min(length, 7001), bytes.length));
      }
      expect(hashed.hex()).toBe(openssl);
    }
  });

  it('a read from byte 0 starts afresh: a file rewritten (same length) after its head was read gives the digest of the pass that followed, not a mixture', () => {
    const first = bytes.slice();
    first[10] ^= 1; // the head as first read, before the file was rewritten
    const firstReads: PieceSource = memorySource(first, 4096), later = fileOf(4096);
    let headDone = false;
    const file: PieceSource = { byteLength: bytes.length, read: (into, offset, length, position) => (headDone ? later : firstReads).read(into, offset, length, position) };
    const hashed = hashedWhileRead(file, nativeSha256);
    for (let at = 0; at < 20_000; at += 4096) readAt(hashed.source, at, 4096); // the head
    headDone = true;
    for (let at = 0; at < bytes.length; at += 4096) readAt(hashed.source, at, 4096); // the first pass, over the file as it is now
    expect(hashed.hex()).toBe(openssl);
  });

  it('a byte never read leaves no digest, even when every later byte was read', () => {
    const hashed = hashedWhileRead(fileOf(1 << 20));
    readAt(hashed.source, 0, 1000);
    readAt(hashed.source, 1001, bytes.length - 1001);
    expect(hashed.hex()).toBeNull();
  });
});
