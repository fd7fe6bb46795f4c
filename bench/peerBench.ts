/**
 * Side by side with a plain numerical-Python linear FQE (../shared/peers/fqe_numpy.py, outside this
 * project) on the same CSV, pair by pair in one run: the peer's whole script (load, features, fit,
 * closed form, grid) against Setpoint Critic's whole `evaluate` (import, fit, surface, and the
 * assessment with the default 1,000 bootstrap resamples, cross-checks, diagnostics, sensitivity),
 * both as fresh processes, wall clock; ours is the built CLI (out/cli/main.js) when it is there, else
 * the sources through tsx, and the output says which (bench/builtCli.ts). The CSV comes from the peer's own generator
 * (make_lq_dataset.py, seed 0). Also prints our phases from an in-process run (the import opens the
 * file as `evaluate` does: in pieces, fingerprinted by Node's SHA-256), the assessment with
 * the CLI's helper thread (as `evaluate` runs it) and again on one thread, each with the CPU time of
 * the loop's own (main) thread beside its wall clock — on a shared machine the wall clock of two
 * threads says little, the main thread's CPU says how much of the work left it. Printed, never asserted.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { cliCommand } from './builtCli';
import { dataFile } from '../src/cli/evaluateProjectFile';
import { helperThread } from '../src/cli/helperThread';
import { nativeSha256 } from '../src/cli/nativeSha256';
import { assessRun } from '../src/pipeline/assessProject';
import { assessmentSettingsFor } from '../src/pipeline/assessSettings';
import { evaluationOf } from '../src/pipeline/evaluateProject';
import { openProject } from '../src/pipeline/openProject';
import { startRun } from '../src/pipeline/projectRun';

const root = resolve(import.meta.dirname, '..');
/** The peer scripts sit beside the main checkout (../shared/peers) or, from a worktree under ../wt/, two levels up; PEER_SCRIPTS overrides. */
export const peers = process.env.PEER_SCRIPTS ?? [resolve(root, '..', 'shared', 'peers'), resolve(root, '..', '..', 'shared', 'peers')].find((p) => existsSync(p)) ?? resolve(root, '..', 'shared', 'peers');
export const work = join(root, 'test-artifacts', 'bench-peer');

/** The peer's plant as a project: states s0, s1; action a0; reward r; its target policy u = −[1.6, 1.3]x + N(0, 0.3²); γ 0.95. */
export function peerProject(csv: string, quadratureNodes = 10): string {
  return JSON.stringify({
    format: 'setpoint-critic-project', version: 1, name: 'Peer LQ plant', data: { path: csv },
    columns: {
      states: [{ column: 's0' }, { column: 's1' }], actions: [{ column: 'a0' }], reward: { kind: 'column', column: 'r', sense: 'reward' },
      nextState: { kind: 'columns', columns: ['next_s0', 'next_s1'] }, episode: { kind: 'column', column: 'episode' }, terminal: 'done',
    },
    discount: 0.95, candidates: [{ name: 'target', offset: [0], gain: [[-1.6, -1.3]], std: [0.3] }],
    approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 }, ridge: 1e-6 }, quadratureNodes,
  }, null, 2);
}

const seconds = (start: bigint) => Number(process.hrtime.bigint() - start) / 1e9;

/** CPU seconds of this process's main thread (Linux: /proc/self/task/<pid>/stat, utime + stime in clock ticks of 1/100 s); NaN elsewhere. */
function mainThreadCpuSeconds(): number {
  try {
    const fields = readFileSync(`/proc/self/task/${process.pid}/stat`, 'utf8').split(') ')[1].split(' ');
    return (Number(fields[11]) + Number(fields[12])) / 100;
  } catch {
    return NaN;
  }
}

function timed(command: string, args: string[], cwd: string): number {
  const t = process.hrtime.bigint();
  execFileSync(command, args, { cwd, stdio: 'ignore', maxBuffer: 1 << 28 });
  return seconds(t);
}

/** The peer's CSV of n transitions (made by its generator on first use) and our project on it, in `work`. */
export function peerFiles(n: number): { csv: string; project: string } {
  mkdirSync(work, { recursive: true });
  const csv = `lq_${n}.csv`, project = join(work, `peer_${n}.spcritic`);
  if (!existsSync(join(work, csv))) execFileSync('python3', [join(peers, 'make_lq_dataset.py'), '--n-transitions', String(n), '--seed', '0', '--out', join(work, csv)], { stdio: 'ignore' });
  writeFileSync(project, peerProject(csv));
  return { csv, project };
}

export async function runPeerBench(n: number, pairs = 2): Promise<Record<string, number | string>> {
  const { csv, project } = peerFiles(n);
  const ours: number[] = [], theirs: number[] = [];
  const cli = cliCommand('evaluate', project, '--json');
  for (let p = 0; p < pairs; p++) {
    theirs.push(timed('python3', [join(peers, 'fqe_numpy.py'), '--data', join(work, csv)], peers));
    ours.push(timed(process.execPath, cli.args, root));
  }
  const phases = await inProcessPhases(project);
  const ratios = ours.map((o, i) => o / theirs[i]);
  return {
    transitions: n, pairs, 'our command line': cli.which, 'peer script (s)': theirs.map((t) => t.toFixed(1)).join(', '), 'our evaluate (s)': ours.map((t) => t.toFixed(1)).join(', '),
    'ratio ours/peer': ratios.map((r) => r.toFixed(2)).join(', '), ...phases,
  };
}

/** Wall clock and the main thread's CPU time of one call. */
async function timedCall<T>(call: () => Promise<T>): Promise<{ result: T; wall: number; mainCpu: number }> {
  const t = process.hrtime.bigint(), cpu = mainThreadCpuSeconds();
  const result = await call();
  return { result, wall: seconds(t), mainCpu: mainThreadCpuSeconds() - cpu };
}

async function inProcessPhases(projectPath: string): Promise<Record<string, number | string>> {
  const folder = resolve(projectPath, '..');
  let t = process.hrtime.bigint();
  // As `evaluate` opens it (cli/evaluateProjectFile.ts): a large file read in pieces, the fingerprint by Node's SHA-256.
  // (Until import35 this phase read the file whole and hashed it with the portable SHA-256, about 1.1 s more at 10⁶ rows.)
  const opened = await openProject(await readFile(projectPath, 'utf8'), 'peer.spcritic', (p) => dataFile(join(folder, p)), { sha256: nativeSha256 });
  if (!opened.ok) throw new Error(JSON.stringify(opened.problems));
  const importSeconds = seconds(t);
  t = process.hrtime.bigint();
  const run = await startRun(opened.value.project, opened.value.dataset);
  if (!run.ok) throw new Error(JSON.stringify(run.problems));
  evaluationOf(run.value);
  const fitSeconds = seconds(t);
  const settings = assessmentSettingsFor(opened.value.project);
  if (!settings.ok) throw new Error('settings');
  const { result: assessment, wall: assessSeconds, mainCpu: assessMainCpu } = await timedCall(() => assessRun(run.value, { settings: settings.value, helper: helperThread() }));
  const { result: oneThread, wall: oneThreadSeconds, mainCpu: oneThreadMainCpu } = await timedCall(() => assessRun(run.value, { settings: settings.value }));
  run.value.dispose();
  if (!assessment.ok) throw new Error(JSON.stringify(assessment.problems));
  if (!oneThread.ok) throw new Error(JSON.stringify(oneThread.problems));
  return {
    'import (s)': importSeconds, 'fit + surface (s)': fitSeconds, 'assessment (s)': assessSeconds, 'assessment, main-thread CPU (s)': assessMainCpu,
    'assessment, one thread (s)': oneThreadSeconds, 'one thread, main-thread CPU (s)': oneThreadMainCpu,
    'one thread / helper': oneThreadSeconds / assessSeconds, 'resample threads': assessment.value.settings.threads,
    'in-process peak RSS (MiB)': process.resourceUsage().maxRSS / 1024,
  };
}
