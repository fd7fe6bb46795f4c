/**
 * The React host of one Chart.js chart: a focusable figure with an accessible name (role="img",
 * aria-label) and a text summary for screen readers, the chart made on mount and destroyed on
 * unmount or when its configuration changes. Arrow keys walk the tooltip through the data so the
 * values can be read without a mouse. A configuration that cannot be built shows its message.
 */
import { Chart, type ChartConfiguration } from 'chart.js';
import { useEffect, useId, useRef, type CSSProperties, type KeyboardEvent } from 'react';
import { scheduleChart } from './chartQueue';
import { registerChartParts } from '../../../figures/parts/chartParts';
import type { PlotPalette } from '../../../figures/parts/plotTheme';

/** Moves the keyboard cursor; returns the new data index of dataset 0, or null to leave it. */
export type KeyStep = (key: string, current: number, count: number) => number | null;

export const stepThroughIndex: KeyStep = (key, current, count) => {
  if (key === 'ArrowRight' || key === 'ArrowDown') return Math.min(count - 1, current + 1);
  if (key === 'ArrowLeft' || key === 'ArrowUp') return Math.max(0, current - 1);
  if (key === 'Home') return 0;
  if (key === 'End') return count - 1;
  return null;
};

const KEY_HINT = 'Arrow keys step through the values; Escape hides the readout.';

interface ChartFigureProps {
  testId: string;
  label: string;
  summary: string;
  heightPx: number;
  palette: PlotPalette;
  /** The chart to draw, or the message saying why it cannot be drawn. */
  build: { config: ChartConfiguration } | { error: string };
  keyStep?: KeyStep;
}

const visuallyHidden: CSSProperties = {
  position: 'absolute', width: 1, height: 1, overflow: 'hidden', clip: 'rect(0 0 0 0)', whiteSpace: 'nowrap', margin: -1, padding: 0, border: 0,
};

export function ChartFigure({ testId, label, summary, heightPx, palette, build, keyStep = stepThroughIndex }: ChartFigureProps) {
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const chartRef = useRef<Chart | null>(null);
  const cursor = useRef(-1);
  const summaryId = useId();
  const config = 'config' in build ? build.config : null;

  useEffect(() => {
    if (!config || !canvasRef.current) return;
    const canvas = canvasRef.current;
    let chart: Chart | null = null;
    const cancel = scheduleChart(() => {
      registerChartParts();
      chart = new Chart(canvas, config);
      chartRef.current = chart;
      cursor.current = -1;
    });
    return () => {
      cancel();
      chart?.destroy();
      chartRef.current = null;
    };
  }, [config]);

  const onKeyDown = (event: KeyboardEvent) => {
    const chart = chartRef.current;
    const points = chart?.getDatasetMeta(0)?.data ?? [];
    if (!chart || points.length === 0) return;
    if (event.key === 'Escape') {
      chart.tooltip?.setActiveElements([], { x: 0, y: 0 });
      chart.update('none');
      return;
    }
    const next = keyStep(event.key, Math.max(0, cursor.current), points.length);
    if (next === null) return;
    event.preventDefault();
    cursor.current = next;
    const { x, y } = points[next];
    chart.tooltip?.setActiveElements([{ datasetIndex: 0, index: next }], { x, y });
    chart.update('none');
  };

  return (
    <figure
      data-testid={testId}
      role="img"
      aria-label={label}
      aria-describedby={summaryId}
      tabIndex={0}
      onKeyDown={onKeyDown}
      style={{ position: 'relative', margin: 0, width: '100%', height: heightPx, background: palette.background, color: palette.text }}
    >
      {config ? <canvas ref={canvasRef} aria-hidden="true" /> : (
        <p role="alert" style={{ margin: 0, padding: '1em', font: 'inherit' }}>{'error' in build ? build.error : ''}</p>
      )}
      <p id={summaryId} style={visuallyHidden}>{summary} {KEY_HINT}</p>
    </figure>
  );
}

/** Build a chart configuration, turning a thrown error into its message for the figure. */
export function tryBuild(make: () => ChartConfiguration): { config: ChartConfiguration } | { error: string } {
  try {
    return { config: make() };
  } catch (error) {
    return { error: `This plot cannot be drawn: ${error instanceof Error ? error.message : String(error)}` };
  }
}
