/**
 * Whether each candidate stays where the logs can speak for it: occupancy shift, the
 * importance weights' effective size, action probability outside the logged range, the unvisited
 * share of the state grid, and the warnings these raise, as sentences.
 */
import type { Assessment, AssessmentWarning } from '../../../../pipeline/assessment';
import { coverageSentences, unvisitedSentence } from './assessmentWords';

export function CoveragePanel({ assessment }: { assessment: Assessment }) {
  const unvisited = unvisitedSentence(assessment.unvisitedShare);
  return (
    <section className="panel" aria-labelledby="coverage-heading" data-testid="coverage">
      <h3 id="coverage-heading">Coverage of the logs</h3>
      <Warnings warnings={assessment.warnings} testId="assessment-warnings" />
      {unvisited && <p>{unvisited}</p>}
      {assessment.candidates.map((c, i) => (
        <div key={c.name} data-testid={`coverage-${i}`}>
          <h4>{c.name}</h4>
          <Warnings warnings={c.warnings} testId={`candidate-warnings-${i}`} />
          <ul>{coverageSentences(c.diagnostics).map((s) => <li key={s}>{s}</li>)}</ul>
        </div>
      ))}
      <details>
        <summary>How these were computed</summary>
        <ul className="small">{assessment.method.map((m) => <li key={m}>{m}</li>)}</ul>
      </details>
    </section>
  );
}

function Warnings({ warnings, testId }: { warnings: AssessmentWarning[]; testId: string }) {
  if (warnings.length === 0) return null;
  return (
    <div className={`problems ${warnings.some((w) => w.severity === 'serious') ? 'error' : 'warning'}`} role="status" data-testid={testId}>
      <ul>
        {warnings.map((w) => <li key={`${w.topic}|${w.message}`}><strong>{w.severity === 'serious' ? 'Serious' : 'Caution'}:</strong> {w.message}</li>)}
      </ul>
    </div>
  );
}
