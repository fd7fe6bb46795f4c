/**
 * How the whole `evaluate` grows with the data and with the quadrature: wall time of a fresh CLI
 * process (default 1,000 resamples) on the peer's plant at 100k, 300k and 1M transitions, and at
 * 8, 16 and 32 action quadrature nodes on 100k, with the least-squares slope of log time against
 * log size (1 = linear growth, 2 = quadratic). The CLI is the built one (out/cli/main.js) when it
 * is there, so the figures exclude compiling the sources; else the sources through tsx, after a
 * discarded warm-up run; the output says which (bench/builtCli.ts). Printed, never asserted.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { BUILT_CLI, cliCommand } from './builtCli';
import { peerProject, peers, work } from './peerBench';

const root = resolve(import.meta.dirname, '..');

/** Least-squares slope of log y on log x (common practice for an empirical order of growth). */
export function logLogSlope(x: readonly number[], y: readonly number[]): number {
  const lx = x.map(Math.log), ly = y.map(Math.log), n = x.length;
  const mx = lx.reduce((a, b) => a + b, 0) / n, my = ly.reduce((a, b) => a + b, 0) / n;
  let sxy = 0, sxx = 0;
  for (let i = 0; i < n; i++) { sxy += (lx[i] - mx) * (ly[i] - my); sxx += (lx[i] - mx) ** 2; }
  return sxy / sxx;
}

function evaluateSeconds(n: number, nodes: number): number {
  mkdirSync(work, { recursive: true });
  const csv = `lq_${n}.csv`, project = join(work, `growth_${n}_${nodes}.spcritic`);
  if (!existsSync(join(work, csv))) execFileSync('python3', [join(peers, 'make_lq_dataset.py'), '--n-transitions', String(n), '--seed', '0', '--out', join(work, csv)], { stdio: 'ignore' });
  writeFileSync(project, peerProject(csv, nodes));
  const { args } = cliCommand('evaluate', project, '--json');
  const t = process.hrtime.bigint();
  execFileSync(process.execPath, args, { cwd: root, stdio: 'ignore', maxBuffer: 1 << 28 });
  return Number(process.hrtime.bigint() - t) / 1e9;
}

export function runGrowthBench(): Record<string, string | number> {
  const sizes = [100_000, 300_000, 1_000_000], nodes = [8, 16, 32];
  const which = cliCommand().which;
  if (!existsSync(BUILT_CLI)) evaluateSeconds(sizes[0], 10); // warm-up, discarded: the first process from the sources after a change compiles the TypeScript (tsx cache)
  const bySize = sizes.map((n) => evaluateSeconds(n, 10)), byNodes = nodes.map((k) => evaluateSeconds(100_000, k));
  return {
    'our command line': which, 'transitions': sizes.join(', '), 'evaluate by size (s)': bySize.map((t) => t.toFixed(1)).join(', '), 'slope in transitions': logLogSlope(sizes, bySize),
    'quadrature nodes (100k)': nodes.join(', '), 'evaluate by nodes (s)': byNodes.map((t) => t.toFixed(1)).join(', '), 'slope in nodes': logLogSlope(nodes, byNodes),
  };
}
