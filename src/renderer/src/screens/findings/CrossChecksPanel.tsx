/**
 * Each candidate's value by independent methods — weighted importance sampling, weighted doubly
 * robust, rollouts of a fitted plant model, the linear-quadratic model — with its interval, its
 * verdict against fitted Q-evaluation and the assumption it rests on; the headline those verdicts
 * give (confirmed, contradicted, unconfirmed); and the candidate in other function classes with the
 * range to report when they disagree.
 */
import { CopyTable } from '../../components/CopyTable';
import { FoldPanel } from './FoldPanel';
import type { Assessment } from '../../../../pipeline/assessment';
import { intervalDetail, levelText, noteWithoutVerdict, typesetMinus, VERDICT } from './assessmentWords';
import { ClassesVerdict } from './ClassesVerdict';
import { intervalAtPrecision, valueAtPrecision, valueInInterval } from '../../../../figures/parts/uncertainNumber';

export function CrossChecksPanel({ assessment }: { assessment: Assessment }) {
  const level = assessment.settings.level, present = assessment.presentController;
  return (
    <FoldPanel section="crossChecks" span="span-2" testId="cross-checks" gist={assessment.candidates.map((c) => `${c.name}: ${c.confirmation.status}`).join('; ')}>
      <p className="small muted">Each method rests on a different assumption; agreement between them is evidence, disagreement is a reason to look closer.</p>
      {assessment.candidates.map((c) => (
        <div key={c.name}>
        <p data-testid={`confirmation-${c.name}`} className={c.confirmation.status === 'contradicted' ? 'error-text' : undefined}>
          <strong>{c.name}:</strong> {c.confirmation.text}
        </p>
        {c.functionClasses && (
          <p className="small" data-testid={`classes-${c.name}`}>
            <ClassesVerdict classes={c.functionClasses} reportedRange={c.reportedRange} reasonTestId={`classes-reason-${c.name}`} />
          </p>
        )}
        {c.rangeCut && <p className="small" data-testid={`range-cut-${c.name}`}>{typesetMinus(c.rangeCut)}</p>}
        <table data-testid={`cross-checks-${c.name}`}>
          <caption>{c.name}: fitted Q-evaluation J = {valueInInterval(c.policyValue.value, c.policyValue.percentile).text}</caption>
          <thead>
            <tr>
              <th scope="col">Method</th><th scope="col" className="number">Value</th><th scope="col" className="number">{levelText(level)} interval</th>
              <th scope="col">Verdict</th>
            </tr>
          </thead>
          <tbody>
            {c.crossChecks.map((x) => (
              <tr key={x.method} data-testid={`cross-check-${x.method}`}>
                <th scope="row">{x.label}</th>
                {/* A check without an interval (the model rollouts) at the decimals of the column’s J, not four significant digits ("5.737" among "5.61"). */}
                <td className="number">{x.estimate ? valueAtPrecision(x.estimate.value, x.estimate.percentile ?? c.policyValue.percentile) : '—'}</td>
                <td className="number interval" title={x.estimate ? intervalDetail(x.estimate, level) : undefined}>{x.estimate ? intervalAtPrecision(x.estimate.percentile) : '—'}</td>
                <td data-testid="verdict" className={x.agreement === 'disagrees' ? 'error-text' : undefined}>{VERDICT[x.agreement]}.{x.note ? <span className="small muted"> {typesetMinus(noteWithoutVerdict(x.note))}</span> : null}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <CopyTable tableTestId={`cross-checks-${c.name}`} fileBase={`cross-checks-${c.name.replace(/[^\w-]+/g, '-').toLowerCase()}`} />
        </div>
      ))}
      {/* The baseline's J across the function classes, as a candidate's (an assessment saved before it had them: nothing). */}
      {present?.functionClasses && (
        <p className="small" data-testid="classes-present">
          <strong>{present.name}:</strong> <ClassesVerdict classes={present.functionClasses} reportedRange={present.reportedRange ?? null} reasonTestId="classes-reason-present" />
        </p>
      )}
      <details data-testid="cross-check-assumptions">
        <summary>What each method rests on</summary>
        <dl className="small">
          {(assessment.candidates[0]?.crossChecks ?? []).map((x) => <div key={x.method}><dt>{x.label}</dt><dd>{x.assumption}</dd></div>)}
        </dl>
      </details>
    </FoldPanel>
  );
}
