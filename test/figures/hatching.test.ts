/**
 * The retune map legend's hatched keys show their pattern: at least MIN_SWATCH_LINES hatch lines
 * cross a swatch of the legend's size, each with a dark edge no thinner than the strong hatch's, and
 * the caution hatch stays the sparser of the two so the keys can be told apart. Geometry of lines
 * x + y = c one every spacing·√2 (elementary); thresholds are ours.
 */
import { describe, expect, it } from 'vitest';
import { HATCH_DEFAULTS, LIGHT_HATCH, MIN_SWATCH_LINES, swatchHatch, type HatchStyle } from '../../src/figures/parts/hatching';
import { HATCH_SWATCH_HEIGHT, LEGEND_DEFAULTS } from '../../src/figures/parts/legendBox';
import { PLOT_FONTS } from '../../src/figures/parts/plotLook';

const linesAcross = (style: HatchStyle, w: number, h: number) => (w + h) / (style.spacingPx * Math.SQRT2);
const edge = (style: HatchStyle) => (style.darkWidthPx - style.lightWidthPx) / 2;

describe('hatched legend keys', () => {
  const w = LEGEND_DEFAULTS.keyWidthPx, h = PLOT_FONTS.legendPx * HATCH_SWATCH_HEIGHT;
  it('cross a swatch with enough lines, each with a visible dark edge', () => {
    for (const style of [HATCH_DEFAULTS, LIGHT_HATCH]) {
      const drawn = swatchHatch(style, w, h);
      expect(linesAcross(drawn, w, h)).toBeGreaterThanOrEqual(MIN_SWATCH_LINES - 1e-9);
      expect(edge(drawn)).toBeGreaterThanOrEqual(edge(HATCH_DEFAULTS) - 1e-9);
    }
  });

  it('keeps the caution hatch sparser than the strong one', () => {
    expect(swatchHatch(LIGHT_HATCH, w, h).spacingPx).toBeGreaterThan(swatchHatch(HATCH_DEFAULTS, w, h).spacingPx);
  });

  it('narrows the spacing only for a swatch too small for the pattern', () => {
    expect(swatchHatch(LIGHT_HATCH, 200, 100)).toBe(LIGHT_HATCH);
    const small = swatchHatch(LIGHT_HATCH, 12, 6);
    expect(linesAcross(small, 12, 6)).toBeCloseTo(MIN_SWATCH_LINES, 9);
  });
});
