/** The value-surface heat map as a React component (see valueSurface.ts for the drawing). */
import type { ChartConfiguration } from 'chart.js';
import { useMemo } from 'react';
import { ChartFigure, tryBuild, type KeyStep } from './ChartFigure';
import { screenLook } from '../../../figures/parts/plotLook';
import { VALUE_SURFACE_DEFAULTS, valueSurfaceChart, valueSurfaceSummary, type ValueSurfacePlotProps } from '../../../figures/charts/valueSurface';

/** Arrow keys move across the grid as seen: up is increasing y (the next row of values). */
function gridStep(nx: number): KeyStep {
  return (key, current, count) => {
    const ix = current % nx, iy = Math.floor(current / nx), ny = count / nx;
    if (key === 'ArrowRight') return iy * nx + Math.min(nx - 1, ix + 1);
    if (key === 'ArrowLeft') return iy * nx + Math.max(0, ix - 1);
    if (key === 'ArrowUp') return Math.min(ny - 1, iy + 1) * nx + ix;
    if (key === 'ArrowDown') return Math.max(0, iy - 1) * nx + ix;
    if (key === 'Home') return 0;
    if (key === 'End') return count - 1;
    return null;
  };
}

export function ValueSurfacePlot(props: ValueSurfacePlotProps) {
  const look = useMemo(() => screenLook(props.theme), [props.theme]);
  const build = useMemo(
    () => tryBuild(() => valueSurfaceChart(props, look) as unknown as ChartConfiguration),
    [props.surface, props.xLabel, props.yLabel, props.valueLabel, props.title, props.heldLabel, props.colourScheme, look],
  );
  const summary = useMemo(() => ('config' in build ? valueSurfaceSummary(props) : ''), [build, props]);
  return (
    <ChartFigure
      testId="plot-surface" label={props.title} summary={summary} heightPx={VALUE_SURFACE_DEFAULTS.heightPx}
      palette={look.palette} build={build} keyStep={gridStep(props.surface.x.length)}
    />
  );
}
