/**
 * The hold-out plants whose logs break one assumption each (probe37): a noisy sensor, a plant that drifts,
 * two tunings in one log. Kept apart from the catalogue and rolloutTruthPlants.ts (their logs are not what
 * the battery's Markov, one-plant, one-controller tests ask of a plant); bench/holdoutCliRows.ts reads them.
 */
import { aerationNoisyProbePlant } from './aerationNoisyProbePlant';
import type { BrokenLogPlant } from './brokenLog';
import { coldStoreRetunedPlant } from './coldStoreRetunedPlant';
import { NUDGED_SETPOINT_C, coldStoreSetpointMovedPlant } from './coldStoreSetpointMovedPlant';
import { dosingPumpWearPlant } from './dosingPumpWearPlant';
import { coolingTowerFillLossPlant } from './coolingTowerFillLossPlant';
import { exchangerFoulingPlant } from './exchangerFoulingPlant';

export function brokenLogPlants(): BrokenLogPlant[] {
  return [aerationNoisyProbePlant(), dosingPumpWearPlant(), coldStoreRetunedPlant()];
}

/** Their controls: each plant with the assumption kept (no reading noise; the end-of-log pump throughout; one tuning). */
export function keptAssumptionPlants(): BrokenLogPlant[] {
  return [aerationNoisyProbePlant(true), dosingPumpWearPlant(true), coldStoreRetunedPlant(true)];
}

/** probe38: the present controller's setpoint moved halfway by 2 K and by 0.5 K, gains kept (their control: keptAssumptionPlants' one-tuning cold store). */
export function movedSetpointPlants(): BrokenLogPlant[] {
  return [coldStoreSetpointMovedPlant(), coldStoreSetpointMovedPlant(NUDGED_SETPOINT_C)];
}

/** drift40: plants that drift through their logs (the wearing pump and two more), and their controls (the end-of-log plant on every run). */
export function driftingPlants(): BrokenLogPlant[] {
  return [dosingPumpWearPlant(), exchangerFoulingPlant(), coolingTowerFillLossPlant()];
}

export function driftingPlantControls(): BrokenLogPlant[] {
  return [exchangerFoulingPlant(true), coolingTowerFillLossPlant(true)];
}
