/**
 * The report panel: "Write report…" (the same self-contained HTML document the CLI's `report`
 * command writes), "Save as PDF…" and "Print…" (the main process prints the same document; the
 * menu's Print Report… and Ctrl+P do the same), from this run's evaluation, assessment and retune
 * maps (src/renderer/src/files/reportCommands.ts).
 */
import { useState } from 'react';
import { reportCommand, type ReportAction, type ReportOutcome } from '../../files/reportCommands';
import type { AssessmentState } from '../../session/sessionStore';
import { useWorkspace } from '../../WorkspaceContext';

const WORKING: Record<ReportAction, string> = { html: 'Writing the report…', pdf: 'Writing the report as PDF…', print: 'Preparing the report for printing…' };

export function ReportButton({ state }: { state: AssessmentState | null }) {
  const { api, documents, session } = useWorkspace();
  const [status, setStatus] = useState<ReportOutcome>(null);
  const running = state?.status === 'running';
  const act = async (action: ReportAction): Promise<void> => {
    setStatus({ tone: 'info', text: WORKING[action] });
    setStatus(await reportCommand(action, api, documents, session));
  };
  return (
    <>
      <p className="small muted">One self-contained document — the job, the data, the settings, the comparison, the figures, the diagnostics, the cross-checks, the retune maps and the cautions — to attach to a design review, as HTML or PDF (A4), or printed.</p>
      <div className="row">
        <button className="primary" onClick={() => void act('html')} disabled={running} data-testid="write-report">Write report…</button>
        <button onClick={() => void act('pdf')} disabled={running} data-testid="report-pdf">Save as PDF…</button>
        <button onClick={() => void act('print')} disabled={running} data-testid="print-report" title="Print the report (Ctrl+P)">Print…</button>
      </div>
      {running && <p className="small muted">The report waits for the intervals and checks.</p>}
      {status && <p className={status.tone === 'error' ? 'error-text' : 'small'} role="status" data-testid="report-status">{status.text}</p>}
    </>
  );
}
