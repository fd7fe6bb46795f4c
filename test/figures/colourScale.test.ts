import { describe, expect, it } from 'vitest';
import { interpolateCividis, interpolateViridis } from 'd3-scale-chromatic';
import { ColourScaleError, colourTable, createColourScale, parseColour } from '../../src/figures/parts/colourScale';

// Published colour tables: matplotlib, lib/matplotlib/_cm_listed.py — `_viridis_data` (the map of
// van der Walt & Smith, 2015) and `_cividis_data` (Nuñez, Anderton & Renslow, 2018, PLoS ONE
// 13(7): e0199239). First and last rows, as RGB fractions, times 255.
const VIRIDIS_FIRST = [0.267004, 0.004874, 0.329415].map((c) => c * 255);
const VIRIDIS_LAST = [0.993248, 0.906157, 0.143936].map((c) => c * 255);
const CIVIDIS_FIRST = [0.0, 0.135112, 0.304751].map((c) => c * 255);
const CIVIDIS_LAST = [0.995737, 0.909344, 0.217772].map((c) => c * 255);

/** WCAG 2.x relative luminance of an sRGB colour (W3C, the "relative luminance" definition; from memory). */
function luminance([r, g, b]: readonly number[]): number {
  const lin = (c: number) => (c / 255 <= 0.04045 ? c / 255 / 12.92 : ((c / 255 + 0.055) / 1.055) ** 2.4);
  return 0.2126 * lin(r) + 0.7152 * lin(g) + 0.0722 * lin(b);
}

describe('colour table endpoints against the published maps', () => {
  it('viridis: ends are the published first and last colours, to the rounding of ×255', () => {
    const table = colourTable('viridis');
    table[0].forEach((c, i) => expect(Math.abs(c - VIRIDIS_FIRST[i])).toBeLessThanOrEqual(0.5));
    table[255].forEach((c, i) => expect(Math.abs(c - VIRIDIS_LAST[i])).toBeLessThanOrEqual(0.5));
  });

  it('cividis: ends within the error of d3’s polynomial fit to the published table', () => {
    // d3-scale-chromatic's cividis is a degree-5 polynomial fit per channel, not the table itself:
    // at t = 1 its blue is rgb(…, 69) against the table's 55.5, so the tolerance is 15 units.
    const table = colourTable('cividis');
    table[0].forEach((c, i) => expect(Math.abs(c - CIVIDIS_FIRST[i])).toBeLessThanOrEqual(15));
    table[255].forEach((c, i) => expect(Math.abs(c - CIVIDIS_LAST[i])).toBeLessThanOrEqual(15));
  });

  it('the table is d3’s scheme sampled at k/255', () => {
    const viridis = colourTable('viridis'), cividis = colourTable('cividis');
    for (const k of [0, 37, 128, 200, 255]) {
      expect(viridis[k]).toEqual(parseColour(interpolateViridis(k / 255)));
      expect(cividis[k]).toEqual(parseColour(interpolateCividis(k / 255)));
    }
  });

  it.each(['viridis', 'cividis'] as const)('%s: luminance rises along the scale (its design goal: monotone lightness)', (scheme) => {
    const table = colourTable(scheme);
    for (let k = 1; k < table.length; k++) expect(luminance(table[k])).toBeGreaterThanOrEqual(luminance(table[k - 1]) - 0.002);
  });
});

describe('createColourScale', () => {
  it('maps the minimum to the first colour and the maximum to the last', () => {
    const scale = createColourScale(Float64Array.of(3, -1, 7, 2));
    expect(scale.min).toBe(-1);
    expect(scale.max).toBe(7);
    expect(scale.constant).toBe(false);
    expect(scale.colour(-1)).toEqual(colourTable('viridis')[0]);
    expect(scale.colour(7)).toEqual(colourTable('viridis')[255]);
    expect(scale.position(3)).toBeCloseTo(0.5, 12);
  });

  it('clamps values outside the domain to the ends', () => {
    const scale = createColourScale([0, 1]);
    expect(scale.position(-5)).toBe(0);
    expect(scale.position(9)).toBe(1);
  });

  it('gives non-finite values no colour and ignores them for the domain', () => {
    const scale = createColourScale([NaN, 2, Infinity, 4, -Infinity]);
    expect([scale.min, scale.max]).toEqual([2, 4]);
    expect(scale.colour(NaN)).toBeNull();
    expect(scale.colour(Infinity)).toBeNull();
    expect(scale.position(-Infinity)).toBeNull();
  });

  it('widens a constant surface around its value, which takes the middle colour', () => {
    const scale = createColourScale([5, 5, 5]);
    expect(scale.constant).toBe(true);
    expect(scale.min).toBeLessThan(5);
    expect(scale.max).toBeGreaterThan(5);
    expect(scale.position(5)).toBeCloseTo(0.5, 12);
    const zero = createColourScale([0, 0]);
    expect([zero.min, zero.max]).toEqual([-0.5, 0.5]);
  });

  it('refuses a surface with no finite value, naming how many there were', () => {
    expect(() => createColourScale([NaN, NaN])).toThrow(ColourScaleError);
    expect(() => createColourScale([NaN, NaN])).toThrow(/all 2/);
  });
});
