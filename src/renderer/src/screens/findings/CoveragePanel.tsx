/**
 * Whether each candidate stays where the logs can speak for it, and what every check found. At the
 * top, the findings matrix (pipeline/findingMatrix.ts): which check is serious for which policy, at a
 * glance. Below it, the same rows as groups of sentences, serious first: the whole log (with the
 * unvisited share, plant memory and run order), then each candidate with its coverage figures
 * (occupancy shift, importance weights, action support), then the present controller where it has
 * findings. A policy's group is open when it holds a serious finding, folded to its count otherwise,
 * until the reader opens or folds it (remembered per project with the sections, foldMemory.ts).
 */
import { useCallback } from 'react';
import type { Assessment, AssessmentWarning } from '../../../../pipeline/assessment';
import { findingAnchor, findingCountText, findingMatrix, type FindingRow } from '../../../../pipeline/findingMatrix';
import { plantMemorySentence } from '../../../../pipeline/plantMemoryWords';
import { runOrderSentence } from '../../../../pipeline/runOrderWords';
import { coverageSentences, typesetMinus, unvisitedSentence } from './assessmentWords';
import { FindingTable } from './FindingTable';
import { FoldPanel } from './FoldPanel';
import { groupFoldId, setOpen } from './foldMemory';
import { useFold, useGroupFold, useProjectKey } from './useFold';

export function CoveragePanel({ assessment }: { assessment: Assessment }) {
  const unvisited = unvisitedSentence(assessment.unvisitedShare, assessment.warnings), memory = plantMemorySentence(assessment.plantMemory);
  const order = runOrderSentence(assessment.runOrder);
  const matrix = findingMatrix(assessment);
  const [log, ...policies] = matrix.rows;
  const key = useProjectKey();
  // Two columns for the matrix while open; folded, its one line of gist keeps one column, so the default page is laid out as before.
  const [panelOpen] = useFold('coverage');
  const jump = useCallback((row: FindingRow, index: number) => {
    if (row.kind !== 'log') setOpen(key, [groupFoldId('coverage', groupOf(row))], true);
    requestAnimationFrame(() => { // after React has opened the group
      const target = document.getElementById(findingAnchor(row, index));
      target?.scrollIntoView({ block: 'center' });
      target?.focus({ preventScroll: true });
    });
  }, [key]);
  return (
    <FoldPanel section="coverage" span={panelOpen ? 'span-2' : undefined} testId="coverage" gist={coverageGist(assessment)}>
      <FindingTable matrix={matrix} onJump={jump} />
      <div className="finding-group" data-testid="coverage-log">
        <h4>{log.label}</h4>
        <Findings row={log} testId="assessment-warnings" />
        {unvisited && <p>{unvisited}</p>}
        {memory && <p data-testid="plant-memory">{memory}</p>}
        {order && <p data-testid="run-order">{order}</p>}
      </div>
      {policies.map((row) => <PolicyGroup key={row.key} row={row} assessment={assessment} />)}
      <details>
        <summary>How these were computed</summary>
        <ul className="small">{assessment.method.map((m) => <li key={m}>{m}</li>)}</ul>
      </details>
    </FoldPanel>
  );
}

/**
 * A policy's group's name in the fold memory: a candidate by its name (its place can change), the present controller by its row;
 * with "|serious" while it holds a serious finding, so a group the reader folded while it held only cautions opens again when a
 * run brings a serious one (a choice made about cautions is not a choice about a serious finding), and one folded while serious stays folded.
 */
const groupOf = (row: FindingRow): string => `${row.kind === 'candidate' ? `candidate:${row.label}` : row.key}${row.serious > 0 ? '|serious' : ''}`;

/** A candidate's or the present controller's findings and figures: open where it holds a serious finding until the reader chooses (kept per project, foldMemory.ts). */
function PolicyGroup({ row, assessment }: { row: FindingRow; assessment: Assessment }) {
  const [open, setOpenHere] = useGroupFold('coverage', groupOf(row), row.serious > 0);
  const i = row.candidateIndex, candidate = i === null ? null : assessment.candidates[i];
  return (
    <details className="finding-group" open={open} data-testid={candidate ? `coverage-${i}` : 'coverage-present'}
      onToggle={(e) => { if (e.currentTarget.open !== open) setOpenHere(e.currentTarget.open); }}>
      <summary><strong>{row.label}</strong> <span className={row.serious ? 'finding-count serious' : 'finding-count'}>— {findingCountText(row)}</span></summary>
      <Findings row={row} testId={candidate ? `candidate-warnings-${i}` : 'present-controller-warnings'} />
      {candidate && <ul>{coverageSentences(candidate.diagnostics).map((s) => <li key={s}>{s}</li>)}</ul>}
    </details>
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

/** A row's findings, serious first, each with the anchor its cell links to. */
function Findings({ row, testId }: { row: FindingRow; testId: string }) {
  if (row.findings.length === 0) return null;
  return (
    <div className={`problems ${row.serious ? 'error' : 'warning'}`} role="status" data-testid={testId}>
      <ul>
        {row.findings.map((w, n) => <FindingItem key={`${w.topic}|${w.message}`} id={findingAnchor(row, n)} warning={w} />)}
      </ul>
    </div>
  );
}

function FindingItem({ id, warning }: { id: string; warning: AssessmentWarning }) {
  return <li id={id} tabIndex={-1}><strong>{warning.severity === 'serious' ? 'Serious' : 'Caution'}:</strong> {typesetMinus(warning.message)}</li>;
}
