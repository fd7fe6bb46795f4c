/**
 * A historian-style export (test/fixtures/realistic/tank-log.csv, written by the seeded script
 * beside it): semicolons, decimal commas, dd.mm.yyyy timestamps with a two-hour stop, dropouts
 * in an unused column, and six corrupt rows. Every row must be accounted for exactly.
 *
 * Expected counts by hand: 600 rows in two episodes of 300 (the stop is 7200 s against a limit
 * of 3 × 10 s). A full episode of 300 rows gives 299 next-row transitions; each isolated
 * excluded row inside an episode removes the step into it and the step out of it. Episode 1
 * loses lines 57, 123 and 250 (299 − 6 = 293), episode 2 lines 401, 480 and 555 (293): 586.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { importDataset } from '../../src/data/importDataset';
import type { ColumnRoles } from '../../src/project/schema';
import { CORRUPT_LINES, FIXTURE_PATH, generateTankLog } from '../fixtures/realistic/generateTankLog';

const ROLES: ColumnRoles = {
  states: [{ column: 'level_upper_m', unit: 'm' }, { column: 'level_lower_m', unit: 'm' }],
  actions: [{ column: 'valve_pct', unit: '%' }],
  reward: { kind: 'column', column: 'cost', sense: 'cost' },
  nextState: { kind: 'nextRow' },
  episode: { kind: 'timeGap', column: 'timestamp' },
};

describe('realistic tank log', () => {
  const bytes = new Uint8Array(readFileSync(FIXTURE_PATH));

  it('the committed fixture is what its seeded script writes', () => {
    expect(new TextDecoder().decode(bytes)).toBe(generateTankLog());
  });

  it('stops on the corrupt rows and lists all six in file order', () => {
    const result = importDataset(bytes, 'tank-log.csv', { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' }, ROLES);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems.filter((p) => (p as { kind?: string }).kind !== 'bad-rows').map((p) => p.where)).toEqual([
      'tank-log.csv, line 57, column level_upper_m',
      'tank-log.csv, line 123, column valve_pct',
      'tank-log.csv, line 250, column level_lower_m',
      'tank-log.csv, line 401',
      'tank-log.csv, line 480, column timestamp',
      'tank-log.csv, line 555, column cost',
    ]);
    expect(result.problems[0].message).toBe('"ERR" is not a number; expected a number such as 12,5');
  });

  it('with bad rows excluded: 586 transitions in 2 episodes, every excluded row listed with its reason', () => {
    const result = importDataset(bytes, 'tank-log.csv', { delimiter: 'auto', decimalMark: 'auto', badRows: 'exclude' }, ROLES);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const { transitions: t, excluded, summary, rowCount, episodeReport } = result.value;
    expect(rowCount).toBe(600);
    expect(excluded.map((e) => [e.line, e.column, e.kind])).toEqual([
      [57, 'level_upper_m', 'not-a-number'],
      [123, 'valve_pct', 'empty-cell'],
      [250, 'level_lower_m', 'not-a-number'],
      [401, undefined, 'ragged-row'],
      [480, 'timestamp', 'bad-timestamp'],
      [555, 'cost', 'not-finite'],
    ]);
    expect(excluded.map((e) => e.line)).toEqual(Object.keys(CORRUPT_LINES).map(Number));
    expect(t.count).toBe(586);
    expect(t.episodeCount).toBe(2);
    expect(summary.usedRowCount).toBe(594);
    expect(summary.excludedFraction).toBe(6 / 600);
    expect(summary.samplingPeriodSeconds).toBe(10);
    expect(summary.delimiter).toBe(';');
    expect(summary.decimalMark).toBe(',');
    expect(summary.dateOrder).toBe('dayFirst');
    // The first state of each episode: lines 2 and 302 of the file.
    expect(Array.from(t.startStates)).toEqual([0.9, 1.0, 0.9408, 1.2302]);
    // No transition starts on an excluded row or on the row before one.
    for (const line of [56, 57, 122, 123, 249, 250, 400, 401, 479, 480, 554, 555, 301, 601]) {
      expect(Array.from(t.sourceLine)).not.toContain(line);
    }
    expect(episodeReport).toContain('Runs from timestamp gaps in column timestamp: a step longer than 30 s (3 × the median sampling period of 10 s) starts a new run; 1 gap → 2 runs.');
    expect(episodeReport.join('\n')).toContain('6 stretches of excluded rows inside a run (lines 57, 123, 250, 401, 480 and 1 more)');
    expect(episodeReport).toContain('Dates in column timestamp: line 2 has a day above 12 in first place, so dates read day first (dd/mm/yyyy).');
  });
});
