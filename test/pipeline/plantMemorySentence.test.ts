/**
 * The plant-memory sentence (app, report, CLI) must not contradict the finding: a share above the
 * caution threshold that its F test does not support raises no finding (plantMemoryFinding.ts), so
 * the sentence must not print that share as the one read beside "a caution above 5 %" with no caution
 * shown. Numbers by hand.
 */
import { describe, expect, it } from 'vitest';
import type { PlantMemorySummary, StateMemory } from '../../src/pipeline/plantMemoryCheck';
import { plantMemorySentence } from '../../src/pipeline/plantMemoryWords';

const state = (name: string, adjusted: number): StateMemory => ({
  state: name, partialRSquared: adjusted, adjustedPartialRSquared: adjusted, fStatistic: 1, degreesOfFreedom: [16, 30], strongest: null,
});

describe('plant-memory sentence beside its finding', () => {
  it('says the share was not supported when no state passed the F guard (no finding was raised)', () => {
    const summary: PlantMemorySummary = { rowsUsed: 60, usableRows: 60, rowsBack: 8, read: null, states: [state('level_m', 0.3)] };
    const sentence = plantMemorySentence(summary)!;
    expect(sentence).toMatch(/level_m/);
    expect(sentence).toMatch(/not supported by its F test/);
  });

  it('reads the state the rule read, not a larger share that failed its F guard', () => {
    const summary: PlantMemorySummary = { rowsUsed: 60, usableRows: 60, rowsBack: 8, read: 'flow_m3h', states: [state('level_m', 0.3), state('flow_m3h', 0.07)] };
    expect(plantMemorySentence(summary)).toMatch(/explain 7\u00a0% .* in flow_m3h/);
  });

  it('says a share below the smallest written as a bound, and one adjusted below zero as 0\u00a0%, not "at most below" or a negative share', () => {
    const tiny: PlantMemorySummary = { rowsUsed: 19_640, usableRows: 19_640, rowsBack: 8, read: 'level_m', states: [state('level_m', 2e-6)] };
    expect(plantMemorySentence(tiny)).toMatch(/explain less than 0\.01\u00a0% \(adjusted for chance\)/);
    expect(plantMemorySentence(tiny)).not.toMatch(/at most below/);
    const none: PlantMemorySummary = { rowsUsed: 19_640, usableRows: 19_640, rowsBack: 8, read: 'level_m', states: [state('level_m', -0.0004)] };
    expect(plantMemorySentence(none)).toMatch(/explain 0\u00a0% \(adjusted for chance\)/);
    expect(plantMemorySentence(none)).not.toMatch(/[-−]\d/);
  });
});
