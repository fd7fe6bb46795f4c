/**
 * The battery itself, checked against outside references before anything is checked on it:
 *   - the simulators log what they claim (shapes, episodes, time-limit ends, seeds);
 *   - an LQ plant's logged states have the stationary mean and covariance of the discrete
 *     Lyapunov equation Σ = FΣFᵀ + BSBᵀ + W (Anderson & Moore, "Optimal Filtering", 1979, ch. 2);
 *   - the rollout truth used for nonlinear plants reproduces the closed-form truth of an LQ plant
 *     (src/core/lq.ts; Bertsekas, "Dynamic Programming and Optimal Control", Vol. I, ch. 4)
 *     within 3.5 of its own standard errors, and state by state (V(s0), the per-state values that
 *     bench/batteryStateErrors.ts compares a fit with) within 4;
 *   - the nonlinear plants really are nonlinear where it matters (their actuator limit is active
 *     on a share of the log), so they test what they are meant to.
 * Monte Carlo tolerances come from the standard errors stated beside each check.
 */
import { describe, expect, it } from 'vitest';
import { closedFormStateCost, lqClosedForm, rewardFromCost } from '../../src/core/lq';
import { createGaussianPolicy } from '../../src/core/policy';
import { candidateNamed, startSetNamed } from './batteryPlant';
import { batteryPlant, batteryPlants } from './catalogue';
import { linearDynamics, type LinearQuadraticBatteryPlant } from './linearQuadraticPlant';
import { PENDULUM_TORQUE_LIMIT } from './nonlinearCatalogue';
import { rolloutStateValues, rolloutTruth } from './rolloutTruth';

describe('battery simulators', () => {
  it.each(batteryPlants().map((p) => [p.name, p] as const))('%s logs whole episodes that end on the time limit, the same for the same seed', (_, plant) => {
    const a = plant.simulate({ transitions: 2_000, seed: 3 }), b = plant.simulate({ transitions: 2_000, seed: 3 });
    const c = plant.simulate({ transitions: 2_000, seed: 4, stepsPerEpisode: 100 });
    expect(a.count).toBe(Math.ceil(2_000 / plant.stepsPerEpisode) * plant.stepsPerEpisode);
    expect(a.stateDim).toBe(plant.stateDim);
    expect(a.terminal.every((t) => t === 0)).toBe(true);
    expect(a.states).toEqual(b.states);
    expect(a.rewards).toEqual(b.rewards);
    expect(c.episodeCount).toBe(20);
    // s' of a row is s of the next row within an episode.
    for (let i = 0; i + 1 < c.count; i++) {
      if (c.episode[i + 1] !== c.episode[i]) continue;
      for (let k = 0; k < c.stateDim; k++) expect(c.nextStates[i * c.stateDim + k]).toBe(c.states[(i + 1) * c.stateDim + k]);
    }
    expect(plant.startSets().map((s) => s.name)).toEqual(['steady', 'wide']);
  });
});

describe('linear-quadratic battery plants', () => {
  const lq = batteryPlants().filter((p): p is LinearQuadraticBatteryPlant => p.kind === 'linearQuadratic');

  it.each(lq.map((p) => [p.name, p] as const))('%s logs runs that start twice as far out when asked (runStarts wide)', (_, plant) => {
    // By construction (startSets.ts): each run's first state is centre + 2·(steady draw − centre), and
    // a seed draws the same numbers in the same order either way, so the root-mean-square deviation
    // of the first states about the operating point is exactly twice the steady log's (to rounding).
    const opts = { transitions: 400 * plant.stepsPerEpisode, seed: 9 };
    const rms = (starts: Float64Array) => {
      const n = plant.stateDim, c = plant.lq.operatingPoint.state;
      let sum = 0;
      for (let i = 0; i < starts.length; i++) sum += (starts[i] - c[i % n]) ** 2;
      return Math.sqrt(sum / starts.length);
    };
    const ratio = rms(plant.simulate({ ...opts, runStarts: 'wide' }).startStates) / rms(plant.simulate(opts).startStates);
    expect(ratio).toBeCloseTo(2, 9);
  });

  it.each(lq.map((p) => [p.name, p] as const))('%s logs states with the exact stationary mean and covariance', (_, plant) => {
    const data = plant.simulate({ transitions: 200_000, seed: 11 });
    const { mean, covariance } = plant.lq.stationaryStart, n = plant.stateDim;
    for (let i = 0; i < n; i++) {
      let m = 0;
      for (let r = 0; r < data.count; r++) m += data.states[r * n + i] / data.count;
      let v = 0;
      for (let r = 0; r < data.count; r++) v += (data.states[r * n + i] - m) ** 2 / data.count;
      // Serially correlated samples: the effective count is smaller, so the tolerances are generous
      // (a wrong Lyapunov solve or sign error moves these by tens of per cent).
      const sd = Math.sqrt(covariance[i * n + i]);
      expect(Math.abs(m - mean[i])).toBeLessThan(0.05 * sd);
      expect(v / covariance[i * n + i]).toBeGreaterThan(0.92);
      expect(v / covariance[i * n + i]).toBeLessThan(1.08);
    }
  });

  it('has a rollout truth that agrees with the closed form (checks the rollout machinery)', () => {
    const plant = batteryPlant('lq3-oven-g0.97') as LinearQuadraticBatteryPlant;
    const candidate = candidateNamed(plant, 'offCentre'), set = startSetNamed(plant, 'wide');
    const exact = plant.truth(candidate.name, set.name).value;
    const rolled = rolloutTruth(linearDynamics(plant.lq.plant, plant.lq.operatingPoint), candidate.spec, plant.discount, set, { rolloutsPerStart: 20, seed: 5 });
    expect(Math.abs(rolled.value - exact)).toBeLessThan(3.5 * rolled.standardError);
    expect(rolled.standardError / Math.abs(exact)).toBeLessThan(0.01);
  });

  it('has per-state rollout values that agree with the closed-form V(s0) state by state, and average to the rollout truth', () => {
    const plant = batteryPlant('lq2-vessel-g0.90') as LinearQuadraticBatteryPlant;
    const candidate = candidateNamed(plant, plant.candidates[0].name), set = startSetNamed(plant, 'wide'), count = 12;
    const states = set.states.subarray(0, count * plant.stateDim), options = { rolloutsPerStart: 200, seed: 6 };
    const dynamics = linearDynamics(plant.lq.plant, plant.lq.operatingPoint);
    const rolled = rolloutStateValues(dynamics, candidate.spec, plant.discount, states, count, options);
    const form = lqClosedForm(plant.lq.plant, plant.lq.operatingPoint, createGaussianPolicy(candidate.spec, plant.stateDim), plant.discount);
    for (let k = 0; k < count; k++) {
      const exact = rewardFromCost(closedFormStateCost(form, states, k * plant.stateDim));
      const standardError = Math.sqrt(rolled.variances[k] / options.rolloutsPerStart);
      expect(Math.abs(rolled.values[k] - exact)).toBeLessThan(4 * standardError); // 12 states at 4 standard errors: a false alarm below 0.1 %
    }
    const subset = { name: 'first', description: '', states: Float64Array.from(states), count };
    expect(rolloutTruth(dynamics, candidate.spec, plant.discount, subset, options).value).toBe(rolled.values.reduce((a, b) => a + b, 0) / count);
  });
});

describe('nonlinear battery plants', () => {
  it('log the greenhouse heater at its limits on a good share of steps', () => {
    const data = batteryPlant('greenhouse-clipped-g0.95').simulate({ transitions: 20_000, seed: 2 });
    const atLimit = data.actions.filter((a) => a === 0 || a === 1).length / data.count;
    expect(atLimit).toBeGreaterThan(0.1);
  });

  it('log pendulum torque commands beyond the motor limit on a share of steps', () => {
    const data = batteryPlant('pendulum-saturating-g0.97').simulate({ transitions: 20_000, seed: 2 });
    const beyond = data.actions.filter((a) => Math.abs(a) > PENDULUM_TORQUE_LIMIT).length / data.count;
    expect(beyond).toBeGreaterThan(0.03);
  });
});
