/**
 * The plant-memory check (src/pipeline/plantMemoryCheck.ts, rule in src/core/diagnostics/plantMemoryFinding.ts)
 * on the battery: quiet on every Markov plant — the battery's and the hold-outs' (whose logged state is
 * their full state, so Markov too), both ways of logging — and raised on the dead-time vessel
 * (deadTimePlant.ts), whose exact J comes from the augmented-state closed form (src/core/lq.ts). The
 * thresholds were chosen on these with bench/plantMemoryTable.ts (3 seeds); here one seed each.
 */
import { describe, expect, it } from 'vitest';
import { plantMemoryAssessment } from '../../src/pipeline/plantMemoryCheck';
import { batteryPlants } from './catalogue';
import { deadTimeLog } from './deadTimePlant';
import { holdoutPlants } from './holdout/levelValvePlant';

describe('plant memory on the battery', () => {
  const markov = [...batteryPlants(), ...holdoutPlants()].flatMap((p) => (['steady', 'wide'] as const).map((runStarts) => [p.name, runStarts, p] as const));

  it.each(markov)('%s (runs logged %s) is quiet', (_, runStarts, plant) => {
    const { summary, warnings } = plantMemoryAssessment(plant.simulate({ transitions: 20_000, seed: 4, runStarts }));
    expect(warnings).toEqual([]);
    expect(summary).toHaveProperty('states');
  });

  it.each([1, 3, 5])('the vessel with a dead time of %i samples, all of the valve late, is serious and names the valve that many rows back', (delay) => {
    const { summary, warnings } = plantMemoryAssessment(deadTimeLog(delay, 100, 7).logged);
    expect(warnings.map((w) => [w.topic, w.severity])).toEqual([['plantMemory', 'serious']]);
    expect(warnings[0].message).toContain(`steam_valve_pct ${delay} row${delay === 1 ? '' : 's'} back`);
    expect(summary).toMatchObject({ read: 'jacket_temp_c' });
  });

  it('the vessel with a tenth of the valve late by 2 samples is a caution; without dead time it is quiet', () => {
    expect(plantMemoryAssessment(deadTimeLog(2, 100, 7, 0.1).logged).warnings.map((w) => w.severity)).toEqual(['caution']);
    expect(plantMemoryAssessment(deadTimeLog(0, 100, 7).logged).warnings).toEqual([]);
  });
});
