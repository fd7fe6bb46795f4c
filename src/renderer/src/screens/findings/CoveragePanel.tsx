/**
 * Whether each candidate stays where the logs can speak for it, and what every check found. At the
 * top, the findings matrix (pipeline/findingMatrix.ts): which check is serious for which policy, at a
 * glance. Below it, the same rows as groups of sentences laid out by pipeline/findingLines.ts: the
 * whole log (with the unvisited share, plant memory and run order), then what is said in the same
 * words of several candidates, once, naming them, then each candidate with its coverage figures on one
 * line (occupancy shift, importance weights, action support; the sentences behind it), then the present
 * controller where it has findings. Serious findings are always in view in an open group; a group's
 * cautions fold behind one line where it also holds a serious one. A policy's group is open when it
 * holds a serious finding, folded to its count otherwise, until the reader opens or folds it
 * (remembered per project with the sections, foldMemory.ts).
 */
import { useCallback } from 'react';
import type { Assessment, CoverageDiagnostics } from '../../../../pipeline/assessment';
import { findingAnchor, findingMatrix, type FindingRow } from '../../../../pipeline/findingMatrix';
import { findingLines, groupCountText, sharedCountOf, type FindingLine } from '../../../../pipeline/findingLines';
import { plantMemorySentence } from '../../../../pipeline/plantMemoryWords';
import { runOrderSentence } from '../../../../pipeline/runOrderWords';
import { coverageLine, coverageSentences, unvisitedSentence } from './assessmentWords';
import { OwnFindings, SharedFindings } from './FindingSentences';
import { FindingTable } from './FindingTable';
import { FoldPanel } from './FoldPanel';
import { groupFoldId, setOpen } from './foldMemory';
import { useFold, useGroupFold, useProjectKey } from './useFold';

export function CoveragePanel({ assessment }: { assessment: Assessment }) {
  const unvisited = unvisitedSentence(assessment.unvisitedShare, assessment.warnings), memory = plantMemorySentence(assessment.plantMemory);
  const order = runOrderSentence(assessment.runOrder);
  const matrix = findingMatrix(assessment), lines = findingLines(matrix);
  const [log, ...policies] = matrix.rows;
  const key = useProjectKey();
  // Two columns for the matrix while open; folded, its one line of gist keeps one column, so the default page is laid out as before.
  const [panelOpen] = useFold('coverage');
  const jump = useCallback((row: FindingRow, index: number) => {
    if (row.kind !== 'log') setOpen(key, [groupFoldId('coverage', groupOf(row))], true);
    requestAnimationFrame(() => { // after React has opened the group
      const target = document.getElementById(findingAnchor(row, index));
      openAround(target);
      target?.scrollIntoView({ block: 'center' });
      target?.focus({ preventScroll: true });
    });
  }, [key]);
  return (
    <FoldPanel section="coverage" span={panelOpen ? 'span-2' : undefined} testId="coverage" gist={coverageGist(assessment)}>
      <FindingTable matrix={matrix} onJump={jump} />
      <div className="finding-group" data-testid="coverage-log">
        <h4>{log.label}</h4>
        <OwnFindings lines={lines.own[0]} testId="assessment-warnings" />
        {unvisited && <p>{unvisited}</p>}
        {memory && <p data-testid="plant-memory">{memory}</p>}
        {order && <p data-testid="run-order">{order}</p>}
      </div>
      <SharedFindings lines={lines.shared} />
      {policies.map((row, k) => <PolicyGroup key={row.key} row={row} own={lines.own[k + 1]} shared={sharedCountOf(lines, row)} assessment={assessment} />)}
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

/** Open every closed disclosure around a sentence a mark links to (its group's cautions), so the focus lands on something in view. */
function openAround(target: HTMLElement | null): void {
  for (let d = target?.closest('details:not([open])'); d; d = d.parentElement?.closest('details:not([open])')) (d as HTMLDetailsElement).open = true;
}

interface GroupProps {
  row: FindingRow;
  /** The row's own lines (pipeline/findingLines.ts) and how many of its findings are said with other candidates'. */
  own: readonly FindingLine[];
  shared: number;
  assessment: Assessment;
}

/** A candidate's or the present controller's findings and figures: open where it holds a serious finding until the reader chooses (kept per project, foldMemory.ts). */
function PolicyGroup({ row, own, shared, assessment }: GroupProps) {
  const [open, setOpenHere] = useGroupFold('coverage', groupOf(row), row.serious > 0);
  const i = row.candidateIndex, candidate = i === null ? null : assessment.candidates[i];
  return (
    <details className="finding-group" open={open} data-testid={candidate ? `coverage-${i}` : 'coverage-present'}
      onToggle={(e) => { if (e.currentTarget.open !== open) setOpenHere(e.currentTarget.open); }}>
      <summary><strong>{row.label}</strong> <span className={row.serious ? 'finding-count serious' : 'finding-count'}>— {groupCountText(row, shared)}</span></summary>
      <OwnFindings lines={own} testId={candidate ? `candidate-warnings-${i}` : 'present-controller-warnings'} />
      {candidate && <CoverageFigures diagnostics={candidate.diagnostics} />}
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

/** A candidate's coverage figures on one line, the sentences that explain them behind it. */
function CoverageFigures({ diagnostics }: { diagnostics: CoverageDiagnostics }) {
  return (
    <details className="coverage-figures">
      <summary>{coverageLine(diagnostics)}</summary>
      <ul>{coverageSentences(diagnostics).map((s) => <li key={s}>{s}</li>)}</ul>
    </details>
  );
}
