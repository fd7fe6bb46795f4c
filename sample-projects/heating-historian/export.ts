/**
 * heating-historian — the heating-loop plant (../heating-loop/simulate.ts) logged the way a building
 * historian exports it: semicolons, decimal commas, local dd.mm.yyyy timestamps every minute, the
 * controller's runs separated by overnight stops (no run column: episodes come from the time gaps),
 * no cost column (the project computes it by an expression), an unused supply-temperature column
 * with dropouts, and a few corrupt cells at known lines, as sensor faults and logger glitches leave
 * them. Seeded; `npx tsx sample-projects/heating-historian/export.ts` rewrites the CSV.
 */
import { pathToFileURL } from 'node:url';
import { createRandom } from '../../src/core/random';
import { heatingSamplePeriodSeconds, simulateHeatingLoop } from '../heating-loop/simulate';

export const HISTORIAN_RUNS = 12;
export const HISTORIAN_STEPS_PER_RUN = 500;
export const HISTORIAN_SEED = 77_301;
/** Pause between runs: the plant was switched to its night programme. */
export const OVERNIGHT_STOP_SECONDS = 6 * 3600;

/** Corrupt cells by file line (header = line 1): what a person would find there. */
export const CORRUPT_CELLS: Record<number, { column: number; text: string }> = {
  214: { column: 1, text: '#####' }, // zone sensor fault text
  1_377: { column: 3, text: '' }, // valve position missing
  2_950: { column: 2, text: 'Bad Input' }, // outdoor sensor offline
  4_108: { column: 1, text: '21,3,4' }, // garbled value
  5_530: { column: 3, text: 'NaN' }, // logger wrote not-a-number
};

const HEADER = ['timestamp_local', 'zone_temp_c', 'outdoor_temp_c', 'heating_valve_pct', 'supply_temp_c'];

function localStamp(epochMs: number): string {
  const d = new Date(epochMs);
  const two = (n: number) => String(n).padStart(2, '0');
  return `${two(d.getUTCDate())}.${two(d.getUTCMonth() + 1)}.${d.getUTCFullYear()} ${two(d.getUTCHours())}:${two(d.getUTCMinutes())}:${two(d.getUTCSeconds())}`;
}

const comma = (v: number, digits: number) => v.toFixed(digits).replace('.', ',');

export function historianCsv(): string {
  const log = simulateHeatingLoop({ runs: HISTORIAN_RUNS, stepsPerRun: HISTORIAN_STEPS_PER_RUN, seed: HISTORIAN_SEED });
  const rng = createRandom(HISTORIAN_SEED + 1);
  const cols = log.columns.length;
  const lines = [HEADER.join(';')];
  let clockMs = Date.UTC(2025, 0, 13, 6, 0, 0);
  for (let i = 0; i < log.rowCount; i++) {
    const v = log.rows.subarray(i * cols, (i + 1) * cols);
    if (i > 0 && v[0] !== log.rows[(i - 1) * cols]) clockMs += OVERNIGHT_STOP_SECONDS * 1000;
    const supply = 45 + 0.3 * v[4] + 0.5 * rng.normal();
    const cells = [localStamp(clockMs), comma(v[2], 3), comma(v[3], 3), comma(v[4], 2), i % 211 === 0 ? 'n/a' : comma(supply, 1)];
    const corrupt = CORRUPT_CELLS[lines.length + 1];
    if (corrupt) cells[corrupt.column] = corrupt.text;
    lines.push(cells.join(';'));
    clockMs += heatingSamplePeriodSeconds * 1000;
  }
  return `\uFEFF${lines.join('\r\n')}\r\n`;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const { writeFileSync } = await import('node:fs');
  const target = new URL('./heating-historian.csv', import.meta.url);
  writeFileSync(target, historianCsv());
  console.log(`wrote ${target.pathname}`);
}
