/**
 * Where the action slice's limit labels go (figures/parts/limitLabels.ts): beyond each limit's line,
 * where the policy puts no density and no point-mass bar stands, unless that side is too narrow; never
 * outside the plot area; two labels that would touch are stacked. Plain geometry, checked by hand.
 */
import { describe, expect, it } from 'vitest';
import { LIMIT_LABEL_DEFAULTS, limitLabelBoxes } from '../../src/figures/parts/limitLabels';

const AREA = { left: 60, right: 840, top: 40 };
const H = 12;

describe('limit labels on the action slice', () => {
  it('puts each label on the far side of its line when it fits there (the density lies between the limits)', () => {
    const [lo, hi] = limitLabelBoxes([{ x: 300, side: 'lower', widthPx: 150 }, { x: 600, side: 'upper', widthPx: 150 }], AREA, H);
    expect(lo.left + lo.width).toBeLessThanOrEqual(300 - LIMIT_LABEL_DEFAULTS.gapPx);
    expect(hi.left).toBeGreaterThanOrEqual(600 + LIMIT_LABEL_DEFAULTS.gapPx);
    expect([lo.top, hi.top]).toEqual([AREA.top + LIMIT_LABEL_DEFAULTS.paddingPx, AREA.top + LIMIT_LABEL_DEFAULTS.paddingPx]);
  });

  it('falls back to the near side, inside the plot area, when a limit sits near the edge', () => {
    const [lo, hi] = limitLabelBoxes([{ x: 100, side: 'lower', widthPx: 150 }, { x: 800, side: 'upper', widthPx: 150 }], AREA, H);
    expect(lo.left).toBeGreaterThanOrEqual(100);
    expect(hi.left + hi.width).toBeLessThanOrEqual(800);
    for (const b of [lo, hi]) {
      expect(b.left).toBeGreaterThanOrEqual(AREA.left);
      expect(b.left + b.width).toBeLessThanOrEqual(AREA.right);
    }
  });

  it('stacks two labels that would overlap (limits close together, both near an edge)', () => {
    const [lo, hi] = limitLabelBoxes([{ x: 90, side: 'lower', widthPx: 150 }, { x: 120, side: 'upper', widthPx: 150 }], AREA, H);
    const apart = lo.top + lo.height <= hi.top || hi.left >= lo.left + lo.width;
    expect(apart).toBe(true);
    expect(hi.top).toBeGreaterThan(lo.top);
  });

  it('scales its gaps with the figure (an export at twice the pixels)', () => {
    const [one] = limitLabelBoxes([{ x: 300, side: 'lower', widthPx: 150 }], AREA, H, 1);
    const [two] = limitLabelBoxes([{ x: 300, side: 'lower', widthPx: 150 }], AREA, H, 2);
    expect(300 - (one.left + one.width)).toBe(LIMIT_LABEL_DEFAULTS.gapPx);
    expect(300 - (two.left + two.width)).toBe(2 * LIMIT_LABEL_DEFAULTS.gapPx);
  });
});
