/**
 * The action-value slice Q(s, ·) at a state set by sliders, with the candidate's action density
 * under it and the quadrature nodes marked: what V^π(s) averages.
 */
import { useMemo, useState } from 'react';
import { ActionSlicePlot } from '../../plots';
import { ProblemList } from '../../components/ProblemList';
import { RichText } from '../../components/RichText';
import { SelectField } from '../../components/SelectField';
import type { Evaluation } from '../../../../pipeline/estimates';
import type { DataImport } from '../../../../shared/workerMessages';
import { useDocument } from '../../hooks';
import type { Theme } from '../../theme';
import { ExportPanel } from './ExportPanel';
import { actionLabel, sliceExplanation, sliceStateLines, valueLabel, valueUnit } from './plotLabels';
import { formatValue } from '../../../../figures/parts/tickFormat';
import { StateSliders } from './StateSliders';
import { useWorkerQuery } from './useWorkerQuery';

const SLICE_POINTS = 161;

export function SlicePanel({ evaluation, imported, theme }: { evaluation: Evaluation; imported: DataImport; theme: Theme }) {
  const doc = useDocument();
  const [candidate, setCandidate] = useState(0);
  const [action, setAction] = useState(0);
  const [state, setState] = useState<number[]>(imported.stateMeans);
  const query = { query: { candidateIndex: candidate, state, actionIndex: action, points: SLICE_POINTS } };
  const answer = useWorkerQuery('slice', query, JSON.stringify(query));
  const policy = evaluation.policies[candidate]?.name ?? '';
  const spec = doc.candidates.find((c) => c.name === policy);
  const limits = spec?.bounds;
  const lo = limits ? limits.lo[action] ?? -Infinity : null, hi = limits ? limits.hi[action] ?? Infinity : null, mode = limits?.mode;
  // One slice object per answer (and limits): a new one on every render would rebuild the chart each time.
  const slice = useMemo(
    () => (answer.status === 'done' ? { ...answer.value, bounds: lo === null || hi === null || !mode ? undefined : { lo, hi, mode } } : null),
    [answer, lo, hi, mode],
  );
  const title = `Action values of ${policy}`;
  const sliceProps = slice ? {
    slice, actionLabel: actionLabel(doc, action), valueLabel: valueLabel(evaluation.valueSense, 'Q', valueUnit(doc)), title, theme,
    subtitle: sliceStateLines(doc, slice.state, formatValue),
  } : null;
  return (
    <>
      <p className="small muted"><RichText text={sliceExplanation(doc.columns.actions.length)} /></p>
      <div className="row">
        <SelectField label="Candidate" value={String(candidate)} onChange={(v) => setCandidate(Number(v))} testId="slice-candidate" className="fit-field"
          options={evaluation.policies.map((p, i) => ({ value: String(i), label: p.name }))} />
        {doc.columns.actions.length > 1 && (
          <SelectField label="Action" value={String(action)} onChange={(v) => setAction(Number(v))}
            options={doc.columns.actions.map((a, i) => ({ value: String(i), label: a.column }))} />
        )}
      </div>
      <StateSliders doc={doc} ranges={imported.stateRanges} values={state} skip={[]} onChange={setState} means={imported.stateMeans} />
      {answer.status === 'failed' && <ProblemList title="The slice could not be drawn" problems={answer.problems} />}
      {sliceProps ? <ActionSlicePlot {...sliceProps} /> : answer.status === 'waiting' && <div className="plot-placeholder">Computing the slice…</div>}
      {sliceProps && (
        <ExportPanel kind="slice" evaluation={evaluation} defaultTitle={title} policy={policy} fileBase={`action-slice-${policy}`}
          makeSpec={(t) => ({ kind: 'slice', props: { ...sliceProps, title: t } })} />
      )}
    </>
  );
}
