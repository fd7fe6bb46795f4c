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
    expect(warnings[0].message).toContain('exclude the earlier rows');
    expect('reason' in summary ? [] : summary.changed.map((c) => c.fit)).toContain('law');
    expect(runOrderSentence(summary)).toMatch(/changed with run order \(see the warning\)/);
  });

  it('the wearing dosing pump: serious, about the plant’s response', () => {
    const { warnings } = runOrderAssessment(dosingPumpWearPlant().simulate({ transitions: 40_000, seed: 1 }));
    expect(warnings[0]?.severity).toBe('serious');
    expect(warnings[0]?.message).toContain('the plant’s response changed');
  });

  it('their controls: no warning, and the sentence says nothing changed', () => {
    for (const plant of [coldStoreRetunedPlant(true), dosingPumpWearPlant(true)]) {
      const { summary, warnings } = runOrderAssessment(plant.simulate({ transitions: 40_000, seed: 1 }));
      expect(warnings).toEqual([]);
      expect(runOrderSentence(summary)).toMatch(/no coefficient changed with run order/);
    }
  });
});
