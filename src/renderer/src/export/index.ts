/**
 * Image and table export of the plots for the app: the host-free writers of src/figures (SVG, the
 * caption, PNG chunks), the browser's PNG encoder, the surface CSV, and the caution every caption
 * carries (src/pipeline/cautions.ts).
 */
import { CAUTION_SHORT } from '../../../pipeline/cautions';
import { exportCaption as captionWith, type CaptionParts } from '../../../figures/writers/exportCaption';

export type { ExportOptions, PlotSpec } from '../../../figures/writers/plotSpec';
export { exportPlotPng, PngExportError } from './exportPng';
export { exportPlotSvg } from '../../../figures/writers/exportSvg';
export { surfaceCsv } from './surfaceCsv';
export type { CaptionParts } from '../../../figures/writers/exportCaption';
export { ExportOptionsError, EXPORT_LIMITS } from '../../../figures/writers/exportPlan';
export { pngDpi, pngSize } from '../../../figures/writers/pngChunks';

/** The export caption with the app's caution. */
export function exportCaption(parts: CaptionParts): string {
  return captionWith(parts, CAUTION_SHORT);
}

export const CAUTION = CAUTION_SHORT;
