/**
 * `evaluate`: read a project and its data file, run the one evaluation pipeline, print the result.
 * Files are read here (Node); everything after the bytes is the shared pipeline.
 */
import { readFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import { basename, dirname, join, resolve } from 'node:path';
import { describeProblems } from '../core/result';
import { assessmentToJson } from '../pipeline/assessmentJson';
import { assessProject } from '../pipeline/assessProject';
import { assessmentSettingsFor, type AssessmentOverrides } from '../pipeline/assessSettings';
import type { CandidateFit } from '../pipeline/candidateFit';
import { evaluateProject } from '../pipeline/evaluateProject';
import { evaluationToJson, importToJson } from '../pipeline/evaluationJson';
import { openProject } from '../pipeline/openProject';
import { formatAssessment } from './assessmentFormat';
import { formatCautions, formatEvaluation } from './formatEvaluation';
import { formatImport } from './formatImport';

export async function runEvaluateCommand(projectPath: string, options: { json: boolean } & AssessmentOverrides): Promise<number> {
  let text: string;
  try {
    text = await readFile(projectPath, 'utf8');
  } catch (e) {
    process.stderr.write(`Cannot read the project file ${projectPath}: ${(e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message}\n`);
    return 1;
  }
  const folder = dirname(resolve(projectPath));
  const loaded = await openProject(text, basename(projectPath), async (relativePath) => new Uint8Array(await readFile(resolve(folder, relativePath))));
  if (!loaded.ok) {
    process.stderr.write(`${describeProblems(loaded.problems)}\n`);
    return 1;
  }
  const { project, dataset, warnings, imported } = loaded.value;
  const settings = assessmentSettingsFor(project, options);
  if (!settings.ok) {
    process.stderr.write(`${describeProblems(settings.problems)}\n`);
    return 2;
  }
  const network = project.approximator.kind === 'network', wasmPath = tensorflowWasmFolder(), fits: CandidateFit[] = [];
  if (network) await quietTensorflow();
  const evaluation = await evaluateProject({
    project, dataset, warnings: warnings.map((w) => `${w.where}: ${w.message}`), wasmPath,
    retainFit: network ? (i, fit) => { fits[i] = fit; } : undefined, // the assessment reuses a (slow) network fit
  });
  if (!evaluation.ok) {
    process.stderr.write(`${describeProblems(evaluation.problems)}\n`);
    return 1;
  }
  const assessment = await assessProject({ project, dataset, settings: settings.value, fits, wasmPath }).finally(() => fits.forEach((f) => f.dispose()));
  if (options.json) {
    const json = {
      ...evaluationToJson(evaluation.value), import: importToJson(imported),
      assessment: assessment.ok ? assessmentToJson(assessment.value) : null, assessmentProblems: assessment.ok ? [] : assessment.problems,
    };
    process.stdout.write(`${JSON.stringify(json, null, 2)}\n`);
  } else {
    process.stdout.write(formatImport(imported, project.data.path));
    process.stdout.write(formatEvaluation(evaluation.value, basename(projectPath)));
    process.stdout.write(assessment.ok ? `\nIntervals, cross-checks and diagnostics\n${formatAssessment(assessment.value)}` : `\nIntervals not computed: ${describeProblems(assessment.problems)}\n`);
    process.stdout.write(formatCautions(evaluation.value));
  }
  return evaluation.value.policies.some((p) => p.status === 'diverged') ? 3 : 0;
}

/** The folder holding TensorFlow.js's .wasm files in node_modules (with a trailing slash, as setWasmPaths wants). */
function tensorflowWasmFolder(): string {
  const packageJson = createRequire(import.meta.url).resolve('@tensorflow/tfjs-backend-wasm/package.json');
  return `${join(dirname(packageJson), 'dist')}/`;
}

/**
 * TensorFlow.js in Node prints advice to install its native backend on first use; the CLI cannot act
 * on it and its users should not have to read it. Production mode silences library warnings only.
 */
async function quietTensorflow(): Promise<void> {
  const tf = await import('@tensorflow/tfjs');
  tf.enableProdMode();
}
