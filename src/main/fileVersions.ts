/**
 * Which version of each project file this app last read or wrote, as a SHA-256 of its bytes
 * (FIPS 180-4), so that a save can tell when another program changed the file in between and ask
 * before replacing that change. A content fingerprint, not mtime + size: a file rewritten within
 * the file system's time resolution with the same length is still told apart.
 */
import { createHash } from 'node:crypto';
import { pathKey, type PathFlavour } from './pathIdentity';

export interface FileVersions {
  /** Record the bytes of `path` as this app last saw them. */
  remember(path: string, bytes: Uint8Array | string): void;
  /** Remember a fingerprint recorded earlier (a recovery copy's). */
  adopt(path: string, sha256: string): void;
  /** The fingerprint remembered for `path`, if any. */
  known(path: string): string | undefined;
  /** True when `bytes` (the file as it is now) differ from the version remembered; false when none is. */
  changed(path: string, bytes: Uint8Array | string): boolean;
}

export function fingerprint(bytes: Uint8Array | string): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** Bytes hashed between two turns of the event loop by fingerprintPaced: ~5–10 ms of SHA-256 on these machines. */
export const FINGERPRINT_SLICE_BYTES = 8 * 1024 * 1024;

/**
 * The same fingerprint of a data file's bytes (up to MAX_DATA_BYTES, 1 GiB), hashed a slice at a time
 * with a turn of the event loop between slices, so the main process keeps answering menus and other
 * requests meanwhile (one call took ~0.6 s at 1 GiB). SHA-256 is defined over the byte stream, so
 * hashing it in slices gives the same digest (FIPS 180-4 §6.2).
 */
export async function fingerprintPaced(bytes: Uint8Array, sliceBytes = FINGERPRINT_SLICE_BYTES): Promise<string> {
  const hash = createHash('sha256');
  for (let at = 0; at < bytes.length; at += sliceBytes) {
    if (at > 0) await new Promise<void>((resolve) => setImmediate(resolve));
    hash.update(bytes.subarray(at, Math.min(at + sliceBytes, bytes.length)));
  }
  return hash.digest('hex');
}

export function createFileVersions(flavour: PathFlavour): FileVersions {
  const versions = new Map<string, string>();
  const key = (path: string) => pathKey(path, flavour);
  return {
    remember: (path, bytes) => void versions.set(key(path), fingerprint(bytes)),
    adopt: (path, sha256) => void versions.set(key(path), sha256),
    known: (path) => versions.get(key(path)),
    changed(path, bytes) {
      const seen = versions.get(key(path));
      return seen !== undefined && seen !== fingerprint(bytes);
    },
  };
}
