/**
 * Two versions of the import side by side, in alternating pairs, each run a fresh process
 * (bench/importOnce.ts): the tank log of 1,000,000 rows × 10 columns as `npm run bench -- import`
 * reads it, with numpy.loadtxt on the same file in the same pair (bench/importReference.py), and the
 * peer's 1,000,000-transition project opened as `evaluate` opens it (the "import" phase of
 * `npm run bench -- peer`). `before` is a folder holding an earlier copy of `src`
 * (`git archive <commit> src | tar -x -C test-artifacts/import-before`); the other is this checkout's.
 * The order of the two alternates from pair to pair, so a change in the machine's load falls on both;
 * every run is niced when the one-minute load is 3 or more at the pair's start. Prints per pair the wall
 * and CPU seconds, MB/s, the ratio to loadtxt, peak RSS and minor page faults (memory touched for the
 * first time), with after / before per pair and the medians. Printed, never asserted.
 *   npm run bench -- import-pairs <before folder> [pairs]
 */
import { execFileSync } from 'node:child_process';
import { statSync } from 'node:fs';
import { loadavg } from 'node:os';
import { join, resolve } from 'node:path';
import { median } from './builtCli';
import { peerFiles, work } from './peerBench';
import { tankLogFile } from './tankLog';

const root = resolve(import.meta.dirname, '..');
/** One-minute load at or above which every run of a pair is niced (the brief's rule for a shared machine). */
const NICE_LOAD = 3;

interface Run { wallSeconds: number; cpuSeconds: number; peakRssMiB: number; minorFaults: number }

function importOnce(src: string, which: 'tank' | 'peer', file: string, niced: boolean): Run {
  const command = [process.execPath, '--import', 'tsx', join(root, 'bench', 'importOnce.ts'), src, which, file];
  const out = execFileSync(niced ? 'nice' : command[0], niced ? ['-n', '10', ...command] : command.slice(1), { cwd: root, encoding: 'utf8', maxBuffer: 1 << 20 });
  return JSON.parse(out.trim().split('\n').pop()!) as Run;
}

function loadtxtSeconds(file: string, niced: boolean): number {
  const command = ['python3', join(root, 'bench', 'importReference.py'), file, '--loadtxt-only'];
  const out = execFileSync(niced ? 'nice' : command[0], niced ? ['-n', '10', ...command] : command.slice(1), { encoding: 'utf8', maxBuffer: 1 << 20 });
  return (JSON.parse(out) as { numpyLoadtxt: { wallSeconds: number } }).numpyLoadtxt.wallSeconds;
}

const fixed = (values: number[], digits: number) => values.map((v) => v.toFixed(digits)).join(', ');
const ratios = (a: number[], b: number[]) => a.map((x, i) => x / b[i]);

export function runImportPairsBench(before: string, pairs = 5): Record<string, string | number> {
  const beforeSrc = resolve(before, 'src'), afterSrc = join(root, 'src');
  const tank = tankLogFile(1_000_000), megabytes = statSync(tank).size / 1e6;
  const peer = peerFiles(1_000_000).project;
  const runs = { tank: { before: [] as Run[], after: [] as Run[] }, peer: { before: [] as Run[], after: [] as Run[] } };
  const loadtxt: number[] = [], loads: string[] = [];
  for (let p = 0; p < pairs; p++) {
    const load = loadavg()[0], niced = load >= NICE_LOAD;
    loads.push(`${load.toFixed(1)}${niced ? ' niced' : ''}`);
    const order = p % 2 === 0 ? (['before', 'after'] as const) : (['after', 'before'] as const);
    for (const build of order) runs.tank[build].push(importOnce(build === 'before' ? beforeSrc : afterSrc, 'tank', tank, niced));
    loadtxt.push(loadtxtSeconds(tank, niced));
    for (const build of order) runs.peer[build].push(importOnce(build === 'before' ? beforeSrc : afterSrc, 'peer', peer, niced));
  }
  const of = (file: 'tank' | 'peer', build: 'before' | 'after', key: keyof Run) => runs[file][build].map((r) => r[key]);
  const table: Record<string, string | number> = { pairs, 'before (src)': beforeSrc, 'load at each pair (1 min)': loads.join(', '), 'tank file MB': megabytes, 'peer project': join(work, 'peer_1000000.spcritic') };
  for (const file of ['tank', 'peer'] as const) {
    const name = file === 'tank' ? 'tank 10⁶ × 10, read + import' : 'peer 10⁶, open (import phase)';
    for (const key of ['wallSeconds', 'cpuSeconds'] as const) {
      const unit = key === 'wallSeconds' ? 'wall' : 'CPU';
      table[`${name}: before ${unit} (s)`] = fixed(of(file, 'before', key), 2);
      table[`${name}: after ${unit} (s)`] = fixed(of(file, 'after', key), 2);
      const r = ratios(of(file, 'after', key), of(file, 'before', key));
      table[`${name}: after / before, ${unit}`] = `${fixed(r, 3)} (median ${median(r).toFixed(3)})`;
    }
    table[`${name}: peak RSS MiB before / after (median)`] = `${median(of(file, 'before', 'peakRssMiB')).toFixed(0)} / ${median(of(file, 'after', 'peakRssMiB')).toFixed(0)}`;
    table[`${name}: MiB touched first, before / after (median)`] = `${(median(of(file, 'before', 'minorFaults')) / 256).toFixed(0)} / ${(median(of(file, 'after', 'minorFaults')) / 256).toFixed(0)}`;
  }
  const mbps = (build: 'before' | 'after', key: 'wallSeconds' | 'cpuSeconds') => of('tank', build, key).map((s) => megabytes / s);
  table['tank MB/s (wall), before'] = `${fixed(mbps('before', 'wallSeconds'), 1)} (median ${median(mbps('before', 'wallSeconds')).toFixed(1)})`;
  table['tank MB/s (wall), after'] = `${fixed(mbps('after', 'wallSeconds'), 1)} (median ${median(mbps('after', 'wallSeconds')).toFixed(1)})`;
  table['tank MB/s (CPU), before'] = `${fixed(mbps('before', 'cpuSeconds'), 1)} (median ${median(mbps('before', 'cpuSeconds')).toFixed(1)})`;
  table['tank MB/s (CPU), after'] = `${fixed(mbps('after', 'cpuSeconds'), 1)} (median ${median(mbps('after', 'cpuSeconds')).toFixed(1)})`;
  table['numpy.loadtxt wall (s)'] = fixed(loadtxt, 2);
  for (const build of ['before', 'after'] as const) {
    const r = ratios(of('tank', build, 'wallSeconds'), loadtxt);
    table[`tank ${build} / loadtxt (wall)`] = `${fixed(r, 2)} (median ${median(r).toFixed(2)})`;
  }
  return table;
}
