/**
 * What the import made of the file: counts, each used column's range, mean, spread and histogram,
 * the rows left out with their reasons, the importer's warnings and report, or its errors exactly
 * as it words them (file, line, column).
 */
import { ProblemList } from '../../components/ProblemList';
import { Histogram } from '../../components/Histogram';
import { formatNumber } from '../../format/numberFormat';
import { useSession } from '../../hooks';
import type { DataImport } from '../../../../shared/workerMessages';

export function ImportSummary() {
  const state = useSession().importState;
  if (state.status === 'idle') return null;
  if (state.status === 'importing') return <section className="panel" aria-busy="true"><h3>Import</h3><p>Importing…</p></section>;
  if (state.status === 'failed') {
    return (
      <section className="panel" aria-labelledby="import-heading">
        <h3 id="import-heading">Import</h3>
        <ProblemList title="The data could not be imported" problems={state.problems} testId="import-errors" />
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
      <ColumnTable result={result} />
      <ExcludedRows result={result} />
    </section>
  );
}

function Counts({ result }: { result: DataImport }) {
  const s = result.summary;
  const n = (x: number): string => x.toLocaleString('en-US');
  return (
    <dl className="facts" data-testid="import-counts">
      <dt>Rows</dt><dd>{n(s.rowCount)} ({n(s.usedRowCount)} used, {n(s.excludedRowCount)} excluded)</dd>
      <dt>Transitions</dt><dd data-testid="transition-count">{n(s.transitionCount)}</dd>
      <dt>Episodes</dt><dd data-testid="episode-count">{n(s.episodeCount)}</dd>
      {s.samplingPeriodSeconds !== null && <><dt>Sampling period</dt><dd>{formatNumber(s.samplingPeriodSeconds)} s (median)</dd></>}
    </dl>
  );
}

function ColumnTable({ result }: { result: DataImport }) {
  return (
    <div className="table-scroll">
      <table>
        <caption className="sr-only">Statistics of the used columns over the rows kept</caption>
        <thead>
          <tr>
            <th scope="col">Column</th><th scope="col">Role</th><th scope="col" className="number">Min</th><th scope="col" className="number">Max</th>
            <th scope="col" className="number">Mean</th><th scope="col" className="number">Std</th><th scope="col">Histogram</th>
          </tr>
        </thead>
        <tbody>
          {result.summary.columns.map((c) => (
            <tr key={c.name}>
              <th scope="row" className="mono">{c.name}</th>
              <td>{c.roles.join(', ')}</td>
              <td className="number">{formatNumber(c.min)}</td><td className="number">{formatNumber(c.max)}</td>
              <td className="number">{formatNumber(c.mean)}</td><td className="number">{formatNumber(c.std)}</td>
              <td><Histogram histogram={c.histogram} label={c.name} /></td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function ExcludedRows({ result }: { result: DataImport }) {
  const total = result.summary.excludedRowCount;
  if (total === 0) return null;
  return (
    <>
      <h4>Rows left out ({total.toLocaleString('en-US')}{result.excluded.length < total ? `, the first ${result.excluded.length} listed` : ''})</h4>
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
