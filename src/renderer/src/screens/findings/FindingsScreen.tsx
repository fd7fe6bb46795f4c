/**
 * Step 5, the findings, read the way a control engineer reads them: the cautions, then the answer
 * (which candidate to trial, J of each with its interval against today's controller, what the checks
 * say), then the evidence in sections the reader can fold — values, retune map, paired comparison,
 * cross-checks, coverage, sensitivity, value surface, action values, convergence, report — with a
 * section index that stays in view. Which sections are open is remembered per project for the
 * session (foldMemory.ts); the evidence starts folded (findingsSections.ts).
 */
import { Cautions } from '../../components/Cautions';
import { RichText } from '../../components/RichText';
import { ProblemList } from '../../components/ProblemList';
import { useDocument, useSession, useStale } from '../../hooks';
import { useStore } from '../../state/useStore';
import { themeStore, type Theme } from '../../theme';
import type { AssessmentState, EvaluationRecord } from '../../session/sessionStore';
import type { DataImport } from '../../../../shared/workerMessages';
import type { Assessment } from '../../../../pipeline/assessment';
import { AnswerPanel } from './AnswerPanel';
import { AssessmentPanel } from './AssessmentPanel';
import { ConvergencePanel } from './ConvergencePanel';
import type { SectionId } from './findingsSections';
import { FoldPanel } from './FoldPanel';
import { ReportButton } from './ReportButton';
import { RetuneMapPanel } from './RetuneMapPanel';
import { SectionIndex } from './SectionIndex';
import { SlicePanel } from './SlicePanel';
import { SurfacePanel } from './SurfacePanel';
import { ValueComparison } from './ValueComparison';
import { readableTime } from '../../format/numberFormat';

const same = (t: Theme) => t;

const assessmentOf = (state: AssessmentState, key: string) => (state.status === 'done' && state.runKey === key ? state.assessment : null);

export function FindingsScreen() {
  const session = useSession();
  const stale = useStale();
  const record = session.evaluation;
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
          <FindingsSections record={record} assessment={assessmentOf(session.assessment, record.runKey)} stale={stale} />
        </>
      )}
    </>
  );
}

/** Which sections this run has, in reading order. */
function presentSections(record: EvaluationRecord, assessment: Assessment | null, imported: DataImport | null, hasMaps: boolean, stale: boolean): SectionId[] {
  const ids: SectionId[] = ['answer', 'values'];
  if (hasMaps) ids.push('retuneMap');
  if (assessment) ids.push('comparison', 'crossChecks', 'coverage');
  if (assessment?.sensitivity) ids.push('sensitivity');
  if (imported && imported.stateNames.length >= 2) ids.push('surface');
  if (imported && !record.restored) ids.push('slice');
  ids.push('convergence');
  if (imported && !stale) ids.push('report');
  return ids;
}

function FindingsSections({ record, assessment, stale }: { record: EvaluationRecord; assessment: Assessment | null; stale: boolean }) {
  const session = useSession();
  const theme = useStore(themeStore, same);
  const imported = session.importState.status === 'done' ? session.importState.result : null;
  const hasMaps = (useDocument().retuneMaps ?? []).length > 0;
  const present = presentSections(record, assessment, imported, hasMaps, stale);
  const serious = assessment ? [...assessment.warnings, ...assessment.candidates.flatMap((c) => c.warnings)].filter((w) => w.severity === 'serious').length : 0;
  const current = session.assessment.status !== 'idle' && session.assessment.runKey === record.runKey ? session.assessment : null;
  return (
    <>
      <SectionIndex present={present} notes={serious ? { coverage: `${serious} serious` } : {}} />
      <div className="findings-grid" data-testid="findings-grid">
        <AnswerPanel evaluation={record.evaluation} assessment={assessment} />
        <ValueComparison evaluation={record.evaluation} theme={theme} assessment={assessment} />
        {hasMaps && (
          <FoldPanel section="retuneMap" span="span-2" testId="retune-map" gist="J over a grid of retunes of one candidate, shaded where the logs no longer support it.">
            <RetuneMapPanel record={record} state={session.retuneMaps} stale={stale} theme={theme} />
          </FoldPanel>
        )}
        <AssessmentPanel record={record} state={session.assessment} stale={stale} theme={theme} />
        {present.includes('surface') && imported && (
          <FoldPanel section="surface" span="span-2" testId="panel-surface" gist={<RichText text="V^{π}(s) of a candidate over two states you choose; cells the logs never visited are hatched." />}>
            <SurfacePanel evaluation={record.evaluation} imported={imported} theme={theme} restored={Boolean(record.restored)} />
          </FoldPanel>
        )}
        {present.includes('slice') && imported && (
          <FoldPanel section="slice" testId="panel-slice" gist={<RichText text="Q^{π}(s, ·) of a candidate at a state set by sliders, with its action density: what V^{π}(s) averages." />}>
            <SlicePanel evaluation={record.evaluation} imported={imported} theme={theme} />
          </FoldPanel>
        )}
        <ConvergencePanel evaluation={record.evaluation} theme={theme} />
        {present.includes('report') && (
          <FoldPanel section="report" testId="panel-report" gist="The job, the data, the settings, the findings and the cautions in one document: HTML, PDF or print.">
            <ReportButton state={current} />
          </FoldPanel>
        )}
      </div>
    </>
  );
}
