/**
 * Picture sizes for export: presets named for where the picture goes (a report figure, an 85 mm
 * journal column, a 175 mm page width, a slide, a screen), and custom sizes in millimetres or in
 * pixels, each at a resolution. pixels = inches × dots per inch and 1 in = 25.4 mm exactly (the
 * units' definitions; the PNG records the dpi in its pHYs chunk). Every label says the printed size
 * width in millimetres and the pixel count, and the line under it the whole printed size, all
 * computed from the same numbers the export uses.
 *
 * The column and page widths are the usual two-column journal layout (about 85 mm per column,
 * about 175 mm across the page; common practice, from memory — publishers vary by a few mm).
 */
export const MM_PER_INCH = 25.4;

export interface PixelSize {
  widthPx: number;
  heightPx: number;
  dpi: number;
}

/** A size in millimetres at a resolution. */
export interface MillimetreSize {
  widthMm: number;
  heightMm: number;
  dpi: number;
}

export interface SizePreset extends MillimetreSize {
  id: string;
  /** Where the picture goes, in the label's words ("85 mm column"). */
  name: string;
}

const inches = (v: number) => v * MM_PER_INCH;

export const SIZE_PRESETS: readonly SizePreset[] = [
  { id: 'report', name: '165 mm report figure', widthMm: inches(6.5), heightMm: inches(4), dpi: 300 },
  { id: 'column', name: '85 mm column', widthMm: 85, heightMm: 64, dpi: 300 },
  { id: 'page', name: '175 mm page width', widthMm: 175, heightMm: 108, dpi: 300 },
  { id: 'slide', name: '254 mm slide', widthMm: inches(10), heightMm: inches(5.625), dpi: 192 },
  { id: 'screen', name: 'Screen', widthMm: inches(1280 / 96), heightMm: inches(800 / 96), dpi: 96 },
];

/** Pixels for a printed size: mm ÷ 25.4 × dpi, rounded to whole pixels. */
export function millimetrePixels(size: MillimetreSize): PixelSize {
  return { widthPx: Math.round((size.widthMm / MM_PER_INCH) * size.dpi), heightPx: Math.round((size.heightMm / MM_PER_INCH) * size.dpi), dpi: size.dpi };
}

export function presetPixels(preset: SizePreset): PixelSize {
  return millimetrePixels(preset);
}

/** Printed size of a pixel size, in inches. */
export function printedInches(size: PixelSize): { widthIn: number; heightIn: number } {
  return { widthIn: size.widthPx / size.dpi, heightIn: size.heightPx / size.dpi };
}

/** Printed size of a pixel size, in millimetres. */
export function printedMillimetres(size: PixelSize): { widthMm: number; heightMm: number } {
  const { widthIn, heightIn } = printedInches(size);
  return { widthMm: widthIn * MM_PER_INCH, heightMm: heightIn * MM_PER_INCH };
}

/** Whole millimetres from 100 mm up, tenths below (a printed size is not known better than that). */
const mm = (v: number) => (v >= 100 ? v.toFixed(0) : (Math.round(v * 10) / 10).toString());

/** "165 × 102 mm". */
export function millimetreText(size: PixelSize): string {
  const { widthMm, heightMm } = printedMillimetres(size);
  return `${mm(widthMm)} × ${mm(heightMm)} mm`;
}

/**
 * "85 mm column at 300 dpi (1004 × 756 px)": the option's label, short enough for a half-width
 * panel; the line under the list gives the full printed size (sizeText).
 */
export function presetLabel(preset: SizePreset): string {
  const px = presetPixels(preset);
  return `${preset.name} at ${px.dpi} dpi (${px.widthPx} × ${px.heightPx} px)`;
}

/** "1950 × 1200 px at 300 dpi: prints at 165 × 102 mm (6.50 × 4.00 in)". */
export function sizeText(size: PixelSize): string {
  const { widthIn, heightIn } = printedInches(size);
  return `${size.widthPx} × ${size.heightPx} px at ${size.dpi} dpi: prints at ${millimetreText(size)} (${widthIn.toFixed(2)} × ${heightIn.toFixed(2)} in)`;
}

/** Printed size of type drawn px CSS pixels high at scale typeScale (1 CSS px = 0.75 pt: CSS Values §6.2, 96 px = 72 pt). */
export function typePoints(px: number, typeScale: number): number {
  return px * 0.75 * typeScale;
}
