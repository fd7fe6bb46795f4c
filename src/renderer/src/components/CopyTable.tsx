/**
 * "Copy table" and "Save as CSV…" under a results table: the table's cells as shown, tab-separated
 * for the clipboard (a spreadsheet pastes them into cells) or as RFC 4180 CSV in a file. The copy
 * goes through the document's copy event, which needs no clipboard permission (the app grants none).
 */
import { useState } from 'react';
import { tableCells, toCsv, toTabSeparated } from './tableText';
import { useWorkspace } from '../WorkspaceContext';
import { fileNameText } from '../../../shared/fileNameText';

export function CopyTable({ tableTestId, fileBase }: { tableTestId: string; fileBase: string }) {
  const { api } = useWorkspace();
  const [status, setStatus] = useState('');
  const cells = (): string[][] => {
    const table = document.querySelector<HTMLTableElement>(`[data-testid="${CSS.escape(tableTestId)}"]`);
    return table ? tableCells(table) : [];
  };
  const copy = (): void => {
    const text = toTabSeparated(cells());
    const onCopy = (e: ClipboardEvent): void => {
      e.clipboardData?.setData('text/plain', text);
      e.preventDefault();
    };
    document.addEventListener('copy', onCopy);
    const ok = document.execCommand('copy');
    document.removeEventListener('copy', onCopy);
    setStatus(ok ? 'Copied: paste it into a spreadsheet.' : 'The clipboard is not available here; use Save as CSV.');
  };
  const save = async (): Promise<void> => {
    const written = await api.exportFile('csv', fileNameText(`${fileBase}.csv`), new TextEncoder().encode(toCsv(cells())));
    setStatus(written ? `Saved ${written.path}` : '');
  };
  return (
    <div className="table-tools">
      <button onClick={copy} data-testid={`copy-${tableTestId}`}>Copy table</button>
      <button onClick={() => void save()} data-testid={`csv-${tableTestId}`}>Save as CSV…</button>
      {status && <span className="small muted" role="status">{status}</span>}
    </div>
  );
}
