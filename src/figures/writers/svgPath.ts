/**
 * A canvas path recorded in device coordinates. Canvas 2D transforms each point by the current
 * matrix when it is added (HTML Living Standard, "Building paths"), so we do the same, and arcs
 * become cubic Bézier pieces of at most 90° (control distance k = 4/3·tan(θ/4) — common practice;
 * radial error below 3e-4 of the radius for a quarter turn, from memory) that stay exact under any affine map.
 */
import { svgNumber } from './svgMarkup';

/** Affine map [a, b, c, d, e, f]: x' = a·x + c·y + e, y' = b·x + d·y + f (the canvas convention). */
export type Matrix = readonly [number, number, number, number, number, number];

export const IDENTITY: Matrix = [1, 0, 0, 1, 0, 0];

export function multiply(m: Matrix, n: Matrix): Matrix {
  return [
    m[0] * n[0] + m[2] * n[1], m[1] * n[0] + m[3] * n[1],
    m[0] * n[2] + m[2] * n[3], m[1] * n[2] + m[3] * n[3],
    m[0] * n[4] + m[2] * n[5] + m[4], m[1] * n[4] + m[3] * n[5] + m[5],
  ];
}

/** Length scale of the linear part (√|det|): stroke widths and dashes scale by it. */
export function lengthScale(m: Matrix): number {
  return Math.sqrt(Math.abs(m[0] * m[3] - m[1] * m[2]));
}

const TWO_PI = Math.PI * 2;

export class RecordedPath {
  private commands: string[] = [];
  private start: [number, number] | null = null;
  private current: [number, number] | null = null;

  get isEmpty(): boolean {
    return this.commands.length === 0;
  }

  toString(): string {
    return this.commands.join('');
  }

  moveTo(m: Matrix, x: number, y: number): void {
    const p = apply(m, x, y);
    this.commands.push(`M${svgNumber(p[0])} ${svgNumber(p[1])}`);
    this.start = p;
    this.current = p;
  }

  lineTo(m: Matrix, x: number, y: number): void {
    if (!this.current) return this.moveTo(m, x, y);
    const p = apply(m, x, y);
    this.commands.push(`L${svgNumber(p[0])} ${svgNumber(p[1])}`);
    this.current = p;
  }

  bezierCurveTo(m: Matrix, c1x: number, c1y: number, c2x: number, c2y: number, x: number, y: number): void {
    if (!this.current) this.moveTo(m, c1x, c1y);
    const [a, b, p] = [apply(m, c1x, c1y), apply(m, c2x, c2y), apply(m, x, y)];
    this.commands.push(`C${[...a, ...b, ...p].map(svgNumber).join(' ')}`);
    this.current = p;
  }

  quadraticCurveTo(m: Matrix, cx: number, cy: number, x: number, y: number): void {
    if (!this.current) this.moveTo(m, cx, cy);
    const [c, p] = [apply(m, cx, cy), apply(m, x, y)];
    this.commands.push(`Q${[...c, ...p].map(svgNumber).join(' ')}`);
    this.current = p;
  }

  closePath(): void {
    if (!this.current) return;
    this.commands.push('Z');
    this.current = this.start;
  }

  rect(m: Matrix, x: number, y: number, w: number, h: number): void {
    this.moveTo(m, x, y);
    this.lineTo(m, x + w, y);
    this.lineTo(m, x + w, y + h);
    this.lineTo(m, x, y + h);
    this.closePath();
  }

  arc(m: Matrix, cx: number, cy: number, r: number, startAngle: number, endAngle: number, counterclockwise = false): void {
    const sweep = arcSweep(startAngle, endAngle, counterclockwise);
    const at = (t: number) => [cx + r * Math.cos(t), cy + r * Math.sin(t)] as const;
    const [sx, sy] = at(startAngle);
    if (this.current) this.lineTo(m, sx, sy);
    else this.moveTo(m, sx, sy);
    const pieces = Math.ceil(Math.abs(sweep) / (Math.PI / 2) - 1e-9);
    for (let i = 0; i < pieces; i++) {
      const t0 = startAngle + (sweep * i) / pieces, t1 = startAngle + (sweep * (i + 1)) / pieces;
      const k = (4 / 3) * Math.tan((t1 - t0) / 4) * r;
      const [x0, y0] = at(t0), [x1, y1] = at(t1);
      this.bezierCurveTo(m, x0 - k * Math.sin(t0), y0 + k * Math.cos(t0), x1 + k * Math.sin(t1), y1 - k * Math.cos(t1), x1, y1);
    }
  }
}

/** Signed sweep per the canvas arc() rules: a full turn when |end − start| ≥ 2π, else wrapped into the direction. */
function arcSweep(start: number, end: number, counterclockwise: boolean): number {
  const raw = end - start;
  if (!counterclockwise) return raw >= TWO_PI ? TWO_PI : ((raw % TWO_PI) + TWO_PI) % TWO_PI;
  return -raw >= TWO_PI ? -TWO_PI : -((((-raw) % TWO_PI) + TWO_PI) % TWO_PI);
}

function apply(m: Matrix, x: number, y: number): [number, number] {
  return [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];
}
