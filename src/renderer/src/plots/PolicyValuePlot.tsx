/** The candidate comparison as a React component (see policyValueChart.ts for the drawing). */
import type { ChartConfiguration } from 'chart.js';
import { useMemo } from 'react';
import { ChartFigure, tryBuild } from './ChartFigure';
import { screenLook } from '../../../figures/parts/plotLook';
import { POLICY_VALUE_DEFAULTS, policyValueChart, policyValueChartHeight, policyValueSummary, type PolicyValueChartProps } from '../../../figures/charts/policyValueChart';

export function PolicyValueChart(props: PolicyValueChartProps) {
  const look = useMemo(() => screenLook(props.theme), [props.theme]);
  const build = useMemo(
    () => tryBuild(() => policyValueChart(props, look) as unknown as ChartConfiguration),
    [props.evaluation, props.title, props.unit, look],
  );
  return (
    <ChartFigure
      testId="plot-comparison" label={props.title ?? POLICY_VALUE_DEFAULTS.title} summary={policyValueSummary(props)}
      heightPx={policyValueChartHeight(props.evaluation)} palette={look.palette} build={build}
    />
  );
}
