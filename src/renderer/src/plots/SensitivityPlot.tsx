/** J against one setting as a React component (see sensitivity.ts for the drawing). */
import type { ChartConfiguration } from 'chart.js';
import { useMemo } from 'react';
import { ChartFigure, tryBuild } from './ChartFigure';
import { screenLook } from '../../../figures/parts/plotLook';
import { SENSITIVITY_DEFAULTS, sensitivityChart, sensitivitySummary, type SensitivityPlotProps } from '../../../figures/charts/sensitivity';

export function SensitivityPlot(props: SensitivityPlotProps) {
  const look = useMemo(() => screenLook(props.theme), [props.theme]);
  const build = useMemo(
    () => tryBuild(() => sensitivityChart(props, look) as unknown as ChartConfiguration),
    [props.curve, props.title, props.valueLabel, look],
  );
  return <ChartFigure testId="plot-sensitivity" label={props.title} summary={sensitivitySummary(props)} heightPx={SENSITIVITY_DEFAULTS.heightPx} palette={look.palette} build={build} />;
}
