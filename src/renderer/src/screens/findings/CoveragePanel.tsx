/**
 * Whether each candidate stays where the logs can speak for it: occupancy shift, the
 * importance weights' effective size, action probability outside the logged range, the unvisited
 * share of the state grid, and the warnings these raise, as sentences.
 */
import type { Assessment, AssessmentWarning } from '../../../../pipeline/assessment';
import { plantMemorySentence } from '../../../../pipeline/plantMemoryWords';
import { runOrderSentence } from '../../../../pipeline/runOrderWords';
import { coverageSentences, typesetMinus, unvisitedSentence } from './assessmentWords';
import { FoldPanel } from './FoldPanel';

export function CoveragePanel({ assessment }: { assessment: Assessment }) {
  const unvisited = unvisitedSentence(assessment.unvisitedShare, assessment.warnings), memory = plantMemorySentence(assessment.plantMemory);
  const order = runOrderSentence(assessment.runOrder);
  return (
    <FoldPanel section="coverage" testId="coverage" gist={coverageGist(assessment)}>
      <Warnings warnings={assessment.warnings} testId="assessment-warnings" />
      {unvisited && <p>{unvisited}</p>}
      {memory && <p data-testid="plant-memory">{memory}</p>}
      {order && <p data-testid="run-order">{order}</p>}
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
    </FoldPanel>
  );
}

/** "2 serious warnings, 5 cautions over 3 candidates": what the folded panel holds. */
export function coverageGist(assessment: Assessment): string {
  const all = [...assessment.warnings, ...assessment.candidates.flatMap((c) => c.warnings)];
  const serious = all.filter((w) => w.severity === 'serious').length, cautions = all.length - serious;
  if (all.length === 0) return 'No warnings: occupancy shift, importance weights and action support per candidate.';
  const parts = [serious ? `${serious} serious warning${serious === 1 ? '' : 's'}` : '', cautions ? `${cautions} caution${cautions === 1 ? '' : 's'}` : ''].filter(Boolean);
  return `${parts.join(' and ')}: occupancy shift, importance weights and action support per candidate.`;
}

function Warnings({ warnings, testId }: { warnings: AssessmentWarning[]; testId: string }) {
  if (warnings.length === 0) return null;
  return (
    <div className={`problems ${warnings.some((w) => w.severity === 'serious') ? 'error' : 'warning'}`} role="status" data-testid={testId}>
      <ul>
        {warnings.map((w) => <li key={`${w.topic}|${w.message}`}><strong>{w.severity === 'serious' ? 'Serious' : 'Caution'}:</strong> {typesetMinus(w.message)}</li>)}
      </ul>
    </div>
  );
}
