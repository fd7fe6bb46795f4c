/**
 * `report`: evaluate and assess a project, then write one self-contained HTML report.
 *   npm run cli -- report <project.spcritic> [--out report.html] [--resamples N] [--level 0.9]
 * Files are read and written here (Node); everything between is the shared pipeline.
 */
import { readFile, writeFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import { basename, dirname, join, resolve } from 'node:path';
import { describeProblems } from '../core/result';
import { assessProject } from '../pipeline/assessProject';
import { assessmentSettingsFor, type AssessmentOverrides } from '../pipeline/assessSettings';
import type { CandidateFit } from '../pipeline/candidateFit';
import { evaluateProject } from '../pipeline/evaluateProject';
import { openProject } from '../pipeline/openProject';
import { reportInputFrom } from '../pipeline/report/reportAssembly';
import { renderReport } from '../pipeline/report/reportDocument';
import { formatAssessment } from './assessmentFormat';

export interface ReportCommandOptions extends AssessmentOverrides {
  /** Where to write the HTML; default "<project name>-report.html" in the working folder. */
  out?: string;
  /** Clock for the time stamps (tests pass a fixed one). */
  now?: () => Date;
}

export async function runReportCommand(projectPath: string, options: ReportCommandOptions = {}): Promise<number> {
  let text: string;
  try {
    text = await readFile(projectPath, 'utf8');
  } catch (e) {
    process.stderr.write(`Cannot read the project file ${projectPath}: ${(e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message}\n`);
    return 1;
  }
  const folder = dirname(resolve(projectPath));
  const opened = await openProject(text, basename(projectPath), async (relativePath) => new Uint8Array(await readFile(resolve(folder, relativePath))));
  if (!opened.ok) return fail(describeProblems(opened.problems));
  const { project, dataset, warnings, imported } = opened.value;
  const settings = assessmentSettingsFor(project, { sensitivity: true, ...options });
  if (!settings.ok) return fail(describeProblems(settings.problems), 2);
  const now = options.now ?? (() => new Date()), network = project.approximator.kind === 'network';
  if (network) (await import('@tensorflow/tfjs')).enableProdMode(); // as `evaluate` does: library advice the user cannot act on
  const wasmPath = tensorflowWasmFolder(), fits: CandidateFit[] = [];
  const evaluation = await evaluateProject({
    project, dataset, warnings: warnings.map((w) => `${w.where}: ${w.message}`), now, wasmPath,
    retainFit: network ? (i, fit) => { fits[i] = fit; } : undefined, // a network fit is slow: the assessment reuses it
  });
  if (!evaluation.ok) return fail(describeProblems(evaluation.problems));
  const assessment = await assessProject({ project, dataset, settings: settings.value, fits, wasmPath }).finally(() => fits.forEach((f) => f.dispose()));
  const input = reportInputFrom({ project, projectFile: basename(projectPath), evaluation: evaluation.value, assessment, data: imported, generatedAt: now() });
  const html = renderReport(input);
  const out = resolve(options.out ?? `${basename(projectPath).replace(/\.spcritic$/i, '')}-report.html`);
  try {
    await writeFile(out, html, 'utf8');
  } catch (e) {
    return fail(`Cannot write the report to ${out}: ${(e as Error).message}`);
  }
  if (assessment.ok) process.stdout.write(formatAssessment(assessment.value));
  else process.stderr.write(`The report has no intervals or diagnostics: ${input.assessmentProblems.join('; ')}\n`);
  process.stdout.write(`Report written to ${out}\n`);
  return evaluation.value.policies.some((p) => p.status === 'diverged') ? 3 : 0;
}

/** TensorFlow.js's .wasm files in node_modules, with the trailing slash setWasmPaths wants (as evaluateCommand.ts finds them). */
function tensorflowWasmFolder(): string {
  const packageJson = createRequire(import.meta.url).resolve('@tensorflow/tfjs-backend-wasm/package.json');
  return `${join(dirname(packageJson), 'dist')}/`;
}

function fail(message: string, code = 1): number {
  process.stderr.write(`${message}\n`);
  return code;
}
