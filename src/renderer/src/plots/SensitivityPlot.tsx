/** J against one setting as a React component (see sensitivity.ts for the drawing). */
import { useMemo } from 'react';
import type { SensitivityPlotProps } from '../../../figures/charts/sensitivity';
import type { PlotSpec } from '../../../figures/writers/plotSpec';
import { PlotFigure } from './PlotFigure';

export function SensitivityPlot({ curve, valueLabel, title, theme }: SensitivityPlotProps) {
  const spec = useMemo<PlotSpec>(() => ({ kind: 'sensitivity', props: { curve, valueLabel, title, theme } }), [curve, valueLabel, title, theme]);
  return <PlotFigure spec={spec} />;
}
