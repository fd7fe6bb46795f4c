/**
 * The run-order finding's advice, followed: the cold store retuned halfway (test/battery/holdout/, retuned
 * at run 50 of 100 here) written as a CSV with a run column labelled "R1"… "R100" and imported as a project
 * imports it; the finding names the run where the law stepped by its label and the runs to leave out; the
 * same CSV imported again with exactly those runs in data.csv.excludedRuns gives a log on which the check
 * finds nothing. The control: the same plant under one tuning gives no finding at all. What following the
 * advice does to J: test/battery/README.md, "Where the log changed".
 */
import { describe, expect, it } from 'vitest';
import type { TransitionSet } from '../../src/core/transitions';
import { importDataset } from '../../src/data/importDataset';
import { runOrderAssessment } from '../../src/pipeline/runOrderCheck';
import type { ColumnRoles, CsvSettings } from '../../src/project/schema';
import { coldStoreRetunedPlant } from '../battery/holdout/coldStoreRetunedPlant';

const ROLES: ColumnRoles = {
  states: [{ column: 'store_temperature_c', unit: '°C' }, { column: 'heat_load', unit: '' }], actions: [{ column: 'compressor_fraction', unit: '' }],
  reward: { kind: 'column', column: 'r', sense: 'reward' }, nextState: { kind: 'columns', columns: ['next_t', 'next_q'] }, episode: { kind: 'column', column: 'run' },
};

/** The log as a CSV, runs labelled "R1"… in order. */
function csvOf(data: TransitionSet): string {
  const lines = ['run,store_temperature_c,heat_load,compressor_fraction,r,next_t,next_q'];
  for (let i = 0; i < data.count; i++) {
    lines.push([`R${data.episode[i] + 1}`, data.states[2 * i], data.states[2 * i + 1], data.actions[i], data.rewards[i], data.nextStates[2 * i], data.nextStates[2 * i + 1]].join(','));
  }
  return `${lines.join('\n')}\n`;
}

function imported(csv: string, excludedRuns: CsvSettings['excludedRuns'] = []): TransitionSet {
  const result = importDataset(csv, 'cold-store.csv', { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop', excludedRuns }, ROLES);
  if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('; '));
  return result.value.transitions;
}

describe('following the run-order advice', () => {
  it('names the step’s run by its label; leaving out the runs it names leaves a log with no finding', () => {
    const csv = csvOf(coldStoreRetunedPlant().simulate({ transitions: 40_000, seed: 2 }));
    const whole = runOrderAssessment(imported(csv));
    expect(whole.warnings[0]?.severity).toBe('serious');
    expect(whole.warnings[0]?.message).toContain('changed around run "R51" (the 51st of 100 in the data)');
    expect(whole.warnings[0]?.message).toContain('leave out runs "R1" to "R50" (project field data.csv.excludedRuns');
    const change = 'reason' in whole.summary ? null : whole.summary.change;
    expect(change).toMatchObject({ kind: 'step', runIndex: 50, runLabel: 'R51' });
    const since = runOrderAssessment(imported(csv, [{ from: 'R1', to: 'R50', reason: 'before the retune' }]));
    expect(since.warnings).toEqual([]);
    expect('reason' in since.summary ? null : since.summary.runs).toBe(50);
    // The import keeps the whole log beside the runs kept (memory38): the step lies before them, so it is resolved.
    expect(since.summary.wholeLog).toMatchObject({ read: true, runs: 100, runsLeftOut: 50, reading: 'resolved' });
    expect(since.summary.wholeLog?.sentence).toContain('the change at run "R51" lies before the runs kept');
    // Cut too early (runs R31… kept, the step at R51 among them): the whole log's serious finding stands.
    const early = runOrderAssessment(imported(csv, [{ from: 'R1', to: 'R30', reason: 'too early' }]));
    expect(early.warnings[0]?.severity).toBe('serious');
    expect(early.warnings[0]?.message).toContain('the runs kept still span the change (some lie before run "R51")');
  });

  it('the whole log drops a bad row of a run left out (its problem is forgotten for the import, not read as a number)', () => {
    const lines = csvOf(coldStoreRetunedPlant().simulate({ transitions: 40_000, seed: 2 })).split('\n');
    const bad = lines.findIndex((l) => l.startsWith('R10,')) + 5;
    lines[bad] = lines[bad].replace(/^R10,[^,]*/, 'R10,not a number');
    const data = imported(lines.join('\n'), [{ from: 'R1', to: 'R50', reason: 'before the retune' }]);
    const whole = data.wholeLog!.transitions;
    expect(whole.episodeCount).toBeGreaterThanOrEqual(100);
    expect(whole.states.every(Number.isFinite)).toBe(true);
    expect([...whole.sourceLine]).not.toContain(bad + 1);
    expect(runOrderAssessment(data).summary.wholeLog).toMatchObject({ reading: 'resolved', runsLeftOut: whole.episodeCount - 50 });
  });

  it('the control, one tuning throughout: no finding, no advice', () => {
    const csv = csvOf(coldStoreRetunedPlant(true).simulate({ transitions: 40_000, seed: 2 }));
    expect(runOrderAssessment(imported(csv)).warnings).toEqual([]);
  });
});
