import { describe, expect, it } from 'vitest';
import { escapeXml, parseFont, parsePaint, svgNumber } from '../../src/figures/writers/svgMarkup';
import { IDENTITY, multiply, RecordedPath, type Matrix } from '../../src/figures/writers/svgPath';

describe('svg markup', () => {
  it('escapes the five XML special characters and drops forbidden controls', () => {
    expect(escapeXml(`a<b & "c" 'd'>\u0001`)).toBe('a&lt;b &amp; &quot;c&quot; &apos;d&apos;&gt;');
  });
  it('splits CSS colours into colour and opacity', () => {
    expect(parsePaint('rgba(0, 114, 178, 0.16)')).toEqual({ colour: 'rgb(0,114,178)', opacity: 0.16 });
    expect(parsePaint('#0072B2')).toEqual({ colour: '#0072b2', opacity: 1 });
    expect(parsePaint('#abc')).toEqual({ colour: '#aabbcc', opacity: 1 });
    expect(parsePaint('#00000080').opacity).toBeCloseTo(128 / 255, 12);
    expect(parsePaint('transparent').opacity).toBe(0);
  });
  it('reads Chart.js font strings', () => {
    expect(parseFont("bold 15px system-ui, 'Segoe UI', sans-serif")).toEqual({ style: 'normal', weight: 'bold', sizePx: 15, family: "system-ui, 'Segoe UI', sans-serif" });
    expect(parseFont('italic 600 12.5px serif')).toEqual({ style: 'italic', weight: '600', sizePx: 12.5, family: 'serif' });
  });
  it('writes compact numbers', () => {
    expect([svgNumber(1.23456), svgNumber(-0.0001), svgNumber(10)]).toEqual(['1.235', '0', '10']);
  });
});

function pathPoints(d: string): number[][] {
  return [...d.matchAll(/-?\d+(?:\.\d+)?/g)].map((m) => Number(m[0])).reduce<number[][]>((pts, v, i) => {
    if (i % 2 === 0) pts.push([v]);
    else pts[pts.length - 1].push(v);
    return pts;
  }, []);
}

describe('recorded paths', () => {
  it('a full circle becomes four cubic pieces whose end points lie on the circle', () => {
    const p = new RecordedPath();
    p.arc(IDENTITY, 100, 50, 20, 0, Math.PI * 2);
    const d = p.toString();
    expect(d.match(/C/g)).toHaveLength(4);
    const ends = d.split('C').slice(1).map((piece) => pathPoints(piece)[2]);
    for (const [x, y] of ends) expect(Math.hypot(x - 100, y - 50)).toBeCloseTo(20, 2);
  });

  it('the cubic quarter-arc stays within 3e-4 r of the circle (k = 4/3·tan(θ/4), common practice; its largest radial error is about 2.7e-4 r, from memory)', () => {
    const p = new RecordedPath();
    p.arc(IDENTITY, 0, 0, 1000, 0, Math.PI / 2);
    const [[x0, y0], [x1, y1], [x2, y2], [x3, y3]] = pathPoints(p.toString());
    for (let t = 0; t <= 1; t += 0.05) {
      const b = (a: number, c: number, e: number, f: number) => (1 - t) ** 3 * a + 3 * (1 - t) ** 2 * t * c + 3 * (1 - t) * t * t * e + t ** 3 * f;
      expect(Math.abs(Math.hypot(b(x0, x1, x2, x3), b(y0, y1, y2, y3)) - 1000)).toBeLessThan(0.3);
    }
  });

  it('points are transformed when added, as a canvas does', () => {
    const rotate90: Matrix = [0, 1, -1, 0, 10, 0]; // x' = −y + 10, y' = x
    const p = new RecordedPath();
    p.moveTo(rotate90, 1, 2);
    p.lineTo(multiply(rotate90, [2, 0, 0, 2, 0, 0]), 1, 0);
    expect(p.toString()).toBe('M8 1L10 2');
  });

  it('follows the canvas sweep rules for counter-clockwise and wrapped angles', () => {
    const cw = new RecordedPath(), ccw = new RecordedPath();
    cw.arc(IDENTITY, 0, 0, 1, 0, -Math.PI / 2); // clockwise the long way: three quarters
    ccw.arc(IDENTITY, 0, 0, 1, 0, -Math.PI / 2, true); // counter-clockwise: one quarter
    expect(cw.toString().match(/C/g)).toHaveLength(3);
    expect(ccw.toString().match(/C/g)).toHaveLength(1);
  });
});
