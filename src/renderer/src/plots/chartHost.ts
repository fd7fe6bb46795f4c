/**
 * The page's side of the chart worker (chartWorker.ts): one worker for every figure, started on
 * first use. A figure attaches its canvas once and then sends specs, sizes, pointer moves and keys;
 * the worker reports each drawing (or why it failed) back to that figure. Exports are numbered
 * requests answered with the file's bytes.
 *
 * Pointer moves are sent at most once per animation frame (the last position wins), as a
 * browser delivers them to a canvas's own listeners.
 */
import type { ExportOptions, PlotSpec } from '../../../figures/writers/plotSpec';
import type { ChartReply, ChartRequest, FigureInspection, FigureSize, KeyNavigation, PlotFrame, PointerKind } from './chartMessages';

export type FigureState = { status: 'drawn'; version: number; frame?: PlotFrame } | { status: 'failed'; version: number; message: string };

export interface FigureHandle {
  /** Each returns the version the worker's report of this drawing will carry. */
  draw(spec: PlotSpec, size: FigureSize, keys: KeyNavigation): number;
  resize(size: FigureSize): number;
  pointer(kind: PointerKind, x: number, y: number): void;
  key(key: string): void;
  inspect(): Promise<FigureInspection | null>;
  detach(): void;
}

interface WorkerLike {
  postMessage(message: ChartRequest, transfer?: Transferable[]): void;
  onmessage: ((event: MessageEvent<ChartReply>) => void) | null;
}

let worker: WorkerLike | null = null;
let nextFigure = 1, nextRequest = 1;
const listeners = new Map<number, (state: FigureState) => void>();
const pending = new Map<number, { resolve: (value: never) => void; reject: (error: Error) => void }>();

function chartWorker(): WorkerLike {
  if (!worker) {
    worker = new Worker(new URL('./chartWorker.ts', import.meta.url), { type: 'module' }) as unknown as WorkerLike;
    worker.onmessage = (event) => receive(event.data);
  }
  return worker;
}

function receive(reply: ChartReply): void {
  switch (reply.type) {
    case 'drawn': listeners.get(reply.figure)?.({ status: 'drawn', version: reply.version, ...(reply.frame ? { frame: reply.frame } : {}) }); return;
    case 'failed': listeners.get(reply.figure)?.({ status: 'failed', version: reply.version, message: reply.message }); return;
    case 'inspected': settle(reply.request, (p) => p.resolve(reply.inspection as never)); return;
    case 'exported': settle(reply.request, (p) => p.resolve(reply.bytes as never)); return;
    case 'exportFailed': settle(reply.request, (p) => p.reject(new Error(reply.message)));
  }
}

function settle(request: number, how: (p: { resolve: (value: never) => void; reject: (error: Error) => void }) => void): void {
  const entry = pending.get(request);
  pending.delete(request);
  if (entry) how(entry);
}

function ask<T>(make: (request: number) => ChartRequest): Promise<T> {
  const request = nextRequest++;
  return new Promise<T>((resolve, reject) => {
    pending.set(request, { resolve: resolve as (value: never) => void, reject });
    chartWorker().postMessage(make(request));
  });
}

/** Whether this browser can hand a canvas to a worker (Chromium, and so Electron, can). */
export function offscreenChartsSupported(): boolean {
  return typeof Worker !== 'undefined' && typeof HTMLCanvasElement !== 'undefined' && 'transferControlToOffscreen' in HTMLCanvasElement.prototype;
}

/** Hand a canvas to the worker; onState hears of each drawing. The canvas is the worker's from now on. */
export function attachFigure(canvas: HTMLCanvasElement, onState: (state: FigureState) => void): FigureHandle {
  const figure = nextFigure++, w = chartWorker();
  const offscreen = canvas.transferControlToOffscreen();
  w.postMessage({ type: 'attach', figure, canvas: offscreen }, [offscreen]);
  listeners.set(figure, onState);
  let version = 0, queued: { kind: PointerKind; x: number; y: number } | null = null;
  const flush = () => {
    if (queued) w.postMessage({ type: 'pointer', figure, ...queued });
    queued = null;
  };
  return {
    draw(spec, size, keys) {
      version++;
      w.postMessage({ type: 'draw', figure, version, spec, size, keys });
      return version;
    },
    resize(size) {
      version++;
      w.postMessage({ type: 'resize', figure, version, size });
      return version;
    },
    pointer(kind, x, y) {
      if (kind !== 'mousemove') {
        queued = null;
        w.postMessage({ type: 'pointer', figure, kind, x, y });
        return;
      }
      if (!queued) requestAnimationFrame(flush);
      queued = { kind, x, y };
    },
    key: (key) => w.postMessage({ type: 'key', figure, key }),
    inspect: () => ask<FigureInspection | null>((request) => ({ type: 'inspect', figure, request })),
    detach() {
      listeners.delete(figure);
      w.postMessage({ type: 'detach', figure });
    },
  };
}

/** A PNG or SVG export written in the worker; rejects with the exporter's message. */
export function exportInWorker(spec: PlotSpec, options: ExportOptions, format: 'png' | 'svg'): Promise<Uint8Array> {
  return ask<Uint8Array>((request) => ({ type: 'export', request, spec, options, format }));
}
