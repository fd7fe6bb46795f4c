/** The fit history as a React component (see convergence.ts for the drawing). */
import { useMemo } from 'react';
import type { ConvergencePlotProps } from '../../../figures/charts/convergence';
import type { PlotSpec } from '../../../figures/writers/plotSpec';
import { PlotFigure } from './PlotFigure';

export function ConvergencePlot({ history, title, theme }: ConvergencePlotProps) {
  const spec = useMemo<PlotSpec>(() => ({ kind: 'convergence', props: { history, title, theme } }), [history, title, theme]);
  return <PlotFigure spec={spec} />;
}
