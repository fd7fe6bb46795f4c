/**
 * Step 5, the findings: the cautions first, then each candidate's value beside today's with its
 * interval, the comparison, cross-checks, coverage and sensitivity of the assessment, the report,
 * the retune maps (when the project has any),
 * the value surface, the action-value slice and the convergence of each fit, each with its export.
 */
import { Cautions } from '../../components/Cautions';
import { ProblemList } from '../../components/ProblemList';
import { useDocument, useSession, useStale } from '../../hooks';
import { useStore } from '../../state/useStore';
import { themeStore, type Theme } from '../../theme';
import type { AssessmentState } from '../../session/sessionStore';
import { AssessmentPanel } from './AssessmentPanel';
import { ConvergencePanel } from './ConvergencePanel';
import { RetuneMapPanel } from './RetuneMapPanel';
import { SlicePanel } from './SlicePanel';
import { SurfacePanel } from './SurfacePanel';
import { ValueComparison } from './ValueComparison';
import { readableTime } from '../../format/numberFormat';

const same = (t: Theme) => t;

const assessmentOf = (state: AssessmentState, key: string) => (state.status === 'done' && state.runKey === key ? state.assessment : null);

export function FindingsScreen() {
  const session = useSession();
  const stale = useStale();
  const theme = useStore(themeStore, same);
  const record = session.evaluation;
  const imported = session.importState.status === 'done' ? session.importState.result : null;
  const hasMaps = (useDocument().retuneMaps ?? []).length > 0;
  return (
    <>
      <header>
        <h2>Findings</h2>
        <p>What the log says about each candidate. Read the cautions before using any number.</p>
      </header>
      <Cautions />
      {!record && <p className="problems info">No results yet: run the evaluation on the Run step.</p>}
      {record && (
        <>
          {record.restored && (
            <p className={`problems ${!stale ? 'info' : 'warning'}`} role="status" data-testid="kept-results">
              {!stale
                ? `Results kept with the project (run of ${readableTime(record.evaluation.evaluatedAt)}); the data and settings are the same, so no rerun is needed. Run again to explore slices and other surfaces.`
                : `Results kept with the project (run of ${readableTime(record.evaluation.evaluatedAt)}) were computed from other data or settings than the project has now: they are shown for reference only. Run again for current results.`}
            </p>
          )}
          {stale && !record.restored && <p className="problems warning" role="status" data-testid="stale-results">These results come from an earlier run; the settings or the data have changed since. Run again to update them.</p>}
          <ProblemList title="Notes from the evaluation" problems={record.evaluation.warnings.map((w) => ({ where: 'evaluation', message: w }))} tone="warning" />
          <div className="findings-grid" data-testid="findings-grid">
            <ValueComparison evaluation={record.evaluation} theme={theme} assessment={assessmentOf(session.assessment, record.runKey)} />
            <AssessmentPanel record={record} state={session.assessment} stale={stale} imported={imported} theme={theme} />
            {hasMaps && <RetuneMapPanel record={record} state={session.retuneMaps} stale={stale} theme={theme} />}
            {imported && imported.stateNames.length >= 2 && <SurfacePanel evaluation={record.evaluation} imported={imported} theme={theme} restored={Boolean(record.restored)} />}
            {imported && !record.restored && <SlicePanel evaluation={record.evaluation} imported={imported} theme={theme} />}
            <ConvergencePanel evaluation={record.evaluation} theme={theme} />
          </div>
        </>
      )}
    </>
  );
}
