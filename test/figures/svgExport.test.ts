import { describe, expect, it } from 'vitest';
import { inflateSync } from 'node:zlib';
import { CAUTION_SHORT } from '../../src/pipeline/cautions';
import { exportPlan, ExportOptionsError } from '../../src/figures/writers/exportPlan';
import { exportPlotSvg } from '../../src/figures/writers/exportSvg';
import type { ExportOptions, PlotSpec } from '../../src/figures/writers/plotSpec';
import { pngSize, readChunks } from '../../src/figures/writers/pngChunks';
import { estimatedTextMeasure } from '../../src/figures/writers/textMeasure';
import { plotPalette } from '../../src/figures/parts/plotTheme';
import { ALL_PLOT_KINDS, syntheticSpec } from './syntheticSpecs';
import { xmlProblems } from './xmlWellFormed';

const options: ExportOptions = { widthPx: 1950, heightPx: 1200, dpi: 300, background: 'white', caption: 'Project: Tank levels · Policy: gentle gain', caution: CAUTION_SHORT };

const base = Object.fromEntries(ALL_PLOT_KINDS.map((kind) => [kind, syntheticSpec(kind, kind === 'surface' ? 'dark' : 'light')])) as Record<PlotSpec['kind'], PlotSpec>;
// Text that must be escaped in XML: a title with angle brackets, a label with an ampersand.
const specs: Record<PlotSpec['kind'], PlotSpec> = {
  ...base,
  surface: { kind: 'surface', props: { ...(base.surface.props as Extract<PlotSpec, { kind: 'surface' }>['props']), title: 'Value surface <gentle gain>', heldLabel: undefined } },
  slice: { kind: 'slice', props: { ...(base.slice.props as Extract<PlotSpec, { kind: 'slice' }>['props']), valueLabel: 'cost & energy', title: 'Q(s, ·)' } },
};

const svgOf = (spec: PlotSpec, o: ExportOptions = options) => exportPlotSvg(spec, o, estimatedTextMeasure)!;

describe('exportPlotSvg', () => {
  it.each(Object.keys(specs))('%s: well-formed XML with title, caption and caution', (kind) => {
    const svg = svgOf(specs[kind as PlotSpec['kind']]);
    expect(xmlProblems(svg)).toEqual([]);
    expect(svg).toContain('<svg xmlns="http://www.w3.org/2000/svg"');
    expect(svg).toContain('Project: Tank levels');
    expect(svg).toContain(CAUTION_SHORT.split(' ').slice(0, 3).join(' '));
  });

  it('retuneMap: the integral time in minutes at round ticks in the exported text (tuningAxis.ts; 300 · 2^k s by hand)', () => {
    const texts = [...svgOf(specs.retuneMap).matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => m[1]);
    const title = texts.indexOf(' (min)');
    expect(texts.slice(title - 2, title + 1)).toEqual(['integral time T', 'i', ' (min)']);
    expect(texts.slice(title + 1, title + 12)).toEqual(['10', '20', '30', '40', '50', '60', '5', '10', '20', '50', '100']); // gains at their cells, then the times
    expect(texts).not.toContain('4,800');
    expect(texts).not.toContain(' (s)');
  });

  it('is 6.5 in × 4 in for 1950 × 1200 px at 300 dpi, with a white background', () => {
    const svg = svgOf(specs.surface);
    expect(svg).toMatch(/width="6.5in" height="4in" viewBox="0 0 1950 1200"/);
    expect(svg).toContain('<rect x="0" y="0" width="1950" height="1200" fill="#ffffff"/>');
    expect(svgOf(specs.surface, { ...options, background: 'transparent' })).not.toContain('fill="#ffffff"/>');
  });

  it('surface: escaped title, axis labels, the colour-bar label and the hatching legend as text', () => {
    const svg = svgOf(specs.surface);
    for (const text of ['Value surface &lt;gentle gain&gt;', 'tank level (m)', 'inflow (m³/h)', '(s), discounted cost (kWh)', 'never visited by the logs']) {
      expect(svg).toContain(text);
    }
    // The colour bar's V^{π}: π a run of its own at the script size (richText.ts), never a literal caret or brace.
    expect(svg).toMatch(/>π<\/text>/);
    expect(svg).not.toMatch(/\^|\{π\}/);
    expect(svg).toContain('transform="matrix(0 -1 1 0'); // the y-axis and colour-bar titles are rotated text
  });

  it('surface: the grid is one embedded PNG of nx × ny pixels drawn crisp, the ramp another', () => {
    const svg = svgOf(specs.surface);
    const images = [...svg.matchAll(/<image[^>]* href="data:image\/png;base64,([^"]+)"[^>]*>/g)];
    expect(images).toHaveLength(2);
    const sizes = images.map((m) => pngSize(Uint8Array.from(atob(m[1]), (c) => c.charCodeAt(0))));
    expect(sizes).toContainEqual({ width: 40, height: 30 });
    expect(sizes).toContainEqual({ width: 1, height: 256 });
    expect(images.find((m) => m[0].includes('pixelated'))).toBeDefined();
    const png = Uint8Array.from(atob(images[0][1]), (c) => c.charCodeAt(0)), idat = readChunks(png).find((c) => c.type === 'IDAT')!;
    expect(() => inflateSync(png.subarray(idat.offset + 8, idat.offset + 8 + idat.dataLength))).not.toThrow();
  });

  it('surface: hatching is clipped to the never-visited cells', () => {
    const svg = svgOf(specs.surface);
    expect((svg.match(/<clipPath /g) ?? []).length).toBeGreaterThanOrEqual(2);
    expect(svg).toMatch(/<path d="M[^"]+" fill="none" stroke="rgb\(255,255,255\)"[^>]*clip-path="url\(#clip\d+\)"/);
  });

  it('a white background always uses the light palette, so text is dark', () => {
    const svg = svgOf(specs.surface);
    expect(svg).toContain(`fill="${plotPalette('light').text}"`);
    const transparent = svgOf(specs.surface, { ...options, background: 'transparent' });
    expect(transparent).toContain(`fill="${plotPalette('dark').text}"`);
  });

  it('slice, convergence and comparison are fully vector, with their labels', () => {
    const slice = svgOf(specs.slice), fit = svgOf(specs.convergence), bars = svgOf(specs.comparison);
    expect(slice).not.toContain('<image');
    expect(slice).toContain('valve move (%)');
    expect(slice).toContain('cost &amp; energy');
    expect(slice).toContain('upper limit 1.1: 15.87\u00a0% probability'); // 1 − Φ(1) = 0.1587 (A&S table 26.1), read beside the lower limit's 0.62 %: one precision for both (sharesText)
    expect(fit).toContain('relative weight change');
    expect(fit).toContain('value (log scale)');
    expect(bars).toContain('J, discounted cost: lower is better'); // the one value-axis writer, valueAxisTitle
    expect(bars).toContain('41.2 ± 1.8');
  });

  it('fonts scale with dpi/96: a 12 px tick label is 37.5 px at 300 dpi', () => {
    expect(svgOf(specs.convergence)).toContain('font-size="37.5"');
    expect(svgOf(specs.convergence, { ...options, dpi: 96 })).toContain('font-size="12"');
  });
});

describe('export options', () => {
  it('refuse sizes, dpi and backgrounds outside the limits, naming the option', () => {
    const plan = (o: Partial<ExportOptions>) => exportPlan(specs.convergence, { ...options, ...o }, estimatedTextMeasure);
    expect(() => plan({ widthPx: 10 })).toThrow(/widthPx: expected a whole number/);
    expect(() => plan({ heightPx: 1200.5 })).toThrow(ExportOptionsError);
    expect(() => plan({ dpi: 0 })).toThrow(/dpi/);
    expect(() => plan({ background: 'grey' as 'white' })).toThrow(/background/);
    // A small picture at a high dpi keeps its room by smaller type (typeScale < 1); only a height below what even that needs is refused.
    expect(plan({ widthPx: 400, heightPx: 400, dpi: 600 }).typeScale).toBeLessThan(1);
    expect(() => plan({ widthPx: 400, heightPx: 64, dpi: 2400 })).toThrow(/too little room/);
  });

  it('the plot gets the height the caption leaves', () => {
    const p = exportPlan(specs.convergence, options, estimatedTextMeasure);
    expect(p.look.scale).toBeCloseTo(300 / 96, 12);
    expect(p.plotHeightPx + p.caption.heightPx).toBeLessThanOrEqual(1200);
    expect(p.plotHeightPx).toBeGreaterThan(1000);
    expect(p.caption.lines.join(' ')).toContain(CAUTION_SHORT);
  });
});

describe('the well-formedness check itself', () => {
  it('catches unbalanced tags, bare ampersands, unquoted attributes and two roots', () => {
    expect(xmlProblems('<svg><g></svg>')).not.toEqual([]);
    expect(xmlProblems('<svg>a & b</svg>')).not.toEqual([]);
    expect(xmlProblems('<svg width=3></svg>')).not.toEqual([]);
    expect(xmlProblems('<a/><b/>')).not.toEqual([]);
    expect(xmlProblems('<svg a="1" a="2"/>')).not.toEqual([]);
    expect(xmlProblems('<?xml version="1.0"?>\n<svg x="&amp;"><t>&lt;ok&gt;</t></svg>')).toEqual([]);
  });
});
