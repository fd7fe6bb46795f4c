/**
 * A recording stand-in for CanvasRenderingContext2D that writes SVG: Chart.js lays out and draws
 * a plot onto it exactly as onto a canvas, and every stroke, fill, text and bitmap becomes an SVG
 * element — vector axes, ticks, labels, lines and bars, with bitmaps (the heat-map grid, the colour
 * ramp) embedded as PNG data: URLs. Only the parts of the canvas API that our charts use are
 * provided; anything else throws SvgContextError naming it, rather than drawing something wrong.
 *
 * Paths are kept in device coordinates (see svgPath.ts); text keeps its own matrix so rotated axis
 * titles stay text. Clipping nests: each clipPath is itself clipped by the one before it.
 */
import type { Raster, RasterDrawingContext } from '../parts/raster';
import { bytesToBase64 } from './base64';
import { encodePng } from './pngEncoder';
import { IDENTITY, lengthScale, multiply, RecordedPath, type Matrix } from './svgPath';
import { attributes, escapeXml, parseFont, parsePaint, svgNumber } from './svgMarkup';
import { RecordingPath2D } from './svgPath2D';

export class SvgContextError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'SvgContextError';
  }
}

/** Width of text in px for a CSS font; the browser's canvas in the app, an estimate in tests. */
export type TextMeasure = (font: string, text: string) => number;

interface DrawState {
  matrix: Matrix;
  fillStyle: string;
  strokeStyle: string;
  lineWidth: number;
  lineCap: CanvasLineCap;
  lineJoin: CanvasLineJoin;
  miterLimit: number;
  lineDash: number[];
  lineDashOffset: number;
  font: string;
  textAlign: CanvasTextAlign;
  textBaseline: CanvasTextBaseline;
  globalAlpha: number;
  imageSmoothingEnabled: boolean;
  clipId: string | null;
}

/** Baseline shifts relative to the alphabetic baseline, in em (a typical Latin font; a choice). */
const BASELINE_SHIFT_EM: Record<CanvasTextBaseline, number> = {
  alphabetic: 0, ideographic: -0.12, bottom: -0.22, top: 0.78, hanging: 0.7, middle: 0.34,
};
const ANCHOR: Record<CanvasTextAlign, string> = { left: 'start', start: 'start', center: 'middle', right: 'end', end: 'end' };

export class SvgContext implements RasterDrawingContext {
  readonly canvas: { width: number; height: number; getContext(kind: '2d'): SvgContext };
  private state: DrawState = initialState();
  private readonly stack: DrawState[] = [];
  private path = new RecordedPath();
  private readonly body: string[] = [];
  private readonly defs: string[] = [];
  private nextId = 0;

  /** idPrefix keeps clip-path ids apart when several SVGs share one HTML document (the report). */
  constructor(width: number, height: number, private readonly measure: TextMeasure, private readonly idPrefix = '') {
    const canvas = { width, height, getContext: () => this };
    this.canvas = canvas;
  }

  /** The recorded elements (without the <svg> wrapper): defs first, then the drawing. */
  markup(): string {
    return (this.defs.length ? `<defs>${this.defs.join('')}</defs>` : '') + this.body.join('\n');
  }

  // --- state -------------------------------------------------------------------------------
  save(): void {
    this.stack.push({ ...this.state, lineDash: [...this.state.lineDash] });
  }
  restore(): void {
    const previous = this.stack.pop();
    if (previous) this.state = previous;
  }
  get fillStyle(): string { return this.state.fillStyle; }
  set fillStyle(v: string) { this.state.fillStyle = paintText(v, 'fillStyle'); }
  get strokeStyle(): string { return this.state.strokeStyle; }
  set strokeStyle(v: string) { this.state.strokeStyle = paintText(v, 'strokeStyle'); }
  get lineWidth(): number { return this.state.lineWidth; }
  set lineWidth(v: number) { if (Number.isFinite(v) && v > 0) this.state.lineWidth = v; }
  get lineCap(): CanvasLineCap { return this.state.lineCap; }
  set lineCap(v: CanvasLineCap) { this.state.lineCap = v; }
  get lineJoin(): CanvasLineJoin { return this.state.lineJoin; }
  set lineJoin(v: CanvasLineJoin) { this.state.lineJoin = v; }
  get miterLimit(): number { return this.state.miterLimit; }
  set miterLimit(v: number) { this.state.miterLimit = v; }
  get lineDashOffset(): number { return this.state.lineDashOffset; }
  set lineDashOffset(v: number) { this.state.lineDashOffset = v; }
  get font(): string { return this.state.font; }
  set font(v: string) { this.state.font = v; }
  get textAlign(): CanvasTextAlign { return this.state.textAlign; }
  set textAlign(v: CanvasTextAlign) { this.state.textAlign = v; }
  get textBaseline(): CanvasTextBaseline { return this.state.textBaseline; }
  set textBaseline(v: CanvasTextBaseline) { this.state.textBaseline = v; }
  get globalAlpha(): number { return this.state.globalAlpha; }
  set globalAlpha(v: number) { if (v >= 0 && v <= 1) this.state.globalAlpha = v; }
  get imageSmoothingEnabled(): boolean { return this.state.imageSmoothingEnabled; }
  set imageSmoothingEnabled(v: boolean) { this.state.imageSmoothingEnabled = v; }
  setLineDash(segments: number[]): void { this.state.lineDash = segments.filter((s) => Number.isFinite(s) && s >= 0); }
  getLineDash(): number[] { return [...this.state.lineDash]; }

  // --- transforms ----------------------------------------------------------------------------
  setTransform(a: number | DOMMatrix2DInit = 1, b = 0, c = 0, d = 1, e = 0, f = 0): void {
    if (typeof a === 'object') this.state.matrix = [a.a ?? 1, a.b ?? 0, a.c ?? 0, a.d ?? 1, a.e ?? 0, a.f ?? 0];
    else this.state.matrix = [a, b, c, d, e, f];
  }
  resetTransform(): void { this.state.matrix = IDENTITY; }
  transform(a: number, b: number, c: number, d: number, e: number, f: number): void {
    this.state.matrix = multiply(this.state.matrix, [a, b, c, d, e, f]);
  }
  translate(x: number, y: number): void { this.transform(1, 0, 0, 1, x, y); }
  scale(x: number, y: number): void { this.transform(x, 0, 0, y, 0, 0); }
  rotate(angle: number): void {
    const cos = Math.cos(angle), sin = Math.sin(angle);
    this.transform(cos, sin, -sin, cos, 0, 0);
  }

  // --- paths ---------------------------------------------------------------------------------
  beginPath(): void { this.path = new RecordedPath(); }
  closePath(): void { this.path.closePath(); }
  moveTo(x: number, y: number): void { this.path.moveTo(this.state.matrix, x, y); }
  lineTo(x: number, y: number): void { this.path.lineTo(this.state.matrix, x, y); }
  bezierCurveTo(a: number, b: number, c: number, d: number, x: number, y: number): void { this.path.bezierCurveTo(this.state.matrix, a, b, c, d, x, y); }
  quadraticCurveTo(a: number, b: number, x: number, y: number): void { this.path.quadraticCurveTo(this.state.matrix, a, b, x, y); }
  rect(x: number, y: number, w: number, h: number): void { this.path.rect(this.state.matrix, x, y, w, h); }
  arc(x: number, y: number, r: number, start: number, end: number, ccw?: boolean): void {
    this.path.arc(this.state.matrix, x, y, r, start, end, ccw);
  }
  // Each takes a Path2D first, as a canvas does (Chart.js strokes its lines that way in a browser: svgPath2D.ts).
  fill(pathOrRule?: RecordingPath2D | CanvasFillRule, rule?: CanvasFillRule): void {
    if (pathOrRule instanceof RecordingPath2D) return this.emitFill(this.replayed(pathOrRule), rule);
    this.emitFill(this.path, pathOrRule);
  }
  stroke(path?: RecordingPath2D): void {
    if (path !== undefined && !(path instanceof RecordingPath2D)) throw new SvgContextError('SVG export: stroke(path) needs the recording Path2D (draw inside withRecordingPath2D)');
    this.emitStroke(path ? this.replayed(path) : this.path);
  }
  /** A Path2D as a RecordedPath under the current transform, leaving the context's own path as it was. */
  private replayed(path: RecordingPath2D): RecordedPath {
    const own = this.path;
    this.path = new RecordedPath();
    path.replay(this);
    const result = this.path;
    this.path = own;
    return result;
  }
  clip(rule?: CanvasFillRule): void {
    const id = `${this.idPrefix}clip${this.nextId++}`;
    const parent = this.state.clipId ? `url(#${this.state.clipId})` : null;
    this.defs.push(`<clipPath${attributes({ id, 'clip-path': parent })}><path${attributes({ d: this.path.toString() || 'M0 0', 'clip-rule': rule === 'evenodd' ? 'evenodd' : null })}/></clipPath>`);
    this.state.clipId = id;
  }
  fillRect(x: number, y: number, w: number, h: number): void {
    const p = new RecordedPath();
    p.rect(this.state.matrix, x, y, w, h);
    this.emitFill(p);
  }
  strokeRect(x: number, y: number, w: number, h: number): void {
    const p = new RecordedPath();
    p.rect(this.state.matrix, x, y, w, h);
    this.emitStroke(p);
  }
  /** Chart.js clears before each frame; an SVG starts empty, so there is nothing to clear. */
  clearRect(): void {}

  // --- text ----------------------------------------------------------------------------------
  measureText(text: string): TextMetrics {
    const width = this.measure(this.state.font, text), size = parseFont(this.state.font).sizePx;
    return { width, actualBoundingBoxAscent: size * 0.75, actualBoundingBoxDescent: size * 0.25, actualBoundingBoxLeft: 0, actualBoundingBoxRight: width } as TextMetrics;
  }
  fillText(text: string, x: number, y: number): void {
    const { style, weight, sizePx, family } = parseFont(this.state.font), paint = parsePaint(this.state.fillStyle);
    const m = this.state.matrix, linear = m[0] !== 1 || m[1] !== 0 || m[2] !== 0 || m[3] !== 1;
    const at = linear ? { x, y, transform: `matrix(${m.map(svgNumber).join(' ')})` } : { x: x + m[4], y: y + m[5], transform: null };
    this.body.push(`<text${attributes({
      x: at.x, y: at.y, dy: BASELINE_SHIFT_EM[this.state.textBaseline] ? `${BASELINE_SHIFT_EM[this.state.textBaseline]}em` : null,
      transform: at.transform, 'text-anchor': ANCHOR[this.state.textAlign], 'font-family': family, 'font-size': sizePx,
      'font-weight': weight === 'normal' ? null : weight, 'font-style': style === 'normal' ? null : style,
      fill: paint.colour, 'fill-opacity': opacityOrNull(paint.opacity * this.state.globalAlpha), 'clip-path': this.clipRef(),
    })} xml:space="preserve">${escapeXml(String(text))}</text>`);
  }

  // --- bitmaps -------------------------------------------------------------------------------
  drawRaster(raster: Raster, x: number, y: number, width: number, height: number, smooth: boolean): void {
    this.emitImage(`data:image/png;base64,${bytesToBase64(encodePng(raster))}`, x, y, width, height, smooth);
  }
  drawImage(image: { toDataURL?: (type: string) => string; width: number; height: number }, ...args: number[]): void {
    if (typeof image.toDataURL !== 'function') throw new SvgContextError('SVG export: drawImage needs a canvas (with toDataURL) as its source');
    if (args.length !== 2 && args.length !== 4) throw new SvgContextError('SVG export: drawImage with a source rectangle is not supported');
    const [x, y, w = image.width, h = image.height] = args;
    this.emitImage(image.toDataURL('image/png'), x, y, w, h, this.state.imageSmoothingEnabled);
  }

  createLinearGradient(): never { throw new SvgContextError('SVG export: gradients are not supported'); }
  createPattern(): never { throw new SvgContextError('SVG export: patterns are not supported'); }

  // --- output --------------------------------------------------------------------------------
  private emitFill(path: RecordedPath, rule?: CanvasFillRule): void {
    if (path.isEmpty) return;
    const paint = parsePaint(this.state.fillStyle);
    if (paint.opacity * this.state.globalAlpha === 0) return;
    this.body.push(`<path${attributes({
      d: path.toString(), fill: paint.colour, 'fill-opacity': opacityOrNull(paint.opacity * this.state.globalAlpha),
      'fill-rule': rule === 'evenodd' ? 'evenodd' : null, 'clip-path': this.clipRef(),
    })}/>`);
  }

  private emitStroke(path: RecordedPath): void {
    if (path.isEmpty) return;
    const paint = parsePaint(this.state.strokeStyle), k = lengthScale(this.state.matrix);
    if (paint.opacity * this.state.globalAlpha === 0) return;
    const dash = this.state.lineDash.length ? this.state.lineDash.map((v) => svgNumber(v * k)).join(' ') : null;
    this.body.push(`<path${attributes({
      d: path.toString(), fill: 'none', stroke: paint.colour, 'stroke-opacity': opacityOrNull(paint.opacity * this.state.globalAlpha),
      'stroke-width': this.state.lineWidth * k, 'stroke-linecap': this.state.lineCap === 'butt' ? null : this.state.lineCap,
      'stroke-linejoin': this.state.lineJoin === 'miter' ? null : this.state.lineJoin, 'stroke-dasharray': dash,
      'stroke-dashoffset': dash && this.state.lineDashOffset ? this.state.lineDashOffset * k : null, 'clip-path': this.clipRef(),
    })}/>`);
  }

  private emitImage(href: string, x: number, y: number, width: number, height: number, smooth: boolean): void {
    const m = this.state.matrix;
    this.body.push(`<image${attributes({
      x, y, width, height, href, 'xlink:href': href, preserveAspectRatio: 'none', transform: `matrix(${m.map(svgNumber).join(' ')})`,
      style: smooth ? null : 'image-rendering:pixelated;image-rendering:crisp-edges', opacity: opacityOrNull(this.state.globalAlpha),
      'clip-path': this.clipRef(),
    })}/>`);
  }

  private clipRef(): string | null {
    return this.state.clipId ? `url(#${this.state.clipId})` : null;
  }
}

function initialState(): DrawState {
  return {
    matrix: IDENTITY, fillStyle: '#000000', strokeStyle: '#000000', lineWidth: 1, lineCap: 'butt', lineJoin: 'miter',
    miterLimit: 10, lineDash: [], lineDashOffset: 0, font: '10px sans-serif', textAlign: 'start', textBaseline: 'alphabetic',
    globalAlpha: 1, imageSmoothingEnabled: true, clipId: null,
  };
}

function paintText(v: unknown, name: string): string {
  if (typeof v !== 'string') throw new SvgContextError(`SVG export: ${name} must be a CSS colour (gradients and patterns are not supported)`);
  return v;
}

function opacityOrNull(opacity: number): number | null {
  return opacity >= 1 ? null : Math.max(0, opacity);
}
