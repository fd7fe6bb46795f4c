/**
 * The content hash of a data file, stored in the project so that a changed or replaced file is
 * noticed when the project is reopened. SHA-256 (FIPS 180-4) from @noble/hashes, which runs the same
 * in Node, a worker and the renderer.
 */
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex } from '@noble/hashes/utils.js';

export function dataFingerprint(bytes: Uint8Array): string {
  return bytesToHex(sha256(bytes));
}
