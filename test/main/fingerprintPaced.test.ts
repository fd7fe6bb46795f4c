/**
 * The main process hashes a data file a slice at a time (fileVersions.ts fingerprintPaced) so it keeps
 * answering while it hashes. SHA-256 over a byte stream does not depend on how the stream is cut
 * (FIPS 180-4 §6.2): the digest must equal the one-call digest of Node's crypto, and the known
 * digest of the empty input (FIPS 180-4 test vectors; e3b0c442…b855).
 */
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { fingerprintPaced } from '../../src/main/fileVersions';

describe('fingerprintPaced', () => {
  it('gives the one-call digest whatever the slice, ends included', async () => {
    const bytes = new Uint8Array(100_003).map((_, i) => (i * 131 + 7) % 251);
    const whole = createHash('sha256').update(bytes).digest('hex');
    for (const slice of [1_000, 4_096, 100_003, 1 << 20]) expect(await fingerprintPaced(bytes, slice)).toBe(whole);
  });
  it('gives the empty input its known digest', async () => {
    expect(await fingerprintPaced(new Uint8Array(0))).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });
  it('lets other work run between slices', async () => {
    let ran = false;
    setImmediate(() => { ran = true; });
    await fingerprintPaced(new Uint8Array(10_000), 1_000);
    expect(ran).toBe(true);
  });
});
