/**
 * The legend, drawn by us: each key is drawn the way its series is — a line with its dash and
 * width, a line with its marker, a filled swatch for an area or bar, a hatched swatch — so a dashed
 * series has a dashed key and a line never gets a filled box. A Chart.js layout box across the
 * full width under the title: its rows are worked out in update() for the width it will be drawn
 * at, so the reserved height always fits what is drawn (no row spills onto the ticks).
 */
import { type Chart, type LayoutItem, type Plugin } from 'chart.js';
import { drawHatching, HATCH_DEFAULTS, swatchHatch, type HatchStyle } from './hatching';

/** Height of a hatched key in em of the legend text; ours. */
export const HATCH_SWATCH_HEIGHT = 1.1;
import { LayoutBoxGeometry, layoutBoxHooks } from './layoutBox';
import { PLOT_FONTS, type PlotLook } from './plotLook';
import { drawRichText, measureRichText } from './richText';

export interface LegendKey {
  readonly label: string;
  readonly kind: 'line' | 'area' | 'hatch' | 'marker';
  readonly colour: string;
  readonly dash?: readonly number[];
  readonly lineWidthPx?: number;
  /** For 'line' keys with points on the line, and 'marker' keys. */
  readonly markerRadiusPx?: number;
  /** Border of an area swatch. */
  readonly border?: string;
  /** Hatch of a 'hatch' swatch (default the strong one). */
  readonly hatch?: HatchStyle;
  /** Border width of an area or hatch swatch in CSS px (default 1). */
  readonly borderWidthPx?: number;
  /** Drawn over the swatch after its border (a double outline), or in a line's or marker's place (a cross): a function, local to the chart, never cloned. */
  readonly overlay?: (ctx: CanvasRenderingContext2D, rect: { x: number; y: number; width: number; height: number }, look: PlotLook) => void;
}

export const LEGEND_DEFAULTS = { keyWidthPx: 30, keyGapPx: 6, itemGapPx: 18, rowGapPx: 4, paddingPx: 6 } as const;

interface Placed {
  key: LegendKey;
  x: number;
  row: number;
}

class LegendBox extends LayoutBoxGeometry implements LayoutItem {
  override readonly fullSize = true;
  readonly position = 'top' as const;
  readonly weight = 1000;
  private placed: Placed[] = [];

  constructor(private readonly chart: Chart, private readonly keys: readonly LegendKey[], private readonly look: PlotLook) {
    super();
  }

  isHorizontal(): boolean {
    return true;
  }

  private font() {
    return { sizePx: PLOT_FONTS.legendPx * this.look.scale, family: this.look.fontFamily ?? PLOT_FONTS.family, weight: 'normal' as const };
  }

  private rowHeight(): number {
    return PLOT_FONTS.legendPx * this.look.scale * 1.3;
  }

  update(maxWidth: number): void {
    const s = this.look.scale, d = LEGEND_DEFAULTS, ctx = this.chart.ctx;
    let x = 0, row = 0;
    this.placed = this.keys.map((key) => {
      const width = (d.keyWidthPx + d.keyGapPx) * s + measureRichText(ctx, key.label, this.font());
      if (x > 0 && x + width > maxWidth) {
        x = 0;
        row++;
      }
      const placed = { key, x, row };
      x += width + d.itemGapPx * s;
      return placed;
    });
    const rows = this.keys.length ? row + 1 : 0;
    this.width = maxWidth;
    this.height = rows ? rows * this.rowHeight() + (rows - 1) * d.rowGapPx * s + 2 * d.paddingPx * s : 0;
  }

  draw(): void {
    const s = this.look.scale, d = LEGEND_DEFAULTS, ctx = this.chart.ctx;
    for (const { key, x, row } of this.placed) {
      const left = this.left + x, middle = this.top + d.paddingPx * s + row * (this.rowHeight() + d.rowGapPx * s) + this.rowHeight() / 2;
      drawKey(ctx, key, left, middle, d.keyWidthPx * s, this.look);
      ctx.save();
      ctx.fillStyle = this.look.palette.text;
      drawRichText(ctx, key.label, left + (d.keyWidthPx + d.keyGapPx) * s, middle, this.font(), 'left');
      ctx.restore();
    }
  }
}

function drawKey(ctx: CanvasRenderingContext2D, key: LegendKey, left: number, middle: number, width: number, look: PlotLook): void {
  // A hatched key is as tall as the text, so its pattern shows (HATCH_SWATCH_HEIGHT, under the row height of 1.3 em).
  const s = look.scale, h = PLOT_FONTS.legendPx * s * (key.kind === 'hatch' ? HATCH_SWATCH_HEIGHT : 0.8);
  ctx.save();
  if (key.kind === 'area' || key.kind === 'hatch') {
    const rect = { x: left, y: middle - h / 2, width, height: h };
    ctx.fillStyle = key.colour;
    ctx.fillRect(rect.x, rect.y, rect.width, rect.height);
    if (key.kind === 'hatch') drawHatching(ctx, [rect], look, swatchHatch(key.hatch ?? HATCH_DEFAULTS, width / s, h / s));
    ctx.strokeStyle = key.border ?? look.palette.axis;
    ctx.lineWidth = (key.borderWidthPx ?? 1) * s;
    ctx.strokeRect(rect.x, rect.y, rect.width, rect.height);
    key.overlay?.(ctx, rect, look);
  }
  if (key.kind === 'line') {
    ctx.strokeStyle = key.colour;
    ctx.lineWidth = (key.lineWidthPx ?? 2) * s;
    ctx.setLineDash((key.dash ?? []).map((v) => v * s));
    ctx.beginPath();
    ctx.moveTo(left, middle);
    ctx.lineTo(left + width, middle);
    ctx.stroke();
    ctx.setLineDash([]);
  }
  if (key.markerRadiusPx) {
    ctx.fillStyle = key.colour;
    ctx.beginPath();
    ctx.arc(left + width / 2, middle, key.markerRadiusPx * s, 0, 2 * Math.PI);
    ctx.fill();
  }
  if (key.kind === 'line' || key.kind === 'marker') key.overlay?.(ctx, { x: left, y: middle - h / 2, width, height: h }, look);
  ctx.restore();
}

export function legendPlugin(keys: readonly LegendKey[], look: PlotLook): Plugin {
  return { id: 'setpointLegend', ...layoutBoxHooks((chart) => new LegendBox(chart, keys, look)) };
}
