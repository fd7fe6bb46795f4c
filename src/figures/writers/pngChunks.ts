/**
 * Reading and writing PNG chunks (W3C PNG 2nd ed., §5.3): 4-byte big-endian data length, 4-byte
 * type, data, 4-byte CRC-32 of type + data. Used to read the size from IHDR (§11.2.2) and to put a
 * pHYs chunk (§11.3.5.3) right after IHDR, which satisfies its rule "before the first IDAT".
 */
import { crc32 } from './crc32';

export const PNG_SIGNATURE = Uint8Array.of(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a);

/** Metres per inch, exactly (international inch). */
const METRES_PER_INCH = 0.0254;

export class PngFormatError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PngFormatError';
  }
}

export interface PngChunk {
  readonly type: string;
  /** Offset of the chunk's length field in the file. */
  readonly offset: number;
  readonly dataLength: number;
}

export function pngChunk(type: string, data: Uint8Array): Uint8Array {
  if (!/^[A-Za-z]{4}$/.test(type)) throw new PngFormatError(`chunk type: expected four ASCII letters, got "${type}"`);
  const out = new Uint8Array(12 + data.length), view = new DataView(out.buffer);
  view.setUint32(0, data.length);
  for (let i = 0; i < 4; i++) out[4 + i] = type.charCodeAt(i);
  out.set(data, 8);
  view.setUint32(8 + data.length, crc32(out, 4, 8 + data.length));
  return out;
}

export function readChunks(png: Uint8Array): PngChunk[] {
  if (png.length < 8 || PNG_SIGNATURE.some((b, i) => png[i] !== b)) throw new PngFormatError('PNG: the file does not start with the PNG signature');
  const view = new DataView(png.buffer, png.byteOffset, png.byteLength), chunks: PngChunk[] = [];
  let offset = 8;
  while (offset < png.length) {
    if (offset + 12 > png.length) throw new PngFormatError(`PNG: chunk at byte ${offset} is cut short`);
    const dataLength = view.getUint32(offset);
    const type = String.fromCharCode(png[offset + 4], png[offset + 5], png[offset + 6], png[offset + 7]);
    if (offset + 12 + dataLength > png.length) throw new PngFormatError(`PNG: chunk ${type} at byte ${offset} runs past the end`);
    chunks.push({ type, offset, dataLength });
    offset += 12 + dataLength;
    if (type === 'IEND') break;
  }
  if (chunks[0]?.type !== 'IHDR') throw new PngFormatError('PNG: the first chunk is not IHDR');
  return chunks;
}

/** Width and height in pixels from IHDR. */
export function pngSize(png: Uint8Array): { width: number; height: number } {
  const ihdr = readChunks(png)[0], view = new DataView(png.buffer, png.byteOffset, png.byteLength);
  return { width: view.getUint32(ihdr.offset + 8), height: view.getUint32(ihdr.offset + 12) };
}

/** Pixels per metre for a resolution in dots per inch, rounded to the nearest integer. */
export function pixelsPerMetre(dpi: number): number {
  return Math.round(dpi / METRES_PER_INCH);
}

/** The complete pHYs chunk: pixels per unit x and y (uint32 each), unit 1 = metre. */
export function physChunk(dpi: number): Uint8Array {
  if (!Number.isFinite(dpi) || dpi <= 0) throw new PngFormatError(`dpi: expected a positive number, got ${dpi}`);
  const data = new Uint8Array(9), view = new DataView(data.buffer), ppm = pixelsPerMetre(dpi);
  view.setUint32(0, ppm);
  view.setUint32(4, ppm);
  data[8] = 1;
  return pngChunk('pHYs', data);
}

/** The file with its pHYs (if any) replaced by one for dpi, placed right after IHDR. */
export function withPhysicalResolution(png: Uint8Array, dpi: number): Uint8Array {
  const chunks = readChunks(png), ihdr = chunks[0], phys = physChunk(dpi);
  const afterIhdr = ihdr.offset + 12 + ihdr.dataLength;
  const parts: Uint8Array[] = [png.subarray(0, afterIhdr), phys];
  let cursor = afterIhdr;
  for (const c of chunks.slice(1)) {
    if (c.type !== 'pHYs') continue;
    parts.push(png.subarray(cursor, c.offset));
    cursor = c.offset + 12 + c.dataLength;
  }
  parts.push(png.subarray(cursor));
  return concatBytes(parts);
}

/** The byte arrays one after another in a new array. */
export function concatBytes(parts: readonly Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.length;
  }
  return out;
}

/** Resolution from the pHYs chunk in dots per inch, or null without one (or with unit 0, aspect only). */
export function pngDpi(png: Uint8Array): { x: number; y: number } | null {
  const phys = readChunks(png).find((c) => c.type === 'pHYs');
  if (!phys) return null;
  const view = new DataView(png.buffer, png.byteOffset, png.byteLength), at = phys.offset + 8;
  if (png[at + 8] !== 1) return null;
  return { x: view.getUint32(at) * METRES_PER_INCH, y: view.getUint32(at + 4) * METRES_PER_INCH };
}
