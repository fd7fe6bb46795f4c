/**
 * Value → colour for the heat map and its colour bar, on a perceptually uniform, colour-blind-safe
 * scale: viridis (van der Walt & Smith, 2015, designed for matplotlib) or cividis (Nuñez, Anderton
 * & Renslow, 2018, "Optimizing colormaps with consideration for color vision deficiency", PLoS ONE
 * 13(7): e0199239). The colours come from d3-scale-chromatic; we sample them once into a 256-entry
 * table so the cells and the colour bar use exactly the same colours.
 *
 * The domain is [min, max] of the finite values. A constant surface has no range to spread, so the
 * domain is widened symmetrically around the value (the value maps to the middle colour and the
 * colour bar still has ticks); non-finite values get no colour (null) and are painted as "no value".
 */
import { interpolateCividis, interpolateViridis } from 'd3-scale-chromatic';

export type ColourScheme = 'viridis' | 'cividis';

export type Rgb = readonly [number, number, number];

export class ColourScaleError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ColourScaleError';
  }
}

export interface ColourScale {
  readonly scheme: ColourScheme;
  /** Domain of the colour bar (widened when the values are constant). */
  readonly min: number;
  readonly max: number;
  /** True when every finite value is the same. */
  readonly constant: boolean;
  /** Position of a value along the bar, clamped to [0, 1]; null when the value is not finite. */
  position(value: number): number | null;
  /** Colour of a value; null when the value is not finite. */
  colour(value: number): Rgb | null;
  /** Colour at a position t ∈ [0, 1] along the bar. */
  colourAt(t: number): Rgb;
}

export const COLOUR_TABLE_SIZE = 256;

/** Range of the finite entries; count is how many were finite. */
export function finiteRange(values: ArrayLike<number>): { min: number; max: number; count: number } {
  let min = Infinity, max = -Infinity, count = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (!Number.isFinite(v)) continue;
    count++;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max, count };
}

export function createColourScale(values: ArrayLike<number>, scheme: ColourScheme = 'viridis'): ColourScale {
  const { min, max, count } = finiteRange(values);
  if (count === 0) {
    throw new ColourScaleError(`values: no finite value to colour (all ${values.length} are NaN or infinite)`);
  }
  const constant = min === max;
  // Half-width of the widened domain: 5 % of the value, or 0.5 around zero (a choice).
  const half = constant ? (min === 0 ? 0.5 : Math.abs(min) * 0.05) : 0;
  const lo = min - half, hi = max + half;
  const table = colourTable(scheme);
  const colourAt = (t: number): Rgb => table[Math.round(Math.min(1, Math.max(0, t)) * (COLOUR_TABLE_SIZE - 1))];
  const position = (value: number): number | null =>
    Number.isFinite(value) ? Math.min(1, Math.max(0, (value - lo) / (hi - lo))) : null;
  return {
    scheme, min: lo, max: hi, constant,
    position,
    colour(value) {
      const t = position(value);
      return t === null ? null : colourAt(t);
    },
    colourAt,
  };
}

/** The scheme sampled at t = k/255, k = 0…255. */
export function colourTable(scheme: ColourScheme): Rgb[] {
  const interpolate = scheme === 'cividis' ? interpolateCividis : interpolateViridis;
  return Array.from({ length: COLOUR_TABLE_SIZE }, (_, k) => parseColour(interpolate(k / (COLOUR_TABLE_SIZE - 1))));
}

/** d3 returns "#rrggbb" (viridis) or "rgb(r, g, b)" (cividis). */
export function parseColour(text: string): Rgb {
  const hex = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(text);
  if (hex) return [parseInt(hex[1], 16), parseInt(hex[2], 16), parseInt(hex[3], 16)];
  const rgb = /^rgb\(\s*(\d+)\s*,\s*(\d+)\s*,\s*(\d+)\s*\)$/.exec(text);
  if (rgb) return [Number(rgb[1]), Number(rgb[2]), Number(rgb[3])];
  throw new ColourScaleError(`colour: expected #rrggbb or rgb(r, g, b), got "${text}"`);
}

export function rgbText([r, g, b]: Rgb): string {
  return `rgb(${r}, ${g}, ${b})`;
}
