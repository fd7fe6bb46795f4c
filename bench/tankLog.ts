/**
 * The import benchmarks' log (bench/importBench.ts, bench/importPairsBench.ts): an invented two-tank
 * plant, rows × 10 columns (time, six levels and flows, two valve moves, a cost), semicolons and
 * decimal commas, seeded; and the column roles the benches import it with.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { createRandom } from '../src/core/random';
import type { ColumnRoles } from '../src/project/schema';

const HEADER = 'time_s;level_1_m;level_2_m;level_3_m;inflow_1_m3h;inflow_2_m3h;outflow_m3h;valve_1_pct;valve_2_pct;cost';

export const TANK_ROLES: ColumnRoles = {
  states: ['level_1_m', 'level_2_m', 'level_3_m', 'inflow_1_m3h', 'inflow_2_m3h', 'outflow_m3h'].map((column) => ({ column, unit: '' })),
  actions: [{ column: 'valve_1_pct', unit: '%' }, { column: 'valve_2_pct', unit: '%' }],
  reward: { kind: 'column', column: 'cost', sense: 'cost' },
  nextState: { kind: 'nextRow' },
  episode: { kind: 'timeGap', column: 'time_s' },
};

/** rows × 10 semicolon-separated, decimal-comma CSV text, seeded. */
export function synthesiseTankLog(rows: number, seed = 7): string {
  const rng = createRandom(seed);
  const chunks: string[] = [HEADER];
  const levels = [1, 1.5, 2];
  let lines: string[] = [];
  for (let i = 0; i < rows; i++) {
    for (let k = 0; k < 3; k++) levels[k] += 0.01 * (1.5 - levels[k]) + 0.02 * rng.normal();
    const valves = [50 + 10 * rng.normal(), 40 + 8 * rng.normal()];
    const cells = [i * 10, ...levels, 3 + rng.normal(), 2 + rng.normal(), 4 + rng.normal(), ...valves, (levels[0] - 1.5) ** 2];
    lines.push(cells.map((v) => (Number.isInteger(v) ? String(v) : v.toFixed(4).replace('.', ','))).join(';'));
    if (lines.length === 10_000) {
      chunks.push(lines.join('\n'));
      lines = [];
    }
  }
  if (lines.length > 0) chunks.push(lines.join('\n'));
  return chunks.join('\n') + '\n';
}

/** The benchmark file for `rows`, written by a child process (so this one never holds the text). */
export function tankLogFile(rows: number): string {
  const folder = join(tmpdir(), 'setpoint-critic-bench');
  const path = join(folder, `tank-${rows}.csv`);
  if (!existsSync(path)) {
    mkdirSync(folder, { recursive: true });
    execFileSync(process.execPath, ['--import', 'tsx', fileURLToPath(new URL('./importBench.ts', import.meta.url)), '--write', String(rows), path], { stdio: 'inherit' });
  }
  return path;
}

