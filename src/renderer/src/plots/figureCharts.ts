/**
 * The chart worker's figures: one slot per figure on the page, holding the OffscreenCanvas the page
 * handed over and the Chart.js chart drawn on it. Each request is answered here; chartWorker.ts only
 * wires this to the worker's messages. Charts are drawn at the figure's CSS size times its device
 * pixel ratio, like Chart.js's own responsive mode, but sized by the page's measurements.
 */
import { Chart, type ChartConfiguration } from 'chart.js';
import { registerChartParts } from '../../../figures/parts/chartParts';
import { screenLook } from '../../../figures/parts/plotLook';
import { plotChartConfig, type PlotSpec } from '../../../figures/writers/plotSpec';
import type { ChartReply, ChartRequest, FigureInspection, FigureSize, KeyNavigation, PlotFrame, PointerKind } from './chartMessages';
import { ForwardedEventsPlatform } from './forwardedEventsPlatform';
import { keyStepOf } from './keyNavigation';

interface Slot {
  canvas: OffscreenCanvas;
  chart: Chart | null;
  spec: PlotSpec | null;
  size: FigureSize | null;
  keys: KeyNavigation;
  version: number;
  cursor: number;
}

export type Post = (reply: ChartReply, transfer?: Transferable[]) => void;

/** Build the screen configuration of a spec and draw it on the canvas at size (throws what the spec's builder throws). */
export function drawFigure(canvas: OffscreenCanvas, spec: PlotSpec, size: FigureSize): Chart {
  registerChartParts();
  const config = plotChartConfig(spec, screenLook(spec.props.theme)) as ChartConfiguration;
  canvas.width = size.widthPx;
  canvas.height = size.heightPx;
  return new Chart(canvas as unknown as HTMLCanvasElement, {
    ...config,
    platform: ForwardedEventsPlatform,
    options: { ...config.options, responsive: false, animation: false, devicePixelRatio: size.pixelRatio },
  });
}

/** The plot area and the values at its left and right edges, for a chart whose x axis is linear. */
export function plotFrameOf(chart: Chart): PlotFrame | undefined {
  const a = chart.chartArea, x = chart.scales.x;
  if (!a || !x || x.type !== 'linear') return undefined;
  const xAtLeft = x.getValueForPixel(a.left), xAtRight = x.getValueForPixel(a.right);
  if (xAtLeft === undefined || xAtRight === undefined || !Number.isFinite(xAtLeft) || !Number.isFinite(xAtRight)) return undefined;
  return { left: a.left, right: a.right, top: a.top, bottom: a.bottom, xAtLeft, xAtRight };
}

export function createFigureCharts(post: Post) {
  const drawn = (figure: number, slot: Slot): void => {
    const frame = slot.chart ? plotFrameOf(slot.chart) : undefined;
    post({ type: 'drawn', figure, version: slot.version, ...(frame ? { frame } : {}) });
  };

  const slots = new Map<number, Slot>();

  function redraw(figure: number, slot: Slot): void {
    slot.chart?.destroy();
    slot.chart = null;
    slot.cursor = -1;
    if (!slot.spec || !slot.size) return;
    if (slot.size.widthPx < 1 || slot.size.heightPx < 1) {
      post({ type: 'drawn', figure, version: slot.version }); // nothing to see at zero size: drawn when it has a size
      return;
    }
    try {
      slot.chart = drawFigure(slot.canvas, slot.spec, slot.size);
      drawn(figure, slot);
    } catch (error) {
      post({ type: 'failed', figure, version: slot.version, message: error instanceof Error ? error.message : String(error) });
    }
  }

  function resize(figure: number, slot: Slot, size: FigureSize): void {
    const before = slot.size;
    slot.size = size;
    if (slot.chart && before && before.pixelRatio === size.pixelRatio && size.widthPx > 0 && size.heightPx > 0) {
      slot.chart.resize(size.widthPx, size.heightPx);
      drawn(figure, slot);
    } else {
      redraw(figure, slot);
    }
  }

  function pointer(slot: Slot, kind: PointerKind, x: number, y: number): void {
    if (slot.chart) (slot.chart.platform as ForwardedEventsPlatform).dispatch(slot.chart, kind, x, y);
  }

  function key(slot: Slot, name: string): void {
    const chart = slot.chart;
    const points = chart?.getDatasetMeta(0)?.data ?? [];
    if (!chart || points.length === 0) return;
    if (name === 'Escape') {
      chart.tooltip?.setActiveElements([], { x: 0, y: 0 });
      chart.update('none');
      return;
    }
    const next = keyStepOf(slot.keys)(name, Math.max(0, slot.cursor), points.length);
    if (next === null) return;
    slot.cursor = next;
    const { x, y } = points[next];
    chart.tooltip?.setActiveElements([{ datasetIndex: 0, index: next }], { x, y });
    chart.update('none');
  }

  function inspect(slot: Slot | undefined): FigureInspection | null {
    const chart = slot?.chart;
    if (!slot || !chart) return null;
    const { width, height } = slot.canvas;
    const ctx = slot.canvas.getContext('2d')!;
    return {
      width, height, pixelRatio: chart.currentDevicePixelRatio, rgba: ctx.getImageData(0, 0, width, height).data,
      boxes: chart.boxes.map((b) => ({ position: String(b.position), isScale: 'axis' in b, left: b.left, top: b.top, right: b.right, bottom: b.bottom })),
      activeCount: chart.tooltip?.getActiveElements().length ?? 0,
    };
  }

  /** Answer one request about a figure (exports are answered by the worker itself). */
  function handle(request: Exclude<ChartRequest, { type: 'export' }>): void {
    if (request.type === 'attach') {
      slots.set(request.figure, { canvas: request.canvas, chart: null, spec: null, size: null, keys: { kind: 'list' }, version: 0, cursor: -1 });
      return;
    }
    const slot = slots.get(request.figure);
    if (request.type === 'inspect') {
      const inspection = inspect(slot);
      post({ type: 'inspected', request: request.request, inspection }, inspection ? [inspection.rgba.buffer] : []);
      return;
    }
    if (!slot) return;
    switch (request.type) {
      case 'draw':
        Object.assign(slot, { spec: request.spec, size: request.size, keys: request.keys, version: request.version });
        redraw(request.figure, slot);
        return;
      case 'resize':
        slot.version = request.version;
        resize(request.figure, slot, request.size);
        return;
      case 'pointer': pointer(slot, request.kind, request.x, request.y); return;
      case 'key': key(slot, request.key); return;
      case 'detach':
        slot.chart?.destroy();
        slots.delete(request.figure);
    }
  }

  return { handle, figureCount: () => slots.size };
}
