/**
 * Picture sizes for export: presets in inches at a resolution (a report column, a slide, a
 * half-width figure), and the pixel count each needs, pixels = inches × dots per inch (the
 * definition of the unit; the PNG records the dpi in its pHYs chunk).
 */
export interface SizePreset {
  id: string;
  label: string;
  widthIn: number;
  heightIn: number;
  dpi: number;
}

export const SIZE_PRESETS: readonly SizePreset[] = [
  { id: 'report', label: 'Report figure, 6.5 × 4 in at 300 dpi', widthIn: 6.5, heightIn: 4, dpi: 300 },
  { id: 'half', label: 'Half-width figure, 3.25 × 2.5 in at 300 dpi', widthIn: 3.25, heightIn: 2.5, dpi: 300 },
  { id: 'slide', label: 'Slide, 10 × 5.625 in at 192 dpi', widthIn: 10, heightIn: 5.625, dpi: 192 },
  { id: 'screen', label: 'Screen, 13.33 × 8.33 in at 96 dpi', widthIn: 13 + 1 / 3, heightIn: 8 + 1 / 3, dpi: 96 },
];

export interface PixelSize {
  widthPx: number;
  heightPx: number;
  dpi: number;
}

export function presetPixels(preset: SizePreset): PixelSize {
  return { widthPx: Math.round(preset.widthIn * preset.dpi), heightPx: Math.round(preset.heightIn * preset.dpi), dpi: preset.dpi };
}

/** Printed size of a pixel size, in inches (for the panel's "prints at …" line). */
export function printedInches(size: PixelSize): { widthIn: number; heightIn: number } {
  return { widthIn: size.widthPx / size.dpi, heightIn: size.heightPx / size.dpi };
}
