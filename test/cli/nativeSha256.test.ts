/**
 * The CLI's native SHA-256 (src/cli/nativeSha256.ts) gives the data file the same fingerprint as
 * the portable one every host can run: the FIPS 180-2 Appendix B examples ("abc" and the 448-bit
 * message; digests quoted from memory of that appendix, and both hashes must give them), and pieces across the yield
 * boundary of dataFingerprintSteps.
 */
import { describe, expect, it } from 'vitest';
import { runSteps } from '../../src/core/fqe/cancellation';
import { createRandom } from '../../src/core/random';
import { nativeSha256 } from '../../src/cli/nativeSha256';
import { dataFingerprintSteps, portableSha256 } from '../../src/pipeline/dataFingerprint';

const FIPS_EXAMPLES: [string, string][] = [
  ['abc', 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'],
  ['abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq', '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1'],
];

function bytesOf(length: number): Uint8Array {
  const rng = createRandom(5), bytes = new Uint8Array(length);
  for (let i = 0; i < length; i++) bytes[i] = Math.floor(256 * rng.uniform());
  return bytes;
}

describe('nativeSha256', () => {
  it.each(FIPS_EXAMPLES)('FIPS 180-2 example "%s"', (message, digest) => {
    const bytes = new TextEncoder().encode(message);
    expect(runSteps(dataFingerprintSteps(bytes, nativeSha256))).toBe(digest);
    expect(runSteps(dataFingerprintSteps(bytes, portableSha256))).toBe(digest);
  });

  it.each([0, (4 << 20) + 3])('%i bytes in pieces: the same fingerprint as the portable hash', (length) => {
    const bytes = bytesOf(length);
    expect(runSteps(dataFingerprintSteps(bytes, nativeSha256))).toBe(runSteps(dataFingerprintSteps(bytes)));
  });
});
