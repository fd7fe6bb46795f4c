/**
 * The one list of plants with rollout truth that the benches read (rolloutTruthPlants.ts): it holds every
 * plant of the battery and the hold-outs whose truth comes from rollouts, each once, and each has a route
 * to its truth from start states of a bench's own — its dynamics, rolled out by rolloutTruth.ts as the
 * benches do, give a finite J with a finite standard error. Before it, a plant's dynamics were paired with
 * its name by hand in two benches and its name listed in two more.
 */
import { describe, expect, it } from 'vitest';
import { batteryPlants } from './catalogue';
import { holdoutPlants } from './holdout/levelValvePlant';
import { rolloutTruth } from './rolloutTruth';
import { rolloutTruthPlantNames, rolloutTruthPlants } from './rolloutTruthPlants';

describe('the plants with rollout truth, listed once for the benches', () => {
  const plants = rolloutTruthPlants();

  it('holds every plant whose truth comes from rollouts, each once', () => {
    const nonlinear = [...batteryPlants(), ...holdoutPlants()].filter((p) => p.kind === 'nonlinear').map((p) => p.name);
    expect(new Set(rolloutTruthPlantNames()).size).toBe(plants.length);
    expect([...rolloutTruthPlantNames()].sort()).toEqual([...new Set(nonlinear)].sort());
    // The fourteen the hand lists held at 1f09a9d (bench/holdoutCliRows.ts DYNAMICS and the row benches' PLANTS): none dropped.
    expect(rolloutTruthPlantNames()).toEqual(expect.arrayContaining([
      'greenhouse-clipped-g0.95', 'pendulum-saturating-g0.97', 'holdout-backlash-level-g0.96', 'holdout-header-pressure-g0.98', 'holdout-level-valve-g0.96',
      'holdout-level-valve-gentle-g0.96', 'holdout-exchanger-g0.95', 'holdout-dryer-g0.99', 'holdout-neutralisation-g0.95', 'holdout-kettle-g0.98',
      'holdout-surge-drum-g0.97', 'holdout-blending-tank-g0.97', 'holdout-steam-drum-g0.97', 'holdout-pipe-heater-g0.97',
    ]));
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
