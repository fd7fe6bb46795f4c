/** The action-value slice as a React component (see actionSlice.ts for the drawing). */
import type { ChartConfiguration } from 'chart.js';
import { useMemo } from 'react';
import { ACTION_SLICE_DEFAULTS, actionSliceChart, actionSliceSummary, type ActionSlicePlotProps } from '../../../figures/charts/actionSlice';
import { ChartFigure, tryBuild } from './ChartFigure';
import { screenLook } from '../../../figures/parts/plotLook';

export function ActionSlicePlot(props: ActionSlicePlotProps) {
  const look = useMemo(() => screenLook(props.theme), [props.theme]);
  const build = useMemo(
    () => tryBuild(() => actionSliceChart(props, look) as unknown as ChartConfiguration),
    [props.slice, props.actionLabel, props.valueLabel, props.title, look],
  );
  const summary = useMemo(() => ('config' in build ? actionSliceSummary(props) : ''), [build, props]);
  return <ChartFigure testId="plot-slice" label={props.title} summary={summary} heightPx={ACTION_SLICE_DEFAULTS.heightPx} palette={look.palette} build={build} />;
}
