/**
 * The colour bar of the heat map, drawn by us: a Chart.js layout box on the right of the plot
 * area, as tall as the plot area, holding the colour ramp, nice ticks (Heckbert 1990) with labels,
 * and the value label with its units written along the bar. Being a layout box, Chart.js makes room
 * for it before it sizes the axes, so nothing overlaps at any font scale.
 */
import { type Chart, type LayoutItem, type Plugin } from 'chart.js';
import { LayoutBoxGeometry, layoutBoxHooks } from './layoutBox';
import type { ColourScale } from './colourScale';
import { niceTicks, type TickSet } from './niceTicks';
import { fontString, PLOT_FONTS, type PlotLook } from './plotLook';
import { paintRaster } from './raster';
import { colourBarRaster } from './surfaceRaster';
import { formatTick } from './tickFormat';
import { drawRichText } from './richText';

/** Sizes in CSS px, times look.scale. */
export const COLOUR_BAR_DEFAULTS = {
  gapPx: 16, // plot area → bar
  barWidthPx: 16,
  tickLengthPx: 5,
  labelGapPx: 4,
  titleGapPx: 10,
  /** About one tick per this many px of bar height. */
  tickSpacingPx: 40,
} as const;

export interface ColourBarSpec {
  readonly scale: ColourScale;
  /** Value label with units, e.g. "V^π (cost, kWh)". */
  readonly label: string;
  readonly look: PlotLook;
  /** A reference value marked across the bar (dashed), e.g. the present controller's J; left out when outside the scale. */
  readonly reference?: { readonly value: number; readonly colour: string; readonly dash: readonly number[] };
}

/** How many ticks a bar heightPx tall asks for: between 2 and 11, about one per tickSpacingPx. */
export function colourBarTickTarget(heightPx: number, look: PlotLook): number {
  return Math.min(11, Math.max(2, Math.round(heightPx / (COLOUR_BAR_DEFAULTS.tickSpacingPx * look.scale))));
}

/** Ticks for a bar heightPx tall (colourBarTickTarget). */
export function colourBarTicks(scale: ColourScale, heightPx: number, look: PlotLook): TickSet {
  return niceTicks(scale.min, scale.max, colourBarTickTarget(heightPx, look));
}

class ColourBarBox extends LayoutBoxGeometry implements LayoutItem {
  readonly position = 'right' as const;
  readonly weight = 10;
  /** The ticks last drawn, chosen from the height the bar is drawn at (read by the tests). */
  drawnTicks: TickSet | null = null;
  private readonly raster;

  constructor(private readonly chart: Chart, private readonly spec: ColourBarSpec) {
    super();
    this.raster = colourBarRaster(spec.scale);
  }

  isHorizontal(): boolean {
    return false;
  }

  /**
   * The box's width. Chart.js sizes a side box before the boxes above and below it take their
   * height, so maxHeight is an upper bound on the height the bar is drawn at, not that height: the
   * ticks are chosen in draw(), from the drawn height, and the width here holds the widest labels of
   * every tick set a height up to maxHeight could ask for.
   */
  update(_maxWidth: number, maxHeight: number): void {
    const { look } = this.spec, s = look.scale, ctx = this.chart.ctx, d = COLOUR_BAR_DEFAULTS;
    ctx.save();
    ctx.font = fontString(look, PLOT_FONTS.tickPx);
    let labelWidth = 0;
    for (let target = 2; target <= colourBarTickTarget(maxHeight, look); target++) {
      const ticks = niceTicks(this.spec.scale.min, this.spec.scale.max, target);
      for (const v of ticks.values) labelWidth = Math.max(labelWidth, ctx.measureText(tickText(ticks, v)).width);
    }
    ctx.restore();
    this.width = (d.gapPx + d.barWidthPx + d.tickLengthPx + d.labelGapPx + d.titleGapPx) * s + labelWidth + PLOT_FONTS.axisTitlePx * s * 1.5;
    this.height = maxHeight;
  }

  draw(): void {
    const { look, scale, label } = this.spec, s = look.scale, ctx = this.chart.ctx, d = COLOUR_BAR_DEFAULTS;
    const x = this.left + d.gapPx * s, barWidth = d.barWidthPx * s, top = this.top, height = this.bottom - this.top;
    const ticks = colourBarTicks(scale, height, look); // from the height drawn on, not the one offered before layout
    this.drawnTicks = ticks;
    paintRaster(ctx, this.raster, { x, y: top, width: barWidth, height }, true);
    ctx.save();
    ctx.strokeStyle = look.palette.axis;
    ctx.lineWidth = s;
    ctx.strokeRect(x, top, barWidth, height);
    this.drawReference(x, top, barWidth, height);
    ctx.fillStyle = look.palette.text;
    ctx.font = fontString(look, PLOT_FONTS.tickPx);
    ctx.textAlign = 'left';
    ctx.textBaseline = 'middle';
    ctx.beginPath();
    let labelRight = x + barWidth;
    for (const v of ticks.values) {
      const y = top + (1 - (scale.position(v) ?? 0)) * height;
      ctx.moveTo(x + barWidth, y);
      ctx.lineTo(x + barWidth + d.tickLengthPx * s, y);
      const textX = x + barWidth + (d.tickLengthPx + d.labelGapPx) * s, text = tickText(ticks, v);
      ctx.fillText(text, textX, y);
      labelRight = Math.max(labelRight, textX + ctx.measureText(text).width);
    }
    ctx.stroke();
    ctx.restore();
    ctx.save();
    ctx.fillStyle = look.palette.text;
    // Reads bottom to top, as the y-axis title does; rich text, so V^{π} is typeset.
    drawRichText(ctx, label, labelRight + d.titleGapPx * s + PLOT_FONTS.axisTitlePx * s * 0.6, top + height / 2,
      { sizePx: PLOT_FONTS.axisTitlePx * s, family: look.fontFamily ?? PLOT_FONTS.family, weight: 'bold' }, 'center', -Math.PI / 2);
    ctx.restore();
  }

  private drawReference(x: number, top: number, barWidth: number, height: number): void {
    const ref = this.spec.reference, s = this.spec.look.scale, ctx = this.chart.ctx;
    if (!ref || !(ref.value >= this.spec.scale.min && ref.value <= this.spec.scale.max)) return;
    const y = top + (1 - (this.spec.scale.position(ref.value) ?? 0)) * height;
    ctx.save();
    ctx.setLineDash(ref.dash.map((v) => v * s));
    for (const [colour, width] of [[this.spec.look.palette.background, 4], [ref.colour, 2]] as const) {
      ctx.strokeStyle = colour;
      ctx.lineWidth = width * s;
      ctx.beginPath();
      ctx.moveTo(x - 3 * s, y);
      ctx.lineTo(x + barWidth + 3 * s, y);
      ctx.stroke();
    }
    ctx.restore();
  }
}

function tickText(ticks: TickSet, v: number): string {
  return formatTick(v, ticks.fractionDigits, ticks.step);
}

/** A per-chart plugin that adds the colour bar box while the chart lives. */
export function colourBarPlugin(spec: ColourBarSpec): Plugin {
  return {
    id: 'setpointColourBar',
    ...layoutBoxHooks((chart) => new ColourBarBox(chart, spec)),
  };
}
