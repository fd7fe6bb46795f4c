/**
 * Every battery plant, by name. Plants are built on first use (their start sets and truths are
 * memoised inside each plant object), so importing the catalogue costs nothing.
 */
import type { BatteryPlant } from './batteryPlant';
import { linearQuadraticPlants } from './linearQuadraticCatalogue';
import { nonlinearPlants } from './nonlinearCatalogue';

let plants: BatteryPlant[] | null = null;

export function batteryPlants(): readonly BatteryPlant[] {
  return (plants ??= [...linearQuadraticPlants(), ...nonlinearPlants()]);
}

export function batteryPlant(name: string): BatteryPlant {
  const found = batteryPlants().find((p) => p.name === name);
  if (!found) throw new Error(`no battery plant "${name}"; have ${batteryPlants().map((p) => p.name).join(', ')}`);
  return found;
}
