/** The plots of the results screen (Chart.js), shared with the exporters. */
export type { Theme } from './plotTheme';
export { ValueSurfacePlot } from './ValueSurfacePlot';
export { ActionSlicePlot } from './ActionSlicePlot';
export { ConvergencePlot } from './ConvergencePlot';
export { PolicyValueChart } from './PolicyValuePlot';
export { SensitivityPlot } from './SensitivityPlot';
export type { ValueSurfacePlotProps } from './valueSurface';
export type { ActionSliceData, ActionSlicePlotProps } from './actionSlice';
export type { ConvergencePlotProps } from './convergence';
export type { PolicyValueChartProps } from './policyValueChart';
export type { SensitivityPlotProps } from './sensitivity';
export type { SliceBounds } from './pointMasses';
export type { ColourScheme } from './colourScale';
