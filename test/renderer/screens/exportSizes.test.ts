/**
 * Export sizes: pixels = inches × dots per inch and 1 in = 25.4 mm exactly (the units' definitions,
 * e.g. NIST SP 811 App. B); A4 is 210 × 297 mm (ISO 216); 1 pt = 1/72 in, so 12 CSS px = 9 pt.
 */
import { describe, expect, it } from 'vitest';
import { millimetrePixels, presetLabel, presetPixels, printedInches, printedMillimetres, SIZE_PRESETS, sizeText, typePoints } from '../../../src/renderer/src/screens/findings/exportSizes';

const preset = (id: string) => SIZE_PRESETS.find((p) => p.id === id)!;

describe('export sizes', () => {
  it('keeps the inch presets exact: 6.5 × 4 in at 300 dpi is 1950 × 1200 px', () => {
    expect(presetPixels(preset('report'))).toEqual({ widthPx: 1950, heightPx: 1200, dpi: 300 });
    expect(presetPixels(preset('slide'))).toEqual({ widthPx: 1920, heightPx: 1080, dpi: 192 });
    expect(presetPixels(preset('screen'))).toEqual({ widthPx: 1280, heightPx: 800, dpi: 96 });
  });

  it('makes an 85 mm column and a 175 mm page width at 300 dpi (85 / 25.4 × 300 = 1003.9 px)', () => {
    expect(presetPixels(preset('column'))).toEqual({ widthPx: 1004, heightPx: 756, dpi: 300 });
    expect(presetPixels(preset('page'))).toEqual({ widthPx: 2067, heightPx: 1276, dpi: 300 });
    expect(presetLabel(preset('column'))).toBe('85 mm column at 300 dpi (1004 × 756 px)');
    expect(presetLabel(preset('page'))).toBe('175 mm page width at 300 dpi (2067 × 1276 px)');
    expect(presetLabel(preset('report'))).toBe('165 mm report figure at 300 dpi (1950 × 1200 px)');
    expect(sizeText(presetPixels(preset('column')))).toBe('1004 × 756 px at 300 dpi: prints at 85 × 64 mm (3.35 × 2.52 in)');
  });

  it('prints a pixel size back at its inches and millimetres', () => {
    expect(printedInches({ widthPx: 975, heightPx: 750, dpi: 300 })).toEqual({ widthIn: 3.25, heightIn: 2.5 });
    const mm = printedMillimetres({ widthPx: 1950, heightPx: 1200, dpi: 300 });
    expect(mm.widthMm).toBeCloseTo(165.1, 10);
    expect(mm.heightMm).toBeCloseTo(101.6, 10);
  });

  it('turns millimetres into pixels: A4 at 300 dpi is 2480 × 3508 px', () => {
    expect(millimetrePixels({ widthMm: 210, heightMm: 297, dpi: 300 })).toEqual({ widthPx: 2480, heightPx: 3508, dpi: 300 });
    expect(millimetrePixels({ widthMm: 25.4, heightMm: 50.8, dpi: 96 })).toEqual({ widthPx: 96, heightPx: 192, dpi: 96 });
  });

  it('says the size both ways, and the type size in points', () => {
    expect(sizeText({ widthPx: 1950, heightPx: 1200, dpi: 300 })).toBe('1950 × 1200 px at 300 dpi: prints at 165 × 102 mm (6.50 × 4.00 in)');
    expect(sizeText({ widthPx: 975, heightPx: 750, dpi: 300 })).toBe('975 × 750 px at 300 dpi: prints at 82.6 × 63.5 mm (3.25 × 2.50 in)');
    expect(typePoints(12, 1)).toBe(9);
  });
});
