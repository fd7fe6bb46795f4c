/**
 * Truth by seeded rollouts, for plants without a closed form: from each start state s0 of a set,
 * R independent rollouts of the candidate policy over H steps give discounted returns G_{s0,r};
 *   V̂(s0) = (1/R) Σ_r G_{s0,r},   Ĵ = (1/S) Σ_{s0} V̂(s0),
 *   SE(Ĵ) = (1/S) √(Σ_{s0} σ̂²_{s0} / R)       (independent rollouts; σ̂² the sample variance per start),
 * common practice for Monte Carlo means. H is chosen so the neglected tail γ^H·max|V| is below
 * 10⁻⁶ of the value (H = ⌈ln 10⁻⁶ / ln γ⌉), far below the standard error. A rollout of a plant
 * whose runs really end (`dynamics.ends`) stops at the absorbing state: its value there is 0.
 */
import { createGaussianPolicy, sampleAction, type GaussianPolicySpec } from '../../src/core/policy';
import { createRandom } from '../../src/core/random';
import type { BatteryTruth, StartSet } from './batteryPlant';
import type { PlantDynamics } from './episodeLog';

export interface RolloutOptions {
  readonly rolloutsPerStart: number; // R
  readonly seed: number;
}

/** Steps after which γ^H < 10⁻⁶. */
export function rolloutHorizon(discount: number): number {
  return Math.ceil(Math.log(1e-6) / Math.log(discount));
}

/** V̂(s0) of each start state with its sample variance σ̂²_{s0} over the R rollouts, in reward terms. */
export interface RolloutStateValues {
  readonly values: Float64Array; // count
  readonly variances: Float64Array; // count
}

/**
 * V̂(s0) for each of `count` states (count×ds row-major), by R rollouts each, all from one random
 * stream in state order (so the J of rolloutTruth is their mean, draw for draw).
 */
export function rolloutStateValues(
  dynamics: PlantDynamics, spec: GaussianPolicySpec, discount: number, states: Float64Array, count: number, options: RolloutOptions,
): RolloutStateValues {
  const ds = dynamics.stateDim, policy = createGaussianPolicy(spec, ds), rng = createRandom(options.seed);
  const horizon = rolloutHorizon(discount), r = options.rolloutsPerStart;
  const s = new Float64Array(ds), a = new Float64Array(dynamics.actionDim), next = new Float64Array(ds);
  const values = new Float64Array(count), variances = new Float64Array(count);
  for (let k = 0; k < count; k++) {
    let sum = 0, squares = 0;
    for (let run = 0; run < r; run++) {
      s.set(states.subarray(k * ds, (k + 1) * ds));
      let g = 0, weight = 1;
      for (let t = 0; t < horizon; t++) {
        sampleAction(policy, s, rng, a);
        g -= weight * dynamics.step(s, a, rng, next);
        weight *= discount;
        s.set(next);
        if (dynamics.ends?.(next)) break;
      }
      sum += g;
      squares += g * g;
    }
    values[k] = sum / r;
    variances[k] = Math.max(0, (squares - r * values[k] * values[k]) / (r - 1));
  }
  return { values, variances };
}

/** J in reward terms (−cost) with its Monte Carlo standard error. */
export function rolloutTruth(
  dynamics: PlantDynamics, spec: GaussianPolicySpec, discount: number, starts: StartSet, options: RolloutOptions,
): BatteryTruth {
  const { values, variances } = rolloutStateValues(dynamics, spec, discount, starts.states, starts.count, options);
  const r = options.rolloutsPerStart, horizon = rolloutHorizon(discount);
  const value = values.reduce((a, b) => a + b, 0) / starts.count;
  const standardError = Math.sqrt(variances.reduce((a, b) => a + b, 0) / r) / starts.count;
  return {
    value, standardError, method: 'rollouts',
    note: `${r} rollouts of ${horizon} steps from each of ${starts.count} start states (seed ${options.seed})`,
  };
}
