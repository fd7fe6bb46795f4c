/**
 * Two builds of the command line side by side on the peer's 1,000,000-transition plant, with the
 * numerical-Python peer script (../shared/peers/fqe_numpy.py) in the same run: per pair, the peer,
 * then `evaluate --json` with each build, the two builds' order alternating from pair to pair, so a
 * change in the machine's load falls on both. Each run is a fresh process; wall clock, and CPU time
 * (user + system, every thread of the process, from GNU time), and the ratio to the peer's wall
 * clock within its pair. Everything runs under `nice -n 10` when the one-minute load is 3 or more at
 * the pair's start (said per pair). Printed, never asserted.
 *   npm run bench -- build-pairs <before/main.js> [pairs]
 * where <before/main.js> is a copy of an earlier out/cli (e.g. `cp -r out/cli test-artifacts/cli-before`
 * before a change; inside the checkout, so its npm packages resolve from node_modules) and the
 * other build is out/cli/main.js.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { BUILT_CLI, cliCommand, median } from './builtCli';
import { peerFiles, peers, work } from './peerBench';

const root = resolve(import.meta.dirname, '..');
/** One-minute load at or above which every run of a pair is niced (the brief's rule for a shared machine). */
const NICE_LOAD = 3;

interface Timing { wall: number; cpu: number }

/** Wall and CPU seconds of one fresh process, measured by GNU time (/usr/bin/time). */
function timed(command: string[], cwd: string, niced: boolean): Timing {
  const folder = mkdtempSync(join(tmpdir(), 'build-pairs-')), out = join(folder, 'time');
  try {
    execFileSync('/usr/bin/time', ['-f', '%e %U %S', '-o', out, ...(niced ? ['nice', '-n', '10'] : []), ...command], { cwd, stdio: 'ignore', maxBuffer: 1 << 28 });
    const [wall, user, system] = readFileSync(out, 'utf8').trim().split('\n').pop()!.split(' ').map(Number);
    return { wall, cpu: user + system };
  } finally {
    rmSync(folder, { recursive: true, force: true });
  }
}

const fixed = (values: number[], digits = 1) => values.map((v) => v.toFixed(digits)).join(', ');

export function runBuildPairsBench(before: string, pairs = 4, n = 1_000_000): Record<string, string | number> {
  if (!existsSync(before)) throw new Error(`build-pairs: no earlier build at ${before}`);
  const { csv, project } = peerFiles(n), which = cliCommand().which;
  const runs = { peer: [] as Timing[], before: [] as Timing[], after: [] as Timing[] }, loads: string[] = [];
  for (let p = 0; p < pairs; p++) {
    const load = loadavg()[0], niced = load >= NICE_LOAD;
    loads.push(`${load.toFixed(1)}${niced ? ' niced' : ''}`);
    runs.peer.push(timed(['python3', join(peers, 'fqe_numpy.py'), '--data', join(work, csv)], peers, niced));
    const order = p % 2 === 0 ? (['before', 'after'] as const) : (['after', 'before'] as const);
    for (const build of order) runs[build].push(timed(['node', build === 'before' ? before : BUILT_CLI, 'evaluate', project, '--json'], root, niced));
  }
  const wall = (k: keyof typeof runs) => runs[k].map((t) => t.wall), cpu = (k: keyof typeof runs) => runs[k].map((t) => t.cpu);
  const ratio = (k: 'before' | 'after') => wall(k).map((w, i) => w / runs.peer[i].wall);
  const afterOverBefore = (f: (k: 'before' | 'after') => number[]) => f('after').map((a, i) => a / f('before')[i]);
  return {
    transitions: n, pairs, 'before (build)': before, 'after (build)': which, 'load at each pair (1 min)': loads.join(', '),
    'peer wall (s)': fixed(wall('peer')), 'before wall (s)': fixed(wall('before')), 'after wall (s)': fixed(wall('after')),
    'before CPU (s)': fixed(cpu('before')), 'after CPU (s)': fixed(cpu('after')),
    'before / peer (wall)': fixed(ratio('before'), 2), 'after / peer (wall)': fixed(ratio('after'), 2),
    'after / before, wall': fixed(afterOverBefore(wall), 3), 'after / before, CPU': fixed(afterOverBefore(cpu), 3),
    'median after / before, wall': median(afterOverBefore(wall)), 'median after / before, CPU': median(afterOverBefore(cpu)),
  };
}
