/**
 * The options every plot shares — fonts, colours, title, legend, tooltip, axes — from one look, so
 * the four plots match each other and an export differs from the screen only by its scale.
 */
import type { ChartOptions, ScaleOptions } from 'chart.js';
import { font, PLOT_FONTS, type PlotLook } from './plotLook';

export const CHART_STYLE_DEFAULTS = { paddingPx: 10, titleGapPx: 6, legendBoxPx: 18, legendGapPx: 12, tooltipPaddingPx: 8 } as const;

export function sharedOptions(look: PlotLook, title: string, subtitle: string | null): ChartOptions {
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
        display: subtitle !== null, text: subtitle ?? '', color: p.mutedText, font: font(look, PLOT_FONTS.subtitlePx),
        padding: { top: 0, bottom: d.titleGapPx * s },
      },
      legend: {
        display: true, position: 'top', align: 'start',
        labels: { color: p.text, font: font(look, PLOT_FONTS.legendPx), boxWidth: d.legendBoxPx * s, boxHeight: 10 * s, padding: d.legendGapPx * s },
      },
      tooltip: {
        enabled: look.interactive, backgroundColor: p.tooltipBackground, titleColor: p.tooltipText, bodyColor: p.tooltipText,
        titleFont: font(look, PLOT_FONTS.tooltipPx, 'bold'), bodyFont: font(look, PLOT_FONTS.tooltipPx), padding: d.tooltipPaddingPx * s,
      },
    },
  };
}

type AxisOptions = ScaleOptions<'linear'>;

/** A numeric axis with a title; grid lines inside the plot area unless drawOnChartArea is false. */
export function valueAxis(look: PlotLook, title: string, position: 'left' | 'right' | 'bottom', gridInside = true): AxisOptions {
  const p = look.palette, s = look.scale;
  return {
    position,
    title: { display: true, text: title, color: p.text, font: font(look, PLOT_FONTS.axisTitlePx, 'bold'), padding: { top: 4 * s, bottom: 2 * s } },
    ticks: { color: p.text, font: font(look, PLOT_FONTS.tickPx), padding: 4 * s },
    grid: { color: p.grid, lineWidth: s, drawOnChartArea: gridInside, tickLength: 5 * s, tickColor: p.axis },
    border: { display: true, color: p.axis, width: s },
  };
}
