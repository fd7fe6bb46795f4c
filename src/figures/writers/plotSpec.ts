/**
 * What to export: one of the plots with its props, and how (pixel size, dpi, background,
 * caption). Each kind maps to its Chart.js configuration and text summary here, so the exporters
 * treat every plot alike.
 */
import type { ChartConfiguration } from 'chart.js';
import { actionSliceChart, actionSliceSummary, type ActionSlicePlotProps } from '../charts/actionSlice';
import { convergenceChart, convergenceSummary, type ConvergencePlotProps } from '../charts/convergence';
import type { PlotLook } from '../parts/plotLook';
import { POLICY_VALUE_DEFAULTS, policyValueChart, policyValueSummary, type PolicyValueChartProps } from '../charts/policyValueChart';
import { sensitivityChart, sensitivitySummary, type SensitivityPlotProps } from '../charts/sensitivity';
import { valueSurfaceChart, valueSurfaceSummary, type ValueSurfacePlotProps } from '../charts/valueSurface';

export type PlotSpec =
  | { kind: 'surface'; props: ValueSurfacePlotProps }
  | { kind: 'slice'; props: ActionSlicePlotProps }
  | { kind: 'convergence'; props: ConvergencePlotProps }
  | { kind: 'comparison'; props: PolicyValueChartProps }
  | { kind: 'sensitivity'; props: SensitivityPlotProps };

export interface ExportOptions {
  widthPx: number;
  heightPx: number;
  /** Sets the PNG pHYs chunk (and the SVG's size in inches) and scales fonts by dpi/96; not the pixel count. */
  dpi: number;
  background: 'white' | 'transparent';
  /** Project, policy, settings, date (see exportCaption); the short caution is added if missing. */
  caption: string;
  /** The short engineering caution (src/pipeline/cautions.ts); added to the caption when missing. */
  caution: string;
}

export function plotChartConfig(spec: PlotSpec, look: PlotLook): ChartConfiguration {
  switch (spec.kind) {
    case 'surface': return valueSurfaceChart(spec.props, look) as unknown as ChartConfiguration;
    case 'slice': return actionSliceChart(spec.props, look) as unknown as ChartConfiguration;
    case 'convergence': return convergenceChart(spec.props, look) as unknown as ChartConfiguration;
    case 'comparison': return policyValueChart(spec.props, look) as unknown as ChartConfiguration;
    case 'sensitivity': return sensitivityChart(spec.props, look) as unknown as ChartConfiguration;
  }
}

export function plotSummary(spec: PlotSpec): string {
  switch (spec.kind) {
    case 'surface': return valueSurfaceSummary(spec.props);
    case 'slice': return actionSliceSummary(spec.props);
    case 'convergence': return convergenceSummary(spec.props);
    case 'comparison': return policyValueSummary(spec.props);
    case 'sensitivity': return sensitivitySummary(spec.props);
  }
}

export function plotTitle(spec: PlotSpec): string {
  return spec.kind === 'comparison' ? spec.props.title ?? POLICY_VALUE_DEFAULTS.title : spec.props.title;
}
