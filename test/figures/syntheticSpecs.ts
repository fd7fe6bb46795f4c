/**
 * One plot spec of every kind, from the fixed synthetic inputs (an invented tank scenario, not
 * data), for the figure tests, the export tests and the e2e plot page.
 */
import type { Theme } from '../../src/figures/parts/plotTheme';
import type { PlotSpec } from '../../src/figures/writers/plotSpec';
import { meanActionCurve } from '../../src/figures/parts/meanActionCurve';
import { bowlSurface, clippedSlice, geometricHistory, threeCandidateEvaluation } from './syntheticPlotData';
import { discountSweep } from './syntheticSensitivity';
import { syntheticRetuneMap } from './syntheticRetuneMap';
import { signalEnvelope } from '../../src/core/trend/signalEnvelope';

export type PlotKind = PlotSpec['kind'];
export const ALL_PLOT_KINDS: readonly PlotKind[] = ['surface', 'slice', 'convergence', 'comparison', 'sensitivity', 'candidates', 'interval', 'retuneMap', 'trend'];

const LIMITS = { lo: [0], hi: [100], mode: 'clip' as const };

/** Valve opening against the upper tank level: 300 logged pairs around 40 % + 20 %/m, two candidates (one steep enough to meet both limits), the present controller. */
export function tankCandidateActions(theme: Theme): Extract<PlotSpec, { kind: 'candidates' }>['props'] {
  const n = 300, x = new Float64Array(n), y = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    x[k] = 0.5 + (2 * k) / (n - 1);
    y[k] = Math.min(100, Math.max(0, 40 + 20 * (x[k] - 1.5) + 6 * Math.sin(k * 2.399)));
  }
  const range = [0.5, 2.5] as const, held = [1.5, 0.8];
  const curve = (offset: number, gain: number, std: number) => meanActionCurve({ offset: [offset], gain: [[gain, 0]], std: [std], bounds: LIMITS }, 0, 0, range, held)!;
  return {
    logged: { x, y },
    candidates: [{ name: 'gentle gain', ...curve(40, 25, 4) }, { name: 'steep gain', ...curve(40, 110, 8) }],
    present: meanActionCurve({ offset: [10], gain: [[20, 0]], std: [0] }, 0, 0, range, held),
    limits: { lo: 0, hi: 100 }, xLabel: 'level_upper (m)', yLabel: 'inflow valve (%)', title: 'Mean action of each candidate', theme,
    subtitle: 'mean applied action after the 0–100 % limits; level_lower held at 0.8 m',
  };
}

export function syntheticSpec(kind: PlotKind, theme: Theme): PlotSpec {
  const evaluation = threeCandidateEvaluation();
  switch (kind) {
    case 'surface':
      return { kind, props: { surface: bowlSurface(), xLabel: 'tank level (m)', yLabel: 'inflow (m³/h)', valueLabel: 'V^{π}(s), discounted cost (kWh)', title: 'Value surface: gentle gain', theme, heldLabel: 'outlet temperature held at 1.5 °C' } };
    case 'slice':
      return { kind, props: { slice: clippedSlice(), actionLabel: 'valve move (%)', valueLabel: 'cost (kWh)', title: 'Action values at one state', theme } };
    case 'convergence':
      return { kind, props: { history: geometricHistory(), title: 'Fit history: gentle gain', theme } };
    case 'comparison':
      return { kind, props: { evaluation, theme } };
    case 'sensitivity':
      return { kind, props: { curve: discountSweep(), valueLabel: 'J (discounted cost)', title: 'J against the discount', theme } };
    case 'candidates':
      return { kind, props: tankCandidateActions(theme) };
    case 'interval':
      return {
        kind, props: {
          rows: [
            ...evaluation.policies.map((p) => ({ label: p.name, value: p.policyValue, interval: [p.policyValue - 2 * p.standardError, p.policyValue + 2 * p.standardError] as const })),
            { label: 'present controller', value: 45.3, interval: [41, 49.6] as const, present: true },
          ],
          axisLabel: 'J, discounted cost (kWh)', title: '90 % intervals of J', theme, reference: 45.3,
        },
      };
    case 'retuneMap':
      return { kind, props: { map: syntheticRetuneMap(), valueLabel: 'J, discounted cost (kWh)', sense: 'cost', title: 'Retune map: PI on the supply temperature', theme } };
    case 'trend':
      return { kind, props: { trend: tankTrend(), windows: [{ fromSeconds: START + 6 * 3600, toSeconds: START + 9 * 3600, label: 'valve test' }], title: 'Logged signals over time', theme } };
  }
}

/** 1 Mar 2024 00:00 (seconds since 1970): the invented tank log's first row. */
const START = Date.UTC(2024, 2, 1) / 1000;

/** Two days of an invented tank log every 60 s: a level, a valve and a cost, as min/max envelopes. */
export function tankTrend() {
  const n = 2 * 1440, time = new Float64Array(n), level = new Float64Array(n), valve = new Float64Array(n), cost = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    time[k] = START + 60 * k;
    level[k] = 1.5 + 0.3 * Math.sin((2 * Math.PI * k) / 1440) + 0.05 * Math.sin(k * 2.399);
    valve[k] = 40 + 15 * Math.sin((2 * Math.PI * k) / 720 + 1);
    cost[k] = (level[k] - 1.5) ** 2 + 0.001 * valve[k];
  }
  return signalEnvelope([
    { name: 'level_upper', role: 'state', unit: 'm', values: level },
    { name: 'inflow_valve', role: 'action', unit: '%', values: valve },
    { name: 'cost', role: 'cost', unit: 'kWh', values: cost },
  ], time, 'seconds', true, 800);
}
