/** The fit history as a React component (see convergence.ts for the drawing). */
import type { ChartConfiguration } from 'chart.js';
import { useMemo } from 'react';
import { ChartFigure, tryBuild } from './ChartFigure';
import { CONVERGENCE_DEFAULTS, convergenceChart, convergenceSummary, type ConvergencePlotProps } from '../../../figures/charts/convergence';
import { screenLook } from '../../../figures/parts/plotLook';

export function ConvergencePlot(props: ConvergencePlotProps) {
  const look = useMemo(() => screenLook(props.theme), [props.theme]);
  const build = useMemo(
    () => tryBuild(() => convergenceChart(props, look) as unknown as ChartConfiguration),
    [props.history, props.title, look],
  );
  return <ChartFigure testId="plot-convergence" label={props.title} summary={convergenceSummary(props)} heightPx={CONVERGENCE_DEFAULTS.heightPx} palette={look.palette} build={build} />;
}
