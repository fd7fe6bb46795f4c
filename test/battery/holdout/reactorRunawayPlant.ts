/**
 * A thirteenth hold-out plant, defined (with the cooling tower, coolingTowerPlant.ts, and the rinse
 * bath, rinseBathPlant.ts) before any run on any of the three: a jacketed stirred reactor with an
 * exothermic first-order reaction whose rate follows the Arrhenius law, run at an operating point that
 * is open-loop unstable (the heat release rises faster with temperature than the jacket and the feed
 * take heat away: a thermal runaway held only by the cooling loop). Not in the battery; nothing was
 * chosen on it. `nice -n 10 npx tsx bench/holdoutCliRows.ts --plants holdout-reactor-runaway-g0.97`.
 *
 * State: reactor temperature T (K) and reactant concentration c (mol/L). Action: coolant valve
 * u ∈ [0, 1] (the controller clips). Per one-minute step, with the rate constant
 *   k(T) = 0.1·exp(−8000·(1/T − 1/350))       (Arrhenius, E/R = 8000 K, 0.1 per step at 350 K),
 *   r    = c·(1 − exp(−k(T)))                    (first-order depletion over the step: never more than c),
 *   c'   = c + 0.1·(1 − c) − r + 0.005·ε₁        (feed at 1 mol/L, a tenth of the volume per step),
 *   T'   = T + 0.1·(330 − T) + H·r − 0.3·u·(T − 300) + 0.8·ε₂
 *          (feed at 330 K, jacket coolant at 300 K, heat of reaction H ≈ 194.8 K per mol/L converted:
 *          the value that puts the plant at rest at T = 350 K, c = 0.5124, u = 0.5).
 * There ∂T'/∂T = 1.34 with c held, and the linearisation has an eigenvalue of about 1.2: unstable
 * without the loop.
 * Cost per step: 0.5·(T − 350)² + 10·max(0, T − 354)² + 30·(c − 0.45) (off the temperature setpoint;
 * far worse above 354 K, where a side reaction spoils the product; unconverted reactant lost with the
 * outflow, counted from 0.45 mol/L).
 * γ 0.97, runs of 400 steps.
 * Logging controller: P on T, u = 0.5 + 0.05·(T − 350), dither 0.03.
 * Candidates, defined in this order, with the answer they were meant to give: `firmer` (0.12 per K,
 * dither 0.03: clearly better, tighter temperature), `softer` (0.025 per K, dither 0.03: clearly worse,
 * nearer the runaway) and `hotter` (0.05 per K around 350.5 K, dither 0.03: a close call, more
 * conversion against more time above 354 K). The weights and candidates were set from short rollouts
 * of the truth alone (10 per run start, seed 1's log) so that each candidate gives the answer meant,
 * before any estimator ran.
 * Truth by seeded rollouts with their standard error.
 */
import type { BatteryPlant } from '../batteryPlant';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { directActingLaw } from './valveLaw';

export const REFERENCE_K = 350, ACTIVATION_K = 8000, RATE_AT_REFERENCE = 0.1, SPOIL_LIMIT_K = 354;
/** Where the plant rests at 350 K: 0.1·(1 − c) = c·(1 − e^{−0.1}). */
export const REST_CONCENTRATION = 0.1 / (0.1 + 1 - Math.exp(-RATE_AT_REFERENCE));
/** Heat of reaction (K per mol/L converted, ≈ 194.8) that balances the feed and the jacket at 350 K with the valve at 0.5. */
export const REACTION_HEAT_K = (0.1 * (REFERENCE_K - 330) + 0.3 * 0.5 * (REFERENCE_K - 300)) / (REST_CONCENTRATION * (1 - Math.exp(-RATE_AT_REFERENCE)));

/** First-order rate constant per step at temperature T (K): the Arrhenius law around 350 K. */
export function rateConstant(temperatureK: number): number {
  return RATE_AT_REFERENCE * Math.exp(-ACTIVATION_K * (1 / temperatureK - 1 / REFERENCE_K));
}

export const reactorDynamics: PlantDynamics = {
  stateDim: 2, actionDim: 1,
  step(s, a, rng, next) {
    const t = s[0], c = Math.max(0, s[1]), u = a[0]; // within [0, 1]: the policy clips
    const r = c * (1 - Math.exp(-rateConstant(Math.max(t, 250))));
    next[1] = Math.max(0, c + 0.1 * (1 - c) - r + 0.005 * rng.normal());
    next[0] = t + 0.1 * (330 - t) + REACTION_HEAT_K * r - 0.3 * u * (t - 300) + 0.8 * rng.normal();
    return 0.5 * (t - REFERENCE_K) ** 2 + 10 * Math.max(0, t - SPOIL_LIMIT_K) ** 2 + 30 * (c - 0.45);
  },
};

/** u = 0.5 + K·(T − setpoint), clipped to [0, 1]: more coolant as T rises (valveLaw.ts). */
export function coolantCommand(k: number, setpointK: number, std: number) {
  return directActingLaw(k, setpointK, 0, std);
}

export function reactorRunawayPlant(): BatteryPlant {
  return nonlinearBatteryPlant({
    name: 'holdout-reactor-runaway-g0.97',
    description: 'jacketed reactor, Arrhenius heat release, open-loop unstable operating point, coolant valve clipped at 0 and 1, 2 states, γ 0.97 (hold-out)',
    stateNames: ['temperature_k', 'concentration_mol_l'], actionNames: ['coolant_valve_fraction'], discount: 0.97, stepsPerEpisode: 400,
    dynamics: reactorDynamics, operatingState: [REFERENCE_K, REST_CONCENTRATION], burnIn: 200,
    behaviour: coolantCommand(0.05, REFERENCE_K, 0.03),
    candidates: [
      { name: 'firmer', description: '0.12 per K, dither 0.03', spec: coolantCommand(0.12, REFERENCE_K, 0.03) },
      { name: 'softer', description: '0.025 per K, dither 0.03', spec: coolantCommand(0.025, REFERENCE_K, 0.03) },
      { name: 'hotter', description: '0.05 per K around 350.5 K, dither 0.03', spec: coolantCommand(0.05, 350.5, 0.03) },
    ],
    rolloutsPerStart: 200,
  });
}
