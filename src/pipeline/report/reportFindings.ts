/**
 * The report's warnings under Diagnostics, as the app's Coverage panel shows them: the findings matrix
 * (findingMatrix.ts) first, each mark linked to its sentence, then the sentences grouped by the same
 * rows, serious first, with a finding said in the same words of several candidates said once, naming
 * them (findingLines.ts). Every warning appears once; a printed page keeps them all in view, so the
 * report folds nothing.
 */
import type { Assessment } from '../assessment';
import { FINDING_MATRIX_CAPTION, cellLabel, cellText, findingAnchor, findingMatrix, type FindingMatrix, type FindingRow } from '../findingMatrix';
import { SEVERITY_WORD, SHARED_LINES_HEADING, findingLines, groupCountText, nameJoint, sharedCountOf, type FindingLine, type FindingLines, type FindingPlace } from '../findingLines';
import { typesetText } from '../../core/typesetText';
import { html, type Html } from './htmlText';

export function findingsHtml(a: Pick<Assessment, 'warnings' | 'candidates'>): Html {
  const matrix = findingMatrix(a);
  if (matrix.columns.length === 0) return html`<p>None.</p>`;
  const lines = findingLines(matrix);
  const groups = matrix.rows.map((row, r) => (row.findings.length ? rowList(row, lines.own[r], sharedCountOf(lines, row)) : html``));
  return html`${matrixTable(matrix)}${groups[0]}${sharedList(lines)}${groups.slice(1)}`;
}

function matrixTable(m: FindingMatrix): Html {
  return html`<table class="finding-table"><caption>${FINDING_MATRIX_CAPTION}</caption>
    <thead><tr><td></td>${m.columns.map((c) => html`<th scope="col" title="${c.meaning}" aria-description="${c.meaning}">${c.title}</th>`)}</tr></thead><tbody>
    ${m.rows.map((row, r) => html`<tr><th scope="row">${row.label}</th>${m.cells[r].map((cell, c) => (cell.severity
    ? html`<td class="finding-cell ${cell.severity}"><a href="#${findingAnchor(row, cell.first)}" aria-label="${cellLabel(row, m.columns[c], cell)}">${cellText(cell)}${cell.count > 1 ? ` (${cell.count})` : ''}</a></td>`
    : html`<td class="finding-cell none">${cellText(cell)}</td>`))}</tr>`)}
    </tbody></table>`;
}

function rowList(row: FindingRow, own: readonly FindingLine[], shared: number): Html {
  return html`<h4>${row.label} — ${groupCountText(row, shared)}</h4>${own.length ? html`<ul>${own.map(ownItem)}</ul>` : null}`;
}

function ownItem(line: FindingLine): Html {
  const { row, index } = line.places[0];
  return html`<li id="${findingAnchor(row, index)}" class="warning ${line.severity}"><strong>${SEVERITY_WORD[line.severity]}:</strong> ${typesetText(line.message)}</li>`;
}

function sharedList(lines: FindingLines): Html | null {
  if (lines.shared.length === 0) return null;
  return html`<h4>${SHARED_LINES_HEADING}</h4><ul>${lines.shared.map((line) => html`<li class="warning ${line.severity}"><strong>${SEVERITY_WORD[line.severity]}</strong> for ${names(line.places)}: ${typesetText(line.message)}</li>`)}</ul>`;
}

/** The candidates a shared line names, each name the anchor its matrix mark goes to. */
function names(places: readonly FindingPlace[]): Html[] {
  return places.map((p, k) => html`${nameJoint(k, places.length)}<span id="${findingAnchor(p.row, p.index)}">${p.row.label}</span>`);
}
