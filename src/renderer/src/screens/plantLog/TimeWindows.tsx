/**
 * The time windows left out of the import (data.csv.excludedTimes): the list with each window's
 * rows and runs from the last import, the problems that stopped an import said at the window, and
 * the form that adds one by its ends (the keyboard's way; a drag on the trend is the pointer's).
 * Both add through useAddWindow: one undoable edit, checked on import.
 */
import { useState } from 'react';
import { clockText, dateEntryText, durationText } from '../../../../core/clockText';
import { EVERY_RUN_SENTENCE } from '../../../../data/timeWindows';
import type { ExcludedTime } from '../../../../project/schema';
import type { DataImport } from '../../../../shared/workerMessages';
import { ProblemList } from '../../components/ProblemList';
import { TextField } from '../../components/TextField';
import { parseNumber } from '../../format/numberFormat';
import { useDocument, useSession } from '../../hooks';
import { useWorkspace } from '../../WorkspaceContext';

/** Add a window to the project's list, as one undoable edit named `label`. */
export function useAddWindow(): (w: ExcludedTime, label: string) => void {
  const { documents } = useWorkspace();
  return (w, label) => documents.edit(label, (d) => ({
    ...d, data: { ...d.data, csv: { ...d.data.csv, excludedTimes: [...(d.data.csv.excludedTimes ?? []), w] } },
  }));
}

/** Said where a window is added when the log's clock restarts in each run (the import report says it too). */
export function EveryRunNote({ clock }: { clock: DataImport['clock'] }) {
  if (!clock || clock.runRestarts === 0) return null;
  return <p className="small every-run-note" data-testid="every-run-note">{EVERY_RUN_SENTENCE}</p>;
}

/** How an end is shown in the list: readable on the log's clock when the import read it. */
function endText(value: number | string, seconds: number | undefined, calendar: boolean): string {
  return seconds === undefined ? String(value) : clockText(seconds, calendar);
}

export function TimeWindows({ imported }: { imported: DataImport }) {
  const { documents } = useWorkspace();
  const addWindow = useAddWindow();
  const windows = useDocument().data.csv.excludedTimes ?? [];
  const clock = imported.clock;
  // Typing a reason is one undo step per window (merged until the field is left); the shading's label follows on the next import.
  const setReason = (i: number, reason: string): void => documents.edit(`name time window ${i + 1}`, (d) => ({
    ...d, data: { ...d.data, csv: { ...d.data.csv, excludedTimes: (d.data.csv.excludedTimes ?? []).map((x, k) => (k === i ? { ...x, reason } : x)) } },
  }), `window-reason-${i}`);
  const remove = (i: number): void => documents.edit('remove a time window left out', (d) => ({
    ...d, data: { ...d.data, csv: { ...d.data.csv, excludedTimes: (d.data.csv.excludedTimes ?? []).filter((_, k) => k !== i) } },
  }));
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
            <thead><tr><th scope="col">Reason</th><th scope="col">From</th><th scope="col">To</th><th scope="col" className="number">Length</th><th scope="col" className="number">Rows left out</th><th scope="col" className="number">Runs</th><th scope="col"><span className="sr-only">Remove</span></th></tr></thead>
            <tbody>
              {windows.map((w, i) => {
                const c = counted[i];
                return (
                  <tr key={i}>
                    <td>
                      <input
                        aria-label={`Reason for window ${i + 1}`} data-testid={`window-reason-${i}`} value={w.reason} placeholder="e.g. valve test" size={14}
                        onChange={(e) => setReason(i, e.target.value)} onBlur={documents.closeStep}
                      />
                    </td>
                    <td>{endText(w.from, c?.fromSeconds, clock.calendar)}</td>
                    <td>{endText(w.to, c?.toSeconds, clock.calendar)}</td>
                    <td className="number">{c ? durationText(c.toSeconds - c.fromSeconds) : '—'}</td>
                    <td className="number" data-testid={`window-rows-${i}`}>{c ? c.rows.toLocaleString('en-US') : '—'}</td>
                    <td className="number" data-testid={`window-runs-${i}`}>{c ? c.runs.toLocaleString('en-US') : '—'}</td>
                    <td><button className="link" onClick={() => remove(i)}>Remove</button></td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
      <WindowProblems count={windows.length} />
      <EveryRunNote clock={clock} />
      <AddWindow calendar={clock.calendar} firstSeconds={clock.firstSeconds} onAdd={(w) => addWindow(w, 'leave out a time window')} />
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
      <div className="field button-field"><button onClick={add} disabled={!ready} data-testid="add-window-button">Leave out this window</button></div>
    </div>
  );
}
