/**
 * The report from what the session holds, and the three things a user does with it: write it as
 * HTML, save it as PDF, print it. One builder (pipeline/report: the same document the CLI's
 * `report` command writes) for the Findings buttons and the menu's Print Report… (Ctrl+P) and
 * Save Report as PDF… commands; the PDF and the printout are made by the main process
 * (src/main/reportPrinting.ts), since only it can drive Chromium's printer.
 *
 * A report is offered only for current results: none before a run, none for results of other data
 * or settings (they would be printed as if current), none while the intervals and checks are
 * still running. Each refusal is a sentence saying what to do.
 */
import { failure, success, type Result } from '../../../core/result';
import type { Assessment } from '../../../pipeline/assessment';
import type { RetuneMapResult } from '../../../pipeline/retuneMaps';
import { reportInputFrom } from '../../../pipeline/report/reportAssembly';
import { renderReport } from '../../../pipeline/report/reportDocument';
import type { AppApi } from '../../../shared/appApi';
import { runKey } from '../../../shared/runKey';
import { fileNameText } from '../../../shared/fileNameText';
import type { DocumentStore } from '../document/documentStore';
import type { SessionState, SessionStore } from '../session/sessionStore';

export type ReportText = { ok: true; html: string; fileBase: string } | { ok: false; reason: string };

function assessmentOf(s: SessionState, key: string): Result<Assessment> {
  const a = s.assessment;
  if (a.status === 'done' && a.runKey === key) return success(a.assessment);
  if (a.status === 'failed' && a.runKey === key) return failure(...a.problems);
  return failure({ where: 'assessment', message: a.status === 'cancelled' ? 'the assessment was cancelled' : 'the assessment has not been computed' });
}

function mapsOf(s: SessionState, key: string, wanted: boolean): Result<RetuneMapResult[]> | undefined {
  if (!wanted) return undefined;
  const m = s.retuneMaps;
  if (m.status === 'done' && m.runKey === key) return success(m.maps);
  if (m.status === 'failed' && m.runKey === key) return failure(...m.problems);
  return failure({ where: 'retuneMaps', message: 'the map was not computed for this run (Findings ▸ Retune map ▸ Compute the retune map)' });
}

/** The report of the session's current results, or why there is none. */
export function reportText(documents: DocumentStore, session: SessionStore, now: Date = new Date()): ReportText {
  const s = session.get(), state = documents.get(), doc = state.history.present, record = s.evaluation;
  if (!record) return { ok: false, reason: 'There is no report yet: run the evaluation on the Run step first.' };
  if (s.importState.status !== 'done') return { ok: false, reason: 'The report needs the project’s data: wait for the import on the Plant log step to finish.' };
  if (record.runKey !== runKey(doc, s.importState.result.fingerprint)) {
    return { ok: false, reason: 'The results are out of date (the data or settings changed since the run): run the evaluation again before writing the report.' };
  }
  if (s.assessment.status === 'running') return { ok: false, reason: 'The report waits for the intervals and checks still running on Findings; try again when they are done.' };
  const projectFile = state.projectPath?.split(/[\\/]/).pop() ?? 'not saved yet';
  const input = reportInputFrom({
    project: doc, projectFile, evaluation: record.evaluation, assessment: assessmentOf(s, record.runKey),
    retuneMaps: mapsOf(s, record.runKey, (doc.retuneMaps ?? []).length > 0), data: s.importState.result, generatedAt: now,
  });
  return { ok: true, html: renderReport(input), fileBase: fileNameText(`${doc.name}-report`) };
}

/** What happened, in a sentence for the status line; null when the user cancelled. */
export type ReportOutcome = { tone: 'info' | 'error'; text: string } | null;

export type ReportAction = 'html' | 'pdf' | 'print';

/** Write, save as PDF or print the current report. */
export async function reportCommand(action: ReportAction, api: AppApi, documents: DocumentStore, session: SessionStore): Promise<ReportOutcome> {
  const report = reportText(documents, session);
  if (!report.ok) return { tone: 'error', text: report.reason };
  try {
    if (action === 'print') return (await api.printReport(report.html)) ? { tone: 'info', text: 'Sent the report to the printer.' } : null;
    const written = action === 'pdf'
      ? await api.saveReportPdf(report.html, `${report.fileBase}.pdf`)
      : await api.exportFile('html', `${report.fileBase}.html`, new TextEncoder().encode(report.html));
    return written ? { tone: 'info', text: `Saved ${written.path}` } : null;
  } catch (e) {
    return { tone: 'error', text: `The report could not be ${action === 'print' ? 'printed' : 'written'}: ${(e as Error).message}` };
  }
}
