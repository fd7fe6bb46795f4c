/**
 * The React host of one chart: a focusable figure with an accessible name (role="img",
 * aria-label) and a text summary for screen readers. Its canvas belongs to the chart worker
 * (chartHost.ts), which draws the spec at the figure's size and redraws on resize; pointer moves
 * and arrow keys are forwarded, so the tooltip can be walked through the data without a mouse.
 * A spec that cannot be drawn shows the builder's message.
 */
import { useEffect, useId, useRef, useState, type CSSProperties, type KeyboardEvent, type MouseEvent } from 'react';
import type { PlotSpec } from '../../../figures/writers/plotSpec';
import type { PlotPalette } from '../../../figures/parts/plotTheme';
import { attachFigure, type FigureHandle, type FigureState } from './chartHost';
import type { FigureInspection, FigureSize, KeyNavigation, PlotFrame, PointerKind } from './chartMessages';
import { NAVIGATION_KEYS } from './keyNavigation';

const KEY_HINT = 'Arrow keys step through the values; Escape hides the readout.';

interface ChartFigureProps {
  testId: string;
  label: string;
  summary: string;
  heightPx: number;
  palette: PlotPalette;
  /** The chart to draw; keep the object the same while nothing in it changes (it is sent to the worker when it changes). */
  spec: PlotSpec;
  /** Arrow keys walk a grid of this many values per row (the heat map); else the list of values. */
  keyColumns?: number;
  /** Hears where each drawing put its plot area (null while a drawing is pending or failed), for gestures on the figure. */
  onFrame?: (frame: PlotFrame | null) => void;
}

const visuallyHidden: CSSProperties = {
  position: 'absolute', width: 1, height: 1, overflow: 'hidden', clip: 'rect(0 0 0 0)', whiteSpace: 'nowrap', margin: -1, padding: 0, border: 0,
};

// Each mounted figure's worker handle, so checks can ask what is drawn (inspectFigure).
const handles = new WeakMap<Element, FigureHandle>();

/** Pixels, layout boxes and tooltip state of the chart in a figure element (null when none is drawn). */
export function inspectFigure(figure: Element): Promise<FigureInspection | null> {
  return handles.get(figure)?.inspect() ?? Promise.resolve(null);
}

function measure(box: HTMLElement): FigureSize {
  const r = box.getBoundingClientRect();
  return { widthPx: Math.round(r.width), heightPx: Math.round(r.height), pixelRatio: window.devicePixelRatio || 1 };
}

const sameSize = (a: FigureSize | null, b: FigureSize) => a !== null && a.widthPx === b.widthPx && a.heightPx === b.heightPx && a.pixelRatio === b.pixelRatio;

export function ChartFigure({ testId, label, summary, heightPx, palette, spec, keyColumns, onFrame }: ChartFigureProps) {
  const figureRef = useRef<HTMLElement>(null);
  const boxRef = useRef<HTMLDivElement>(null);
  const handleRef = useRef<FigureHandle | null>(null);
  const sizeRef = useRef<FigureSize | null>(null);
  const drawnVersion = useRef(0);
  const requestRef = useRef<((version: number) => void) | null>(null);
  const [state, setState] = useState<FigureState | null>(null);
  const summaryId = useId();
  const onFrameRef = useRef(onFrame);
  onFrameRef.current = onFrame;
  useEffect(() => onFrameRef.current?.(state?.status === 'drawn' ? state.frame ?? null : null), [state]);

  // The canvas is made here, not by React: once handed to the worker it cannot be handed again,
  // so a remount (StrictMode, a new figure) gets a fresh one.
  useEffect(() => {
    const box = boxRef.current!, figure = figureRef.current!;
    const canvas = document.createElement('canvas');
    canvas.setAttribute('aria-hidden', 'true');
    canvas.style.cssText = 'display:block;width:100%;height:100%';
    box.appendChild(canvas);
    const handle = attachFigure(canvas, (s) => {
      if (s.version === drawnVersion.current) setState(s);
    });
    // Until the worker reports the latest drawing, the figure says it is waiting (checks wait on it).
    const request = (version: number) => {
      drawnVersion.current = version;
      setState(null);
    };
    requestRef.current = request;
    handleRef.current = handle;
    handles.set(figure, handle);
    const onResize = () => {
      const size = measure(box);
      if (sameSize(sizeRef.current, size)) return;
      sizeRef.current = size;
      request(handle.resize(size));
    };
    const observer = new ResizeObserver(onResize);
    observer.observe(box);
    const zoom = window.matchMedia(`(resolution: ${window.devicePixelRatio || 1}dppx)`);
    zoom.addEventListener('change', onResize);
    return () => {
      observer.disconnect();
      zoom.removeEventListener('change', onResize);
      handle.detach();
      handles.delete(figure);
      canvas.remove();
      handleRef.current = null;
      sizeRef.current = null;
    };
  }, []);

  useEffect(() => {
    const handle = handleRef.current, box = boxRef.current;
    if (!handle || !box) return;
    const size = sizeRef.current ?? measure(box);
    sizeRef.current = size;
    const keys: KeyNavigation = keyColumns ? { kind: 'grid', columns: keyColumns } : { kind: 'list' };
    requestRef.current?.(handle.draw(spec, size, keys));
  }, [spec, keyColumns]);

  const onKeyDown = (event: KeyboardEvent) => {
    if (!NAVIGATION_KEYS.has(event.key)) return;
    if (event.key !== 'Escape') event.preventDefault();
    handleRef.current?.key(event.key);
  };
  const onPointer = (kind: PointerKind) => (event: MouseEvent) => {
    const r = boxRef.current?.getBoundingClientRect();
    if (r) handleRef.current?.pointer(kind, event.clientX - r.left, event.clientY - r.top);
  };

  const failed = state?.status === 'failed' ? state.message : null;
  return (
    <figure
      ref={figureRef}
      data-testid={testId}
      data-chart-state={state?.status ?? 'waiting'}
      role="img"
      aria-label={label}
      aria-describedby={summaryId}
      tabIndex={0}
      onKeyDown={onKeyDown}
      style={{ position: 'relative', margin: 0, width: '100%', height: heightPx, background: palette.background, color: palette.text }}
    >
      <div ref={boxRef} style={{ width: '100%', height: '100%' }} onMouseMove={onPointer('mousemove')} onMouseLeave={onPointer('mouseout')} onClick={onPointer('click')} />
      {failed && <p role="alert" style={{ position: 'absolute', inset: 0, margin: 0, padding: '1em', font: 'inherit', background: palette.background }}>This plot cannot be drawn: {failed}</p>}
      <p id={summaryId} style={visuallyHidden}>{summary} {KEY_HINT}</p>
    </figure>
  );
}
