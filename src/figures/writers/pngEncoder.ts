/**
 * A minimal PNG encoder for small RGBA bitmaps (the heat-map grid and colour ramp embedded in an
 * SVG export): 8-bit RGBA, no interlace, filter type 0 on every row, and a zlib stream of stored
 * (uncompressed) deflate blocks (RFC 1950 / RFC 1951 §3.2.4). The bitmaps are a few thousand
 * pixels, so compression would save little and needs no code of its own here.
 *
 * Layout: rgba is height×width×4 row-major, row 0 at the top.
 */
import type { Raster } from '../parts/raster';
import { adler32 } from './adler32';
import { concatBytes, PNG_SIGNATURE, PngFormatError, pngChunk } from './pngChunks';

/** Largest stored deflate block (LEN is 16 bits). */
const STORED_BLOCK = 65535;

export function encodePng(raster: Raster): Uint8Array {
  const { width, height, rgba } = raster;
  if (!Number.isInteger(width) || !Number.isInteger(height) || width < 1 || height < 1) {
    throw new PngFormatError(`bitmap: expected a positive whole width and height, got ${width}×${height}`);
  }
  if (rgba.length !== width * height * 4) throw new PngFormatError(`bitmap: expected ${width}×${height}×4 = ${width * height * 4} bytes, got ${rgba.length}`);
  const header = new Uint8Array(13), view = new DataView(header.buffer);
  view.setUint32(0, width);
  view.setUint32(4, height);
  header.set([8, 6, 0, 0, 0], 8); // bit depth 8, colour type 6 (RGBA), deflate, filter method 0, no interlace
  return concatBytes([PNG_SIGNATURE, pngChunk('IHDR', header), pngChunk('IDAT', zlibStored(filteredRows(raster))), pngChunk('IEND', new Uint8Array(0))]);
}

/** Each row prefixed with filter type 0 (None), PNG §9.2. */
function filteredRows({ width, height, rgba }: Raster): Uint8Array {
  const stride = width * 4, out = new Uint8Array(height * (stride + 1));
  for (let row = 0; row < height; row++) out.set(rgba.subarray(row * stride, (row + 1) * stride), row * (stride + 1) + 1);
  return out;
}

function zlibStored(data: Uint8Array): Uint8Array {
  const blocks = Math.max(1, Math.ceil(data.length / STORED_BLOCK));
  const out = new Uint8Array(2 + blocks * 5 + data.length + 4), view = new DataView(out.buffer);
  out[0] = 0x78; // CMF: deflate, 32 K window
  out[1] = 0x01; // FLG: no dictionary, fastest; (0x78·256 + 0x01) is a multiple of 31 (RFC 1950 §2.2)
  let at = 2;
  for (let b = 0; b < blocks; b++) {
    const start = b * STORED_BLOCK, length = Math.min(STORED_BLOCK, data.length - start);
    out[at] = b === blocks - 1 ? 1 : 0; // BFINAL, BTYPE = 00 (stored)
    view.setUint16(at + 1, length, true);
    view.setUint16(at + 3, ~length & 0xffff, true);
    out.set(data.subarray(start, start + length), at + 5);
    at += 5 + length;
  }
  view.setUint32(at, adler32(data));
  return out;
}
