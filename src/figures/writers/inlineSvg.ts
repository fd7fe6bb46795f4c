/**
 * A chart as an <svg> element to place inside an HTML document (the report): the same Chart.js
 * configuration the app draws, replayed onto SvgContext at a size in CSS px, with no caption (the
 * document's <figcaption> carries it). Text is laid out with the Helvetica metrics and names the
 * metric-compatible family, so the layout holds wherever the document is opened.
 */
import type { ChartConfiguration } from 'chart.js';
import { plotPalette, type Theme } from '../parts/plotTheme';
import type { PlotLook } from '../parts/plotLook';
import { drawConfigOnce } from './drawChart';
import { METRIC_FONT_FAMILY, metricTextMeasure } from './fontMetrics';
import { SvgContext, type TextMeasure } from './svgContext';
import { withRecordingPath2D } from './svgPath2D';
import { attributes, escapeXml } from './svgMarkup';

export interface InlineSvgOptions {
  widthPx: number;
  heightPx: number;
  /** Unique within the document; prefixes the SVG's ids. */
  id: string;
  /** The accessible name (role="img"). */
  label: string;
  theme?: Theme;
  measure?: TextMeasure;
}

/** The look of a figure in a document: the light palette at scale 1 in the metric family. */
export function documentLook(theme: Theme = 'light'): PlotLook {
  return { palette: plotPalette(theme), scale: 1, interactive: false, fontFamily: METRIC_FONT_FAMILY };
}

export function inlineSvg(make: (look: PlotLook) => ChartConfiguration, options: InlineSvgOptions): string {
  const look = documentLook(options.theme);
  const ctx = new SvgContext(options.widthPx, options.heightPx, options.measure ?? metricTextMeasure, `${options.id}-`);
  withRecordingPath2D(() => drawConfigOnce(ctx.canvas, make(look)).destroy());
  return `<svg${attributes({
    xmlns: 'http://www.w3.org/2000/svg', viewBox: `0 0 ${options.widthPx} ${options.heightPx}`, width: options.widthPx, height: options.heightPx,
    role: 'img', 'aria-label': options.label, id: options.id,
  })}><title>${escapeXml(options.label)}</title>${ctx.markup()}</svg>`;
}
