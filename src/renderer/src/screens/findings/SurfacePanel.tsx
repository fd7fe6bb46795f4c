/**
 * The value surface V^π over two state axes the user picks, the other states held by sliders. The
 * worker recomputes it from the candidate's retained fit; the chosen axes are kept in the project.
 */
import { useMemo, useState } from 'react';
import { ValueSurfacePlot } from '../../plots';
import { surfaceCsv } from '../../export';
import { ProblemList } from '../../components/ProblemList';
import { RichText } from '../../components/RichText';
import { SelectField } from '../../components/SelectField';
import type { Evaluation } from '../../../../pipeline/estimates';
import type { DataImport } from '../../../../shared/workerMessages';
import { formatNumber } from '../../format/numberFormat';
import { useDocument } from '../../hooks';
import type { Theme } from '../../theme';
import { useWorkspace } from '../../WorkspaceContext';
import { ExportPanel } from './ExportPanel';
import { heldLabel, stateLabel, valueLabel, valueUnit } from './plotLabels';
import { StateSliders } from './StateSliders';
import { useWorkerQuery } from './useWorkerQuery';

const RESOLUTIONS = ['30', '60', '100'] as const;

export function SurfacePanel({ evaluation, imported, theme, restored = false }: { evaluation: Evaluation; imported: DataImport; theme: Theme; restored?: boolean }) {
  const { documents } = useWorkspace();
  const doc = useDocument();
  const names = doc.columns.states.map((s) => s.column);
  const [candidate, setCandidate] = useState(0);
  const [held, setHeld] = useState<number[]>(imported.stateMeans);
  const xAxis = Math.max(0, names.indexOf(doc.surface?.xState ?? names[0]));
  const yAxis = Math.max(0, names.indexOf(doc.surface?.yState ?? names[1]));
  const resolution = doc.surface?.resolution ?? 60;
  const setSurface = (x: number, y: number, r: number): void =>
    documents.edit('choose the surface axes', (d) => ({ ...d, surface: { xState: names[x], yState: names[y], resolution: r } }));
  const query = xAxis !== yAxis && !restored ? { query: { candidateIndex: candidate, xAxis, yAxis, heldState: held, resolution } } : null;
  const asked = useWorkerQuery('surface', query, JSON.stringify(query));
  // Results read back from the project have the run's own surface, but no fitted model to ask for another.
  const kept = restored ? evaluation.policies[candidate]?.surface ?? null : null;
  const state = restored ? (kept ? { status: 'done' as const, value: kept } : { status: 'failed' as const, problems: [{ where: 'surface', message: 'no surface was kept with these results' }] }) : asked;
  const policy = evaluation.policies[candidate]?.name ?? '';
  const title = `Value surface of ${policy}`;
  const held_ = useMemo(() => heldLabel(doc, held, [xAxis, yAxis], (v) => formatNumber(v)), [doc, held, xAxis, yAxis]);
  const options = names.map((n, i) => ({ value: String(i), label: n }));
  const surfaceProps = state.status === 'done' ? {
    surface: state.value, xLabel: stateLabel(doc, xAxis), yLabel: stateLabel(doc, yAxis), valueLabel: valueLabel(evaluation.valueSense, 'V', valueUnit(doc)), title, theme,
    heldLabel: held_ || undefined,
  } : null;
  return (
    <>
      <p className="small muted"><RichText text="V^{π}(s) over two states; hatched cells are where the logs never went, so V there is extrapolated." /></p>
      <div className="row">
        <SelectField label="Candidate" value={String(candidate)} onChange={(v) => setCandidate(Number(v))} testId="surface-candidate" className="fit-field"
          options={evaluation.policies.map((p, i) => ({ value: String(i), label: p.name }))} />
        <SelectField label="Horizontal axis" value={String(xAxis)} options={options} testId="surface-x" onChange={(v) => setSurface(Number(v), Number(v) === yAxis ? xAxis : yAxis, resolution)} />
        <SelectField label="Vertical axis" value={String(yAxis)} options={options} testId="surface-y" onChange={(v) => setSurface(Number(v) === xAxis ? yAxis : xAxis, Number(v), resolution)} />
        <SelectField label="Grid" value={String(resolution)} options={[...new Set([...RESOLUTIONS, String(resolution)])].map((r) => ({ value: r, label: `${r} × ${r}` }))}
          onChange={(v) => setSurface(xAxis, yAxis, Number(v))} />
      </div>
      {restored
        ? <p className="small muted" data-testid="surface-kept">The surface kept with the results (axes and held states of that run). The fitted models are not kept in the project: run again to choose other axes or move the sliders.</p>
        : <StateSliders doc={doc} ranges={imported.stateRanges} values={held} skip={[xAxis, yAxis]} onChange={setHeld} means={imported.stateMeans} />}
      {state.status === 'failed' && <ProblemList title="The surface could not be drawn" problems={state.problems} />}
      {surfaceProps ? <ValueSurfacePlot {...surfaceProps} /> : state.status === 'waiting' && <div className="plot-placeholder">Computing the surface…</div>}
      {surfaceProps && (
        <ExportPanel kind="surface" evaluation={evaluation} defaultTitle={title} policy={policy} fileBase={`value-surface-${policy}`}
          makeSpec={(t) => ({ kind: 'surface', props: { ...surfaceProps, title: t } })}
          csv={() => surfaceCsv(surfaceProps.surface, surfaceProps.valueLabel)} />
      )}
    </>
  );
}
