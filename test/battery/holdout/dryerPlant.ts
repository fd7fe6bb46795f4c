/**
 * A fourth hold-out plant, defined (with the neutralisation tank, neutralisationPlant.ts) before any
 * run on either, to check what the tool tells a user on plants nobody tuned on: the outlet
 * moisture of a belt dryer, where the burner damper is rate-limited and the heat reaches the product
 * after a transport delay. Not in the battery; nothing was chosen on it.
 * `npm run bench -- battery --holdout --plants holdout-dryer-g0.99`.
 *
 * State: outlet moisture m (%), damper position p (fraction open), and q, the damper position one
 * step earlier (the heat still on the belt). Per 20-second step the damper moves towards the
 * command a by at most 0.03 (rate limit, both ways) and stays within [0, 1]; the moisture moves a
 * tenth of the way towards 14 − 10·q, with process noise 0.25 % per step:
 *   p' = clip(p + clip(a − p, −0.03, 0.03), 0, 1),   q' = p,   m' = m + 0.1·(14 − 10·q − m) + 0.25·ε.
 * Cost per step: (m − 8)² + 2·p (off-spec product, and fuel). γ 0.99.
 * Logging controller: P on moisture, a = 0.6 + 0.04·(m − 8), dither 0.02.
 * Candidates, defined in this order: 'steadier' (0.05 per %, dither 0.02: within the logged actions)
 * and 'firmer' (0.09 per % with damper-position feedback −0.3·(p − 0.6), dither 0.015: it acts one
 * to two logged dithers away from the logged actions and runs into the rate limit more often).
 * Truth by seeded rollouts with their standard error.
 */
import type { BatteryPlant } from '../batteryPlant';
import type { PlantDynamics } from '../episodeLog';
import { nonlinearBatteryPlant } from '../nonlinearPlant';

const SETPOINT_PCT = 8, DAMPER_BIAS = 0.6;
/** Largest damper move per step (fraction open). */
export const DAMPER_RATE_LIMIT = 0.03;

export const dryerDynamics: PlantDynamics = {
  stateDim: 3, actionDim: 1,
  step(s, a, rng, next) {
    const m = s[0], p = s[1], q = s[2];
    const move = Math.min(DAMPER_RATE_LIMIT, Math.max(-DAMPER_RATE_LIMIT, a[0] - p));
    next[1] = Math.min(1, Math.max(0, p + move));
    next[2] = p;
    next[0] = m + 0.1 * (14 - 10 * q - m) + 0.25 * rng.normal();
    return (m - SETPOINT_PCT) ** 2 + 2 * p;
  },
};

/** a = 0.6 + K·(m − 8) − P·(p − 0.6), as offset + G·s. */
export function damperCommand(k: number, positionFeedback: number, std: number) {
  return { offset: [DAMPER_BIAS - k * SETPOINT_PCT + positionFeedback * DAMPER_BIAS], gain: [[k, -positionFeedback, 0]], std: [std] };
}

export function dryerPlant(): BatteryPlant {
  return nonlinearBatteryPlant({
    name: 'holdout-dryer-g0.99',
    description: 'belt dryer, damper rate-limited to 0.03 per step, transport delay, 3 states, γ 0.99 (hold-out)',
    stateNames: ['moisture_pct', 'damper_fraction', 'damper_previous_fraction'], actionNames: ['damper_command'], discount: 0.99, stepsPerEpisode: 400,
    dynamics: dryerDynamics, operatingState: [SETPOINT_PCT, DAMPER_BIAS, DAMPER_BIAS], burnIn: 300,
    behaviour: damperCommand(0.04, 0, 0.02),
    candidates: [
      { name: 'steadier', description: 'K = 0.05 per %, dither 0.02', spec: damperCommand(0.05, 0, 0.02) },
      { name: 'firmer', description: 'K = 0.09 per %, damper feedback 0.3, dither 0.015', spec: damperCommand(0.09, 0.3, 0.015) },
    ],
    rolloutsPerStart: 200,
  });
}
