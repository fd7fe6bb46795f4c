/** The four plots with fixed synthetic data (see test/renderer/plots/syntheticPlotData.ts), per theme. */
import type { PlotSpec } from '../../../src/renderer/src/export';
import type { Theme } from '../../../src/renderer/src/plots';
import { discountSweep } from '../../figures/syntheticSensitivity';
import { bowlSurface, clippedSlice, geometricHistory, threeCandidateEvaluation } from '../../figures/syntheticPlotData';

export type PlotKind = PlotSpec['kind'];
export const PLOT_KINDS: PlotKind[] = ['surface', 'slice', 'convergence', 'comparison'];

const surface = bowlSurface(), slice = clippedSlice(), history = geometricHistory(), evaluation = threeCandidateEvaluation();

export function plotSpec(kind: PlotKind, theme: Theme): PlotSpec {
  switch (kind) {
    case 'surface':
      return { kind, props: { surface, xLabel: 'tank level (m)', yLabel: 'inflow (m³/h)', valueLabel: 'V^π (cost, kWh)', title: 'Value surface: gentle gain', theme, heldLabel: 'outlet temperature held at 1.5 °C' } };
    case 'slice':
      return { kind, props: { slice, actionLabel: 'valve move (%)', valueLabel: 'cost (kWh)', title: 'Action values at one state', theme } };
    case 'convergence':
      return { kind, props: { history, title: 'Fit history: gentle gain', theme } };
    case 'comparison':
      return { kind, props: { evaluation, theme } };
    case 'sensitivity':
      return { kind, props: { curve: discountSweep(), valueLabel: 'J (discounted cost)', title: 'J against the discount', theme } };
  }
}
