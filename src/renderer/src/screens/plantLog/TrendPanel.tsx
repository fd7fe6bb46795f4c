/**
 * The logged signals over time (src/figures/charts/trendChart.ts, drawn by the chart worker) with
 * the time windows left out shaded, and the list of those windows with a form to add one. The
 * windows live in the project (data.csv.excludedTimes); each edit imports again, and the counts of
 * rows left out come back from the import.
 */
import { useMemo, useRef, useState } from 'react';
import { clockText, dateEntryText, durationText } from '../../../../core/clockText';
import type { ExcludedTime } from '../../../../project/schema';
import type { PlotSpec } from '../../../../figures/writers/plotSpec';
import type { DataImport } from '../../../../shared/workerMessages';
import { ProblemList } from '../../components/ProblemList';
import { TextField } from '../../components/TextField';
import { parseNumber } from '../../format/numberFormat';
import { useDocument, useSession } from '../../hooks';
import { PlotFigure } from '../../plots';
import { useStore } from '../../state/useStore';
import { themeStore, type Theme } from '../../theme';
import { useWorkspace } from '../../WorkspaceContext';

const same = (t: Theme) => t;

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
  const spec = useMemo<PlotSpec | null>(() => imported && {
    kind: 'trend',
    props: {
      trend: imported.trend, theme, title: 'Logged signals over time',
      windows: imported.timeWindows.map((w) => ({ fromSeconds: w.fromSeconds, toSeconds: w.toSeconds, label: w.reason })),
    },
  }, [imported, theme]);
  if (!imported || !spec) return null;
  return (
    <section className="panel" aria-labelledby="trend-heading" aria-busy={importing} data-testid="trend-panel">
      <h3 id="trend-heading">Trend of the logged signals</h3>
      <p className="small muted">
        Every row of the file, states, actions and the {imported.trend.signals.at(-1)?.role ?? 'cost'} each on its own scale. Look for a start-up,
        a plant test or a period under another controller, and leave it out below: its rows are counted and the run is cut in two there.
      </p>
      <PlotFigure spec={spec} testId="plot-trend" />
      <TimeWindows imported={imported} />
    </section>
  );
}

/** How an end is shown in the list: readable on the log's clock when the import read it. */
function endText(value: number | string, seconds: number | undefined, calendar: boolean): string {
  return seconds === undefined ? String(value) : clockText(seconds, calendar);
}

function TimeWindows({ imported }: { imported: DataImport }) {
  const { documents } = useWorkspace();
  const windows = useDocument().data.csv.excludedTimes ?? [];
  const clock = imported.clock;
  const setWindows = (next: ExcludedTime[], label: string): void =>
    documents.edit(label, (d) => ({ ...d, data: { ...d.data, csv: { ...d.data.csv, excludedTimes: next } } }));
  if (!clock) {
    return <p className="small muted">A time window can be left out once a column has the role “Timestamp”.</p>;
  }
  const counted = imported.timeWindows.length === windows.length ? imported.timeWindows : [];
  return (
    <>
      <h4>Time windows left out</h4>
      <p className="small muted" data-testid="log-clock">
        The log runs from {clockText(clock.firstSeconds, clock.calendar)} to {clockText(clock.lastSeconds, clock.calendar)} ({durationText(clock.lastSeconds - clock.firstSeconds)}).
      </p>
      {windows.length > 0 && (
        <div className="table-scroll">
          <table data-testid="time-windows">
            <thead><tr><th scope="col">Reason</th><th scope="col">From</th><th scope="col">To</th><th scope="col" className="number">Length</th><th scope="col" className="number">Rows left out</th><th scope="col"><span className="sr-only">Remove</span></th></tr></thead>
            <tbody>
              {windows.map((w, i) => {
                const c = counted[i];
                return (
                  <tr key={i}>
                    <td>{w.reason || '—'}</td>
                    <td>{endText(w.from, c?.fromSeconds, clock.calendar)}</td>
                    <td>{endText(w.to, c?.toSeconds, clock.calendar)}</td>
                    <td className="number">{c ? durationText(c.toSeconds - c.fromSeconds) : '—'}</td>
                    <td className="number" data-testid={`window-rows-${i}`}>{c ? c.rows.toLocaleString('en-US') : '—'}</td>
                    <td><button className="link" onClick={() => setWindows(windows.filter((_, k) => k !== i), 'remove a time window left out')}>Remove</button></td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
      <WindowProblems count={windows.length} />
      <AddWindow calendar={clock.calendar} firstSeconds={clock.firstSeconds} onAdd={(w) => setWindows([...windows, w], 'leave out a time window')} />
    </>
  );
}

/** Problems of the windows from the last import, said at the windows: "Window 2, To: …". */
function WindowProblems({ count }: { count: number }) {
  const state = useSession().importState;
  if (state.status !== 'failed') return null;
  const mine = state.problems.filter((p) => p.field?.[2] === 'excludedTimes' && Number(p.field[3]) < Math.max(count, 1));
  const where = (field: readonly (string | number)[] | undefined): string =>
    `Window ${Number(field?.[3]) + 1}${field?.[4] === 'from' ? ', From' : field?.[4] === 'to' ? ', To' : ''}`;
  return <ProblemList title="This time window cannot be used" problems={mine.map((p) => ({ ...p, where: where(p.field) }))} testId="window-problems" />;
}

/** A time as typed: a plain number stays a number of seconds, anything else is read like the timestamp cells. */
function timeValue(text: string): number | string {
  const number = parseNumber(text);
  return number === null ? text.trim() : number;
}

function AddWindow(props: { calendar: boolean; firstSeconds: number; onAdd: (w: ExcludedTime) => void }) {
  const [from, setFrom] = useState(''), [to, setTo] = useState(''), [reason, setReason] = useState('');
  const example = props.calendar ? dateEntryText(props.firstSeconds) : String(props.firstSeconds);
  const ready = from.trim() !== '' && to.trim() !== '';
  const add = (): void => {
    props.onAdd({ from: timeValue(from), to: timeValue(to), reason: reason.trim() });
    setFrom(''); setTo(''); setReason('');
  };
  const how = props.calendar ? `a date and time as the timestamp column writes it, e.g. ${example}` : `seconds on the timestamp column’s clock, e.g. ${example}`;
  return (
    <div className="row" data-testid="add-window">
      <TextField label="From" value={from} onChange={setFrom} placeholder={example} help={`Start of the window, included: ${how}.`} />
      <TextField label="To" value={to} onChange={setTo} placeholder={example} help="End of the window, included." />
      <TextField label="Reason" value={reason} onChange={setReason} placeholder="start-up" help="Shown on the chart and in the import report." />
      <div className="field"><button onClick={add} disabled={!ready} data-testid="add-window-button">Leave out this window</button></div>
    </div>
  );
}
