/**
 * The data file's fingerprint hashed in pieces between yields (dataFingerprintSteps) is the same
 * SHA-256 as hashing it at once, and as Node's own crypto (OpenSSL) gives: across piece boundaries,
 * for an empty file, and for a file of several pieces.
 */
import { createHash } from 'node:crypto';
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex } from '@noble/hashes/utils.js';
import { describe, expect, it } from 'vitest';
import { runSteps } from '../../src/core/fqe/cancellation';
import { createRandom } from '../../src/core/random';
import { dataFingerprintSteps } from '../../src/pipeline/dataFingerprint';

function bytesOf(length: number): Uint8Array {
  const rng = createRandom(3), bytes = new Uint8Array(length);
  for (let i = 0; i < length; i++) bytes[i] = Math.floor(256 * rng.uniform());
  return bytes;
}

describe('dataFingerprintSteps', () => {
  it.each([0, 1, (4 << 20) - 1, 4 << 20, (9 << 20) + 5])('%i bytes: the one-shot hash and OpenSSL’s', (length) => {
    const bytes = bytesOf(length);
    const openssl = createHash('sha256').update(bytes).digest('hex');
    expect(runSteps(dataFingerprintSteps(bytes))).toBe(openssl);
    expect(bytesToHex(sha256(bytes))).toBe(openssl); // the same library hashing at once
  });
});
