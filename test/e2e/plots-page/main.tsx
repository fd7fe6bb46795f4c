/**
 * Test page: every plot in both themes with fixed synthetic data, plus the export functions on
 * window.plotsPage so the e2e test can call them in a real browser and inspect what comes out.
 */
import { Chart } from 'chart.js';
import { createRoot } from 'react-dom/client';
import { CAUTION, exportCaption, exportPlotPng, exportPlotSvg, type ExportOptions } from '../../../src/renderer/src/export';
import { bytesToBase64 } from '../../../src/figures/writers/base64';
import { ActionSlicePlot, ConvergencePlot, PolicyValueChart, ValueSurfacePlot, type Theme } from '../../../src/renderer/src/plots';
import { plotPalette } from '../../../src/figures/parts/plotTheme';
import { clippedSlice, SLICE_POLICY } from '../../figures/syntheticPlotData';
import { PLOT_KINDS, plotSpec, type PlotKind } from './plotSpecs';
import { canvasStats, colourBarProbe, decodePng, parseSvg, renderSvg } from './pageProbes';

function Plot({ kind, theme }: { kind: PlotKind; theme: Theme }) {
  const spec = plotSpec(kind, theme);
  switch (spec.kind) {
    case 'surface': return <ValueSurfacePlot {...spec.props} />;
    case 'slice': return <ActionSlicePlot {...spec.props} />;
    case 'convergence': return <ConvergencePlot {...spec.props} />;
    case 'comparison': return <PolicyValueChart {...spec.props} />;
  }
}

function Page() {
  return (
    <>
      {(['light', 'dark'] as const).map((theme) => (
        <section key={theme} data-theme={theme} style={{ background: plotPalette(theme).background, padding: 16, width: 900 }}>
          {PLOT_KINDS.map((kind) => (
            <div key={kind} id={`${kind}-${theme}`} style={{ marginBottom: 24 }}>
              <Plot kind={kind} theme={theme} />
            </div>
          ))}
        </section>
      ))}
      <section style={{ background: plotPalette('light').background, padding: 16, width: 900 }}>
        <div id="slice-bounded-light">
          <ActionSlicePlot slice={clippedSlice(61, SLICE_POLICY.lo, SLICE_POLICY.hi)} actionLabel="valve move (%)" valueLabel="cost (kWh)" title="Action values, slice cut at the bounds" theme="light" />
        </div>
      </section>
    </>
  );
}

const caption = exportCaption({ project: 'Tank levels (synthetic)', policy: 'gentle gain', settings: 'discount 0.95, polynomial degree 2, 5 nodes, seed 7', date: '2025-01-15' });

const api = {
  caption,
  async exportPng(kind: PlotKind, theme: Theme, options: Omit<ExportOptions, 'caption' | 'caution'>): Promise<string> {
    return bytesToBase64(await exportPlotPng(plotSpec(kind, theme), { ...options, caption, caution: CAUTION }));
  },
  exportSvg(kind: PlotKind, theme: Theme, options: Omit<ExportOptions, 'caption' | 'caution'>): string | null {
    return exportPlotSvg(plotSpec(kind, theme), { ...options, caption, caution: CAUTION });
  },
  decodePng, parseSvg, renderSvg, canvasStats, colourBarProbe,
  /** Whether the chart in a plot has an active tooltip (keyboard navigation). */
  tooltipActive(kind: PlotKind, theme: Theme): number {
    const canvas = document.querySelector<HTMLCanvasElement>(`#${kind}-${theme} canvas`);
    return canvas ? Chart.getChart(canvas)?.tooltip?.getActiveElements().length ?? 0 : 0;
  },
};

declare global {
  interface Window {
    plotsPage: typeof api;
    plotsReady: boolean;
  }
}
window.plotsPage = api;
createRoot(document.getElementById('root')!).render(<Page />);
// Charts draw in effects after the first commit; two frames later every canvas is painted.
requestAnimationFrame(() => requestAnimationFrame(() => { window.plotsReady = true; }));
