/**
 * The run-order check with runs left out (data.csv.excludedRuns) reads the whole log as well
 * (core/diagnostics/runsLeftOutReading.ts; rule written before measuring: /work/notes/memory38-rule.md).
 * Constructed logs from the probe37 hold-out plants, whose change is known by construction: the cold store
 * retuned at run 50 of 100 (a step; coldStoreRetunedPlant.ts) and the dosing pump wearing linearly over
 * its runs (a drift; dosingPumpWearPlant.ts). The runs kept are cut from the whole log as the import cuts
 * them (episodeTransitions: the same rows, episodes renumbered), the whole log beside them with its kept runs marked.
 */
import { describe, expect, it } from 'vitest';
import { episodeTransitions, indexEpisodes } from '../../src/core/bootstrap/episodeTransitions';
import type { TransitionSet } from '../../src/core/transitions';
import { runOrderAssessment } from '../../src/pipeline/runOrderCheck';
import { runOrderSentence } from '../../src/pipeline/runOrderWords';
import { coldStoreRetunedPlant } from '../battery/holdout/coldStoreRetunedPlant';
import { dosingPumpWearPlant } from '../battery/holdout/dosingPumpWearPlant';

const labelled = (data: TransitionSet): TransitionSet => ({ ...data, episodeLabels: Array.from({ length: data.episodeCount }, (_, e) => `R${e}`) });

/** The runs `keep` passes, as the import keeps them, with the whole log beside them. */
function leftOut(whole: TransitionSet, keep: (run: number) => boolean): TransitionSet {
  const runs = Int32Array.from({ length: whole.episodeCount }, (_, e) => e).filter(keep);
  const kept = episodeTransitions(whole, indexEpisodes(whole), runs);
  return { ...kept, episodeLabels: [...runs].map((e) => whole.episodeLabels?.[e] ?? null), wholeLog: { transitions: whole, keptRuns: Uint8Array.from({ length: whole.episodeCount }, (_, e) => (keep(e) ? 1 : 0)) } };
}

describe('the run-order check remembers the runs left out', () => {
  const store = labelled(coldStoreRetunedPlant().simulate({ transitions: 40_000, seed: 1 }));

  it('a step, runs kept after it: resolved by the runs left out, and the runs kept decide (no warning here)', () => {
    const { summary, warnings } = runOrderAssessment(leftOut(store, (e) => e >= 50));
    expect(warnings).toEqual([]);
    expect(summary.wholeLog).toMatchObject({ read: true, runs: 100, runsLeftOut: 50, reading: 'resolved', resolved: true });
    expect(summary.wholeLog?.sentence).toContain('the change at run "R50" lies before the runs kept');
    // The kept runs' own numbers: 50 runs, nothing changed.
    expect('reason' in summary ? null : [summary.runs, summary.changed.length]).toEqual([50, 0]);
    expect(runOrderSentence(summary)).toContain('the runs left out resolve it');
  });

  it('a step, runs kept before it (cut too early) or on both sides (a middle cut): the whole log’s serious finding stands', () => {
    for (const keep of [(e: number) => e >= 30, (e: number) => e < 20 || e >= 40]) {
      const { summary, warnings } = runOrderAssessment(leftOut(store, keep));
      expect(warnings).toHaveLength(1);
      expect(warnings[0]).toMatchObject({ severity: 'serious', topic: 'runOrder' });
      expect(warnings[0].message).toContain('No candidate is named for a trial.');
      expect(warnings[0].message).toContain('the runs kept still span the change (some lie before run "R50")');
      expect(summary.wholeLog).toMatchObject({ reading: 'stands', resolved: false, runs: 100 });
      // The numbers are the whole log's: 100 runs, the step at run 50.
      expect('reason' in summary ? null : [summary.runs, summary.change]).toEqual([100, { kind: 'step', runIndex: 50, runLabel: 'R50', line: 20_002, clear: true }]);
    }
  });

  it('a drift cut to its latest third: the whole log’s serious finding stands, with no remedy by leaving runs out', () => {
    const pump = labelled(dosingPumpWearPlant().simulate({ transitions: 40_000, seed: 1 }));
    const { summary, warnings } = runOrderAssessment(leftOut(pump, (e) => e >= 67));
    expect(warnings).toHaveLength(1);
    expect(warnings[0].severity).toBe('serious');
    expect(warnings[0].message).toContain('drifts steadily, through the runs kept too');
    expect(warnings[0].message).toContain('no part of the log describes the plant as it is now');
    expect(warnings[0].message).not.toContain('To do so, leave out');
    expect(summary.wholeLog).toMatchObject({ reading: 'stands', runsLeftOut: 67 });
  });

  it('a log without a change: no finding either way, the runs kept decide', () => {
    const { summary, warnings } = runOrderAssessment(leftOut(labelled(coldStoreRetunedPlant(true).simulate({ transitions: 40_000, seed: 1 })), (e) => e >= 33));
    expect(warnings).toEqual([]);
    expect(summary.wholeLog).toMatchObject({ reading: 'no-change', resolved: false, sentence: null });
  });
});
