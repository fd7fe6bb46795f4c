/**
 * `report`: evaluate and assess a project, then write one self-contained HTML report.
 *   npm run cli -- report <project.spcritic> [--out report.html] [--resamples N] [--level 0.9]
 * Files are read and written here (Node); everything between is the shared pipeline.
 */
import { writeFile } from 'node:fs/promises';
import { basename, resolve } from 'node:path';
import { reportInputFrom } from '../pipeline/report/reportAssembly';
import { renderReport } from '../pipeline/report/reportDocument';
import type { AssessmentOverrides } from '../pipeline/assessSettings';
import { formatAssessment } from './assessmentFormat';
import { formatCautions } from './formatEvaluation';
import { evaluateProjectFile } from './evaluateProjectFile';
import { exitStatusOf } from './exitStatus';
import { createTerminalProgress } from './terminalProgress';
import { destinationRefusal } from './reportDestination';
import { processTerminal, type Terminal } from './terminal';
import { truncationMatters } from '../core/loggedReturn';

export interface ReportCommandOptions extends AssessmentOverrides {
  /** Where to write the HTML; default "<project name>-report.html" in the working folder. */
  out?: string;
  /** Clock for the time stamps (tests pass a fixed one). */
  now?: () => Date;
  terminal?: Terminal;
}

export async function runReportCommand(projectPath: string, options: ReportCommandOptions = {}): Promise<number> {
  const now = options.now ?? (() => new Date());
  const terminal = options.terminal ?? processTerminal;
  const fail = (message: string, code = 1): number => (terminal.err(`${message}\n`), code);
  const out = resolve(options.out ?? `${basename(projectPath).replace(/\.spcritic$/i, '')}-report.html`);
  const progress = createTerminalProgress();
  const result = await evaluateProjectFile(projectPath, { sensitivity: true, ...options }, now, progress, (files) => destinationRefusal(out, files)).finally(() => progress.done());
  if (!result.ok) return fail(result.failure.message, result.failure.exitCode);
  const { project, imported, evaluation, assessment, retuneMaps } = result.run;
  const input = reportInputFrom({ project, projectFile: basename(projectPath), evaluation, assessment, retuneMaps, data: imported, generatedAt: now() });
  const html = renderReport(input);
  try {
    await writeFile(out, html, 'utf8');
  } catch (e) {
    return fail(`Cannot write the report to ${out}: ${(e as Error).message}`);
  }
  if (assessment.ok) terminal.out(formatAssessment(assessment.value, truncationMatters(evaluation.behaviour), project.columns.reward.unit ?? ''));
  else terminal.err(`The report has no intervals or diagnostics: ${input.assessmentProblems.join('; ')}\n`);
  // The cautions where the numbers are printed, as `evaluate` ends with them: the answer above points "at the end" to them.
  terminal.out(formatCautions(evaluation));
  terminal.out(`Report written to ${out}\n`);
  return exitStatusOf(evaluation);
}
