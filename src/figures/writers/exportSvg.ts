/**
 * A plot as SVG: the same chart as the PNG, drawn by Chart.js onto SvgContext, so axes, ticks,
 * labels, lines, bars, whiskers, the colour bar's ticks and the hatching are vector; the heat-map
 * grid and the colour ramp are embedded bitmaps. The document's size is given in inches (pixels ÷
 * dpi) over a viewBox in pixels, so it places at the same physical size as the PNG.
 *
 * Every plot kind can be written today; null stays in the signature for kinds that could not be.
 */
import { withRecordingPath2D } from './svgPath2D';
import { drawCaption } from './captionLayout';
import { exportPlan } from './exportPlan';
import { drawChartOnce } from './drawChart';
import { plotSummary, plotTitle, type ExportOptions, type PlotSpec } from './plotSpec';
import { SvgContext, type TextMeasure } from './svgContext';
import { attributes, escapeXml, svgNumber } from './svgMarkup';
import { defaultTextMeasure } from './textMeasure';

export function exportPlotSvg(spec: PlotSpec, options: ExportOptions, measure: TextMeasure = defaultTextMeasure()): string | null {
  const plan = exportPlan(spec, options, measure);
  const ctx = new SvgContext(plan.widthPx, plan.plotHeightPx, measure);
  withRecordingPath2D(() => drawChartOnce(ctx.canvas, spec, plan.look).destroy());
  drawCaption(ctx as unknown as CanvasRenderingContext2D, plan.caption, plan.plotHeightPx, plan.look);
  const background = options.background === 'white' ? `<rect${attributes({ x: 0, y: 0, width: plan.widthPx, height: plan.heightPx, fill: '#ffffff' })}/>` : '';
  const title = plotTitle(spec), description = `${plotSummary(spec)} ${plan.caption.lines.join(' ')}`;
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<svg${attributes({
      xmlns: 'http://www.w3.org/2000/svg', 'xmlns:xlink': 'http://www.w3.org/1999/xlink', version: '1.1',
      width: `${svgNumber(plan.widthPx / options.dpi)}in`, height: `${svgNumber(plan.heightPx / options.dpi)}in`,
      viewBox: `0 0 ${plan.widthPx} ${plan.heightPx}`, role: 'img', 'aria-labelledby': 'plot-title plot-desc',
    })}>`,
    `<title id="plot-title">${escapeXml(title)}</title>`,
    `<desc id="plot-desc">${escapeXml(description)}</desc>`,
    background,
    ctx.markup(),
    '</svg>',
    '',
  ].join('\n');
}
