/**
 * The logged signals over time (src/figures/charts/trendChart.ts, drawn by the chart worker) with
 * the time windows and the runs left out by label shaded (runs drawn muted on a clock that starts
 * again in each run). A window is added by dragging across the trend
 * (TrendWindowDrag.tsx) or by typing its ends (TimeWindows.tsx); both edit the project
 * (data.csv.excludedTimes) the same undoable way, each edit imports again, and the counts of rows
 * and runs left out come back from the import.
 */
import { useMemo, useRef, useState } from 'react';
import { runSpanText } from '../../../../core/runLabelText';
import type { PlotSpec } from '../../../../figures/writers/plotSpec';
import type { DataImport } from '../../../../shared/workerMessages';
import { useSession } from '../../hooks';
import { PlotFigure } from '../../plots';
import type { PlotFrame } from '../../plots/chartMessages';
import { useStore } from '../../state/useStore';
import { themeStore, type Theme } from '../../theme';
import { TimeWindows, useAddWindow } from './TimeWindows';
import { RunsLeftOut } from './RunsLeftOut';
import { draggedWindow } from './trendDrag';
import { TrendWindowDrag } from './TrendWindowDrag';

const same = (t: Theme) => t;

/** What the trend says of a range of runs left out: 'runs "1" to "15": before the retune'. */
function runsLeftOutLabel(r: DataImport['runsLeftOut'][number]): string {
  const span = runSpanText({ label: r.from, line: 0 }, { label: r.to, line: 0 }) ?? ''; // labels, so never null
  return `${span}${r.reason ? `: ${r.reason}` : ''}`;
}

/** The last import that succeeded, kept while a new one runs so the chart does not blink. */
function useLastImport(): DataImport | null {
  const state = useSession().importState;
  const last = useRef<DataImport | null>(null);
  if (state.status === 'done') last.current = state.result;
  if (state.status === 'idle') last.current = null;
  return last.current;
}

export function TrendPanel() {
  const imported = useLastImport();
  const importing = useSession().importState.status === 'importing';
  const theme = useStore(themeStore, same);
  const [frame, setFrame] = useState<PlotFrame | null>(null);
  const addWindow = useAddWindow();
  const spec = useMemo<PlotSpec | null>(() => imported && {
    kind: 'trend',
    props: {
      trend: imported.trend, theme, title: 'Logged signals over time', runTime: (imported.clock?.runRestarts ?? 0) > 0,
      windows: imported.timeWindows.map((w) => ({ fromSeconds: w.fromSeconds, toSeconds: w.toSeconds, label: w.reason })),
      runsLeftOut: imported.runsLeftOut.map(runsLeftOutLabel),
    },
  }, [imported, theme]);
  if (!imported || !spec) return null;
  const clock = imported.clock;
  // The last drawn plot area is kept while the trend is drawn again (each import redraws it over
  // the same time axis), so a press at that moment is not lost.
  const figure = <PlotFigure spec={spec} testId="plot-trend" onFrame={(f) => { if (f) setFrame(f); }} />;
  return (
    <section className="panel" aria-labelledby="trend-heading" aria-busy={importing} data-testid="trend-panel">
      <h3 id="trend-heading">Trend of the logged signals</h3>
      <p className="small muted">
        Every row of the file, states, actions and the {imported.trend.signals.at(-1)?.role ?? 'cost'} each on its own scale. Look for a start-up,
        a plant test or a period under another controller, and leave it out: its rows are counted and the run is cut in two there.
        {clock && ' Drag across the trend to leave out a window, or type its ends below.'}
      </p>
      {clock
        ? (
          <TrendWindowDrag
            frame={frame} calendar={clock.calendar} everyRun={clock.runRestarts > 0}
            onAdd={(span) => addWindow(draggedWindow(span, clock.calendar), 'leave out a time window dragged on the trend')}
          >
            {figure}
          </TrendWindowDrag>
        )
        : figure}
      <TimeWindows imported={imported} />
      <RunsLeftOut imported={imported} />
    </section>
  );
}
