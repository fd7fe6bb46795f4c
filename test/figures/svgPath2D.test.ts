/**
 * SVG figures drawn where Path2D exists (the app's chart worker and the report it writes, in a
 * browser): Chart.js then strokes each line as a Path2D, and the SVG must draw that path, not the
 * clip rectangle. Under Node there is no Path2D, so this file defines one before Chart.js loads, as
 * a browser has (Chart.js reads `typeof Path2D` when its module loads). Found in the screen review:
 * the two-valve report's slices had no Q curve, only a blue rectangle round the plot.
 */
import { describe, expect, it } from 'vitest';

describe('SVG lines where the platform has Path2D', () => {
  it('draws the slice’s Q curve and the density’s outline as curves, not as the plot’s clip rectangle', async () => {
    const scope = globalThis as { Path2D?: unknown };
    const had = scope.Path2D;
    scope.Path2D = class NativePath2D { moveTo() {} lineTo() {} bezierCurveTo() {} closePath() {} }; // unreadable, as a browser's is
    try {
      const { inlineSvg } = await import('../../src/figures/writers/inlineSvg');
      const { actionSliceChart } = await import('../../src/figures/charts/actionSlice');
      const n = 121, actions = new Float64Array(n), values = new Float64Array(n), density = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        const a = i * 0.5;
        actions[i] = a;
        values[i] = 4.2 + 0.0004 * (a - 20) ** 2;
        density[i] = Math.exp(-0.5 * ((a - 22) / 10) ** 2) / (10 * Math.sqrt(2 * Math.PI));
      }
      const svg = inlineSvg((look) => actionSliceChart({
        slice: { actions, actionValues: values, density, nodes: { points: new Float64Array(0), weights: new Float64Array(0) }, state: [22, 1], policyName: 'p' },
        actionLabel: 'a', valueLabel: 'Q', title: '', subtitle: 's', theme: 'light', loggedRange: [2, 45], meanAction: 22,
      }, look) as never, { widthPx: 420, heightPx: 330, id: 't', label: 'slice' });
      const strokes = [...svg.matchAll(/<path d="([^"]*)"[^>]*stroke-width="2\.2"[^>]*>/g)].map((m) => m[1]);
      const curve = strokes.filter((d) => (d.match(/[LC]/g) ?? []).length > 50);
      expect(curve.length, `strokes of width 2.2: ${strokes.map((d) => d.slice(0, 60)).join(' | ')}`).toBeGreaterThanOrEqual(1);
      expect(strokes.filter((d) => /^M[\d.]+ [\d.]+L[\d.]+ [\d.]+L[\d.]+ [\d.]+L[\d.]+ [\d.]+Z$/.test(d))).toEqual([]); // no stroke that is just a rectangle
      expect(scope.Path2D).not.toBe(undefined); // the global is restored after the drawing
    } finally {
      scope.Path2D = had;
    }
  });
});
