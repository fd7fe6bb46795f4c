/**
 * The answer first: which candidate to take to a plant trial (by the rule in pipeline/trialChoice.ts, stated
 * beside it), each candidate's J with its interval and unit against today's controller, how often
 * it came out better, what the cross-checks and the coverage warnings say, and where to read more.
 * Before the intervals and checks are in, J ± s.e. only, and no candidate is named.
 */
import type { Assessment } from '../../../../pipeline/assessment';
import type { Evaluation } from '../../../../pipeline/estimates';
import { useDocument } from '../../hooks';
import { levelText, sharesText } from './assessmentWords';
import { FoldPanel } from './FoldPanel';
import type { SectionId } from './findingsSections';
import { columnName, displayName, valueUnit } from './plotLabels';
import { LOGGED_RETURN, PRESENT_CONTROLLER } from '../../../../figures/parts/plotTheme';
import { sweepsVerdict } from '../../../../figures/charts/sensitivity';
import { TRIAL_RULE, trialAnswer, trialChoice, warningsText, type TrialChoice } from '../../../../pipeline/trialChoice';
import { jumpToSection, useProjectKey } from './useFold';
import { valueColumnHead, valueSenseSentence } from '../../../../pipeline/valueUnitWords';
import { intervalAtPrecision, valueAtPrecision, valueInInterval, valueWithError } from '../../../../figures/parts/uncertainNumber';

const CONFIRMATION: Record<string, string> = { confirmed: 'confirmed', contradicted: 'contradicted', unconfirmed: 'unconfirmed' };

/** Where the app shows what the answer points to. */
const APP_PLACES = { cautions: 'above', warnings: 'under Coverage' } as const;

function Lead({ choice, assessment, unit }: { choice: TrialChoice; assessment: Assessment; unit: string }) {
  const answer = trialAnswer(assessment, choice, APP_PLACES, unit);
  if (!answer) return null;
  return (
    <p className="answer-lead" data-testid="answer-lead">
      <strong>{answer.headline}</strong>{answer.detail && ` ${answer.detail}`}
      {answer.logCautions && <span data-testid="answer-log-cautions"> {answer.logCautions}</span>}
    </p>
  );
}

function JumpLink({ section, children }: { section: SectionId; children: string }) {
  const key = useProjectKey();
  return <button type="button" className="link" onClick={() => jumpToSection(key, section)}>{children}</button>;
}

function AssessedTable({ choice, assessment, evaluation, unit }: { choice: TrialChoice; assessment: Assessment; evaluation: Evaluation; unit: string }) {
  const level = levelText(assessment.settings.level), base = assessment.presentController?.policyValue ?? assessment.behaviour;
  const baseName = displayName(assessment.comparison.baseline.name);
  // "Better in", down the column at one precision (core/shareText.ts, sharesText).
  const betterIn = sharesText(choice.lines.map((l) => l.difference?.probabilityBetter ?? null));
  return (
    <table className="answer-table" data-testid="answer-table">
      <thead>
        <tr>
          <th scope="col">Policy</th><th scope="col" className="number">{valueColumnHead('J', unit)}</th><th scope="col" className="number">{level} interval</th>
          <th scope="col" className="number">Minus baseline</th><th scope="col" className="number">Better in</th><th scope="col">Cross-checks</th><th scope="col">Warnings</th>
        </tr>
      </thead>
      <tbody>
        {choice.lines.map((l, i) => (
          <tr key={l.candidate.name} className={l === choice.pick ? 'answer-pick' : undefined} data-testid={`answer-row-${evaluation.policies.findIndex((p) => p.name === l.candidate.name)}`}>
            <th scope="row">{columnName(l.candidate.name)}</th>
            <td className="number">{valueAtPrecision(l.candidate.policyValue.value, l.candidate.policyValue.percentile)}</td>
            <td className="number interval">
              {intervalAtPrecision(l.candidate.policyValue.percentile)}
              {/* Not settled: the sampling interval alone understates the error; the number to carry forward is the range across classes. */}
              {l.candidate.settled === false && l.candidate.reportedRange && <div className="small" data-testid="answer-range-to-report">range to report {intervalAtPrecision(l.candidate.reportedRange)}</div>}
            </td>
            <td className="number interval">{l.difference ? valueInInterval(l.difference.difference.value, l.difference.difference.percentile).text : '—'}</td>
            <td className="number">{betterIn[i]}</td>
            <td className={l.candidate.confirmation.status === 'contradicted' ? 'error-text' : undefined}>{CONFIRMATION[l.candidate.confirmation.status]}</td>
            <td className={l.serious || l.logSerious ? 'error-text' : undefined}>{warningsText(l)}</td>
          </tr>
        ))}
        <tr data-testid="answer-row-baseline">
          <th scope="row">{baseName} <span className="small muted">(baseline)</span></th>
          <td className="number">{valueAtPrecision(base.value, base.percentile)}</td><td className="number interval">{intervalAtPrecision(base.percentile)}</td>
          <td className="number">—</td><td className="number">—</td><td /><td />
        </tr>
      </tbody>
    </table>
  );
}

function PointTable({ evaluation, unit }: { evaluation: Evaluation; unit: string }) {
  const pc = evaluation.presentController;
  const rows = [...evaluation.policies.map((p) => ({ name: p.name, value: p.policyValue, se: p.standardError })),
    pc ? { name: `${PRESENT_CONTROLLER} (baseline)`, value: pc.estimate.policyValue, se: pc.estimate.standardError } : { name: `${LOGGED_RETURN} (baseline)`, value: evaluation.behaviour.value, se: evaluation.behaviour.standardError }];
  return (
    <table className="answer-table" data-testid="answer-table">
      <thead><tr><th scope="col">Policy</th><th scope="col" className="number">{valueColumnHead('J', unit)}</th><th scope="col" className="number">± s.e.</th></tr></thead>
      <tbody>{rows.map((r) => <tr key={r.name}><th scope="row">{r.name}</th><td className="number">{valueWithError(r.value, r.se).value}</td><td className="number">{valueWithError(r.value, r.se).error}</td></tr>)}</tbody>
    </table>
  );
}

export function AnswerPanel({ evaluation, assessment }: { evaluation: Evaluation; assessment: Assessment | null }) {
  const unit = valueUnit(useDocument());
  const choice = assessment ? trialChoice(assessment) : null;
  const sense = `${valueSenseSentence(evaluation.valueSense, unit)}.`;
  const gist = choice ? (choice.pick ? `Trial first: ${choice.pick.candidate.name}.` : 'No candidate is named for a trial.') : 'Waiting for the intervals and checks.';
  return (
    <FoldPanel section="answer" span="span-2" testId="panel-answer" gist={gist}>
      {assessment && choice ? <Lead choice={choice} assessment={assessment} unit={unit} />
        : <p className="answer-lead" data-testid="answer-lead"><strong>Intervals and checks are not in yet:</strong> J ± one standard error over the start states only; no candidate is named until they are.</p>}
      {assessment && choice ? <AssessedTable choice={choice} assessment={assessment} evaluation={evaluation} unit={unit} /> : <PointTable evaluation={evaluation} unit={unit} />}
      <p className="small muted">{sense}{assessment ? ` Baseline: ${displayName(assessment.comparison.baseline.name)}; “minus baseline” (its ${levelText(assessment.settings.level)} interval in brackets) and “better in” come from the same ${assessment.settings.resamples.toLocaleString('en-US')} paired resamples of the logged runs.` : ''}</p>
      {assessment && <p className="small muted" data-testid="answer-rule">{TRIAL_RULE}</p>}
      {assessment && (
        <p className="small answer-more" data-testid="answer-more">
          Read more: <JumpLink section="comparison">paired comparison</JumpLink> · <JumpLink section="crossChecks">cross-checks</JumpLink> · <JumpLink section="coverage">coverage and warnings</JumpLink>
          {/* After a dash, not in parentheses: the verdict has its own where some J are crossed, and "(… (…))" read badly. */}
          {assessment.sensitivity && <> · <JumpLink section="sensitivity">sensitivity</JumpLink> — {sweepsVerdict(assessment.sensitivity.curves)}</>}
        </p>
      )}
    </FoldPanel>
  );
}
