/**
 * Test fixture: an invented inverted pendulum held near upright by a torque that saturates — a
 * nonlinear plant (sin θ, the actuator clip, end stops) whose value no low-degree polynomial
 * represents well.
 *
 *   ω' = ω + Δt (a sin θ − c ω + u) + σ_ω ε,   θ' = θ + Δt ω'       (semi-implicit Euler, Δt = 0.05 s)
 * Mechanical end stops at ±θ_stop hold the arm (θ' clipped, ω' = 0 there), from where the torque
 * limit can still lift it (a sin θ_stop < u_max): no run falls over, so every cost stays bounded and
 * the rollout truth has a light-tailed Monte Carlo error.
 *   u = clip(k₀ − k_θ θ − k_ω ω + σ_u η, −u_max, u_max),   cost = θ² + 0.1 ω² + 0.01 u²,  reward = −cost.
 * States (θ rad, ω rad/s), action u (torque per inertia, rad/s²). Truth J(π) over given start states
 * by seeded rollouts of the plant itself, with its Monte Carlo standard error.
 */
import { meanOverStarts } from '../support/startMeans';
import { createRandom, type RandomSource } from '../../src/core/random';
import type { TransitionSet } from '../../src/core/transitions';

export const PENDULUM = { dt: 0.05, gravity: 4, damping: 0.5, noise: 0.05, torqueLimit: 2, stop: 0.45 } as const;

export interface PendulumController { offset: number; gainAngle: number; gainRate: number; std: number }

export const pendulumLogging: PendulumController = { offset: 0, gainAngle: 8, gainRate: 3, std: 0.4 };

function torque(c: PendulumController, theta: number, omega: number, rng: RandomSource): number {
  const u = c.offset - c.gainAngle * theta - c.gainRate * omega + c.std * rng.normal();
  return Math.min(PENDULUM.torqueLimit, Math.max(-PENDULUM.torqueLimit, u));
}

function step(theta: number, omega: number, u: number, rng: RandomSource): [number, number] {
  const w = omega + PENDULUM.dt * (PENDULUM.gravity * Math.sin(theta) - PENDULUM.damping * omega + u) + PENDULUM.noise * rng.normal();
  const next = theta + PENDULUM.dt * w;
  return Math.abs(next) >= PENDULUM.stop ? [Math.sign(next) * PENDULUM.stop, 0] : [next, w];
}

const cost = (theta: number, omega: number, u: number) => theta * theta + 0.1 * omega * omega + 0.01 * u * u;

/** Start states: θ₀ uniform in ±angle, ω₀ uniform in ±rate. */
export function pendulumLog(c: PendulumController, episodes: number, steps: number, seed: number, angle = 0.3, rate = 0.3): TransitionSet {
  const rng = createRandom(seed), n = episodes * steps;
  const states = new Float64Array(2 * n), nextStates = new Float64Array(2 * n), actions = new Float64Array(n), rewards = new Float64Array(n);
  const episode = new Int32Array(n), startStates = new Float64Array(2 * episodes);
  for (let e = 0, row = 0; e < episodes; e++) {
    let theta = angle * (2 * rng.uniform() - 1), omega = rate * (2 * rng.uniform() - 1);
    startStates.set([theta, omega], 2 * e);
    for (let t = 0; t < steps; t++, row++) {
      const u = torque(c, theta, omega, rng);
      states.set([theta, omega], 2 * row);
      actions[row] = u;
      rewards[row] = -cost(theta, omega, u);
      [theta, omega] = step(theta, omega, u, rng);
      nextStates.set([theta, omega], 2 * row);
      episode[row] = e;
    }
  }
  return {
    count: n, stateDim: 2, actionDim: 1, stateNames: ['angle_rad', 'rate_rad_s'], actionNames: ['torque'],
    states, actions, rewards, nextStates, terminal: new Uint8Array(n), episode, episodeCount: episodes, startStates,
    sourceLine: Int32Array.from({ length: n }, (_, i) => i + 2),
  };
}

/** J(π) = mean over the start states of V^π(s₀), by `rollouts` seeded rollouts each, cut where γ^t < 1e-6; with its Monte Carlo SE. */
export function pendulumRolloutValue(c: PendulumController, discount: number, starts: Float64Array, rollouts: number, seed: number): { value: number; standardError: number } {
  const steps = Math.ceil(Math.log(1e-6) / Math.log(discount));
  return meanOverStarts(starts.length / 2, rollouts, (s, r) => {
    const rng = createRandom(seed + s * rollouts + r);
    let theta = starts[2 * s], omega = starts[2 * s + 1], g = 0, power = 1;
    for (let t = 0; t < steps; t++, power *= discount) {
      const u = torque(c, theta, omega, rng);
      g -= power * cost(theta, omega, u);
      [theta, omega] = step(theta, omega, u, rng);
    }
    return g;
  });
}
