/**
 * Each candidate's policy value beside the present controller's (its model, evaluated the same way:
 * the baseline) and the logged return as a check: the comparison
 * chart, and a table with J, its standard error over start states, the fixed-point J, and how
 * the fit went; once the assessment is in, the bootstrap interval of each (percentile, the basic
 * interval in its tooltip).
 */
import { useMemo } from 'react';
import { COMPARATOR_DEGREE } from '../../../../core/fqe/comparatorDegree';
import { FIT_STATUS_WORDS } from '../../../../core/fqe/fitStatus';
import type { Assessment, IntervalEstimate } from '../../../../pipeline/assessment';
import { PolicyValueChart } from '../../plots';
import { VALUES_CHART_TITLE } from '../../../../figures/parts/plotTheme';
import type { Evaluation } from '../../../../pipeline/estimates';
import { plural, screenMessage, sentence } from '../../format/numberFormat';
import { useDocument } from '../../hooks';
import { valueUnit } from './plotLabels';
import { valueColumnHead, valueSenseSentence } from '../../../../pipeline/valueUnitWords';
import type { Theme } from '../../theme';
import { intervalDetail, levelText } from './assessmentWords';
import { ExportPanel } from './ExportPanel';
import { CopyTable } from '../../components/CopyTable';
import { FoldPanel } from './FoldPanel';
import { loggedReturnRole, TRUNCATION_NOTICE, truncationMatters } from '../../../../core/loggedReturn';
import { lawFittedOnMovingRows } from '../../../../pipeline/heldActionsCheck';
import { heldRowsLeftOutText } from '../../../../core/diagnostics/heldActionsFinding';
import { shareText } from '../../../../core/shareText';
import { intervalAtPrecision, valueAtPrecision, valueWithError } from '../../../../figures/parts/uncertainNumber';
import { BASELINE_RANGE_READING } from '../../../../pipeline/baselineClassWarning';


/**
 * Where a fit's own account goes: the Fit column already says "converged (347 iterations)", so for a
 * converged fit the account (the last change against the tolerance) is a detail, beside the backend;
 * a fit that stopped at its limit or diverged keeps it in the row, where the reader must see why.
 */
function fitDetail(status: string): boolean {
  return status === 'converged';
}

function IntervalCell({ estimate, level, testId }: { estimate: IntervalEstimate | undefined; level: number; testId: string }) {
  const p = estimate?.percentile ?? null;
  return (
    <td className="number interval" data-testid={testId} data-lo={p ? String(p[0]) : undefined} data-hi={p ? String(p[1]) : undefined}
      title={estimate ? intervalDetail(estimate, level) : 'no resamples for this policy'}>{intervalAtPrecision(p)}</td>
  );
}

export function ValueComparison({ evaluation, theme, assessment }: { evaluation: Evaluation; theme: Theme; assessment?: Assessment | null }) {
  const doc = useDocument();
  const unit = valueUnit(doc);
  const level = assessment?.settings.level ?? 0;
  const sense = valueSenseSentence(evaluation.valueSense, unit);
  const b = evaluation.behaviour, pc = evaluation.presentController;
  // The completed logged return has a row only where the value past the runs' ends weighs enough to be said (core/loggedReturn.ts).
  const completed = truncationMatters(b);
  const endsWeigh = pc && !completed && b.meanTruncationWeight > 0
    ? ` (the value past those ends weighs ${shareText(b.meanTruncationWeight)} of the return on average, under the ${shareText(TRUNCATION_NOTICE)} from which a completed row is shown)` : '';
  // With intervals computed, every J here is written at its interval's decimal place, as the answer table writes it.
  const presentInterval = assessment?.presentController?.policyValue.percentile ?? null;
  const completedInterval = assessment?.presentController?.completedReturn.percentile ?? null, loggedInterval = assessment?.behaviour.percentile ?? null;
  const presentClasses = assessment?.presentController?.functionClasses ?? null;
  const chartIntervals = useMemo(() => (assessment
    ? [...evaluation.policies.map((_, i) => assessment.candidates[i]?.policyValue.percentile ?? null), pc ? presentInterval : loggedInterval] : undefined),
  [assessment, evaluation, pc, presentInterval, loggedInterval]);
  return (
    <FoldPanel section="values" span="span-2" testId="panel-values" gist={`J of ${plural(evaluation.policies.length, 'candidate')} beside the baseline: chart, table and how each fit went.`}>
      <p className="small muted">{sense}. ± is one standard error over the start states only; it does not cover the error of the fit (the interval does, once computed).</p>
      <PolicyValueChart evaluation={evaluation} theme={theme} unit={unit} intervals={chartIntervals} />
      <table data-testid="value-table">
        <thead>
          <tr>
            <th scope="col">Policy</th><th scope="col" className="number">{valueColumnHead('J', unit)}</th><th scope="col" className="number">± s.e.</th>
            {assessment && <th scope="col" className="number" title="Percentile bootstrap interval over runs; hover a cell for the basic interval">{levelText(level)} interval</th>}
            <th scope="col" className="number" title="J from solving the fit’s fixed-point equations directly (LSTD-Q), as a check on the iterated fit">J by direct solve</th><th scope="col">Fit</th><th scope="col">How the fit went</th>
          </tr>
        </thead>
        <tbody>
          {evaluation.policies.map((p, i) => {
            const interval = assessment?.candidates[i]?.policyValue.percentile ?? null, shown = valueWithError(p.policyValue, p.standardError, interval);
            return (
              <tr key={p.name} data-testid={`value-row-${i}`}>
                <th scope="row">{p.name}</th>
                <td className="number" data-testid={`policy-value-${i}`} data-value={String(p.policyValue)}>{shown.value}</td>
                <td className="number">{shown.error}</td>
                {assessment && <IntervalCell estimate={assessment.candidates[i]?.policyValue} level={level} testId={`policy-interval-${i}`} />}
                <td className="number">{p.fixedPointValue === null ? '—' : valueWithError(p.fixedPointValue, p.standardError, interval).value}</td>
                <td>{FIT_STATUS_WORDS[p.status]} ({plural(p.iterations, 'iteration')})</td>
                <td className="small" data-testid={`policy-account-${i}`}>{!fitDetail(p.status) && sentence(screenMessage(p.message))}
                  {p.network && (
                    <span data-testid={`network-check-${i}`} className={p.network.agreement.verdict === 'disagree' ? 'error-text' : undefined}>
                      {/* With the assessment in, the interval column holds the network's interval (on the assessment's resamples); not a second one here. */}
                      {' '}{assessment ? '' : `${levelText(p.network.level)} interval ${intervalAtPrecision(p.network.interval)}; `}degree-{COMPARATOR_DEGREE} linear {valueAtPrecision(p.network.linear.value, p.network.linear.interval)} {intervalAtPrecision(p.network.linear.interval)}. {sentence(p.network.agreement.message)}
                    </span>
                  )}
                  <details className="details-section"><summary>Details</summary>{fitDetail(p.status) && <>{sentence(screenMessage(p.message))} </>}Computed by {p.backend}; {plural(p.featureCount, 'fitted weight')}.</details></td>
              </tr>
            );
          })}
          {pc && (
            <tr data-testid="value-row-present">
              <th scope="row">Present controller <span className="small muted">(baseline)</span></th>
              <td className="number" data-testid="present-value" data-value={String(pc.estimate.policyValue)}>{valueWithError(pc.estimate.policyValue, pc.estimate.standardError, presentInterval).value}</td>
              <td className="number">{valueWithError(pc.estimate.policyValue, pc.estimate.standardError, presentInterval).error}</td>
              {assessment && <IntervalCell estimate={assessment.presentController?.policyValue} level={level} testId="present-interval" />}
              <td className="number">{pc.estimate.fixedPointValue === null ? '—' : valueWithError(pc.estimate.fixedPointValue, pc.estimate.standardError, presentInterval).value}</td>
              <td>{FIT_STATUS_WORDS[pc.estimate.status]} ({plural(pc.estimate.iterations, 'iteration')})</td>
              <td className="small">The controller that ran while the log was recorded, as fitted to the log{heldRowsLeftOutText(pc.model.heldRowsLeftOut)} (gain, offset, dither, the actuator limits seen) and evaluated like the candidates: every candidate is compared with it.
                {/* Where its function classes disagree, the range and how every difference then reads, in short: the reason of
                    the verdict is under Cross-checks, as for a candidate, and in the whole-log caution (saved before: nothing). */}
                {presentClasses && !presentClasses.settled && (
                  <p data-testid="present-range-reading"><strong>Not settled across function classes</strong> (range to report {intervalAtPrecision(assessment?.presentController?.reportedRange ?? null)}; why: under Cross-checks). {BASELINE_RANGE_READING}</p>
                )}</td>
            </tr>
          )}
          {pc && completed && (
            <tr data-testid="value-row-completed">
              <th scope="row">Logged return, completed <span className="small muted">(check)</span></th>
              <td className="number" data-value={String(pc.completedReturn.value)}>{valueWithError(pc.completedReturn.value, pc.completedReturn.standardError, completedInterval).value}</td>
              <td className="number">{valueWithError(pc.completedReturn.value, pc.completedReturn.standardError, completedInterval).error}</td>
              {assessment && <IntervalCell estimate={assessment.presentController?.completedReturn} level={level} testId="completed-interval" />}
              <td className="number">—</td>
              <td>{plural(b.episodes, 'run')}</td>
              <td className="small">The logged return with the value past each time-limited run end added from the present controller’s fit.</td>
            </tr>
          )}
          <tr data-testid="value-row-behaviour">
            <th scope="row">Logged return <span className="small muted">({pc ? loggedReturnRole(false, lawFittedOnMovingRows(assessment?.heldActions)) : 'baseline'})</span></th>
            <td className="number" data-testid="behaviour-value" data-value={String(b.value)}>{valueWithError(b.value, b.standardError, loggedInterval).value}</td>
            <td className="number">{valueWithError(b.value, b.standardError, loggedInterval).error}</td>
            {assessment && <IntervalCell estimate={assessment.behaviour} level={level} testId="behaviour-interval" />}
            <td className="number">—</td>
            <td>{plural(b.episodes, 'run')}</td>
            <td className="small">The discounted {evaluation.valueSense} actually logged, averaged over the runs; cut short where a run ends on a time limit{endsWeigh}{pc ? '' : ` (no model of the present controller: ${evaluation.presentControllerReason})`}.</td>
          </tr>
        </tbody>
      </table>
      <CopyTable tableTestId="value-table" fileBase="candidate-values" />
      <ExportPanel kind="comparison" evaluation={evaluation} defaultTitle={VALUES_CHART_TITLE} policy={evaluation.policies.map((p) => p.name).join(', ')}
        fileBase="candidate-values" makeSpec={(title) => ({ kind: 'comparison', props: { evaluation, theme, title, unit, intervals: chartIntervals } })} />
    </FoldPanel>
  );
}
