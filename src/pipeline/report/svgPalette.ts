/**
 * Colours of the report's figures. Lines and markers use the Okabe–Ito palette, distinguishable
 * with the common colour-vision deficiencies (Okabe & Ito, "Color Universal Design", 2008; common
 * practice); heat maps use viridis (van der Walt & Smith, 2015) from d3-scale-chromatic.
 */
import { interpolateViridis } from 'd3-scale-chromatic';

const SERIES_COLOURS = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9', '#000000'];

export function seriesColour(index: number): string {
  return SERIES_COLOURS[index % SERIES_COLOURS.length];
}

/** Viridis at t ∈ [0, 1] as "#rrggbb". */
export function sequentialColour(t: number): string {
  return interpolateViridis(Math.min(1, Math.max(0, t)));
}
