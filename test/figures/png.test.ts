import { describe, expect, it } from 'vitest';
import { crc32 as zlibCrc32, inflateSync } from 'node:zlib';
import { encodePng } from '../../src/figures/writers/pngEncoder';
import { physChunk, pixelsPerMetre, PngFormatError, pngChunk, pngDpi, pngSize, readChunks, withPhysicalResolution } from '../../src/figures/writers/pngChunks';

const bytes = (...values: number[]) => Uint8Array.from(values);

function smallPng(): Uint8Array {
  const rgba = new Uint8ClampedArray(3 * 2 * 4).map((_, i) => (i * 37) % 256);
  return encodePng({ width: 3, height: 2, rgba });
}

describe('pHYs (W3C PNG 2nd ed., §11.3.5.3)', () => {
  it('300 dpi is 11811 pixels per metre (300 / 0.0254 = 11811.02)', () => {
    expect(pixelsPerMetre(300)).toBe(11811);
    expect(pixelsPerMetre(96)).toBe(3780); // 96 / 0.0254 = 3779.53
  });

  it('chunk layout: length 9, "pHYs", x and y pixels per unit (uint32 big-endian), unit 1 = metre, CRC', () => {
    const chunk = physChunk(300);
    expect(chunk.length).toBe(21);
    expect(Array.from(chunk.subarray(0, 17))).toEqual([
      0, 0, 0, 9, 0x70, 0x48, 0x59, 0x73, // length, "pHYs"
      0x00, 0x00, 0x2e, 0x23, 0x00, 0x00, 0x2e, 0x23, // 11811 = 0x2E23, twice
      1,
    ]);
    const crc = new DataView(chunk.buffer).getUint32(17);
    expect(crc).toBe(zlibCrc32(chunk.subarray(4, 17))); // CRC over type + data, by an independent implementation
  });

  it('goes right after IHDR and reads back as the dpi', () => {
    const png = withPhysicalResolution(smallPng(), 300);
    expect(readChunks(png).map((c) => c.type)).toEqual(['IHDR', 'pHYs', 'IDAT', 'IEND']);
    const dpi = pngDpi(png)!;
    expect(dpi.x).toBeCloseTo(300, 2);
    expect(dpi.y).toBeCloseTo(300, 2);
    expect(pngSize(png)).toEqual({ width: 3, height: 2 });
  });

  it('replaces an existing pHYs rather than adding a second', () => {
    const twice = withPhysicalResolution(withPhysicalResolution(smallPng(), 72), 600);
    expect(readChunks(twice).filter((c) => c.type === 'pHYs')).toHaveLength(1);
    expect(pngDpi(twice)!.x).toBeCloseTo(600, 1);
  });

  it('refuses what is not a PNG, and a non-positive dpi', () => {
    expect(() => readChunks(bytes(1, 2, 3))).toThrow(PngFormatError);
    expect(() => physChunk(0)).toThrow(/dpi/);
    expect(() => pngChunk('IDATA', new Uint8Array(0))).toThrow(/four ASCII letters/);
  });
});

describe('encodePng (stored deflate)', () => {
  it('writes IHDR for 8-bit RGBA and an IDAT that zlib inflates to the filtered rows', () => {
    const png = smallPng(), chunks = readChunks(png), view = new DataView(png.buffer);
    expect(chunks.map((c) => c.type)).toEqual(['IHDR', 'IDAT', 'IEND']);
    const ihdr = chunks[0].offset + 8;
    expect([view.getUint32(ihdr), view.getUint32(ihdr + 4)]).toEqual([3, 2]);
    expect(Array.from(png.subarray(ihdr + 8, ihdr + 13))).toEqual([8, 6, 0, 0, 0]);
    const idat = chunks[1];
    const raw = inflateSync(png.subarray(idat.offset + 8, idat.offset + 8 + idat.dataLength)); // Node's zlib checks the Adler-32
    expect(raw.length).toBe(2 * (1 + 3 * 4));
    expect(raw[0]).toBe(0);
    expect(raw[13]).toBe(0);
    expect(Array.from(raw.subarray(1, 5))).toEqual([0, 37, 74, 111]);
  });

  it('every chunk CRC matches zlib.crc32', () => {
    const png = smallPng();
    for (const c of readChunks(png)) {
      const end = c.offset + 8 + c.dataLength;
      expect(new DataView(png.buffer).getUint32(end)).toBe(zlibCrc32(png.subarray(c.offset + 4, end)));
    }
  });

  it('splits data beyond 65535 bytes into several stored blocks', () => {
    const width = 200, height = 100, rgba = new Uint8ClampedArray(width * height * 4).fill(200);
    const png = encodePng({ width, height, rgba }), idat = readChunks(png)[1];
    expect(inflateSync(png.subarray(idat.offset + 8, idat.offset + 8 + idat.dataLength)).length).toBe(height * (1 + width * 4));
  });

  it('refuses a bitmap whose bytes do not match its size', () => {
    expect(() => encodePng({ width: 2, height: 2, rgba: new Uint8ClampedArray(15) })).toThrow(/expected 2×2×4 = 16 bytes/);
  });
});
