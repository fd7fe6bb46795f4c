/**
 * The dead-time vessel (deadTimePlant.ts) checked before the plant-memory threshold was chosen on it:
 *   - its exact J by the augmented-state closed form (src/core/lq.ts; the state augmentation for an
 *     input delay, Åström & Wittenmark, "Computer-Controlled Systems", 1997, §2.3, from memory) agrees
 *     with seeded rollouts of the simulator itself within 4 of their standard errors;
 *   - what is logged is the vessel's two temperatures and the valve only, chained row to row.
 */
import { describe, expect, it } from 'vitest';
import { augmentedCandidate, augmentedDynamics, DEAD_TIME_CANDIDATES, DEAD_TIME_DISCOUNT, deadTimeLog, deadTimeTruth } from './deadTimePlant';
import { rolloutTruth } from './rolloutTruth';

describe('dead-time vessel', () => {
  it.each([[3, 1], [2, 0.3]])('d = %i, late share %s: the augmented closed form agrees with rollouts of the simulator', (delay, late) => {
    const log = deadTimeLog(delay, 12, 2, late), n = 2 + delay;
    const starts = { name: 'logged', description: 'the logged runs’ augmented starts', states: log.augmentedStarts, count: log.augmentedStarts.length / n };
    for (const c of DEAD_TIME_CANDIDATES) {
      const exact = deadTimeTruth(delay, c, log.augmentedStarts, late);
      const mc = rolloutTruth(augmentedDynamics(delay, late), augmentedCandidate(delay, c), DEAD_TIME_DISCOUNT, starts, { rolloutsPerStart: 150, seed: 9 });
      expect(Math.abs(mc.value - exact)).toBeLessThan(4 * mc.standardError);
    }
  });

  it('logs the two temperatures and the valve only, each row’s next state the next row’s state', () => {
    const { logged } = deadTimeLog(2, 3, 1);
    expect(logged.stateDim).toBe(2);
    expect(logged.stateNames).toEqual(['vessel_temp_c', 'jacket_temp_c']);
    expect(logged.states.length).toBe(2 * logged.count);
    for (let i = 0; i + 1 < logged.count; i++) {
      if (logged.episode[i + 1] !== logged.episode[i]) continue;
      expect([logged.nextStates[2 * i], logged.nextStates[2 * i + 1]]).toEqual([logged.states[2 * i + 2], logged.states[2 * i + 3]]);
    }
  });
});
