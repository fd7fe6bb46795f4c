/** Export presets: pixels = inches × dots per inch (the unit's definition). */
import { describe, expect, it } from 'vitest';
import { presetPixels, printedInches, SIZE_PRESETS } from '../../../src/renderer/src/screens/findings/exportSizes';

describe('export sizes', () => {
  it('makes 6.5 × 4 in at 300 dpi 1950 × 1200 px', () => {
    expect(presetPixels(SIZE_PRESETS.find((p) => p.id === 'report')!)).toEqual({ widthPx: 1950, heightPx: 1200, dpi: 300 });
    expect(presetPixels(SIZE_PRESETS.find((p) => p.id === 'slide')!)).toEqual({ widthPx: 1920, heightPx: 1080, dpi: 192 });
    expect(presetPixels(SIZE_PRESETS.find((p) => p.id === 'screen')!)).toEqual({ widthPx: 1280, heightPx: 800, dpi: 96 });
  });

  it('prints a pixel size back at its inches', () => {
    expect(printedInches({ widthPx: 975, heightPx: 750, dpi: 300 })).toEqual({ widthIn: 3.25, heightIn: 2.5 });
  });
});
