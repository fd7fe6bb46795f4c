/**
 * Import throughput: synthesise a rows × 10 CSV in memory (a logged two-tank plant: time, six
 * levels and flows, two valve moves, a cost), then time parse + import into a TransitionSet.
 * Prints, never asserts; `npx tsx bench/importBench.ts 1000000` runs it alone.
 */
import { pathToFileURL } from 'node:url';
import { createRandom } from '../src/core/random';
import { importDataset } from '../src/data/importDataset';
import type { ColumnRoles } from '../src/project/schema';

export interface ImportBenchResult {
  rows: number;
  rowsPerSecond: number;
  seconds: number;
  /** Peak resident set size of the whole process so far (includes the synthesised text). */
  peakRssMiB: number;
  /** RSS increase across the import itself. */
  importRssGrowthMiB: number;
  textMiB: number;
  transitions: number;
}

const HEADER = 'time_s;level_1_m;level_2_m;level_3_m;inflow_1_m3h;inflow_2_m3h;outflow_m3h;valve_1_pct;valve_2_pct;cost';

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

const ROLES: ColumnRoles = {
  states: ['level_1_m', 'level_2_m', 'level_3_m', 'inflow_1_m3h', 'inflow_2_m3h', 'outflow_m3h'].map((column) => ({ column, unit: '' })),
  actions: [{ column: 'valve_1_pct', unit: '%' }, { column: 'valve_2_pct', unit: '%' }],
  reward: { kind: 'column', column: 'cost', sense: 'cost' },
  nextState: { kind: 'nextRow' },
  episode: { kind: 'timeGap', column: 'time_s' },
};

const mib = (bytes: number): number => bytes / 1024 / 1024;

export async function runImportBench(rows: number): Promise<ImportBenchResult> {
  const text = synthesiseTankLog(rows);
  const rssBefore = process.memoryUsage().rss;
  const start = performance.now();
  const result = importDataset(text, 'bench.csv', { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' }, ROLES);
  const seconds = (performance.now() - start) / 1000;
  if (!result.ok) throw new Error(`benchmark import failed: ${result.problems[0].where}: ${result.problems[0].message}`);
  return {
    rows,
    rowsPerSecond: rows / seconds,
    seconds,
    peakRssMiB: process.resourceUsage().maxRSS / 1024,
    importRssGrowthMiB: mib(process.memoryUsage().rss - rssBefore),
    textMiB: mib(text.length), // V8 keeps ASCII text one byte per character
    transitions: result.value.transitions.count,
  };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const rows = Number(process.argv[2] ?? 1_000_000);
  runImportBench(rows).then((r) => {
    console.log(`import of ${r.rows.toLocaleString('en-US')} rows × 10 columns: ${r.seconds.toFixed(2)} s, ${Math.round(r.rowsPerSecond).toLocaleString('en-US')} rows/s`);
    console.log(`text ${r.textMiB.toFixed(0)} MiB; peak RSS ${r.peakRssMiB.toFixed(0)} MiB; RSS growth during import ${r.importRssGrowthMiB.toFixed(0)} MiB; ${r.transitions.toLocaleString('en-US')} transitions`);
  });
}
