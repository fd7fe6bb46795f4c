/**
 * What the import made of the file: counts, each used column's unit, range, mean, spread and
 * histogram (times and durations written readably), the rows left out with their reasons, the
 * importer's warnings and report, or its errors exactly as it words them (file, line, column) —
 * with, when rows cannot be used, the one click that imports without them.
 */
import { clockText, durationText } from '../../../../core/clockText';
import { ProblemList } from '../../components/ProblemList';
import { Histogram } from '../../components/Histogram';
import { statisticsText } from './columnStatisticsText';
import { useDocument, useSession } from '../../hooks';
import { useWorkspace } from '../../WorkspaceContext';
import type { DataImport } from '../../../../shared/workerMessages';
import { columnUnits, columnUnitText } from '../../../../pipeline/columnUnitWords';

export function ImportSummary() {
  const state = useSession().importState;
  const doc = useDocument();
  if (state.status === 'idle') return null;
  if (state.status === 'importing') return <section className="panel" aria-busy="true"><h3>Import</h3><p>Importing…</p></section>;
  if (state.status === 'failed') {
    return (
      <section className="panel" aria-labelledby="import-heading">
        <h3 id="import-heading">Import</h3>
        <ProblemList title="The data could not be imported" problems={state.problems} testId="import-errors" />
        <LeaveOutBadRows problems={state.problems} />
      </section>
    );
  }
  const { result } = state;
  return (
    <section className="panel" aria-labelledby="import-heading" data-testid="import-summary">
      <h3 id="import-heading">Import</h3>
      <Counts result={result} />
      <ProblemList title="Warnings" problems={result.warnings} tone="warning" testId="import-warnings" />
      {result.episodeReport.length > 0 && <ul className="small muted">{result.episodeReport.map((line) => <li key={line}>{line}</li>)}</ul>}
      <ColumnTable result={result} units={columnUnits(doc)} />
      <ExcludedRows result={result} />
    </section>
  );
}

/** When the import stopped on rows that cannot be used: import without them in one click (undoable). */
function LeaveOutBadRows({ problems }: { problems: readonly { kind?: string; rows?: number }[] }) {
  const { documents } = useWorkspace();
  const hint = problems.find((p) => p.kind === 'bad-rows');
  if (!hint?.rows) return null;
  const leaveOut = (): void => documents.edit('leave out the rows that cannot be used', (d) => ({ ...d, data: { ...d.data, csv: { ...d.data.csv, badRows: 'exclude' } } }));
  return (
    <button onClick={leaveOut} data-testid="leave-out-bad-rows">
      Leave out the {hint.rows.toLocaleString('en-US')} row{hint.rows === 1 ? '' : 's'} that cannot be used
    </button>
  );
}

/** Rows left out in time windows (counted per window), in runs left out (counted per range) and rows that cannot be used (listed). */
function windowRows(result: DataImport): number {
  return result.timeWindows.reduce((sum, w) => sum + w.rows, 0);
}

function runRows(result: DataImport): number {
  return result.runsLeftOut.reduce((sum, r) => sum + r.rows, 0);
}

function Counts({ result }: { result: DataImport }) {
  const s = result.summary;
  const n = (x: number): string => x.toLocaleString('en-US');
  const inWindows = windowRows(result), inRuns = runRows(result), bad = s.excludedRowCount - inWindows - inRuns;
  const parts = [
    inRuns > 0 ? `${n(inRuns)} in runs left out` : '', inWindows > 0 ? `${n(inWindows)} in time windows left out` : '', bad > 0 ? `${n(bad)} that cannot be used` : '',
  ].filter(Boolean);
  const used = parts.length === 0 ? 'all used' : `${n(s.usedRowCount)} used; left out: ${parts.join(', ')}`;
  return (
    <dl className="facts" data-testid="import-counts">
      <dt>Rows</dt><dd data-testid="row-counts">{n(s.rowCount)} ({used})</dd>
      <dt>Transitions</dt><dd data-testid="transition-count">{n(s.transitionCount)}</dd>
      <dt>Runs</dt><dd data-testid="episode-count">{n(s.episodeCount)}</dd>
      {s.samplingPeriodSeconds !== null && <><dt>Sampling period</dt><dd data-testid="sampling-period">{durationText(s.samplingPeriodSeconds)} (median)</dd></>}
      {result.clock && <><dt>Time span</dt><dd>{clockText(result.clock.firstSeconds, result.clock.calendar)} to {clockText(result.clock.lastSeconds, result.clock.calendar)} ({durationText(result.clock.lastSeconds - result.clock.firstSeconds)})</dd></>}
    </dl>
  );
}


/** A timestamp column's statistics are times (min, max, mean) and a duration (spread); others are numbers. */
function statistics(c: DataImport['summary']['columns'][number], result: DataImport): string[] {
  if (!c.roles.includes('timestamp')) return statisticsText(c.min, c.max, c.mean, c.std);
  const calendar = result.clock?.calendar ?? false;
  return [clockText(c.min, calendar), clockText(c.max, calendar), clockText(c.mean, calendar), durationText(c.std)];
}

function ColumnTable({ result, units }: { result: DataImport; units: ReadonlyMap<string, string> }) {
  return (
    <div className="table-scroll">
      <table>
        <caption className="sr-only">Statistics of the used columns over the rows kept</caption>
        <thead>
          <tr>
            <th scope="col">Column</th><th scope="col">Role</th><th scope="col">Unit</th><th scope="col" className="number">Min</th><th scope="col" className="number">Max</th>
            <th scope="col" className="number">Mean</th><th scope="col" className="number">Std dev</th><th scope="col">Histogram</th>
          </tr>
        </thead>
        <tbody>
          {result.summary.columns.map((c) => (
            <tr key={c.name}>
              <th scope="row" className="mono">{c.name}</th>
              <td>{c.roles.join(', ')}</td>
              <td data-testid={`stat-unit-${c.name}`}>{c.roles.includes('timestamp') ? (result.clock?.calendar ? 'date and time' : 's') : columnUnitText(c.roles, units.get(c.name))}</td>
              {statistics(c, result).map((text, k) => <td key={k} className="number">{text}</td>)}
              <td><Histogram histogram={c.histogram} label={c.name} /></td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function ExcludedRows({ result }: { result: DataImport }) {
  const total = result.summary.excludedRowCount - windowRows(result) - runRows(result);
  if (total === 0) return null;
  return (
    <>
      <h4>Rows that cannot be used, left out ({total.toLocaleString('en-US')}{result.excluded.length < total ? `, the first ${result.excluded.length} listed` : ''})</h4>
      <div className="table-scroll">
        <table data-testid="excluded-rows">
          <thead><tr><th scope="col" className="number">Line</th><th scope="col">Column</th><th scope="col">Reason</th></tr></thead>
          <tbody>
            {result.excluded.map((row) => (
              <tr key={row.line}><td className="number">{row.line}</td><td className="mono">{row.column ?? '—'}</td><td>{row.reason}</td></tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
