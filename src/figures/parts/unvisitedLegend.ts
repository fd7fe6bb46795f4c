/**
 * Legend line above the heat map explaining the hatching: a hatched swatch and what it means.
 * A Chart.js layout box, so the plot area shrinks to make room for it.
 */
import { type Chart, type LayoutItem, type Plugin } from 'chart.js';
import { LayoutBoxGeometry, layoutBoxHooks } from './layoutBox';
import { drawHatching } from './hatching';
import { fontString, PLOT_FONTS, type PlotLook } from './plotLook';

export const UNVISITED_LEGEND_DEFAULTS = { swatchWidthPx: 24, swatchHeightPx: 13, gapPx: 8, paddingPx: 6 } as const;

export interface UnvisitedLegendSpec {
  readonly text: string;
  /** Swatch fill under the hatching (a mid colour of the scale). */
  readonly swatchFill: string;
  readonly look: PlotLook;
}

class UnvisitedLegendBox extends LayoutBoxGeometry implements LayoutItem {
  readonly position = 'top' as const;
  readonly weight = 500; // nearer the plot area than the title (Chart.js gives the title 2000)

  constructor(private readonly chart: Chart, private readonly spec: UnvisitedLegendSpec) {
    super();
  }

  isHorizontal(): boolean {
    return true;
  }

  update(maxWidth: number): void {
    const s = this.spec.look.scale, d = UNVISITED_LEGEND_DEFAULTS;
    this.width = maxWidth;
    this.height = Math.max(d.swatchHeightPx * s, PLOT_FONTS.legendPx * s * 1.25) + 2 * d.paddingPx * s;
  }

  draw(): void {
    const { look, text, swatchFill } = this.spec, s = look.scale, d = UNVISITED_LEGEND_DEFAULTS, ctx = this.chart.ctx;
    const middle = (this.top + this.bottom) / 2;
    const swatch = { x: this.left, y: middle - (d.swatchHeightPx * s) / 2, width: d.swatchWidthPx * s, height: d.swatchHeightPx * s };
    ctx.save();
    ctx.fillStyle = swatchFill;
    ctx.fillRect(swatch.x, swatch.y, swatch.width, swatch.height);
    drawHatching(ctx, [swatch], look);
    ctx.strokeStyle = look.palette.axis;
    ctx.lineWidth = s;
    ctx.strokeRect(swatch.x, swatch.y, swatch.width, swatch.height);
    ctx.fillStyle = look.palette.text;
    ctx.font = fontString(look, PLOT_FONTS.legendPx);
    ctx.textAlign = 'left';
    ctx.textBaseline = 'middle';
    ctx.fillText(text, swatch.x + swatch.width + d.gapPx * s, middle);
    ctx.restore();
  }
}

export function unvisitedLegendPlugin(spec: UnvisitedLegendSpec): Plugin {
  return {
    id: 'setpointUnvisitedLegend',
    ...layoutBoxHooks((chart) => new UnvisitedLegendBox(chart, spec)),
  };
}
