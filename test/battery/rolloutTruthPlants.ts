/**
 * Every plant whose truth comes from seeded rollouts, with the dynamics that give it: the battery's
 * clipped and saturating plants, then the hold-outs. The benches that take the truth over start states
 * or discounts of their own (bench/holdoutCliRows.ts over a log's run starts, bench/sweepCheck.ts at each
 * swept γ′) and the benches that judge those rows plant by plant (bench/nestedClassRows.ts,
 * bench/networkNestedRows.ts) read this one list, so a plant added beside the others is run, rolled out
 * with its own dynamics and counted in every table; before, four hand lists had to agree by name.
 */
import type { BatteryPlant } from './batteryPlant';
import type { PlantDynamics } from './episodeLog';
import { nonlinearPlants } from './nonlinearCatalogue';
import { holdoutPlants } from './holdout/levelValvePlant';

export type RolloutTruthPlant = BatteryPlant & { readonly dynamics: PlantDynamics };

/** The plants in the order the benches print them; throws where one has lost its dynamics (its truth would have no route). */
export function rolloutTruthPlants(): RolloutTruthPlant[] {
  return [...nonlinearPlants(), ...holdoutPlants()].map((plant) => {
    if (!plant.dynamics) throw new Error(`${plant.name}: a plant with rollout truth but no dynamics to roll out`);
    return plant as RolloutTruthPlant;
  });
}

/** Their names, for the benches that read rows by plant. */
export function rolloutTruthPlantNames(): string[] {
  return rolloutTruthPlants().map((plant) => plant.name);
}
