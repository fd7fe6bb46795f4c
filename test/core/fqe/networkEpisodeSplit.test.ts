/** The seeded hold-out of whole episodes. */
import { describe, expect, it } from 'vitest';
import { splitEpisodes } from '../../../src/core/fqe/networkEpisodeSplit';
import { FqeOptionsError } from '../../../src/core/fqe/fqeErrors';
import { createRandom } from '../../../src/core/random';
import { simulateTankLevels } from '../../../sample-projects/tank-levels/simulate';
import { tankLogTransitions } from './simulatedTransitions';

const log = simulateTankLevels({ runs: 20, stepsPerRun: 11, seed: 5 });
const data = tankLogTransitions(log.rows, log.rowCount); // 20 episodes × 10 transitions

describe('splitEpisodes', () => {
  it('holds out round(fraction·e) whole episodes, training rows first, every transition once', () => {
    const split = splitEpisodes(data, 0.25, createRandom(3));
    expect(split.heldOutEpisodes).toBe(5);
    expect(split.heldOutCount).toBe(50);
    expect(split.trainingCount).toBe(150);
    expect([...split.order].sort((a, b) => a - b)).toEqual(Array.from({ length: 200 }, (_, i) => i));
    const trainingEpisodes = new Set([...split.order.subarray(0, 150)].map((i) => data.episode[i]));
    const heldOutEpisodes = new Set([...split.order.subarray(150)].map((i) => data.episode[i]));
    expect(heldOutEpisodes.size).toBe(5);
    for (const e of heldOutEpisodes) expect(trainingEpisodes.has(e)).toBe(false);
  });

  it('is fixed by the seed and changes with it', () => {
    const a = splitEpisodes(data, 0.25, createRandom(3)), b = splitEpisodes(data, 0.25, createRandom(3)), c = splitEpisodes(data, 0.25, createRandom(4));
    expect(Array.from(a.order)).toEqual(Array.from(b.order));
    expect(Array.from(a.order)).not.toEqual(Array.from(c.order));
  });

  it('holds out at least one episode for a small positive fraction, none for 0', () => {
    expect(splitEpisodes(data, 0.01, createRandom(1)).heldOutEpisodes).toBe(1);
    expect(splitEpisodes(data, 0, createRandom(1))).toMatchObject({ heldOutEpisodes: 0, heldOutCount: 0, trainingCount: 200 });
  });

  it('refuses a hold-out from a single episode, naming the setting', () => {
    const one = tankLogTransitions(simulateTankLevels({ runs: 1, stepsPerRun: 30, seed: 1 }).rows, 30);
    expect(() => splitEpisodes(one, 0.1, createRandom(1))).toThrow(FqeOptionsError);
    expect(() => splitEpisodes(one, 0.1, createRandom(1))).toThrow(/heldOutFraction: .* the data have 1 episode/);
  });
});
