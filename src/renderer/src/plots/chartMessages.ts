/**
 * Every message between the page and the chart worker (chartWorker.ts), typed once for both sides.
 *
 * A figure on the page hands its canvas to the worker once (transferControlToOffscreen); after that
 * the page sends only what the chart is (a PlotSpec: plain data, no functions) and what the person
 * does (its size, the pointer, keys), and the worker builds, draws and redraws the Chart.js chart.
 * The main thread never runs Chart.js for the screen, so a chart that takes 300 ms to lay out cannot
 * hold up input or painting (W3C Long Tasks API: a task over 50 ms is a long task).
 */
import type { ExportOptions, PlotSpec } from '../../../figures/writers/plotSpec';

/** How arrow keys walk the tooltip: along the data, or over a grid of `columns` per row (the heat map). */
export type KeyNavigation = { kind: 'list' } | { kind: 'grid'; columns: number };

/** A figure's drawing size: CSS pixels and the screen's device pixel ratio. */
export interface FigureSize {
  widthPx: number;
  heightPx: number;
  pixelRatio: number;
}

export type PointerKind = 'mousemove' | 'mouseout' | 'click';

export type ChartRequest =
  | { type: 'attach'; figure: number; canvas: OffscreenCanvas }
  | { type: 'draw'; figure: number; version: number; spec: PlotSpec; size: FigureSize; keys: KeyNavigation }
  | { type: 'resize'; figure: number; version: number; size: FigureSize }
  | { type: 'pointer'; figure: number; kind: PointerKind; x: number; y: number }
  | { type: 'key'; figure: number; key: string }
  | { type: 'detach'; figure: number }
  /** What is on a figure's canvas (pixels, layout boxes, tooltip), for tests and checks. */
  | { type: 'inspect'; figure: number; request: number }
  | { type: 'export'; request: number; spec: PlotSpec; options: ExportOptions; format: 'png' | 'svg' };

/** A layout box as Chart.js placed it, in CSS px (axes have isScale). */
export interface PlacedBox {
  position: string;
  isScale: boolean;
  left: number;
  top: number;
  right: number;
  bottom: number;
}

/**
 * Where a drawn chart put its plot area (CSS px from the figure's top left) and the x values at
 * its left and right edges, so a gesture on the page can turn a pointer position into a value on
 * a linear x axis without asking the worker: x = xAtLeft + (px − left)/(right − left)·(xAtRight − xAtLeft).
 */
export interface PlotFrame {
  left: number;
  right: number;
  top: number;
  bottom: number;
  xAtLeft: number;
  xAtRight: number;
}

export interface FigureInspection {
  width: number;
  height: number;
  pixelRatio: number;
  /** height×width×4, row-major, of the canvas as drawn. */
  rgba: Uint8ClampedArray;
  boxes: PlacedBox[];
  /** Data points with an active tooltip. */
  activeCount: number;
}

export type ChartReply =
  | { type: 'drawn'; figure: number; version: number; frame?: PlotFrame }
  | { type: 'failed'; figure: number; version: number; message: string }
  | { type: 'inspected'; request: number; inspection: FigureInspection | null }
  | { type: 'exported'; request: number; bytes: Uint8Array }
  | { type: 'exportFailed'; request: number; message: string };
