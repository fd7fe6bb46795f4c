/** Adler-32 checksum of a zlib stream's uncompressed data (RFC 1950 §8.2), modulus 65521. */
const MOD_ADLER = 65521;
/** Largest run of sums before a reduction keeps b below 2^53 safely (RFC 1950 reference code uses 5552 for 32-bit). */
const BLOCK = 5552;

export function adler32(bytes: Uint8Array): number {
  let a = 1, b = 0;
  for (let start = 0; start < bytes.length; start += BLOCK) {
    const end = Math.min(bytes.length, start + BLOCK);
    for (let i = start; i < end; i++) {
      a += bytes[i];
      b += a;
    }
    a %= MOD_ADLER;
    b %= MOD_ADLER;
  }
  return ((b << 16) | a) >>> 0;
}
