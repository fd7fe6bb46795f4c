/**
 * An invented first-order loop with integral action, for the checks of the P/PI forms: a product
 * temperature y (°C) driven by a heater output u (%), sampled every 10 s,
 *   y⁺ = 0.9·y + 0.05·u + 2.5 + w,   w ~ N(0, 0.2²),   cost = (y − 50)² + 0.01·(u − 50)²,
 * whose equilibrium at the setpoint 50 °C needs u = 50 %. A PI controller reads the error integral
 * I = Σ_{k<t} (50 − y_k)·Δt (the derived state of src/data/derivedStates.ts), so with the
 * augmented state z = (y, I) the loop is linear-quadratic (first-order plant plus an integrator):
 *   A = [[0.9, 0], [−Δt, 1]],  B = [0.05, 0]ᵀ,  W = diag(0.2², 0),  Q = diag(1, 0),  R = 0.01,
 * around the operating point (y, I, u) = (50, 0, 50); its closed-form value comes from the
 * Lyapunov equation (src/core/lq.ts). Optionally the output is rate limited and clipped, in which
 * case the truth comes from seeded rollouts of this simulator instead.
 */
import { meanOverStarts } from '../support/startMeans';
import { createRandom, type RandomSource } from '../../src/core/random';
import type { LinearQuadraticPlant, OperatingPoint } from '../../src/core/lq';

export const PI_LOOP_PERIOD_SECONDS = 10;
export const PI_LOOP_SETPOINT = 50;
export const PI_LOOP_DISCOUNT = 0.95;

export const piLoopPlant: LinearQuadraticPlant = {
  stateDim: 2, actionDim: 1,
  dynamics: Float64Array.of(0.9, 0, -PI_LOOP_PERIOD_SECONDS, 1),
  inputGain: Float64Array.of(0.05, 0),
  processNoiseCovariance: Float64Array.of(0.04, 0, 0, 0),
  stateWeight: Float64Array.of(1, 0, 0, 0),
  actionWeight: Float64Array.of(0.01),
};
export const piLoopOperatingPoint: OperatingPoint = { state: Float64Array.of(PI_LOOP_SETPOINT, 0), action: Float64Array.of(50) };

/** A PI law u = bias + Kc·(50 − y) + (Kc/Ti)·I + N(0, dither²), optionally rate limited and clipped. */
export interface PiLaw {
  readonly bias: number;
  readonly proportionalGain: number;
  readonly integralTimeSeconds: number;
  readonly dither: number;
  readonly maxStep?: number;
  readonly limits?: readonly [number, number];
}

/** The logging controller: a gentler PI with more dither. */
export const PI_LOOP_BEHAVIOUR: PiLaw = { bias: 50, proportionalGain: 3, integralTimeSeconds: 150, dither: 2 };

export interface PiLoopState {
  y: number; integral: number; previous: number;
}

/** One action of the law at the state (previous = the output one step earlier). */
export function piAction(law: PiLaw, s: PiLoopState, rng: RandomSource): number {
  let u = law.bias + law.proportionalGain * (PI_LOOP_SETPOINT - s.y) + (law.proportionalGain / law.integralTimeSeconds) * s.integral + law.dither * rng.normal();
  if (law.maxStep !== undefined) u = Math.min(s.previous + law.maxStep, Math.max(s.previous - law.maxStep, u));
  if (law.limits) u = Math.min(law.limits[1], Math.max(law.limits[0], u));
  return u;
}

/** Stage cost of (y, u), then advance y and the error integral in place. */
export function piStep(s: PiLoopState, u: number, rng: RandomSource): number {
  const cost = (s.y - PI_LOOP_SETPOINT) ** 2 + 0.01 * (u - 50) ** 2;
  s.integral += (PI_LOOP_SETPOINT - s.y) * PI_LOOP_PERIOD_SECONDS;
  s.y = 0.9 * s.y + 0.05 * u + 2.5 + 0.2 * rng.normal();
  s.previous = u;
  return cost;
}

/** A start after an upset: y ~ N(50, 3²), I = 0, previous output 50 %. */
export function piStart(rng: RandomSource): PiLoopState {
  return { y: PI_LOOP_SETPOINT + 3 * rng.normal(), integral: 0, previous: 50 };
}

/** The log as CSV text: run, t_s, temp_c, heater_pct, cost (the integral is derived on import). */
export function piLoopCsv(runs: number, rowsPerRun: number, seed: number, law: PiLaw = PI_LOOP_BEHAVIOUR): string {
  const rng = createRandom(seed), lines = ['run,t_s,temp_c,heater_pct,cost'];
  for (let run = 1; run <= runs; run++) {
    const s = piStart(rng);
    for (let k = 0; k < rowsPerRun; k++) {
      const y = s.y, u = piAction(law, s, rng), cost = piStep(s, u, rng);
      lines.push(`${run},${k * PI_LOOP_PERIOD_SECONDS},${y},${u},${cost}`);
    }
  }
  return lines.join('\n') + '\n';
}

/**
 * J of a law by seeded rollouts from given start states (count×3: y, I, previous), reward sense:
 * the mean over starts of each start's mean discounted return (horizon 400: γ^400 ≈ 1e−9), and
 * its standard error given the starts, √(Σ_i s_i²/R)/count with s_i² the sample variance of start
 * i's R returns (the truth is J over these very starts, as the estimate is).
 */
export function rolloutValue(law: PiLaw, starts: Float64Array, rolloutsPerStart: number, seed: number): { value: number; standardError: number } {
  const rng = createRandom(seed);
  return meanOverStarts(starts.length / 3, rolloutsPerStart, (i) => {
    const s = { y: starts[3 * i], integral: starts[3 * i + 1], previous: starts[3 * i + 2] };
    let ret = 0, weight = 1;
    for (let t = 0; t < 400; t++, weight *= PI_LOOP_DISCOUNT) ret -= weight * piStep(s, piAction(law, s, rng), rng);
    return ret;
  });
}
