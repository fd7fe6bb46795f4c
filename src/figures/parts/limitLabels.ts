/**
 * Where the labels of the actuator limits go on an action slice: at the top of the plot area, on
 * the far side of each limit's dashed line — the side where the policy has no density, so a label
 * never sits on the density curve or on the point-mass bar — and on the near side only when the far
 * side is too narrow for it. Labels that would still overlap go one row down. Each is drawn on a
 * backing of the plot's background (backedText.ts), so the Q curve passing under it cannot hide it.
 */
import { BACKED_TEXT_DEFAULTS, type LabelBox } from './backedText';
import { fontString, PLOT_FONTS, type PlotLook } from './plotLook';

export const LIMIT_LABEL_DEFAULTS = { gapPx: 4, paddingPx: BACKED_TEXT_DEFAULTS.paddingPx } as const;

export interface LimitLabelRequest {
  /** The limit's line, in canvas pixels. */
  readonly x: number;
  readonly side: 'lower' | 'upper';
  readonly widthPx: number;
}


/** Boxes (text left edge, top, width, height) for the labels, in request order; area: the plot area in pixels. */
export function limitLabelBoxes(
  requests: readonly LimitLabelRequest[], area: { left: number; right: number; top: number }, heightPx: number, scale = 1,
): LabelBox[] {
  const gap = LIMIT_LABEL_DEFAULTS.gapPx * scale, pad = LIMIT_LABEL_DEFAULTS.paddingPx * scale;
  const placed: LabelBox[] = [];
  for (const r of requests) {
    const outsideRoom = r.side === 'lower' ? r.x - area.left : area.right - r.x;
    const outside = outsideRoom >= r.widthPx + gap + 2 * pad;
    const leftward = (r.side === 'lower') === outside; // a lower limit’s far side is its left
    let left = leftward ? r.x - gap - r.widthPx : r.x + gap;
    left = Math.min(Math.max(left, area.left + pad), area.right - pad - r.widthPx);
    let top = area.top + pad;
    while (placed.some((b) => overlaps(b, { left, top, width: r.widthPx, height: heightPx }, pad))) top += heightPx + 2 * pad;
    placed.push({ left, top, width: r.widthPx, height: heightPx });
  }
  return placed;
}

function overlaps(a: LabelBox, b: LabelBox, pad: number): boolean {
  return a.left < b.left + b.width + 2 * pad && b.left < a.left + a.width + 2 * pad && a.top < b.top + b.height + pad && b.top < a.top + a.height + pad;
}

/** The tick font the limit labels use, and its line height in pixels. */
export function limitLabelFont(look: PlotLook): { font: string; heightPx: number } {
  return { font: fontString(look, PLOT_FONTS.tickPx), heightPx: PLOT_FONTS.tickPx * look.scale };
}
