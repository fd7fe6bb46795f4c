/** The candidate comparison as a React component (see policyValueChart.ts for the drawing). */
import { useMemo } from 'react';
import type { PolicyValueData } from '../../../figures/charts/figureData';
import type { PolicyValueChartProps } from '../../../figures/charts/policyValueChart';
import type { PlotSpec } from '../../../figures/writers/plotSpec';
import { PlotFigure } from './PlotFigure';

/** Only what the chart draws: an evaluation also carries surfaces and histories, which the worker need not be sent. */
export function policyValueData(evaluation: PolicyValueData): PolicyValueData {
  return {
    policies: evaluation.policies.map(({ name, policyValue, standardError, status }) => ({ name, policyValue, standardError, status })),
    behaviour: { value: evaluation.behaviour.value, standardError: evaluation.behaviour.standardError },
    presentController: evaluation.presentController
      ? { estimate: { policyValue: evaluation.presentController.estimate.policyValue, standardError: evaluation.presentController.estimate.standardError } } : null,
    valueSense: evaluation.valueSense,
  };
}

export function PolicyValueChart({ evaluation, theme, title, unit, intervals }: PolicyValueChartProps) {
  const spec = useMemo<PlotSpec>(() => ({ kind: 'comparison', props: { evaluation: policyValueData(evaluation), theme, title, unit, intervals } }), [evaluation, theme, title, unit, intervals]);
  return <PlotFigure spec={spec} />;
}
