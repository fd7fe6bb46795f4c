/**
 * Two versions of the app worker's first look at a data file (`setData`, inspectData) side by
 * side, in alternating pairs of fresh processes (bench/inspectionOnce.ts), on the peer's
 * 1,000,000-transition log (bench/peerBench.ts) or the CSV given. `before` is a folder holding an
 * earlier copy of `src` (`git archive <commit> src | tar -x -C test-artifacts/inspect-before`); the
 * other is this checkout's. Prints CPU seconds, the peak RSS each look added and the heap in use
 * after it, with after / before per pair and the medians. Printed, never asserted.
 *   npm run bench -- inspect-pairs <before folder> [pairs] [csv file]
 */
import { execFileSync } from 'node:child_process';
import { statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { median } from './builtCli';
import { peerFiles, work } from './peerBench';

const root = resolve(import.meta.dirname, '..');

interface Look { cpuSeconds: number; peakRssAddedMiB: number; heapAddedMiB: number }

function lookOnce(src: string, file: string): Look {
  const out = execFileSync('nice', ['-n', '10', process.execPath, '--import', 'tsx', join(root, 'bench', 'inspectionOnce.ts'), src, file], { cwd: root, encoding: 'utf8', maxBuffer: 1 << 20 });
  return JSON.parse(out.trim().split('\n').pop()!) as Look;
}

const fixed = (values: number[], digits: number) => values.map((v) => v.toFixed(digits)).join(', ');

export function runInspectionPairsBench(before: string, pairs = 5, csvFile?: string): Record<string, string | number> {
  const file = csvFile ? resolve(csvFile) : join(work, peerFiles(1_000_000).csv);
  const looks = { before: [] as Look[], after: [] as Look[] };
  for (let p = 0; p < pairs; p++) {
    const order = p % 2 === 0 ? (['before', 'after'] as const) : (['after', 'before'] as const);
    for (const build of order) looks[build].push(lookOnce(build === 'before' ? resolve(before, 'src') : join(root, 'src'), file));
  }
  const table: Record<string, string | number> = { pairs, file, 'file MB': statSync(file).size / 1e6 };
  const rows: [keyof Look, string, number][] = [['cpuSeconds', 'CPU (s)', 3], ['peakRssAddedMiB', 'peak RSS added (MiB)', 1], ['heapAddedMiB', 'heap in use after (MiB)', 1]];
  for (const [key, name, digits] of rows) {
    const of = (build: 'before' | 'after') => looks[build].map((l) => l[key]);
    table[`${name}, before`] = `${fixed(of('before'), digits)} (median ${median(of('before')).toFixed(digits)})`;
    table[`${name}, after`] = `${fixed(of('after'), digits)} (median ${median(of('after')).toFixed(digits)})`;
    table[`${name}, before / after (medians)`] = (median(of('before')) / median(of('after'))).toFixed(1);
  }
  return table;
}
