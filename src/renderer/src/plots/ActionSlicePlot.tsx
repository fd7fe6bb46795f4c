/** The action-value slice as a React component (see actionSlice.ts for the drawing). */
import { useMemo } from 'react';
import type { ActionSlicePlotProps } from '../../../figures/charts/actionSlice';
import type { PlotSpec } from '../../../figures/writers/plotSpec';
import { PlotFigure } from './PlotFigure';

export function ActionSlicePlot({ slice, actionLabel, valueLabel, title, theme, loggedRange, meanAction, subtitle }: ActionSlicePlotProps) {
  const spec = useMemo<PlotSpec>(
    () => ({ kind: 'slice', props: { slice, actionLabel, valueLabel, title, theme, loggedRange, meanAction, subtitle } }),
    [slice, actionLabel, valueLabel, title, theme, loggedRange, meanAction, subtitle],
  );
  return <PlotFigure spec={spec} />;
}
