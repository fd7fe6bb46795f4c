/**
 * Press, drag and release across the trend to leave out a time window: while the button is held
 * the span is shaded over the plot with its two ends and its length; on release it is handed to
 * `onAdd`, which adds it the way the form does (one undoable edit of data.csv.excludedTimes, checked
 * on import with the same messages). Escape, or the pointer being taken away, cancels the drag.
 * The figure keeps its tooltip and arrow keys; keyboard users add a window with the form.
 *
 * The span is a page element over the worker-drawn canvas, placed from the plot area the worker
 * reported (PlotFrame), so a drag redraws nothing until the window is added.
 */
import { useEffect, useRef, useState, type PointerEvent, type ReactNode, type SyntheticEvent } from 'react';
import { clockText, durationText } from '../../../../core/clockText';
import type { PlotFrame } from '../../plots/chartMessages';
import { clampToFrame, draggedSpan } from './trendDrag';

interface Drag {
  frame: PlotFrame;
  pointerId: number;
  startPx: number;
  endPx: number;
}

interface TrendWindowDragProps {
  /** Where the trend's plot area is; null while it is being drawn (no drag then). */
  frame: PlotFrame | null;
  calendar: boolean;
  /** The log's clock starts again in each run: say that the window is taken from every run. */
  everyRun: boolean;
  onAdd: (span: { fromSeconds: number; toSeconds: number }) => void;
  children: ReactNode;
}

const inside = (f: PlotFrame, x: number, y: number): boolean => x >= f.left && x <= f.right && y >= f.top && y <= f.bottom;

export function TrendWindowDrag({ frame, calendar, everyRun, onAdd, children }: TrendWindowDragProps) {
  // The drag lives in a ref, read by every pointer event as it arrives (no event waits for a render
  // to see the press), and is mirrored into state only to draw the span.
  const [drag, setDragState] = useState<Drag | null>(null);
  const dragRef = useRef<Drag | null>(null);
  const boxRef = useRef<HTMLDivElement>(null);
  const justDragged = useRef(false);
  const setDrag = (next: Drag | null): void => {
    dragRef.current = next;
    setDragState(next);
  };
  const at = (event: PointerEvent): { x: number; y: number } => {
    const r = boxRef.current!.getBoundingClientRect();
    return { x: event.clientX - r.left, y: event.clientY - r.top };
  };
  const cancel = (): void => {
    const current = dragRef.current;
    if (current && boxRef.current?.hasPointerCapture(current.pointerId)) boxRef.current.releasePointerCapture(current.pointerId);
    setDrag(null);
  };

  const dragging = drag !== null;
  useEffect(() => {
    if (!dragging) return;
    const onKey = (event: KeyboardEvent): void => {
      if (event.key !== 'Escape') return;
      event.preventDefault();
      cancel();
    };
    window.addEventListener('keydown', onKey, true);
    return () => window.removeEventListener('keydown', onKey, true);
  }, [dragging]); // cancel reads refs only, so the listener never goes stale

  const onPointerDown = (event: PointerEvent): void => {
    const p = at(event);
    if (!frame || event.button !== 0 || !inside(frame, p.x, p.y)) return;
    event.preventDefault(); // no text selection while dragging
    boxRef.current!.setPointerCapture(event.pointerId);
    setDrag({ frame, pointerId: event.pointerId, startPx: p.x, endPx: p.x });
  };
  const onPointerMove = (event: PointerEvent): void => {
    const current = dragRef.current;
    if (current?.pointerId === event.pointerId) setDrag({ ...current, endPx: clampToFrame(current.frame, at(event).x) });
  };
  const onPointerUp = (event: PointerEvent): void => {
    const current = dragRef.current;
    if (current?.pointerId !== event.pointerId) return;
    const span = draggedSpan(current.frame, current.startPx, at(event).x);
    cancel();
    justDragged.current = span !== null;
    if (span) onAdd(span);
  };
  // Capture taken away (the window lost focus, the element went): the drag ends. A late notice of an
  // earlier release is ignored while this drag still holds the capture.
  const loseCapture = (event: PointerEvent): void => {
    if (dragRef.current?.pointerId === event.pointerId && !boxRef.current?.hasPointerCapture(event.pointerId)) setDrag(null);
  };
  // While dragging, the figure's tooltip does not follow the pointer, and the release is not also a click on the chart.
  const swallow = (event: SyntheticEvent): void => {
    if (dragRef.current || justDragged.current) event.stopPropagation();
    if (event.type === 'click') justDragged.current = false;
  };

  return (
    <div
      ref={boxRef} style={{ position: 'relative', overflow: 'hidden', cursor: frame ? 'col-resize' : undefined, touchAction: 'pan-y' }} data-testid="trend-drag"
      // The plot area and the times at its edges, for checks that drag to a given time.
      data-plot-area={frame ? [frame.left, frame.right, frame.xAtLeft, frame.xAtRight].join(' ') : undefined}
      onPointerDown={onPointerDown} onPointerMove={onPointerMove} onPointerUp={onPointerUp}
      onPointerCancel={cancel} onLostPointerCapture={loseCapture} onMouseMoveCapture={swallow} onClickCapture={swallow}
    >
      {children}
      {drag && <DragSpan drag={drag} calendar={calendar} everyRun={everyRun} />}
    </div>
  );
}

function DragSpan({ drag, calendar, everyRun }: { drag: Drag; calendar: boolean; everyRun: boolean }) {
  const { frame } = drag;
  const left = Math.min(drag.startPx, drag.endPx), right = Math.max(drag.startPx, drag.endPx);
  const span = draggedSpan(frame, drag.startPx, drag.endPx);
  const text = span
    ? `${clockText(span.fromSeconds, calendar)} to ${clockText(span.toSeconds, calendar)} (${durationText(span.toSeconds - span.fromSeconds)})${everyRun ? ' in every run' : ''} — release to leave out, Escape to cancel`
    : 'Drag across the time axis to leave out a window; Escape cancels';
  return (
    // Pointer feedback only (it changes with every move, so it is not announced); the list below says what was added.
    <div className="trend-drag-span" data-testid="trend-drag-span" aria-hidden="true" style={{ left, width: Math.max(1, right - left), top: frame.top, height: frame.bottom - frame.top }}>
      <span className="trend-drag-label" style={labelSide(frame, left, right)}>{text}</span>
    </div>
  );
}

/**
 * The label goes beside the span on the side with more room and wraps to that room, so it stays on
 * the plot: nothing of the drag may reach past the figure, or the page would gain a scroll bar,
 * the figure a new width and the chart a redraw in the middle of the drag.
 */
function labelSide(frame: PlotFrame, left: number, right: number): { left?: number; right?: number; maxWidth: number } {
  const roomLeft = left - frame.left, roomRight = frame.right - right;
  return roomLeft > roomRight
    ? { right: right - left + 4, maxWidth: Math.max(120, roomLeft - 8) }
    : { left: right - left + 4, maxWidth: Math.max(120, roomRight - 8) };
}
