/**
 * The options every plot shares — fonts, colours, title, legend, tooltip, axes — from one look, so
 * the four plots match each other and an export differs from the screen only by its scale.
 */
import type { ChartOptions, Plugin, ScaleOptions } from 'chart.js';
import { axisTitlePlugin } from './axisTitle';
import { formatTick, fractionDigitsOf, tickStepOf } from './tickFormat';
import { font, PLOT_FONTS, type PlotLook } from './plotLook';

export const CHART_STYLE_DEFAULTS = { paddingPx: 10, titleGapPx: 6, legendBoxPx: 18, legendGapPx: 12, tooltipPaddingPx: 8 } as const;

/** subtitle: one line, or several (Chart.js squeezes a line wider than the plot rather than wrapping it). */
export function sharedOptions(look: PlotLook, title: string, subtitle: string | readonly string[] | null): ChartOptions {
  const p = look.palette, s = look.scale, d = CHART_STYLE_DEFAULTS;
  return {
    responsive: look.interactive,
    maintainAspectRatio: false,
    animation: false,
    locale: 'en-US',
    ...(look.interactive ? {} : { devicePixelRatio: 1, events: [] }),
    color: p.text,
    layout: { padding: d.paddingPx * s },
    plugins: {
      title: {
        display: title.length > 0, text: title, color: p.text, font: font(look, PLOT_FONTS.titlePx, 'bold'),
        padding: { top: 0, bottom: (subtitle ? 2 : d.titleGapPx) * s },
      },
      subtitle: {
        display: subtitle !== null, text: typeof subtitle === 'string' || subtitle === null ? subtitle ?? '' : [...subtitle], color: p.mutedText, font: font(look, PLOT_FONTS.subtitlePx),
        padding: { top: 0, bottom: d.titleGapPx * s },
      },
      // Our own legend box (legendBox.ts) draws keys that match the series; Chart.js's stays off.
      legend: { display: false },
      tooltip: {
        enabled: look.interactive, backgroundColor: p.tooltipBackground, titleColor: p.tooltipText, bodyColor: p.tooltipText,
        titleFont: font(look, PLOT_FONTS.tooltipPx, 'bold'), bodyFont: font(look, PLOT_FONTS.tooltipPx), padding: d.tooltipPaddingPx * s,
      },
    },
  };
}

type AxisOptions = ScaleOptions<'linear'>;

/**
 * A numeric axis. Its title is drawn by axisTitles (axisTitlePlugin, so it can carry V^{π}), never here; ticks use one
 * number of decimals per axis, the true minus sign, and no extra ticks at the axis ends (an end
 * tick such as "3.2" would crowd the round "3" beside it).
 */
export function valueAxis(look: PlotLook, position: 'left' | 'right' | 'bottom', gridInside = true): AxisOptions {
  const p = look.palette, s = look.scale;
  return {
    position,
    title: { display: false },
    ticks: {
      // Never rotated: a rotated label's box reaches into its neighbours' and the axis title's;
      // Chart.js leaves out every other label instead, with at least autoSkipPadding between two.
      color: p.text, font: font(look, PLOT_FONTS.tickPx), padding: 4 * s, includeBounds: false, maxRotation: 0, autoSkipPadding: 8 * s,
      callback: (value, _index, ticks) => formatTick(Number(value), fractionDigitsOf(ticks.map((t) => t.value)), tickStepOf(ticks.map((t) => t.value))),
    },
    grid: { color: p.grid, lineWidth: s, drawOnChartArea: gridInside, tickLength: 5 * s, tickColor: p.axis },
    border: { display: true, color: p.axis, width: s },
  };
}

/** The axis titles of a chart as plugins (see axisTitle.ts). */
export function axisTitles(look: PlotLook, titles: readonly { scaleId: string; position: 'left' | 'right' | 'bottom'; text: string }[]): Plugin[] {
  return titles.map((t) => axisTitlePlugin({ ...t, look }));
}
