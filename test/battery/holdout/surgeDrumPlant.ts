/**
 * A seventh hold-out plant, defined (with the batch kettle, kettlePlant.ts) before any run on either,
 * to check whether the intervals and warnings stay honest when a few runs carry most of the cost: an
 * invented surge drum whose feed is upset by rare, large jumps. Not in the battery; nothing was chosen
 * on it. `npm run bench -- battery --holdout --plants holdout-surge-drum-g0.97`.
 *
 * State: level deviation x (m) from the drum's normal level and the feed's deviation d from its
 * nominal 0.5 (measured, in units of the outlet valve's full flow). Per step, with the outlet valve
 * u ∈ [0, 1] (clipped by the policy):
 *   x' = x + 0.5·(0.5 + d − u) + 0.01·ε,    d' = 0.9·d + 0.02·ε + J,
 * where J is a compound Poisson upset: with probability 0.002 per step (about one per 500 steps) a
 * jump 0.25·T₃, T₃ Student's t with 3 degrees of freedom, truncated to |J| ≤ 1.5 (the feed pump's
 * capacity; the truncation also keeps every moment of the cost finite, so the rollout truth's
 * standard error means what it says).
 * Cost per step: x² + 9·max(0, x − 0.3)² + 0.2·(u − 0.5)² (level off normal, a high level near the
 * overflow much worse, and an unsteady outlet flow upsets the unit downstream). γ 0.97.
 * Logging controller: P on level, u = 0.5 + 0.5·x, dither 0.05.
 * Candidates, defined in this order: 'feedforward' (the same P with half the feed deviation fed
 * forward, 0.5·d, dither 0.05: within the logged actions between upsets) and 'lower' (K = 1 per m
 * around a level 0.1 m below normal, to leave room for surges, with 0.5·d fed forward, dither 0.04:
 * 0.1 above the logged mean at the normal level, one to two logged dithers away).
 * Truth by seeded rollouts with their standard error (2000 per start: the returns are heavy-tailed).
 */
import type { RandomSource } from '../../../src/core/random';
import type { BatteryPlant } from '../batteryPlant';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';
import { directActingLaw } from './valveLaw';

/** Chance of a feed upset per step, its scale and its largest size. */
export const UPSET_RATE = 0.002, UPSET_SCALE = 0.25, UPSET_LIMIT = 1.5;

/** Student's t with 3 degrees of freedom: Z / √(χ²₃ / 3), χ²₃ a sum of three squared normals. */
export function studentT3(rng: RandomSource): number {
  const z = rng.normal();
  let chi = 0;
  for (let i = 0; i < 3; i++) chi += rng.normal() ** 2;
  return z / Math.sqrt(chi / 3);
}

/** The feed upset of one step: 0 mostly, else a truncated scaled t₃ jump. */
export function feedUpset(rng: RandomSource): number {
  if (rng.uniform() >= UPSET_RATE) return 0;
  return Math.max(-UPSET_LIMIT, Math.min(UPSET_LIMIT, UPSET_SCALE * studentT3(rng)));
}

export const surgeDrumDynamics: PlantDynamics = {
  stateDim: 2, actionDim: 1,
  step(s, a, rng, next) {
    const x = s[0], d = s[1], valve = a[0]; // within [0, 1]: the policy clips
    next[0] = x + 0.5 * (0.5 + d - valve) + 0.01 * rng.normal();
    next[1] = 0.9 * d + 0.02 * rng.normal() + feedUpset(rng);
    return x * x + 9 * Math.max(0, x - 0.3) ** 2 + 0.2 * (valve - 0.5) ** 2;
  },
};

/** u = 0.5 + K·(x − x_set) + F·d, clipped to [0, 1]: the outlet opens as the level rises (valveLaw.ts). */
export const outletCommand = directActingLaw;

export function surgeDrumPlant(): BatteryPlant {
  return nonlinearBatteryPlant({
    name: 'holdout-surge-drum-g0.97',
    description: 'surge drum, rare large feed upsets (compound Poisson, Student-t₃ sizes), outlet valve clipped at 0 and 1, 2 states, γ 0.97 (hold-out)',
    stateNames: ['level_deviation_m', 'feed_deviation'], actionNames: ['outlet_valve_fraction'], discount: 0.97, stepsPerEpisode: 400,
    dynamics: surgeDrumDynamics, operatingState: [0, 0], burnIn: 200,
    behaviour: outletCommand(0.5, 0, 0, 0.05),
    candidates: [
      { name: 'feedforward', description: 'K = 0.5 per m, feedforward 0.5 of the feed deviation, dither 0.05', spec: outletCommand(0.5, 0, 0.5, 0.05) },
      { name: 'lower', description: 'K = 1 per m around −0.1 m, feedforward 0.5, dither 0.04', spec: outletCommand(1, -0.1, 0.5, 0.04) },
    ],
    // The returns are heavy-tailed: 400 rollouts per start left the truth's standard error at 7 % of J.
    rolloutsPerStart: 2000,
  });
}
