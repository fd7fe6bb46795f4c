/**
 * Error whiskers on horizontal bars (±1 standard error) and the value written past each whisker.
 * Drawn after the bars, through the chart's own value scale. A layout box on the right, as wide as
 * the longest label, keeps the labels of the largest bars inside the image at any font scale.
 */
import { type Chart, type LayoutItem, type Plugin } from 'chart.js';
import { LayoutBoxGeometry, layoutBoxHooks } from './layoutBox';
import { fontString, PLOT_FONTS, type PlotLook } from './plotLook';

export interface WhiskerSpec {
  readonly values: readonly number[];
  /** Half-widths; null where no standard error exists. */
  readonly errors: readonly (number | null)[];
  readonly labels: readonly string[];
  readonly look: PlotLook;
}

export const WHISKER_DEFAULTS = { capPx: 7, lineWidthPx: 1.6, labelGapPx: 6 } as const;

/** Empty room right of the plot area for the value labels. */
class LabelRoomBox extends LayoutBoxGeometry implements LayoutItem {
  readonly position = 'right' as const;
  readonly weight = 10;

  constructor(private readonly chart: Chart, private readonly spec: WhiskerSpec) {
    super();
  }

  isHorizontal(): boolean {
    return false;
  }

  update(_maxWidth: number, maxHeight: number): void {
    const ctx = this.chart.ctx, { look } = this.spec;
    ctx.save();
    ctx.font = fontString(look, PLOT_FONTS.tickPx);
    const widest = Math.max(0, ...this.spec.labels.map((l, i) => (this.spec.values[i] >= 0 ? ctx.measureText(l).width : 0)));
    ctx.restore();
    this.width = widest > 0 ? widest + WHISKER_DEFAULTS.labelGapPx * look.scale : 0;
    this.height = maxHeight;
  }

  draw(): void {}
}

export function errorWhiskersPlugin(spec: WhiskerSpec): Plugin {
  return {
    id: 'setpointErrorWhiskers',
    ...layoutBoxHooks((chart) => new LabelRoomBox(chart, spec)),
    afterDatasetsDraw(chart) {
      const { ctx } = chart, xs = chart.scales.x, meta = chart.getDatasetMeta(0), s = spec.look.scale, d = WHISKER_DEFAULTS;
      ctx.save();
      ctx.strokeStyle = spec.look.palette.text;
      ctx.fillStyle = spec.look.palette.text;
      ctx.lineWidth = d.lineWidthPx * s;
      ctx.font = fontString(spec.look, PLOT_FONTS.tickPx);
      ctx.textBaseline = 'middle';
      meta.data.forEach((bar, i) => {
        const v = spec.values[i], e = spec.errors[i], y = bar.y, cap = (d.capPx * s) / 2;
        let end = xs.getPixelForValue(v);
        if (e !== null && Number.isFinite(e)) {
          const lo = xs.getPixelForValue(v - e), hi = xs.getPixelForValue(v + e);
          ctx.beginPath();
          ctx.moveTo(lo, y);
          ctx.lineTo(hi, y);
          ctx.moveTo(lo, y - cap);
          ctx.lineTo(lo, y + cap);
          ctx.moveTo(hi, y - cap);
          ctx.lineTo(hi, y + cap);
          ctx.stroke();
          end = v >= 0 ? Math.max(lo, hi) : Math.min(lo, hi);
        }
        ctx.textAlign = v >= 0 ? 'left' : 'right';
        ctx.fillText(spec.labels[i], end + (v >= 0 ? 1 : -1) * d.labelGapPx * s, y);
      });
      ctx.restore();
    },
  };
}
