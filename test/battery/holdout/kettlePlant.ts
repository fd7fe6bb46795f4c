/**
 * A sixth hold-out plant, defined (with the surge drum, surgeDrumPlant.ts) before any run on either,
 * to check the tool on runs that really end: an invented batch kettle heated by a steam valve from
 * its charge temperature until the batch reaches 80 °C, where the run ends (an absorbing state: the
 * batch is discharged and nothing more is paid). Runs that have not reached 80 °C after 60 one-minute
 * steps are cut by the log's time limit (terminal 0: the batch goes on after the log stops). Not in
 * the battery; nothing was chosen on it. `npm run bench -- battery --holdout --plants holdout-kettle-g0.98`.
 *
 * State: batch temperature T (°C) and the steam supply's deviation s from its nominal heating power
 * (measured; set per batch and drifting). Per step, with the valve u ∈ [0, 1] (clipped by the policy):
 *   T' = T + 3·u·(1 + s) − 0.01·(T − 20) + 0.4·ε,    s' = 0.97·s + 0.02·ε,
 * and the run ends on the row whose T' ≥ 80. A batch is charged at T ~ N(20, 4²) with s ~ N(0, 0.1²).
 * Cost per step: 1 + 0.8·u² (the kettle is occupied, and steam). γ 0.98.
 * Logging controller: P on temperature, u = 0.35 + 0.006·(80 − T), dither 0.08 (valveLaw.ts).
 * Candidates, defined in this order: 'trimmed' (0.40 + 0.005·(80 − T), dither 0.08: within the logged
 * actions, at most 0.05 from the logged mean) and 'hotter' (0.50 + 0.006·(80 − T), dither 0.06: 0.15
 * above the logged mean at every temperature, about two logged dithers, so it finishes sooner).
 * Truth by seeded rollouts with their standard error, each rollout stopping at the absorbing state.
 */
import type { BatteryPlant } from '../batteryPlant';
import type { PlantDynamics, StartSampler } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { valveLaw } from './valveLaw';

/** The batch is done (discharged) when it reaches this temperature. */
export const TARGET_C = 80;
/** Steps (minutes) after which the log cuts a run that has not ended. */
export const BATCH_TIME_LIMIT = 60;
const CHARGE_C = 20, CHARGE_SPREAD_C = 4, SUPPLY_SPREAD = 0.1;

export const kettleDynamics: PlantDynamics = {
  stateDim: 2, actionDim: 1,
  step(s, a, rng, next) {
    const temperature = s[0], supply = s[1], valve = a[0]; // within [0, 1]: the policy clips
    next[0] = temperature + 3 * valve * (1 + supply) - 0.01 * (temperature - CHARGE_C) + 0.4 * rng.normal();
    next[1] = 0.97 * supply + 0.02 * rng.normal();
    return 1 + 0.8 * valve * valve;
  },
  ends: (next) => next[0] >= TARGET_C,
};

/** A fresh batch: charge temperature and steam supply deviation. */
export const batchCharge: StartSampler = (rng, out) => {
  out[0] = CHARGE_C + CHARGE_SPREAD_C * rng.normal();
  out[1] = SUPPLY_SPREAD * rng.normal();
};

/** u = bias + K·(80 − T), clipped to [0, 1]; the steam supply is not used. */
export function steamCommand(bias: number, k: number, std: number) {
  return valveLaw({ bias, setpoint: TARGET_C, gain: k, feedforward: 0, std, clipped: true });
}

export function kettlePlant(): BatteryPlant {
  return nonlinearBatteryPlant({
    name: 'holdout-kettle-g0.98',
    description: 'batch kettle heated until 80 °C, where the run ends (absorbing); runs cut at 60 steps otherwise; steam valve clipped at 0 and 1, 2 states, γ 0.98 (hold-out)',
    stateNames: ['batch_temperature_c', 'steam_supply_deviation'], actionNames: ['steam_valve_fraction'], discount: 0.98, stepsPerEpisode: BATCH_TIME_LIMIT,
    dynamics: kettleDynamics, operatingState: [CHARGE_C, 0], burnIn: 0, runStart: batchCharge,
    behaviour: steamCommand(0.35, 0.006, 0.08),
    candidates: [
      { name: 'trimmed', description: 'u = 0.40 + 0.005·(80 − T), dither 0.08', spec: steamCommand(0.4, 0.005, 0.08) },
      { name: 'hotter', description: 'u = 0.50 + 0.006·(80 − T), dither 0.06', spec: steamCommand(0.5, 0.006, 0.06) },
    ],
    rolloutsPerStart: 200,
  });
}
