/**
 * Test page: every plot in both themes with fixed synthetic data, plus the export functions on
 * window.plotsPage so the e2e test can call them in a real browser and inspect what comes out.
 */
import { createRoot } from 'react-dom/client';
import { CAUTION, exportCaption, exportPlotPng, exportPlotSvg, type ExportOptions } from '../../../src/renderer/src/export';
import { bytesToBase64 } from '../../../src/figures/writers/base64';
import { useMemo } from 'react';
import { ActionSlicePlot, PlotFigure, type Theme } from '../../../src/renderer/src/plots';
import { plotPalette } from '../../../src/figures/parts/plotTheme';
import { clippedSlice, SLICE_POLICY } from '../../figures/syntheticPlotData';
import { PLOT_KINDS, plotSpec, type PlotKind } from './plotSpecs';
import { allDrawn, canvasStats, colourBarProbe, decodePng, parseSvg, renderSvg, tooltipActive } from './pageProbes';

function Plot({ kind, theme }: { kind: PlotKind; theme: Theme }) {
  const spec = useMemo(() => plotSpec(kind, theme), [kind, theme]);
  return <PlotFigure spec={spec} keyColumns={spec.kind === 'surface' ? spec.props.surface.x.length : undefined} />;
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
  decodePng, parseSvg, renderSvg, canvasStats, colourBarProbe, tooltipActive,
};

declare global {
  interface Window {
    plotsPage: typeof api;
    plotsReady: boolean;
  }
}
window.plotsPage = api;
createRoot(document.getElementById('root')!).render(<Page />);
// Charts are drawn by the chart worker; the page is ready once every figure reports its drawing.
const ready = () => (allDrawn() ? (window.plotsReady = true) : setTimeout(ready, 50));
ready();
