/**
 * The chart worker: draws every on-screen chart on the OffscreenCanvas its figure handed over, and
 * writes PNG and SVG exports, so Chart.js's layout and drawing never run on the page's main thread.
 * The figures themselves are src/figures chart specs; this file only routes messages.
 */
import { exportPlotSvg } from '../../../figures/writers/exportSvg';
import { exportPlotPng } from '../export/exportPng';
import type { ChartReply, ChartRequest } from './chartMessages';
import { createFigureCharts } from './figureCharts';

const scope = self as unknown as { postMessage(message: ChartReply, transfer?: Transferable[]): void; onmessage: ((event: MessageEvent<ChartRequest>) => void) | null };
const post = (reply: ChartReply, transfer: Transferable[] = []) => scope.postMessage(reply, transfer);
const figures = createFigureCharts(post);

async function exportImage(request: Extract<ChartRequest, { type: 'export' }>): Promise<void> {
  try {
    let bytes: Uint8Array;
    if (request.format === 'png') bytes = await exportPlotPng(request.spec, request.options);
    else {
      const svg = exportPlotSvg(request.spec, request.options);
      if (svg === null) throw new Error('SVG is not available for this plot');
      bytes = new TextEncoder().encode(svg);
    }
    post({ type: 'exported', request: request.request, bytes }, [bytes.buffer as ArrayBuffer]);
  } catch (error) {
    post({ type: 'exportFailed', request: request.request, message: error instanceof Error ? error.message : String(error) });
  }
}

scope.onmessage = (event) => {
  const request = event.data;
  if (request.type === 'export') void exportImage(request);
  else figures.handle(request);
};
