/**
 * The run-order check on the probe37 logs (test/battery/holdout/): the cold store retuned halfway and the
 * dosing pump that wears give a serious whole-log warning naming what changed and what to do; their
 * controls (one tuning, a steady pump) give none. The threshold's evidence over five seeds and every
 * battery plant: test/battery/README.md, "Run order" (bench/runOrderBattery.ts).
 */
import { describe, expect, it } from 'vitest';
import { runOrderAssessment } from '../../src/pipeline/runOrderCheck';
import { runOrderSentence } from '../../src/pipeline/runOrderWords';
import { coldStoreRetunedPlant } from '../battery/holdout/coldStoreRetunedPlant';
import { dosingPumpWearPlant } from '../battery/holdout/dosingPumpWearPlant';

describe('run-order check on logs that change by run order, and their controls', () => {
  it('the retuned cold store: serious, about the present controller’s law, whole-log (no candidate), with what to do', () => {
    const data = coldStoreRetunedPlant().simulate({ transitions: 40_000, seed: 1 });
    const { summary, warnings } = runOrderAssessment(data);
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toMatchObject({ severity: 'serious', topic: 'runOrder' });
    expect(warnings[0].candidate).toBeUndefined();
    expect(warnings[0].message).toContain('the present controller’s gain of compressor_fraction');
    // Retuned at run 50 of 100 (the plant's own definition); without a run column the rows are named by line (400 rows a run, header line 1).
    expect(warnings[0].message).toContain('changed around the run from line 20,002 (the 51st of 100 in the data), in one step rather than a steady drift');
    expect(warnings[0].message).toContain('leave out the rows above line 20,002');
    expect('reason' in summary ? [] : summary.changed.map((c) => c.fit)).toContain('law');
    expect('reason' in summary ? null : summary.change).toEqual({ kind: 'step', runIndex: 50, runLabel: null, line: 20_002, clear: true });
    expect(runOrderSentence(summary)).toMatch(/changed with run order \(see the warning\)/);
  });

  it('the wearing dosing pump: serious, about the plant’s response', () => {
    const { warnings } = runOrderAssessment(dosingPumpWearPlant().simulate({ transitions: 40_000, seed: 1 }));
    expect(warnings[0]?.severity).toBe('serious');
    expect(warnings[0]?.message).toContain('the plant’s response changed');
  });

  it('with a run column, the runs are named by its labels, as data.csv.excludedRuns takes them', () => {
    const data = coldStoreRetunedPlant().simulate({ transitions: 40_000, seed: 1 });
    const { summary, warnings } = runOrderAssessment({ ...data, episodeLabels: Array.from({ length: data.episodeCount }, (_, e) => `C${e + 1}`) });
    expect(warnings[0].message).toContain('changed around run "C51" (the 51st of 100 in the data)');
    expect(warnings[0].message).toContain('To evaluate the runs since the change, leave out runs "C1" to "C50" (project field data.csv.excludedRuns; in the app, Plant log → Runs left out); that keeps 50 runs.');
    expect('reason' in summary ? null : summary.change).toEqual({ kind: 'step', runIndex: 50, runLabel: 'C51', line: 20_002, clear: true });
    const pump = dosingPumpWearPlant().simulate({ transitions: 40_000, seed: 1 });
    const drift = runOrderAssessment({ ...pump, episodeLabels: Array.from({ length: pump.episodeCount }, (_, e) => `P${e}`) });
    // A drift: no run to cut at, and leaving out earlier runs is not offered as the remedy (memory38).
    expect(drift.warnings[0].message).toContain('changed steadily over the runs, not in one step');
    expect(drift.warnings[0].message).toContain('Leaving out earlier runs narrows the gap but does not close it');
    expect(drift.warnings[0].message).toContain('fresh logs, in a file of their own, taken after the cause');
    expect(drift.warnings[0].message).not.toContain('leave out runs');
    expect('reason' in drift.summary ? null : drift.summary.change).toEqual({ kind: 'drift' });
  });

  it('a state constant within every run (a grade column) switches the check off, and the sentence names it', () => {
    const data = coldStoreRetunedPlant(true).simulate({ transitions: 40_000, seed: 1 }), states = data.states.slice();
    for (let i = 0; i < data.count; i++) states[i * 2 + 1] = data.episode[i] % 3; // heat_load made a grade held through each run
    const { summary, warnings } = runOrderAssessment({ ...data, states });
    expect(warnings).toEqual([]);
    expect(runOrderSentence(summary)).toContain('Run order: not checked — fewer than 10 runs could be fitted');
    expect(runOrderSentence(summary)).toContain('heat_load is constant within every run (a setpoint or grade?), so no run’s fit can tell its effect from the run’s own offset.');
  });

  it('their controls: no warning, and the sentence says nothing changed', () => {
    for (const plant of [coldStoreRetunedPlant(true), dosingPumpWearPlant(true)]) {
      const { summary, warnings } = runOrderAssessment(plant.simulate({ transitions: 40_000, seed: 1 }));
      expect(warnings).toEqual([]);
      expect(runOrderSentence(summary)).toMatch(/no coefficient changed with run order/);
    }
  });
});
