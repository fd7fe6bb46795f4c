/**
 * Axis titles set by us instead of Chart.js, so they can carry sub- and superscripts (V^{π}, Q^{π})
 * in the app, in PNG and in SVG alike: a Chart.js layout box beside the scale, outside its tick
 * labels (a higher weight than the scale's 0 puts it further from the plot area), so the layout
 * engine makes room for it before sizing the plot and nothing overlaps at any scale.
 */
import { type Chart, type LayoutItem, type Plugin } from 'chart.js';
import { LayoutBoxGeometry, layoutBoxHooks } from './layoutBox';
import { PLOT_FONTS, type PlotLook } from './plotLook';
import { drawRichText } from './richText';

export const AXIS_TITLE_DEFAULTS = { gapPx: 4, weight: 5 } as const;

export interface AxisTitleSpec {
  /** The scale id whose extent the title is centred on. */
  readonly scaleId: string;
  readonly position: 'left' | 'right' | 'bottom';
  /** Rich-text markup (richText.ts). */
  readonly text: string;
  readonly look: PlotLook;
}

class AxisTitleBox extends LayoutBoxGeometry implements LayoutItem {
  readonly weight = AXIS_TITLE_DEFAULTS.weight;
  readonly position: 'left' | 'right' | 'bottom';

  constructor(private readonly chart: Chart, private readonly spec: AxisTitleSpec) {
    super();
    this.position = spec.position;
  }

  isHorizontal(): boolean {
    return this.spec.position === 'bottom';
  }

  private thickness(): number {
    const s = this.spec.look.scale;
    return PLOT_FONTS.axisTitlePx * s * 1.5 + AXIS_TITLE_DEFAULTS.gapPx * s;
  }

  update(maxWidth: number, maxHeight: number): void {
    if (this.isHorizontal()) {
      this.width = maxWidth;
      this.height = this.thickness();
    } else {
      this.width = this.thickness();
      this.height = maxHeight;
    }
  }

  draw(): void {
    const { look, text, position, scaleId } = this.spec, ctx = this.chart.ctx, scale = this.chart.scales[scaleId];
    if (!scale || !text) return;
    const font = { sizePx: PLOT_FONTS.axisTitlePx * look.scale, family: look.fontFamily ?? PLOT_FONTS.family, weight: 'bold' as const };
    ctx.save();
    ctx.fillStyle = look.palette.text;
    if (position === 'bottom') drawRichText(ctx, text, (scale.left + scale.right) / 2, (this.top + this.bottom) / 2 + (AXIS_TITLE_DEFAULTS.gapPx * look.scale) / 2, font, 'center');
    else {
      const middle = (scale.top + scale.bottom) / 2, x = (this.left + this.right) / 2;
      drawRichText(ctx, text, x, middle, font, 'center', position === 'left' ? -Math.PI / 2 : Math.PI / 2);
    }
    ctx.restore();
  }
}

/** One plugin per titled axis; give each a distinct id suffix. */
export function axisTitlePlugin(spec: AxisTitleSpec): Plugin {
  return { id: `setpointAxisTitle-${spec.scaleId}`, ...layoutBoxHooks((chart) => new AxisTitleBox(chart, spec)) };
}
