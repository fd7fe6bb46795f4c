/**
 * A plot as a PNG of exactly widthPx × heightPx: the chart drawn off screen at that size (fonts and
 * lines scaled by dpi/96), the caption drawn under it, on white or left transparent, encoded by the
 * browser, with a pHYs chunk telling the dpi so a report places it at its intended physical size
 * (e.g. 1950 × 1200 px at 300 dpi = 6.5 in × 4 in). Drawn on OffscreenCanvas, so it runs in the
 * chart worker as well as on the page.
 */
import { drawCaption } from '../../../figures/writers/captionLayout';
import { exportPlan } from '../../../figures/writers/exportPlan';
import { drawChartOnce } from '../../../figures/writers/drawChart';
import type { ExportOptions, PlotSpec } from '../../../figures/writers/plotSpec';
import { withPhysicalResolution } from '../../../figures/writers/pngChunks';
import { canvasTextMeasure } from '../../../figures/writers/textMeasure';

export class PngExportError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PngExportError';
  }
}

export async function exportPlotPng(spec: PlotSpec, options: ExportOptions): Promise<Uint8Array> {
  const measure = canvasTextMeasure();
  if (!measure) throw new PngExportError('PNG export needs a browser canvas, and none is available here');
  const plan = exportPlan(spec, options, measure);
  const plot = new OffscreenCanvas(plan.widthPx, plan.plotHeightPx);
  const chart = drawChartOnce(plot, spec, plan.look);
  const out = new OffscreenCanvas(plan.widthPx, plan.heightPx);
  const ctx = out.getContext('2d');
  if (!ctx) throw new PngExportError('PNG export: the browser gave no 2D canvas context');
  if (options.background === 'white') {
    ctx.fillStyle = '#ffffff';
    ctx.fillRect(0, 0, out.width, out.height);
  }
  ctx.drawImage(plot, 0, 0);
  chart.destroy();
  drawCaption(ctx as unknown as CanvasRenderingContext2D, plan.caption, plan.plotHeightPx, plan.look);
  let blob: Blob;
  try {
    blob = await out.convertToBlob({ type: 'image/png' });
  } catch {
    throw new PngExportError(`PNG export: the browser could not encode a ${out.width}×${out.height} image`);
  }
  return withPhysicalResolution(new Uint8Array(await blob.arrayBuffer()), options.dpi);
}
