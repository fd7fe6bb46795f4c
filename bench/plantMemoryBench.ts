/**
 * The plant-memory check's cost beside the whole evaluate on the 1,000,000-transition peer project
 * (bench/peerBench.ts builds it): the check alone in process (median of 3), and the whole `evaluate`
 * (import, fit, surface, the assessment with the check in it) as a fresh process, wall clock, once.
 * The budget is 5 % of the whole evaluate. Printed, never asserted.
 */
import { execFileSync } from 'node:child_process';
import { readFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { loggedPlantMemory } from '../src/pipeline/plantMemoryCheck';
import { openProject } from '../src/pipeline/openProject';
import { cliCommand } from './builtCli';
import { peerFiles } from './peerBench';

const root = resolve(import.meta.dirname, '..');
const seconds = (start: bigint) => Number(process.hrtime.bigint() - start) / 1e9;

export async function runPlantMemoryBench(n = 1_000_000): Promise<Record<string, number | string>> {
  const { project } = peerFiles(n), folder = resolve(project, '..');
  const opened = await openProject(await readFile(project, 'utf8'), 'peer.spcritic', async (p) => new Uint8Array(await readFile(join(folder, p))));
  if (!opened.ok) throw new Error(JSON.stringify(opened.problems));
  const data = opened.value.dataset, times: number[] = [];
  let rows = 0;
  for (let k = 0; k < 3; k++) {
    const t = process.hrtime.bigint(), result = loggedPlantMemory(data);
    times.push(seconds(t));
    rows = 'rows' in result ? result.rows : 0;
  }
  const check = times.sort((a, b) => a - b)[1];
  const cli = cliCommand('evaluate', project, '--json'), t = process.hrtime.bigint();
  execFileSync(process.execPath, cli.args, { cwd: root, stdio: 'ignore', maxBuffer: 1 << 28 });
  const whole = seconds(t);
  return { transitions: n, 'rows the check read': rows, 'check (s, median of 3)': check, 'whole evaluate (s)': whole, 'check / whole evaluate': `${(100 * check / whole).toFixed(2)} %`, 'our command line': cli.which };
}
