/** Image and table export of the plots (PNG with pHYs, SVG, surface CSV) and their caption. */
export type { ExportOptions, PlotSpec } from './plotSpec';
export { exportPlotPng, PngExportError } from './exportPng';
export { exportPlotSvg } from './exportSvg';
export { surfaceCsv } from './surfaceCsv';
export { exportCaption, withCaution, type CaptionParts } from './exportCaption';
export { ExportOptionsError, EXPORT_LIMITS } from './exportPlan';
export { pngDpi, pngSize } from './pngChunks';
