/**
 * Which command line a benchmark runs: the built one (out/cli/main.js, `npm run build:cli`) when it
 * is there, else the sources through tsx. Says which, and whether the build is older than a source
 * file (then it may not be the code being measured).
 */
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';

const root = resolve(import.meta.dirname, '..');
/** SETPOINT_CRITIC_CLI names another build's main.js (e.g. one kept beside out/cli while a bench times out/cli). */
export const BUILT_CLI = process.env.SETPOINT_CRITIC_CLI ?? join(root, 'out', 'cli', 'main.js');
export const SOURCE_CLI = join(root, 'src', 'cli', 'main.ts');

/** Node arguments that start the command line from its sources (tsx compiles them at every start). */
export const sourceCliArgs = (...args: string[]): string[] => ['--import', 'tsx', SOURCE_CLI, ...args];
export const builtCliArgs = (...args: string[]): string[] => [BUILT_CLI, ...args];

/** The middle of a few run timings (the upper middle one for an even count), as the command-line benches print it. */
export const median = (values: number[]): number => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

/** Newest modification time (ms) of a .ts file under `folder`. */
function newestSource(folder: string): number {
  return readdirSync(folder, { recursive: true, encoding: 'utf8' })
    .filter((f) => f.endsWith('.ts'))
    .reduce((newest, f) => Math.max(newest, statSync(join(folder, f)).mtimeMs), 0);
}

/** The node arguments for the CLI with `args`, and in words which CLI that is. */
export function cliCommand(...args: string[]): { args: string[]; which: string } {
  if (!existsSync(BUILT_CLI)) return { args: sourceCliArgs(...args), which: 'sources through tsx (no out/cli/main.js: npm run build:cli)' };
  const stale = newestSource(join(root, 'src')) > statSync(BUILT_CLI).mtimeMs;
  return { args: builtCliArgs(...args), which: `built out/cli/main.js${stale ? ' (older than a source file: npm run build:cli)' : ''}` };
}
