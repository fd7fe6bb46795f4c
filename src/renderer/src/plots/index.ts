/** The plots of the results screen (Chart.js), shared with the exporters. */
export type { Theme } from '../../../figures/parts/plotTheme';
export { ValueSurfacePlot } from './ValueSurfacePlot';
export { ActionSlicePlot } from './ActionSlicePlot';
export { ConvergencePlot } from './ConvergencePlot';
export { PolicyValueChart } from './PolicyValuePlot';
export { SensitivityPlot } from './SensitivityPlot';
export { PlotFigure } from './PlotFigure';
export type { ValueSurfacePlotProps } from '../../../figures/charts/valueSurface';
export type { ActionSliceData, ActionSlicePlotProps } from '../../../figures/charts/actionSlice';
export type { ConvergencePlotProps } from '../../../figures/charts/convergence';
export type { PolicyValueChartProps } from '../../../figures/charts/policyValueChart';
export type { SensitivityPlotProps } from '../../../figures/charts/sensitivity';
export type { SliceBounds } from '../../../figures/parts/pointMasses';
export type { ColourScheme } from '../../../figures/parts/colourScale';
