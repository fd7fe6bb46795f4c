/**
 * A hold-out plant whose log holds the present controller at TWO SETPOINTS (probe38; defined before any
 * estimator ran on it: /work/notes/probe38-rule.md): the cold store of coldStoreRetunedPlant.ts, its loop
 * kept at 0.3 per K with dither 0.05 over the whole log, but its setpoint moved by +2 K at the middle run
 * (−22 °C on the first half of the runs, a colder grade; −20 °C from then on, today's grade); the rule's
 * addendum adds a +0.5 K move (−20.5 °C, a seasonal nudge) as a second plant. Gains are kept,
 * so only the law's offset moves — the run-order check reads that as a caution, since an integral taking up
 * a drifting load also moves it. The plant is the same on every run; the reward is today's cost on every row
 * (the cost column as the engineer counts it today), so the present controller is the one broken assumption.
 * Candidates carry today's setpoint (a retune keeps the current setpoint); the truth for "today" is the law
 * at −20 °C, rolled out from the log's own run starts. Not in the battery or the catalogue.
 * `nice -n 10 npx tsx bench/holdoutCliRows.ts --plants holdout-cold-store-setpoint-moved-g0.97`.
 *
 * A P law u = b + K·(T − sp) rests (q = 0, no dither, unclipped) where the heat balance 0.02·(25 − T) = 1.8·u
 * holds: T* = (0.5 − 1.8·b + 1.8·K·sp)/(0.02 + 1.8·K) — −21.929 °C for the old setpoint, −20 °C for today's.
 */
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { steadyRun, withBrokenLog, type BrokenLogPlant } from './brokenLog';
import { RETUNE, SETPOINT_C, coldStoreDynamics, coldStoreRetunedPlant } from './coldStoreRetunedPlant';
import { directActingLaw } from './valveLaw';

/** The setpoint in force on the first half of the runs (the 2 K move), and the law there (today's gains and dither). */
export const OLD_SETPOINT_C = -22;
/** The smaller move of the rule's addendum: −20.5 °C on the first half (a seasonal nudge). */
export const NUDGED_SETPOINT_C = -20.5;
export const oldSetpointLaw = (setpoint: number) => directActingLaw(0.3, setpoint, 0, 0.05);

/** Where a P law u = b + K·(T − sp) holds the store at the nominal load, by the heat balance (no clip, no dither). */
export function restTemperature(bias: number, k: number, setpoint: number): number {
  return (0.5 - 1.8 * bias + 1.8 * k * setpoint) / (0.02 + 1.8 * k);
}

/** The log with the setpoint moved from `oldSetpoint` to −20 °C at run E/2 (gains kept); today's law, candidates and truth as the cold store's. */
export function coldStoreSetpointMovedPlant(oldSetpoint = OLD_SETPOINT_C): BrokenLogPlant {
  const moveK = SETPOINT_C - oldSetpoint, nudged = oldSetpoint === NUDGED_SETPOINT_C;
  const retuned = coldStoreRetunedPlant(true);
  const plant = nonlinearBatteryPlant({
    name: nudged ? 'holdout-cold-store-setpoint-nudged-g0.97' : 'holdout-cold-store-setpoint-moved-g0.97',
    description: `cold store, the temperature setpoint moved from ${oldSetpoint} to −20 °C halfway through the log (gains kept), measured heat load, compressor clipped at 0 and 1, 2 states, γ 0.97 (hold-out; the log breaks: two operating points of one controller; truth: the law at −20 °C in force at the end)`,
    stateNames: retuned.stateNames, actionNames: retuned.actionNames, discount: 0.97, stepsPerEpisode: 400,
    dynamics: coldStoreDynamics, operatingState: [SETPOINT_C, 0], burnIn: 200, behaviour: RETUNE,
    candidates: retuned.candidates, rolloutsPerStart: 200,
  });
  const before = steadyRun(coldStoreDynamics, oldSetpointLaw(oldSetpoint), [restTemperature(0.5, 0.3, oldSetpoint), 0], 200);
  const today = steadyRun(coldStoreDynamics, RETUNE, [SETPOINT_C, 0], 200);
  return withBrokenLog(plant, `two setpoints: the present controller’s setpoint moved by +${moveK} K halfway through the log (gains kept)`, {
    runConditions: (e, episodes) => (e < episodes / 2 ? before : today),
  });
}
