/**
 * What to export: one of the plots with its props, and how (pixel size, dpi, background,
 * caption). Each kind maps to its Chart.js configuration and text summary here, so the exporters
 * treat every plot alike.
 */
import type { ChartConfiguration } from 'chart.js';
import { ACTION_SLICE_DEFAULTS, actionSliceChart, actionSliceSummary, type ActionSlicePlotProps } from '../charts/actionSlice';
import { CANDIDATE_ACTIONS_DEFAULTS, candidateActionsChart, candidateActionsSummary, type CandidateActionsPlotProps } from '../charts/candidateActions';
import { intervalChart, intervalChartHeight, intervalSummary, type IntervalChartProps } from '../charts/intervalChart';
import { CONVERGENCE_DEFAULTS, convergenceChart, convergenceSummary, type ConvergencePlotProps } from '../charts/convergence';
import type { PlotLook } from '../parts/plotLook';
import { POLICY_VALUE_DEFAULTS, policyValueChart, policyValueChartHeight, policyValueSummary, type PolicyValueChartProps } from '../charts/policyValueChart';
import { retuneMapChart, retuneMapHeight, retuneMapSummary, type RetuneMapPlotProps } from '../charts/retuneMap';
import { sensitivityChart, sensitivityChartHeight, sensitivitySummary, type SensitivityPlotProps } from '../charts/sensitivity';
import { trendChart, trendChartHeight, trendSummary, type TrendPlotProps } from '../charts/trendChart';
import { VALUE_SURFACE_DEFAULTS, valueSurfaceChart, valueSurfaceSummary, type ValueSurfacePlotProps } from '../charts/valueSurface';

export type PlotSpec =
  | { kind: 'surface'; props: ValueSurfacePlotProps }
  | { kind: 'slice'; props: ActionSlicePlotProps }
  | { kind: 'convergence'; props: ConvergencePlotProps }
  | { kind: 'comparison'; props: PolicyValueChartProps }
  | { kind: 'sensitivity'; props: SensitivityPlotProps }
  | { kind: 'candidates'; props: CandidateActionsPlotProps }
  | { kind: 'interval'; props: IntervalChartProps }
  | { kind: 'retuneMap'; props: RetuneMapPlotProps }
  | { kind: 'trend'; props: TrendPlotProps };

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
    case 'candidates': return candidateActionsChart(spec.props, look) as unknown as ChartConfiguration;
    case 'interval': return intervalChart(spec.props, look) as unknown as ChartConfiguration;
    case 'retuneMap': return retuneMapChart(spec.props, look);
    case 'trend': return trendChart(spec.props, look) as unknown as ChartConfiguration;
  }
}

export function plotSummary(spec: PlotSpec): string {
  switch (spec.kind) {
    case 'surface': return valueSurfaceSummary(spec.props);
    case 'slice': return actionSliceSummary(spec.props);
    case 'convergence': return convergenceSummary(spec.props);
    case 'comparison': return policyValueSummary(spec.props);
    case 'sensitivity': return sensitivitySummary(spec.props);
    case 'candidates': return candidateActionsSummary(spec.props);
    case 'interval': return intervalSummary(spec.props);
    case 'retuneMap': return retuneMapSummary(spec.props);
    case 'trend': return trendSummary(spec.props);
  }
}

export function plotTitle(spec: PlotSpec): string {
  if (spec.kind === 'comparison') return spec.props.title ?? POLICY_VALUE_DEFAULTS.title;
  if (spec.kind === 'candidates') return spec.props.title || CANDIDATE_ACTIONS_DEFAULTS.title;
  return spec.props.title;
}

/** The on-screen height of a plot in CSS px (the width follows its container). */
export function plotScreenHeight(spec: PlotSpec): number {
  switch (spec.kind) {
    case 'surface': return VALUE_SURFACE_DEFAULTS.heightPx;
    case 'slice': return ACTION_SLICE_DEFAULTS.heightPx;
    case 'convergence': return CONVERGENCE_DEFAULTS.heightPx;
    case 'comparison': return policyValueChartHeight(spec.props.evaluation);
    case 'sensitivity': return sensitivityChartHeight(spec.props.curve);
    case 'candidates': return CANDIDATE_ACTIONS_DEFAULTS.heightPx;
    case 'interval': return intervalChartHeight(spec.props.rows.length);
    case 'retuneMap': return retuneMapHeight(spec.props.map);
    case 'trend': return trendChartHeight(spec.props.trend);
  }
}
