/**
 * The project's retune maps on the findings screen (only when the project has any): computed on
 * request in the worker over the kept run, with progress and Cancel; then the map as a figure (a
 * heat map over two parameters or a curve over one), the headline, the notes, the value of every
 * point and the export. Parameters are named in the trade's words (the map's axis labels).
 */
import { useMemo, useState } from 'react';
import type { RetuneMapResult } from '../../../../pipeline/retuneMaps';
import type { PlotSpec } from '../../../../figures/writers/plotSpec';
import { ProblemList } from '../../components/ProblemList';
import { RichText } from '../../components/RichText';
import { SelectField } from '../../components/SelectField';
import { useDocument } from '../../hooks';
import { PlotFigure } from '../../plots/PlotFigure';
import type { EvaluationRecord, RetuneMapState } from '../../session/sessionStore';
import type { Theme } from '../../theme';
import { useWorkspace } from '../../WorkspaceContext';
import { ExportPanel } from './ExportPanel';
import { policyValueLabel, valueUnit } from './plotLabels';
import { RetuneMapTable } from './RetuneMapTable';
import { headline, mapFraction, mapName, mapProgressLine, richAxisLabel } from './retuneMapWords';

interface Props {
  record: EvaluationRecord;
  state: RetuneMapState;
  stale: boolean;
  theme: Theme;
}

export function RetuneMapPanel({ record, state, stale, theme }: Props) {
  const current = state.status !== 'idle' && state.runKey === record.runKey ? state : null;
  return (
    <>
      <p className="small muted">
        J over a grid of retunes of one candidate, each point a full estimate with its interval, shaded where the logs no longer support it.
        A map takes seconds to a minute.
      </p>
      {current?.status === 'done' && record.restored && <KeptMapNote stale={stale} />}
      {current?.status === 'done'
        ? <MapResults maps={current.maps} record={record} theme={theme} />
        : <MapStatus record={record} state={current} stale={stale} />}
    </>
  );
}

/** Maps read back from the project file: current when the data and settings are the ones they were computed from. */
function KeptMapNote({ stale }: { stale: boolean }) {
  return (
    <p className={`problems ${stale ? 'warning' : 'info'}`} role="status" data-testid="kept-retune-map">
      {stale
        ? 'Out of date: this map was kept with the project but computed from other data or settings than the project has now (a changed candidate, map or data file). It is shown for reference only; run the evaluation again and compute the map for current values.'
        : 'Map kept with the project from the last run; the data and settings are the same, so it needs no recomputing.'}
    </p>
  );
}

function MapStatus({ record, state, stale }: { record: EvaluationRecord; state: RetuneMapState | null; stale: boolean }) {
  const { mapper } = useWorkspace();
  const doc = useDocument();
  if (state?.status === 'running') {
    return (
      <>
        <div className="progress" role="progressbar" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(mapFraction(state.progress) * 100)} aria-label="Retune map progress">
          <div style={{ width: `${mapFraction(state.progress) * 100}%` }} />
        </div>
        <p aria-live="polite" data-testid="retune-map-progress">{mapProgressLine(state.progress)}</p>
        <button onClick={mapper.cancel} data-testid="cancel-retune-map">Cancel</button>
        {!mapper.stopKeepsRun && <p className="small muted">Cancelling restarts the worker here: the evaluation must then be run again.</p>}
      </>
    );
  }
  const blocked = record.restored ? 'The results kept with the project hold no fitted models: run the evaluation again to compute the map.'
    : stale ? 'The project changed since the last run: run the evaluation again to compute the map.' : null;
  return (
    <>
      {state?.status === 'cancelled' && <p className="problems warning" role="status" data-testid="retune-map-cancelled">The map was cancelled; no points were kept.</p>}
      {state?.status === 'failed' && <ProblemList title="The retune map could not be computed" problems={state.problems} testId="retune-map-problems" />}
      {blocked && <p className="small">{blocked}</p>}
      <button onClick={() => void mapper.compute(doc, record.runKey)} disabled={blocked !== null} data-testid="compute-retune-map">Compute the retune map</button>
    </>
  );
}

function MapResults({ maps, record, theme }: { maps: RetuneMapResult[]; record: EvaluationRecord; theme: Theme }) {
  const doc = useDocument();
  const [index, setIndex] = useState(0);
  const map = maps[index] ?? maps[0];
  const sense = record.evaluation.valueSense;
  const valueLabel = policyValueLabel(sense, valueUnit(doc));
  const title = `Retune map: ${map?.candidate ?? ''}`;
  const shown = useMemo(() => map && { ...map, axes: map.axes.map((a) => ({ ...a, label: richAxisLabel(a.label) })) }, [map]);
  const spec = useMemo<PlotSpec | null>(() => (shown ? { kind: 'retuneMap', props: { map: shown, valueLabel, sense, title, theme } } : null), [shown, valueLabel, sense, title, theme]);
  if (!map || !spec || !shown) return <p className="small">The project has no retune map.</p>;
  return (
    <>
      {maps.length > 1 && (
        <div className="row">
          <SelectField label="Map" value={String(index)} onChange={(v) => setIndex(Number(v))} testId="retune-map-choice"
            options={maps.map((m, i) => ({ value: String(i), label: mapName(m) }))} />
        </div>
      )}
      <p data-testid="retune-map-headline"><strong><RichText text={richAxisLabel(headline(map))} /></strong></p>
      <PlotFigure spec={spec} keyColumns={map.axes.length === 2 ? map.axes[0].values.length : undefined} testId="plot-retuneMap" />
      <ul className="small muted" data-testid="retune-map-notes">
        <li>{`Features: ${map.features}.`}</li>
        {map.notes.map((n) => <li key={n}>{n}</li>)}
      </ul>
      <RetuneMapTable map={map} testId="retune-map-table" unit={valueUnit(doc)} />
      <ExportPanel kind="retuneMap" evaluation={record.evaluation} defaultTitle={title} policy={map.candidate}
        fileBase={`retune-map-${map.candidate.replace(/[^\w-]+/g, '-').replace(/^-|-$/g, '').toLowerCase() || 'map'}`}
        makeSpec={(t) => ({ kind: 'retuneMap', props: { map: shown, valueLabel, sense, title: t, theme } })} />
    </>
  );
}
