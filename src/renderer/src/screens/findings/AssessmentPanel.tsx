/**
 * The assessment of the last run on the findings screen: its progress and Cancel while it runs
 * (it starts by itself after every run), then the comparison, the cross-checks, the coverage
 * diagnostics and the sensitivity sweep (the report panel follows at the end of the screen). It runs in the worker, so the screen stays live.
 */
import { ProblemList } from '../../components/ProblemList';
import { useDocument } from '../../hooks';
import type { AssessmentState, EvaluationRecord } from '../../session/sessionStore';
import type { Theme } from '../../theme';
import { useWorkspace } from '../../WorkspaceContext';
import { assessmentFraction, progressLine } from './assessmentWords';
import { ComparisonTable } from './ComparisonTable';
import { CoveragePanel } from './CoveragePanel';
import { CrossChecksPanel } from './CrossChecksPanel';
import { SensitivityPanel } from './SensitivityPanel';

interface Props {
  record: EvaluationRecord;
  state: AssessmentState;
  stale: boolean;
  theme: Theme;
}

export function AssessmentPanel({ record, state, stale, theme }: Props) {
  const current = state.status !== 'idle' && state.runKey === record.runKey ? state : null;
  const done = current?.status === 'done' ? current.assessment : null;
  return (
    <>
      {!stale && <AssessmentStatus record={record} state={current} />}
      {done && (
        <>
          <ComparisonTable assessment={done} />
          <CrossChecksPanel assessment={done} />
          <CoveragePanel assessment={done} />
          {done.sensitivity && <SensitivityPanel sensitivity={done.sensitivity} evaluation={record.evaluation} theme={theme} />}
        </>
      )}
    </>
  );
}

function AssessmentStatus({ record, state }: { record: EvaluationRecord; state: AssessmentState | null }) {
  const { assessor } = useWorkspace();
  const doc = useDocument();
  const compute = () => void assessor.assess(doc, record.runKey);
  if (state?.status === 'done') return null;
  return (
    <section className="panel" aria-labelledby="assessment-heading" data-testid="assessment-status">
      <h3 id="assessment-heading">Intervals and checks</h3>
      {state?.status === 'running' ? (
        <>
          <div className="progress" role="progressbar" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(assessmentFraction(state.progress) * 100)} aria-label="Assessment progress">
            <div style={{ width: `${assessmentFraction(state.progress) * 100}%` }} />
          </div>
          <p aria-live="polite" data-testid="assessment-progress">{progressLine(state.progress)}</p>
          <button onClick={assessor.cancel} data-testid="cancel-assessment">Cancel</button>
        </>
      ) : (
        <>
          {state?.status === 'cancelled' && (
            <p className="problems warning" role="status" data-testid="assessment-cancelled">
              The assessment was cancelled; no intervals were kept.
              {doc.approximator.kind === 'network' && ' Stopping it restarted the worker that held the network fits, so the surface and slice plots need a new run before they can be redrawn.'}
            </p>
          )}
          {state?.status === 'failed' && <ProblemList title="The intervals and checks could not be computed" problems={state.problems} testId="assessment-problems" />}
          <p className="small muted">Bootstrap intervals over runs, cross-checks by other estimators, coverage diagnostics and the sensitivity to the settings.</p>
          <button onClick={compute} data-testid="compute-assessment">Compute intervals and checks</button>
        </>
      )}
    </section>
  );
}

