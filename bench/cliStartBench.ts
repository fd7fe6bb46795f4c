/**
 * Start-up of the command line from its sources through tsx (`npm run cli`) beside the built one
 * (out/cli/main.js, `npm run build:cli`; built here first when missing or older than a source):
 * `--help` (start-up alone) and a tiny `evaluate` (the first 1,500 rows of the tank-levels sample,
 * 3 runs: import, fits and surface; too few runs for the assessment), each a fresh process, wall
 * clock, the two commands taken in turn so that a change in the machine's load falls on both.
 * Medians and the ratio tsx / built. Printed, never asserted.
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { BUILT_CLI, builtCliArgs, cliCommand, median, sourceCliArgs } from './builtCli';

const root = resolve(import.meta.dirname, '..');
const work = join(root, 'test-artifacts', 'bench-cli-start');
const TINY_ROWS = 1500;

const seconds = (start: bigint) => Number(process.hrtime.bigint() - start) / 1e9;

function timedNode(args: string[]): number {
  const t = process.hrtime.bigint();
  execFileSync(process.execPath, args, { cwd: root, stdio: 'ignore' });
  return seconds(t);
}

/** Builds out/cli unless the built CLI is there and newer than every source; says which. */
function ensureBuilt(): string {
  const { which } = cliCommand();
  if (which.startsWith('built') && !which.includes('older')) return 'present';
  execFileSync(process.execPath, [join(root, 'node_modules', 'vite', 'bin', 'vite.js'), 'build', '--config', 'vite.cli.config.ts'], { cwd: root, stdio: 'ignore' });
  return 'built now (npm run build:cli)';
}

/** The tiny project: the tank-levels sample's project on the first TINY_ROWS rows of its CSV. */
function tinyProject(): string {
  mkdirSync(work, { recursive: true });
  const sample = join(root, 'sample-projects', 'tank-levels');
  const lines = readFileSync(join(sample, 'tank-levels.csv'), 'utf8').split('\n').slice(0, TINY_ROWS + 1);
  writeFileSync(join(work, 'tank-levels.csv'), `${lines.join('\n')}\n`);
  const project = join(work, 'tiny.spcritic');
  writeFileSync(project, readFileSync(join(sample, 'tank-levels.spcritic')));
  return project;
}

export function runCliStartBench(repeats = 7): Record<string, number | string> {
  const build = ensureBuilt();
  const cases = { '--help': ['--help'], 'tiny evaluate': ['evaluate', tinyProject()] };
  const figures: Record<string, number | string> = { 'built CLI': `${build}: ${BUILT_CLI}`, repeats };
  for (const [name, args] of Object.entries(cases)) {
    const tsx: number[] = [], built: number[] = [];
    for (let r = 0; r < repeats; r++) {
      tsx.push(timedNode(sourceCliArgs(...args)));
      built.push(timedNode(builtCliArgs(...args)));
    }
    figures[`${name}, tsx (s)`] = median(tsx);
    figures[`${name}, built (s)`] = median(built);
    figures[`${name}, tsx / built`] = median(tsx) / median(built);
  }
  return figures;
}
