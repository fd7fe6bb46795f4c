/**
 * A hold-out plant whose drift bends LATE (drift41; defined before any estimator ran on it): the chlorine-dosing
 * loop of dosingPumpWearPlant.ts — the same dynamics, cost, logging controller, candidates and END plant
 * (delivery 1.6) — but the pump tube holds its delivery of 2 per unit speed for the first 60 % of the runs
 * (run index e ≤ 0.6·(E − 1)) and only then wears, on a straight line, to 1.6 at the last run. A kink in run
 * order: a smooth trend fitted over the whole log cannot follow it exactly. Truth: the end-of-log plant.
 * `nice -n 10 npx tsx bench/driftForecastRows.ts --plants holdout-dosing-pump-late-wear-g0.96 --blocks 10 --degree 2`.
 */
import { driftingLog, type BrokenLogPlant } from './brokenLog';
import { DELIVERY, TARGET_MG_L, dosingDynamics, dosingPumpWearPlant } from './dosingPumpWearPlant';

/** The share of the runs (in run order) before the tube starts to wear. */
export const WEAR_STARTS_AT = 0.6;

/** Run e of E (0-based): delivery 2 up to 60 % of the way through the log, then a straight line to 1.6 at the last run. */
export function lateDeliveryAtRun(e: number, episodes: number): number {
  if (episodes <= 1) return DELIVERY.last;
  const knee = WEAR_STARTS_AT * (episodes - 1);
  return e <= knee ? DELIVERY.first : DELIVERY.first + (DELIVERY.last - DELIVERY.first) * (e - knee) / (episodes - 1 - knee);
}

export function dosingPumpLateWearPlant(): BrokenLogPlant {
  const base = dosingPumpWearPlant(true); // the steady control: the end-of-log pump; its candidates and logging law
  const plant = {
    ...base,
    name: 'holdout-dosing-pump-late-wear-g0.96',
    description: 'chlorine dosing, the pump holding its delivery for the first 60 % of the logged runs and then wearing to 20 % less per unit speed at the last run, measured demand, pump clipped at 0 and 1, 2 states, γ 0.96 (hold-out; the log breaks: a plant whose drift bends late; truth: the end-of-log plant)',
  };
  return driftingLog(plant, false, {
    kept: 'none', drifts: 'a plant that drifts late: the pump holds its delivery for 60 % of the runs, then delivers 20 % less per unit speed by the last run',
  }, (e, episodes) => dosingDynamics(lateDeliveryAtRun(e, episodes)), [TARGET_MG_L, 0], 200);
}
