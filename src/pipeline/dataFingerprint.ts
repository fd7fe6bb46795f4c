/**
 * The content hash of a data file, stored in the project so that a changed or replaced file is
 * noticed when the project is reopened. SHA-256 (FIPS 180-4) from @noble/hashes, which runs the same
 * in Node, a worker and the renderer.
 */
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex } from '@noble/hashes/utils.js';
import type { PassSteps } from '../core/fqe/cancellation';

/** Bytes hashed between two yields of dataFingerprintSteps (a choice: tens of milliseconds). */
const BYTES_PER_STEP = 4 << 20;

/** The SHA-256 of the data file's bytes (hex), as a pass that yields after every BYTES_PER_STEP bytes; SHA-256 fed in pieces is the same hash (FIPS 180-4 §6.2: the blocks are processed in order either way). */
export function* dataFingerprintSteps(bytes: Uint8Array): PassSteps<string> {
  const hash = sha256.create();
  for (let at = 0; at < bytes.length; at += BYTES_PER_STEP) {
    hash.update(bytes.subarray(at, Math.min(bytes.length, at + BYTES_PER_STEP)));
    yield;
  }
  return bytesToHex(hash.digest());
}
