/**
 * A hold-out plant that DRIFTS over the months of its log (probe37; defined before any estimator ran on it,
 * with aerationNoisyProbePlant.ts and coldStoreRetunedPlant.ts): a chlorine-dosing loop on a treated-water
 * tank whose peristaltic pump tube wears, so the chlorine delivered per unit of pump speed falls by 20 %
 * from the first logged run to the last. The truth is the plant AS IT IS AT THE END of the log (the plant a
 * retune will meet). Not in the battery or the catalogue; nothing was chosen on it.
 * `nice -n 10 npx tsx bench/holdoutCliRows.ts --plants holdout-dosing-pump-wear-g0.96`.
 *
 * State: free chlorine residual c (mg/L; target 1) and the chlorine demand d (deviation from nominal,
 * measured, first-order 0.9 per step, spread about 0.3). Action: pump speed u ∈ [0, 1] (the controller clips).
 * Per step, with the pump's delivery g (2 at the first run, falling linearly to 1.6 at the last),
 *   c' = c + 0.2·(g·u − c − 0.5·d) + 0.03·ε₁,    d' = 0.9·d + 0.13·ε₂
 * (at rest at c = 1, d = 0 with u = 1/g: 0.5 new, 0.625 worn). Cost per step: 5·(c − 1)² +
 * 50·max(0, 0.8 − c)² + 0.2·u (off target; far worse below 0.8 mg/L, under-disinfected water; chemical).
 * γ 0.96, runs of 400 steps.
 * Logging controller: u = 0.5 − 0.5·(c − 1) + 0.25·d, dither 0.05 (tuned for the new tube).
 * Candidates, set from 10 rollouts per run start of the truth on seed 1's log before any estimator ran:
 * `rebiased` (the bias the worn tube needs: clearly better), `sluggish` (0.1 per mg/L: clearly worse), `firmer`
 * (0.55 per mg/L: a close call). Truth by seeded rollouts of the END
 * plant (g = 1.6) from the log's own run starts, with its standard error.
 */
import type { GaussianPolicySpec } from '../../../src/core/policy';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { alongRuns, driftingLog, type BrokenLogPlant } from './brokenLog';
import { directActingLaw } from './valveLaw';

export const TARGET_MG_L = 1, UNDERDOSED_MG_L = 0.8;
/** The pump's delivery per unit speed at the first logged run and at the last (20 % less: the worn tube). */
export const DELIVERY = { first: 2, last: 1.6 } as const;

export function dosingDynamics(delivery: number): PlantDynamics {
  return {
    stateDim: 2, actionDim: 1,
    step(s, a, rng, next) {
      const c = s[0], d = s[1], u = a[0]; // within [0, 1]: the policy clips
      next[0] = c + 0.2 * (delivery * u - c - 0.5 * d) + 0.03 * rng.normal();
      next[1] = 0.9 * d + 0.13 * rng.normal();
      return 5 * (c - TARGET_MG_L) ** 2 + 50 * Math.max(0, UNDERDOSED_MG_L - c) ** 2 + 0.2 * u;
    },
  };
}

/** Run e of E (0-based) meets the pump's delivery on a straight line from the first run's to the last's. */
export const deliveryAtRun = alongRuns(DELIVERY);

/** u = bias − K·(c − 1) + F·d, clipped to [0, 1]: more chlorine as the residual falls or the demand rises. */
export function dosingLaw(k: number, feedforward: number, std: number, bias = 0.5): GaussianPolicySpec {
  const law = directActingLaw(-k, TARGET_MG_L, feedforward, std);
  return { ...law, offset: [law.offset[0] + bias - 0.5] };
}

/**
 * kept: the control (probe37's addendum) — the same plant, candidates and seeds with the pump at the end-of-log
 * delivery on every run (holdout-dosing-pump-steady-g0.96), to tell what the drift costs from what the plant costs.
 */
export function dosingPumpWearPlant(kept = false): BrokenLogPlant {
  const behaviour = dosingLaw(0.5, 0.25, 0.05), end = dosingDynamics(DELIVERY.last);
  const plant = nonlinearBatteryPlant({
    name: kept ? 'holdout-dosing-pump-steady-g0.96' : 'holdout-dosing-pump-wear-g0.96',
    description: 'chlorine dosing, the pump delivering 20 % less per unit speed at the last logged run than at the first (tube wear), measured demand, pump clipped at 0 and 1, 2 states, γ 0.96 (hold-out; the log breaks: a plant that drifts; truth: the end-of-log plant)',
    stateNames: ['chlorine_residual_mg_l', 'chlorine_demand'], actionNames: ['pump_speed_fraction'], discount: 0.96, stepsPerEpisode: 400,
    dynamics: end, operatingState: [TARGET_MG_L, 0], burnIn: 200, behaviour,
    candidates: [
      { name: 'rebiased', description: '0.5 per mg/L around a pump bias of 0.625 (the worn tube at rest), 0.3 of the demand fed forward, dither 0.05', spec: dosingLaw(0.5, 0.3, 0.05, 0.625) },
      { name: 'sluggish', description: '0.1 per mg/L, 0.25 of the demand fed forward, dither 0.05', spec: dosingLaw(0.1, 0.25, 0.05) },
      { name: 'firmer', description: '0.55 per mg/L, 0.25 of the demand fed forward, dither 0.05', spec: dosingLaw(0.55, 0.25, 0.05) },
    ],
    rolloutsPerStart: 200,
  });
  return driftingLog(plant, kept, {
    kept: 'none (the control: the end-of-log pump on every run)', drifts: 'a plant that drifts: the pump delivers 20 % less per unit speed at the last run than at the first',
  }, (e, episodes) => dosingDynamics(deliveryAtRun(e, episodes)), [TARGET_MG_L, 0], 200);
}
