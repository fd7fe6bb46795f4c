/**
 * CRC-32 as PNG uses it (W3C PNG 2nd ed., §5.5 and Annex D; the same CRC as ISO 3309 / ITU-T V.42,
 * catalogued as CRC-32/ISO-HDLC): reflected polynomial 0xEDB88320, register preset to all ones,
 * final complement. Table-driven, one byte at a time (Sarwate 1988).
 */
const TABLE = buildTable();

function buildTable(): Uint32Array {
  const table = new Uint32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    table[n] = c >>> 0;
  }
  return table;
}

/** CRC of bytes[start, end), continuing from a previous crc (0 to start). */
export function crc32(bytes: Uint8Array, start = 0, end = bytes.length, previous = 0): number {
  let c = (previous ^ 0xffffffff) >>> 0;
  for (let i = start; i < end; i++) c = TABLE[(c ^ bytes[i]) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}
