/**
 * `evaluate`: read a project and its data file, run the one evaluation pipeline, print the result.
 * Files are read here (Node); everything after the bytes is the shared pipeline.
 */
import { readFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import { basename, dirname, join, resolve } from 'node:path';
import { describeProblems } from '../core/result';
import { evaluateProject } from '../pipeline/evaluateProject';
import { evaluationToJson, importToJson } from '../pipeline/evaluationJson';
import { openProject } from '../pipeline/openProject';
import { formatEvaluation } from './formatEvaluation';
import { formatImport } from './formatImport';

export async function runEvaluateCommand(projectPath: string, options: { json: boolean }): Promise<number> {
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
  if (project.approximator.kind === 'network') await quietTensorflow();
  const evaluation = await evaluateProject({ project, dataset, warnings: warnings.map((w) => `${w.where}: ${w.message}`), wasmPath: tensorflowWasmFolder() });
  if (!evaluation.ok) {
    process.stderr.write(`${describeProblems(evaluation.problems)}\n`);
    return 1;
  }
  if (options.json) {
    const json = { ...evaluationToJson(evaluation.value), import: importToJson(imported) };
    process.stdout.write(`${JSON.stringify(json, null, 2)}\n`);
  } else {
    process.stdout.write(formatImport(imported, project.data.path));
    process.stdout.write(formatEvaluation(evaluation.value, basename(projectPath)));
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
