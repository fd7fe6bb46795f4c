/**
 * A hold-out plant that DRIFTS over its log (drift40; defined, with exchangerFoulingPlant.ts, before any
 * estimator ran on either): the cooling tower of coolingTowerPlant.ts losing fill (packing that breaks up
 * and clogs), so the water comes back warmer for the same fan: an added warming w per two-minute step,
 * 0 at the first logged run rising on a straight line to 0.15 K at the last (with the fan held, 1.5 K warmer
 * at rest: 0.15 / (1 − 0.9)). The truth is the plant AS IT IS AT THE END of the log. Not in the battery or
 * the catalogue; nothing was chosen on it.
 *
 *   T' = 28 + 0.9·(T − 28) + 0.15·q − 0.6·(f − 0.5) + w + 0.2·ε₁,   q' = 0.98·q + 0.1·ε₂,   f the fan's speed
 * (the nearest quarter of the command); cost 2·(T − 28)² + 4·f³. γ 0.96, runs of 400 steps.
 * Logging controller and candidates as coolingTowerPlant.ts's: u = 0.5 + 0.3·(T − 28), dither 0.1; `loadFed`,
 * `sluggish`, `firmer`.
 */
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { alongRuns, driftingLog, type BrokenLogPlant } from './brokenLog';
import { SETPOINT_C, coolingTowerDynamicsWith, coolingTowerPlant } from './coolingTowerPlant';

/** Warming per step (K) at the first logged run and at the last. */
export const FILL_WARMING = { first: 0, last: 0.15 } as const;

/** Run e of E (0-based) meets the warming on a straight line from the first run's to the last's. */
export const warmingAtRun = alongRuns(FILL_WARMING);

/** kept: the control — the tower with its fill lost on every run (holdout-cooling-tower-fill-lost-steady-g0.96). */
export function coolingTowerFillLossPlant(kept = false): BrokenLogPlant {
  const built = coolingTowerPlant(), end = coolingTowerDynamicsWith(FILL_WARMING.last);
  const plant = nonlinearBatteryPlant({
    name: kept ? 'holdout-cooling-tower-fill-lost-steady-g0.96' : 'holdout-cooling-tower-fill-loss-g0.96',
    description: 'cooling tower losing fill: the water comes back warmer for the same fan, 1.5 K at rest by the last logged run, five-speed fan, cube-law fan power, measured heat load, 2 states, γ 0.96 (hold-out; the log breaks: a plant that drifts; truth: the end-of-log plant)',
    stateNames: built.stateNames, actionNames: built.actionNames, discount: built.discount, stepsPerEpisode: built.stepsPerEpisode,
    dynamics: end, operatingState: [SETPOINT_C, 0], burnIn: 200, behaviour: built.behaviour, candidates: built.candidates,
    rolloutsPerStart: 200,
  });
  return driftingLog(plant, kept, {
    kept: 'none (the control: the tower with its fill lost on every run)', drifts: 'a plant that drifts: the water comes back warmer for the same fan, more so at every run',
  }, (e, episodes) => coolingTowerDynamicsWith(warmingAtRun(e, episodes)), [SETPOINT_C, 0], 200);
}
