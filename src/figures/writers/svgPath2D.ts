/**
 * A Path2D for SvgContext. In a browser (the app's chart worker, and the report it writes) Chart.js
 * builds each line dataset as a Path2D once and draws it with ctx.stroke(path) — it tests
 * `typeof Path2D === 'function'` when it loads, so under Node (the command line) it never does. A
 * native Path2D cannot be read back, so SvgContext, which ignored the argument, stroked its own
 * current path instead: the clip rectangle. The app's SVG exports and its report drew a rectangle
 * where the slice's Q curve, the density and the fit history's lines should be (found in the screen
 * review: no Q curve in the two-valve report's slices).
 *
 * So while an SVG is drawn, the global Path2D is this recording class (withRecordingPath2D), and
 * SvgContext replays a recorded path onto its own at stroke, fill or clip time, with the transform
 * current then, as a canvas applies it (HTML Living Standard, "Path2D objects": a path is transformed
 * by the current transformation matrix when it is drawn).
 */

type PathTarget = {
  moveTo(x: number, y: number): void;
  lineTo(x: number, y: number): void;
  bezierCurveTo(a: number, b: number, c: number, d: number, x: number, y: number): void;
  quadraticCurveTo(a: number, b: number, x: number, y: number): void;
  rect(x: number, y: number, w: number, h: number): void;
  arc(x: number, y: number, r: number, start: number, end: number, ccw?: boolean): void;
  closePath(): void;
};

type Op = (target: PathTarget) => void;

export class RecordingPath2D {
  private readonly ops: Op[] = [];

  constructor(from?: RecordingPath2D) {
    if (from instanceof RecordingPath2D) this.ops.push(...from.ops);
  }

  moveTo(x: number, y: number): void { this.ops.push((t) => t.moveTo(x, y)); }
  lineTo(x: number, y: number): void { this.ops.push((t) => t.lineTo(x, y)); }
  bezierCurveTo(a: number, b: number, c: number, d: number, x: number, y: number): void { this.ops.push((t) => t.bezierCurveTo(a, b, c, d, x, y)); }
  quadraticCurveTo(a: number, b: number, x: number, y: number): void { this.ops.push((t) => t.quadraticCurveTo(a, b, x, y)); }
  rect(x: number, y: number, w: number, h: number): void { this.ops.push((t) => t.rect(x, y, w, h)); }
  arc(x: number, y: number, r: number, start: number, end: number, ccw?: boolean): void { this.ops.push((t) => t.arc(x, y, r, start, end, ccw)); }
  closePath(): void { this.ops.push((t) => t.closePath()); }
  addPath(path: RecordingPath2D): void { if (path instanceof RecordingPath2D) this.ops.push(...path.ops); }

  /** Draw the recorded path onto `target` (SvgContext's own path methods). */
  replay(target: PathTarget): void {
    for (const op of this.ops) op(target);
  }
}

/** Run `draw` with the global Path2D replaced by RecordingPath2D (where there is one to replace), restoring it after. */
export function withRecordingPath2D<T>(draw: () => T): T {
  const scope = globalThis as { Path2D?: unknown };
  if (typeof scope.Path2D !== 'function') return draw();
  const native = scope.Path2D;
  scope.Path2D = RecordingPath2D;
  try {
    return draw();
  } finally {
    scope.Path2D = native;
  }
}
