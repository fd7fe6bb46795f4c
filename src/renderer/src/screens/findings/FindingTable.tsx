/**
 * The findings matrix at the top of the Coverage panel (pipeline/findingMatrix.ts): a row per policy
 * and the whole log, a column per kind of finding that occurs, each cell "serious", "caution" or "—"
 * in words (the colour only repeats them), linked to its sentence below. A column's short title sits
 * on one line; its meaning is the header's tooltip and its description for a screen reader.
 */
import type { MouseEvent } from 'react';
import { FINDING_MATRIX_CAPTION, cellLabel, cellText, findingAnchor, type FindingMatrix, type FindingRow } from '../../../../pipeline/findingMatrix';

interface Props {
  matrix: FindingMatrix;
  /** Open the row's group and bring its n-th sentence into view. */
  onJump: (row: FindingRow, index: number) => void;
}

export function FindingTable({ matrix, onJump }: Props) {
  if (matrix.columns.length === 0) return <p data-testid="finding-table-none">No check raised a warning or a caution.</p>;
  const follow = (row: FindingRow, index: number) => (event: MouseEvent<HTMLAnchorElement>) => {
    event.preventDefault();
    onJump(row, index);
  };
  return (
    <div className="finding-table-wrap">
      <table className="finding-table" data-testid="finding-table">
        <caption>{FINDING_MATRIX_CAPTION}</caption>
        <thead>
          <tr>
            <td />
            {matrix.columns.map((c) => <th key={c.key} scope="col" title={c.meaning} aria-description={c.meaning} data-column={c.key}>{c.title}</th>)}
          </tr>
        </thead>
        <tbody>
          {matrix.rows.map((row, r) => (
            <tr key={row.key} data-testid={`finding-row-${row.key}`}>
              <th scope="row">{row.label}</th>
              {matrix.cells[r].map((cell, c) => (
                <td key={matrix.columns[c].key} className={cell.severity ? `finding-cell ${cell.severity}` : 'finding-cell none'}>
                  {cell.severity
                    ? <a href={`#${findingAnchor(row, cell.first)}`} aria-label={cellLabel(row, matrix.columns[c], cell)} onClick={follow(row, cell.first)}>{cellText(cell)}{cell.count > 1 ? ` (${cell.count})` : ''}</a>
                    : cellText(cell)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
