/**
 * The whole `evaluate` (fit, surface, assessment with the default 1,000 resamples, cross-checks,
 * sensitivity) with radial-basis features of 7 centres per input (d = 7³ = 343) on the peer's
 * plant at 100,000 transitions, as a fresh CLI process, wall clock; issue 11 asks for ≤ 60 s.
 * The CLI is the built one (out/cli/main.js) when it is there, so the figures exclude compiling the
 * sources; else the sources through tsx; the output says which (bench/builtCli.ts). Printed, never asserted.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { cliCommand } from './builtCli';
import { peerProject, peers, work } from './peerBench';

const root = resolve(import.meta.dirname, '..');

export function radialProject(csv: string, centresPerInput = 7): string {
  const doc = JSON.parse(peerProject(csv)) as Record<string, unknown>;
  doc.approximator = { kind: 'linear', features: { kind: 'radialBasis', centresPerInput, widthScale: 1 }, ridge: 1e-6 };
  return JSON.stringify(doc, null, 2);
}

export function runRadialBench(n = 100_000, runs = 2): Record<string, string | number> {
  mkdirSync(work, { recursive: true });
  const csv = `lq_${n}.csv`, project = join(work, `radial_${n}.spcritic`);
  if (!existsSync(join(work, csv))) execFileSync('python3', [join(peers, 'make_lq_dataset.py'), '--n-transitions', String(n), '--seed', '0', '--out', join(work, csv)], { stdio: 'ignore' });
  writeFileSync(project, radialProject(csv));
  const seconds: number[] = [];
  const cli = cliCommand('evaluate', project, '--json');
  for (let r = 0; r < runs; r++) {
    const t = process.hrtime.bigint();
    execFileSync(process.execPath, cli.args, { cwd: root, stdio: 'ignore', maxBuffer: 1 << 28 });
    seconds.push(Number(process.hrtime.bigint() - t) / 1e9);
  }
  return { 'our command line': cli.which, transitions: n, features: 343, 'evaluate (s)': seconds.map((s) => s.toFixed(1)).join(', '), 'target (s)': 60 };
}
