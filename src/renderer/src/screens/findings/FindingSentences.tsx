/**
 * The sentences under the findings matrix on the Coverage panel, laid out by pipeline/findingLines.ts
 * (the report's writer lays out the same lines): a group's own findings, serious ones always in view
 * and its cautions folded behind one line where the group also holds a serious one, and the findings
 * said alike of several candidates, once, each candidate's name the anchor its matrix mark goes to.
 */
import type { FindingLine } from '../../../../pipeline/findingLines';
import { SEVERITY_WORD, SHARED_LINES_HEADING, cautionsSummaryText, nameJoint, type FindingPlace } from '../../../../pipeline/findingLines';
import { findingAnchor } from '../../../../pipeline/findingMatrix';
import { typesetMinus } from './assessmentWords';

/** A group's own findings: serious first and always in view; its cautions behind one line when a serious one is with them. */
export function OwnFindings({ lines, testId }: { lines: readonly FindingLine[]; testId: string }) {
  if (lines.length === 0) return null;
  const serious = lines.filter((l) => l.severity === 'serious'), cautions = lines.filter((l) => l.severity !== 'serious');
  const fold = serious.length > 0 && cautions.length > 0;
  return (
    <div className={`problems ${serious.length ? 'error' : 'warning'}`} role="status" data-testid={testId}>
      <ul>{(fold ? serious : lines).map((l) => <OwnItem key={anchorOf(l.places[0])} line={l} />)}</ul>
      {fold && (
        <details className="finding-cautions" data-testid={`${testId}-cautions`}>
          <summary>{cautionsSummaryText(cautions)}</summary>
          <ul>{cautions.map((l) => <OwnItem key={anchorOf(l.places[0])} line={l} />)}</ul>
        </details>
      )}
    </div>
  );
}

const anchorOf = (p: FindingPlace): string => findingAnchor(p.row, p.index);

function OwnItem({ line }: { line: FindingLine }) {
  return <li id={anchorOf(line.places[0])} tabIndex={-1}><strong>{SEVERITY_WORD[line.severity]}:</strong> {typesetMinus(line.message)}</li>;
}

/** The findings said in the same words of two or more candidates, each once, naming them. */
export function SharedFindings({ lines }: { lines: readonly FindingLine[] }) {
  if (lines.length === 0) return null;
  return (
    <div className="finding-group" data-testid="coverage-shared">
      <h4>{SHARED_LINES_HEADING}</h4>
      <div className={`problems ${lines.some((l) => l.severity === 'serious') ? 'error' : 'warning'}`} role="status">
        <ul>
          {lines.map((l) => (
            <li key={anchorOf(l.places[0])}>
              <strong>{SEVERITY_WORD[l.severity]}</strong> for {l.places.map((p, k) => (
                // A mark's jump lands on the name; the finding's words describe it, so a screen reader reads the sentence too.
                <span key={anchorOf(p)}>{nameJoint(k, l.places.length)}<span id={anchorOf(p)} tabIndex={-1} aria-describedby={`words-${anchorOf(l.places[0])}`}>{p.row.label}</span></span>
              ))}: <span id={`words-${anchorOf(l.places[0])}`}>{typesetMinus(l.message)}</span>
            </li>
          ))}
        </ul>
      </div>
    </div>
  );
}
