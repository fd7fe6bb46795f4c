/**
 * A Chart.js platform for a chart drawn in a worker on an OffscreenCanvas. Chart.js's DOM platform
 * listens to the canvas element, which a worker does not have; this one keeps the listeners Chart.js
 * registers (mousemove, mouseout, click …) and lets the worker deliver the pointer events the page
 * forwards, already in CSS pixels relative to the canvas. The event object has the fields Chart.js
 * reads from its own (type, chart, native.type, x, y).
 */
import { BasicPlatform, type Chart, type ChartEvent } from 'chart.js';

type Listener = (event: ChartEvent) => void;

export class ForwardedEventsPlatform extends BasicPlatform {
  private readonly listeners = new Map<string, Listener>();

  override addEventListener(_chart: Chart, type: string, listener: Listener): void {
    this.listeners.set(type, listener);
  }

  override removeEventListener(_chart: Chart, type: string): void {
    this.listeners.delete(type);
  }

  /** Deliver a pointer event at (x, y) CSS px; false when the chart does not listen for it. */
  dispatch(chart: Chart, type: string, x: number, y: number): boolean {
    const listener = this.listeners.get(type);
    if (!listener) return false;
    listener({ type, chart, native: { type }, x, y } as unknown as ChartEvent);
    return true;
  }
}
