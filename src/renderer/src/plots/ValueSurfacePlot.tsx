/** The value-surface heat map as a React component (see valueSurface.ts for the drawing). */
import { useMemo } from 'react';
import type { ValueSurfacePlotProps } from '../../../figures/charts/valueSurface';
import type { PlotSpec } from '../../../figures/writers/plotSpec';
import { PlotFigure } from './PlotFigure';

export function ValueSurfacePlot({ surface, xLabel, yLabel, valueLabel, title, heldLabel, colourScheme, theme }: ValueSurfacePlotProps) {
  const spec = useMemo<PlotSpec>(
    () => ({ kind: 'surface', props: { surface, xLabel, yLabel, valueLabel, title, heldLabel, colourScheme, theme } }),
    [surface, xLabel, yLabel, valueLabel, title, heldLabel, colourScheme, theme],
  );
  return <PlotFigure spec={spec} keyColumns={surface.x.length} />;
}
