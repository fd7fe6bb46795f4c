/**
 * A minimal PNG encoder for the report's heat maps (8-bit RGB, no filtering), so a value surface
 * can be embedded as one small data URL instead of thousands of SVG rectangles — without a browser
 * or a native library. Format: PNG (W3C Recommendation, 2nd ed., 2003; RFC 2083): signature, IHDR,
 * IDAT, IEND chunks, each with a CRC-32 (ISO 3309, the polynomial 0xEDB88320 reflected). The
 * image data is a zlib stream (RFC 1950) of "stored" deflate blocks (RFC 1951 §3.2.4: no
 * compression, at most 65,535 bytes each) with the Adler-32 checksum; surfaces are small, so the
 * missing compression costs little.
 */
const SIGNATURE = [137, 80, 78, 71, 13, 10, 26, 10];
const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});

export class PngError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PngError';
  }
}

/** rgb: height×width×3 bytes, row-major from the top row. */
export function encodePng(width: number, height: number, rgb: Uint8Array): Uint8Array {
  if (!Number.isInteger(width) || !Number.isInteger(height) || width < 1 || height < 1) throw new PngError(`image size: expected whole numbers ≥ 1, got ${width}×${height}`);
  if (rgb.length !== width * height * 3) throw new PngError(`pixels: expected ${width}×${height}×3 = ${width * height * 3} bytes, got ${rgb.length}`);
  const raw = new Uint8Array(height * (1 + 3 * width)); // each row: filter type 0, then its pixels
  for (let y = 0; y < height; y++) raw.set(rgb.subarray(y * width * 3, (y + 1) * width * 3), y * (1 + 3 * width) + 1);
  const header = new Uint8Array(13);
  writeUint32(header, 0, width);
  writeUint32(header, 4, height);
  header.set([8, 2, 0, 0, 0], 8); // bit depth 8, colour type 2 (RGB), deflate, adaptive filtering, no interlace
  return concat([Uint8Array.from(SIGNATURE), chunk('IHDR', header), chunk('IDAT', zlibStored(raw)), chunk('IEND', new Uint8Array(0))]);
}

/** "data:image/png;base64,…" for an encoded PNG. */
export function pngDataUrl(png: Uint8Array): string {
  let binary = '';
  for (let i = 0; i < png.length; i += 0x8000) binary += String.fromCharCode(...png.subarray(i, i + 0x8000));
  return `data:image/png;base64,${btoa(binary)}`;
}

function zlibStored(data: Uint8Array): Uint8Array {
  const blocks = Math.max(1, Math.ceil(data.length / 65535));
  const out = new Uint8Array(2 + blocks * 5 + data.length + 4);
  out[0] = 0x78; // CMF: deflate, 32 KiB window
  out[1] = 0x01; // FLG: (0x78·256 + 0x01) is a multiple of 31, no dictionary
  let o = 2;
  for (let b = 0; b < blocks; b++) {
    const start = b * 65535, size = Math.min(65535, data.length - start);
    out[o++] = b === blocks - 1 ? 1 : 0; // BFINAL, BTYPE = 00 (stored)
    out[o++] = size & 0xff;
    out[o++] = size >>> 8;
    out[o++] = ~size & 0xff;
    out[o++] = (~size >>> 8) & 0xff;
    out.set(data.subarray(start, start + size), o);
    o += size;
  }
  writeUint32(out, o, adler32(data));
  return out;
}

function adler32(data: Uint8Array): number {
  let a = 1, b = 0;
  for (let i = 0; i < data.length; i++) {
    a = (a + data[i]) % 65521;
    b = (b + a) % 65521;
  }
  return ((b << 16) | a) >>> 0;
}

function chunk(type: string, data: Uint8Array): Uint8Array {
  const out = new Uint8Array(12 + data.length);
  writeUint32(out, 0, data.length);
  for (let i = 0; i < 4; i++) out[4 + i] = type.charCodeAt(i);
  out.set(data, 8);
  writeUint32(out, 8 + data.length, crc32(out.subarray(4, 8 + data.length)));
  return out;
}

function crc32(bytes: Uint8Array): number {
  let c = 0xffffffff;
  for (let i = 0; i < bytes.length; i++) c = CRC_TABLE[(c ^ bytes[i]) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function writeUint32(out: Uint8Array, offset: number, value: number): void {
  out[offset] = value >>> 24;
  out[offset + 1] = (value >>> 16) & 0xff;
  out[offset + 2] = (value >>> 8) & 0xff;
  out[offset + 3] = value & 0xff;
}

function concat(parts: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let o = 0;
  for (const p of parts) {
    out.set(p, o);
    o += p.length;
  }
  return out;
}
