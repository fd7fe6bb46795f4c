/**
 * Each candidate's mean action against the logged actions over one state axis: a scatter of the
 * logged (state, action) pairs with every candidate's μ(s) line, and the behaviour model's dashed,
 * the other states held at their logged means. Chart.js draws it.
 */
import { useEffect, useRef } from 'react';
import { Chart, Legend, LinearScale, LineController, LineElement, PointElement, ScatterController, Tooltip } from 'chart.js';
import type { ProjectDocument } from '../../../../project/schema';
import type { DataImport } from '../../../../shared/workerMessages';
import { candidateColour } from '../../format/candidatePalette';
import { useStore } from '../../state/useStore';
import { themeStore, type Theme } from '../../theme';
import { loggedPoints, meanActionLine } from './meanActionLines';

Chart.register(ScatterController, LineController, PointElement, LineElement, LinearScale, Legend, Tooltip);

const same = (t: Theme) => t;

interface Props {
  doc: ProjectDocument;
  imported: DataImport;
  axis: number;
  action: number;
}

function datasets({ doc, imported, axis, action }: Props, theme: Theme) {
  const range = imported.stateRanges[axis];
  const logged = {
    type: 'scatter' as const, label: 'Logged actions', data: loggedPoints(imported.sample, imported.stateNames.length, imported.actionNames.length, axis, action),
    pointRadius: 1.5, backgroundColor: theme === 'dark' ? 'rgba(200,210,220,0.35)' : 'rgba(60,70,80,0.3)', borderWidth: 0,
  };
  const lines = doc.candidates.flatMap((c, i) => {
    const data = c.form.kind === 'affine' ? meanActionLine(c.form, axis, action, range, imported.stateMeans) : null;
    return data ? [{ type: 'line' as const, label: c.name, data, borderColor: candidateColour(i), backgroundColor: candidateColour(i), borderWidth: 2.5, pointRadius: 0 }] : [];
  });
  const model = imported.behaviour.ok ? meanActionLine(imported.behaviour.model, axis, action, range, imported.stateMeans) : null;
  const behaviour = model ? [{
    type: 'line' as const, label: 'Behaviour model (fitted to the log)', data: model, borderColor: theme === 'dark' ? '#e6e9ed' : '#1b1f24',
    backgroundColor: 'transparent', borderDash: [6, 4], borderWidth: 2, pointRadius: 0,
  }] : [];
  return [logged, ...behaviour, ...lines];
}

export function CandidateChart(props: Props) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const chart = useRef<Chart | null>(null);
  const theme = useStore(themeStore, same);
  const { doc, imported, axis, action } = props;
  useEffect(() => {
    if (!canvas.current) return;
    const text = theme === 'dark' ? '#e6e9ed' : '#1b1f24', grid = theme === 'dark' ? '#414a55' : '#dde2e8';
    const unit = (u: string) => (u ? ` (${u})` : '');
    const title = (t: string) => ({ display: true, text: t, color: text });
    chart.current = new Chart(canvas.current, {
      type: 'scatter',
      data: { datasets: datasets({ doc, imported, axis, action }, theme) as never },
      options: {
        animation: false, maintainAspectRatio: false, responsive: true,
        scales: {
          x: { type: 'linear', title: title(`${doc.columns.states[axis]?.column ?? ''}${unit(doc.columns.states[axis]?.unit ?? '')}`), ticks: { color: text }, grid: { color: grid } },
          y: { type: 'linear', title: title(`${doc.columns.actions[action]?.column ?? ''}${unit(doc.columns.actions[action]?.unit ?? '')}`), ticks: { color: text }, grid: { color: grid } },
        },
        plugins: { legend: { labels: { color: text } }, tooltip: { enabled: true } },
      },
    });
    return () => {
      chart.current?.destroy();
      chart.current = null;
    };
  }, [doc, imported, axis, action, theme]);
  return (
    <div className="chart-box" data-testid="candidate-chart">
      <canvas ref={canvas} role="img" aria-label={`Mean action of each candidate and the logged actions against ${doc.columns.states[axis]?.column}`} />
    </div>
  );
}
