/**
 * A reason given for runs or a time window left out is a note: the app does not import again when
 * it changes (shared/runKey.ts), and writes the last import's report again with the new reason.
 * Checked against the reference that counts: a fresh import of the same log with the new reasons
 * must say exactly the same. An invented log: runs "1" to "6" of 5 rows each, the clock starting
 * again in each run.
 */
import { describe, expect, it } from 'vitest';
import { importDataset } from '../../src/data/importDataset';
import { leftOutReport, withCurrentReasons } from '../../src/data/leftOutReasons';
import type { ColumnRoles, CsvSettings } from '../../src/project/schema';

// A run column and a clock that starts again in each run, so both sentences are written.
const ROLES: ColumnRoles = {
  states: [{ column: 'level_m', unit: 'm' }], actions: [{ column: 'valve_pct', unit: '%' }], timestamp: 'time',
  reward: { kind: 'column', column: 'cost', sense: 'cost', unit: '' }, nextState: { kind: 'nextRow' }, episode: { kind: 'column', column: 'run' },
};

function log(): string {
  const rows = ['run,time,level_m,valve_pct,cost'];
  for (let k = 0; k < 6; k++) {
    for (let i = 0; i < 5; i++) rows.push(`${k + 1},${10 * i},${(1 + 0.01 * i + 0.1 * k).toFixed(2)},${40 + i + k},${(0.5 + 0.1 * i).toFixed(1)}`);
  }
  return `${rows.join('\n')}\n`;
}

const csv = (runReason: string, windowReason: string): CsvSettings => ({
  delimiter: 'auto', decimalMark: 'auto', badRows: 'stop',
  excludedRuns: [{ from: '1', to: '2', reason: runReason }],
  excludedTimes: [{ from: 0, to: 5, reason: windowReason }],
});

function imported(settings: CsvSettings) {
  const result = importDataset(log(), 'log.csv', settings, ROLES);
  if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
  return result.value;
}

describe('the reasons of what is left out, from the current document', () => {
  const before = imported(csv('before the retune', 'start-up'));

  it('a new reason reads as a fresh import with it would (runs, windows and report)', () => {
    for (const [runReason, windowReason] of [['trip test', 'start-up'], ['before the retune', ''], ['', 'valve test']]) {
      const now = csv(runReason, windowReason), fresh = imported(now);
      const kept = withCurrentReasons(before, now, ROLES.episode);
      expect(kept.runsLeftOut).toEqual(fresh.runsLeftOut);
      expect(kept.timeWindows).toEqual(fresh.timeWindows);
      expect(kept.episodeReport).toEqual(fresh.episodeReport);
    }
    const said = withCurrentReasons(before, csv('trip test', 'valve test'), ROLES.episode).episodeReport.join(' ');
    expect(said).toContain('2 runs, "1" to "2", 10 rows: trip test.');
    expect(said).toContain('for valve test (');
    expect(said).not.toContain('before the retune');
  });

  it('puts the sentences where the import recorded them, between the dialect lines and the runs', () => {
    const { start, count } = before.leftOutLines;
    expect(count).toBe(3); // the runs' sentence, the windows' and the clock's "every run" sentence
    expect(before.episodeReport.slice(start, start + count)).toEqual(leftOutReport(before.runsLeftOut, before.timeWindows, before.clock, ROLES.episode));
  });

  // The splice this replaces looked for the old sentence by its words and, not finding it, kept it: here the report
  // says a reason its ranges no longer hold (as a report carried over from elsewhere would), and the old sentence stays out.
  it('rebuilds the sentences from the current reasons even where the report no longer says what its ranges hold', () => {
    const stale = { ...before, runsLeftOut: before.runsLeftOut.map((r) => ({ ...r, reason: 'written over' })) };
    for (const reasons of [['trip test', 'valve test'], ['before the retune', 'start-up']]) {
      const now = csv(reasons[0], reasons[1]), kept = withCurrentReasons(stale, now, ROLES.episode);
      expect(kept.episodeReport).toEqual(imported(now).episodeReport);
    }
    expect(withCurrentReasons(stale, csv('trip test', 'start-up'), ROLES.episode).episodeReport.join(' ')).not.toContain('before the retune');
  });

  it('unchanged reasons give the same object (nothing to redraw)', () => {
    expect(withCurrentReasons(before, csv('before the retune', 'start-up'), ROLES.episode)).toBe(before);
  });
});
