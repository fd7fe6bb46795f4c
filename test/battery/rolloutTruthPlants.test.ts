/**
 * The one list of plants with rollout truth that the benches read (rolloutTruthPlants.ts): it holds every
 * plant of the battery and the hold-outs whose truth comes from rollouts — as each plant's own truth() says,
 * whatever the catalogue holds — each once and nothing else, and each has a route
 * to its truth from start states of a bench's own — its dynamics, rolled out by rolloutTruth.ts as the
 * benches do, give a finite J with a finite standard error. Before it, a plant's dynamics were paired with
 * its name by hand in two benches and its name listed in two more.
 */
import { describe, expect, it, vi } from 'vitest';
import { batteryPlants } from './catalogue';
import { holdoutPlants } from './holdout/levelValvePlant';
import { rolloutTruth } from './rolloutTruth';
import { rolloutTruthPlantNames, rolloutTruthPlants } from './rolloutTruthPlants';

// Watched, so the catalogue test can ask every plant for its truth as the benches do and read the method off
// without paying for full rollouts (minutes per plant); everywhere else it is the real function.
vi.mock('./rolloutTruth', async (original) => {
  const actual = await original<typeof import('./rolloutTruth')>();
  return { ...actual, rolloutTruth: vi.fn(actual.rolloutTruth) };
});

describe('the plants with rollout truth, listed once for the benches', () => {
  const plants = rolloutTruthPlants();

  it('holds every plant of the catalogue (the battery and the hold-outs) whose truth comes from rollouts, each once, and nothing else', async () => {
    // Whatever the catalogue holds: each plant's own truth() says how it was formed (BatteryTruth.method), not its kind.
    // The real rollouts, cut to one start state and two rollouts: only the method is read here, never the value.
    const real = (await vi.importActual<typeof import('./rolloutTruth')>('./rolloutTruth')).rolloutTruth;
    vi.mocked(rolloutTruth).mockImplementation((dynamics, spec, discount, starts, options) =>
      real(dynamics, spec, discount, { ...starts, states: starts.states.slice(0, dynamics.stateDim), count: 1 }, { ...options, rolloutsPerStart: 2 }));
    try {
      const catalogue = [...batteryPlants(), ...holdoutPlants()];
      const byRollouts = catalogue.filter((p) => p.truth(p.candidates[0].name, 'steady').method === 'rollouts').map((p) => p.name);
      expect(vi.mocked(rolloutTruth)).toHaveBeenCalledTimes(byRollouts.length); // each read off the rollout route itself
      expect(new Set(rolloutTruthPlantNames()).size).toBe(plants.length);
      expect([...rolloutTruthPlantNames()].sort()).toEqual([...new Set(byRollouts)].sort());
    } finally {
      vi.mocked(rolloutTruth).mockImplementation(real);
    }
  });

  it.each(plants.map((p) => [p.name, p] as const))('%s has a route to its truth: its own dynamics, rolled out from a start state of the bench’s choosing', (_, plant) => {
    expect(plant.dynamics.stateDim).toBe(plant.stateDim);
    expect(plant.dynamics.actionDim).toBe(plant.actionDim);
    const steady = plant.startSets().find((s) => s.name === 'steady')!;
    const one = { name: 'first', description: 'the first steady start', states: steady.states.slice(0, plant.stateDim), count: 1 };
    const truth = rolloutTruth(plant.dynamics, plant.candidates[0].spec, plant.discount, one, { rolloutsPerStart: 4, seed: 31_337 });
    expect(Number.isFinite(truth.value)).toBe(true);
    expect(Number.isFinite(truth.standardError)).toBe(true);
  });
});
