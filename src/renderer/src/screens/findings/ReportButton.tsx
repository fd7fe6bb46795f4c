/**
 * "Write report…": the same self-contained HTML document the CLI's `report` command writes, from
 * this run's evaluation and assessment (or the reason the assessment is missing), saved where the
 * user says through the main process.
 */
import { useState } from 'react';
import { failure, success, type Result } from '../../../../core/result';
import type { Assessment } from '../../../../pipeline/assessment';
import type { Evaluation } from '../../../../pipeline/estimates';
import { reportInputFrom } from '../../../../pipeline/report/reportAssembly';
import { renderReport } from '../../../../pipeline/report/reportDocument';
import type { DataImport } from '../../../../shared/workerMessages';
import { useDocument, useDocumentState } from '../../hooks';
import type { AssessmentState } from '../../session/sessionStore';
import { useWorkspace } from '../../WorkspaceContext';

type Status = { tone: 'info' | 'error'; text: string } | null;

const pathOf = (s: { projectPath: string | null }) => s.projectPath;

function assessmentResult(state: AssessmentState | null): Result<Assessment> {
  if (state?.status === 'done') return success(state.assessment);
  if (state?.status === 'failed') return failure(...state.problems);
  return failure({ where: 'assessment', message: state?.status === 'cancelled' ? 'the assessment was cancelled' : 'the assessment has not been computed' });
}

export function ReportButton({ evaluation, state, imported }: { evaluation: Evaluation; state: AssessmentState | null; imported: DataImport }) {
  const { api } = useWorkspace();
  const doc = useDocument();
  const projectPath = useDocumentState(pathOf);
  const [status, setStatus] = useState<Status>(null);
  const running = state?.status === 'running';
  const write = async (): Promise<void> => {
    setStatus({ tone: 'info', text: 'Writing the report…' });
    try {
      const projectFile = projectPath?.split(/[\\/]/).pop() ?? `${doc.name}.spcritic`;
      const input = reportInputFrom({ project: doc, projectFile, evaluation, assessment: assessmentResult(state), data: imported, generatedAt: new Date() });
      const written = await api.exportFile('html', `${doc.name}-report.html`, new TextEncoder().encode(renderReport(input)));
      setStatus(written ? { tone: 'info', text: `Saved ${written.path}` } : null);
    } catch (e) {
      setStatus({ tone: 'error', text: `The report could not be written: ${(e as Error).message}` });
    }
  };
  return (
    <section className="panel" aria-labelledby="report-heading">
      <h3 id="report-heading">Report</h3>
      <p className="small muted">One self-contained HTML file — the job, the data, the settings, the comparison, the figures, the diagnostics, the cross-checks and the cautions — to attach to a design review.</p>
      <button className="primary" onClick={() => void write()} disabled={running} data-testid="write-report">Write report…</button>
      {running && <span className="small muted"> (waits for the intervals and checks)</span>}
      {status && <p className={status.tone === 'error' ? 'error-text' : 'small'} role="status" data-testid="report-status">{status.text}</p>}
    </section>
  );
}
