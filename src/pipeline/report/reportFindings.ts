/**
 * The report's warnings under Diagnostics, as the app's Coverage panel shows them: the findings matrix
 * (findingMatrix.ts) first, each mark linked to its sentence, then the sentences grouped by the same
 * rows, serious first. Every warning appears once; a printed page keeps them all in view.
 */
import type { Assessment } from '../assessment';
import { FINDING_MATRIX_CAPTION, cellLabel, cellText, findingAnchor, findingCountText, findingMatrix, type FindingMatrix, type FindingRow } from '../findingMatrix';
import { typesetText } from '../../core/typesetText';
import { html, type Html } from './htmlText';

export function findingsHtml(a: Pick<Assessment, 'warnings' | 'candidates'>): Html {
  const matrix = findingMatrix(a);
  if (matrix.columns.length === 0) return html`<p>None.</p>`;
  return html`${matrixTable(matrix)}${matrix.rows.filter((r) => r.findings.length).map(rowList)}`;
}

function matrixTable(m: FindingMatrix): Html {
  return html`<table class="finding-table"><caption>${FINDING_MATRIX_CAPTION}</caption>
    <thead><tr><td></td>${m.columns.map((c) => html`<th scope="col" title="${c.meaning}">${c.title}</th>`)}</tr></thead><tbody>
    ${m.rows.map((row, r) => html`<tr><th scope="row">${row.label}</th>${m.cells[r].map((cell, c) => (cell.severity
    ? html`<td class="finding-cell ${cell.severity}"><a href="#${findingAnchor(row, cell.first)}" aria-label="${cellLabel(row, m.columns[c], cell)}">${cellText(cell)}${cell.count > 1 ? ` (${cell.count})` : ''}</a></td>`
    : html`<td class="finding-cell none">${cellText(cell)}</td>`))}</tr>`)}
    </tbody></table>`;
}

function rowList(row: FindingRow): Html {
  return html`<h4>${row.label} — ${findingCountText(row)}</h4><ul>${row.findings.map((w, n) => html`<li id="${findingAnchor(row, n)}" class="warning ${w.severity}"><strong>${w.severity === 'serious' ? 'Serious' : 'Caution'}:</strong> ${typesetText(w.message)}</li>`)}</ul>`;
}
