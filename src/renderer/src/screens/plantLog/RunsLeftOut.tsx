/**
 * The runs left out of the import by label (data.csv.excludedRuns), beside the time windows: the list
 * with each range's runs and rows from the last import, the problems that stopped an import said at
 * the range, and the form that adds one by its first and last label (offering the labels the log
 * holds). Each edit is one undoable change of the project, checked on import.
 */
import { useId, useState } from 'react';
import type { ColumnRoles, ExcludedRun } from '../../../../project/schema';
import { runLabelText } from '../../../../core/runLabelText';
import type { DataImport } from '../../../../shared/workerMessages';
import { ProblemList } from '../../components/ProblemList';
import { TextField } from '../../components/TextField';
import { useDocument, useSession } from '../../hooks';
import { useWorkspace } from '../../WorkspaceContext';

type Ranges = readonly ExcludedRun[];
const RANGE_FIELD = 'excludedRuns';

/** Edits data.csv.excludedRuns as one undoable step named `label` (`merge`: typing in one field is one step). */
function useEditRanges(): (label: string, change: (ranges: Ranges) => ExcludedRun[], merge?: string) => void {
  const { documents } = useWorkspace();
  return (label, change, merge) => documents.edit(label, (d) => ({
    ...d, data: { ...d.data, csv: { ...d.data.csv, excludedRuns: change(d.data.csv.excludedRuns ?? []) } },
  }), merge);
}

export function RunsLeftOut({ imported }: { imported: DataImport }) {
  const { documents } = useWorkspace();
  const doc = useDocument();
  const edit = useEditRanges();
  const ranges = doc.data.csv.excludedRuns ?? [];
  const runColumn = doc.columns.episode.kind === 'column';
  if (!runColumn && ranges.length === 0) return <NoRunColumn episode={doc.columns.episode} />;
  const counted = imported.runsLeftOut.length === ranges.length ? imported.runsLeftOut : [];
  const setReason = (i: number, reason: string): void => edit(`name runs left out ${i + 1}`, (r) => r.map((x, k) => (k === i ? { ...x, reason } : x)), `runs-reason-${i}`);
  return (
    <div data-testid="runs-left-out">
      <h4>Runs left out</h4>
      <p className="small muted">
        Leave out whole runs by their label: the runs before a retune, a trip test, a time the plant was different. A range takes every run from
        its first label to its last, in the order the runs appear in the log; only the runs kept are evaluated.
      </p>
      {ranges.length > 0 && (
        <div className="table-scroll">
          <table data-testid="run-ranges">
            <thead><tr><th scope="col">Reason</th><th scope="col">From run</th><th scope="col">To run</th><th scope="col" className="number">Runs</th><th scope="col" className="number">Rows left out</th><th scope="col"><span className="sr-only">Remove</span></th></tr></thead>
            <tbody>
              {ranges.map((r, i) => (
                <tr key={i}>
                  <td>
                    <input
                      aria-label={`Reason for runs left out ${i + 1}`} data-testid={`runs-reason-${i}`} value={r.reason} placeholder="e.g. before the retune" size={18}
                      onChange={(e) => setReason(i, e.target.value)} onBlur={documents.closeStep}
                    />
                  </td>
                  <td className="mono">{runLabelText(r.from)}</td>
                  <td className="mono">{runLabelText(r.to ?? r.from)}</td>
                  <td className="number" data-testid={`runs-count-${i}`}>{counted[i] ? counted[i].runs.toLocaleString('en-US') : '—'}</td>
                  <td className="number" data-testid={`runs-rows-${i}`}>{counted[i] ? counted[i].rows.toLocaleString('en-US') : '—'}</td>
                  <td><button className="link" onClick={() => edit('remove runs left out', (x) => x.filter((_, k) => k !== i))}>Remove</button></td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <RangeProblems count={ranges.length} />
      {runColumn && <AddRange labels={imported.runLabels} onAdd={(r) => edit('leave out runs', (x) => [...x, r])} />}
    </div>
  );
}

/** Without a run column there are no labels to name: say what to do instead. */
function NoRunColumn({ episode }: { episode: ColumnRoles['episode'] }) {
  const why = episode.kind === 'timeGap' ? 'Runs found at gaps in the time have no labels' : 'The log is read as one run';
  return <p className="small muted" data-testid="runs-left-out-unavailable">{why}: to leave out a period, leave out a time window. Runs can be left out by label once a column gives the runs.</p>;
}

/** Problems of the ranges from the last import, said at the ranges: "Runs left out 2, To run: …". */
function RangeProblems({ count }: { count: number }) {
  const state = useSession().importState;
  if (state.status !== 'failed') return null;
  const mine = state.problems.filter((p) => p.field?.[2] === RANGE_FIELD && Number(p.field[3]) < Math.max(count, 1));
  const where = (field: readonly (string | number)[] | undefined): string =>
    `Runs left out ${Number(field?.[3]) + 1}${field?.[4] === 'from' ? ', From run' : field?.[4] === 'to' ? ', To run' : ''}`;
  return <ProblemList title="These runs cannot be left out" problems={mine.map((p) => ({ ...p, where: where(p.field) }))} testId="run-range-problems" />;
}

function AddRange(props: { labels: readonly string[]; onAdd: (r: ExcludedRun) => void }) {
  const [from, setFrom] = useState(''), [to, setTo] = useState(''), [reason, setReason] = useState('');
  const listId = useId();
  const first = props.labels[0] ?? '1', last = props.labels.at(-1) ?? first;
  const add = (): void => {
    props.onAdd({ from: from.trim(), ...(to.trim() === '' ? {} : { to: to.trim() }), reason: reason.trim() });
    setFrom(''); setTo(''); setReason('');
  };
  return (
    <div className="row" data-testid="add-run-range">
      <datalist id={listId}>{props.labels.map((label) => <option key={label} value={label} />)}</datalist>
      <TextField label="From run" value={from} onChange={setFrom} placeholder={first} list={listId} help="The first run left out, its label as the run column writes it." />
      <TextField label="To run" value={to} onChange={setTo} placeholder={last} list={listId} help="The last run left out, included; empty: that one run." />
      <TextField label="Reason" value={reason} onChange={setReason} placeholder="before the retune" help="Shown in the import report." />
      <div className="field button-field"><button onClick={add} disabled={from.trim() === ''} data-testid="add-run-range-button">Leave out these runs</button></div>
    </div>
  );
}
