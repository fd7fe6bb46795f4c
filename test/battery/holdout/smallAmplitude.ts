/**
 * The linear part of a hold-out plant at small amplitude, for its test: rollouts of the plant's own step
 * from its rest point with every random draw (the process noise and the controller's dither) scaled by ε,
 * summing only a quadratic part of the cost, Σ_t γ^t (x_t − x*)ᵀQ(x_t − x*), divided by ε². As ε → 0 this
 * tends to the discounted cost of the plant linearised at its rest point under the same linear feedback,
 * given in closed form by the discrete Lyapunov equation (Bertsekas, Dynamic Programming and Optimal
 * Control, vol. I, §4.1: V(0) = γ/(1 − γ)·tr(P·(W + B·S·Bᵀ)) with P = Q + γ·A_clᵀ·P·A_cl), which the test
 * forms from a Jacobian written out by hand from the plant's stated equations (src/core/lq.ts's
 * feedbackCostToGo). What is left at ε = 0.01 is of order ε relative: the nonlinear terms.
 */
import { createRandom, type RandomSource } from '../../../src/core/random';
import type { PlantDynamics } from '../episodeLog';
import { rolloutHorizon } from '../rolloutTruth';

export interface SmallAmplitudeRun {
  readonly dynamics: PlantDynamics;
  /** Rest state x* (ds) and the controller there: u = u* + G·(x − x*) + std·ε·z. */
  readonly rest: readonly number[];
  readonly restAction: number;
  readonly gain: readonly number[]; // G: 1×ds
  readonly std: number;
  /** The quadratic part of the stage cost, diagonal weights (ds). */
  readonly weights: readonly number[];
  readonly discount: number;
  readonly scale: number; // ε
  readonly rollouts: number;
  readonly seed: number;
}

/** Σγ^t (x − x*)ᵀQ(x − x*) / ε² from x*, averaged over the rollouts, with its Monte Carlo standard error. */
export function smallAmplitudeQuadraticValue(run: SmallAmplitudeRun): { value: number; standardError: number } {
  const inner = createRandom(run.seed), ds = run.dynamics.stateDim, eps = run.scale;
  const scaled: RandomSource = { normal: () => eps * inner.normal(), uniform: () => inner.uniform(), integer: (n) => inner.integer(n) };
  const horizon = rolloutHorizon(run.discount), s = new Float64Array(ds), next = new Float64Array(ds), a = new Float64Array(1);
  let sum = 0, squares = 0;
  for (let k = 0; k < run.rollouts; k++) {
    s.set(run.rest);
    let g = 0, weight = 1;
    for (let t = 0; t < horizon; t++) {
      let cost = 0, u = run.restAction;
      for (let j = 0; j < ds; j++) {
        cost += run.weights[j] * (s[j] - run.rest[j]) ** 2;
        u += run.gain[j] * (s[j] - run.rest[j]);
      }
      a[0] = u + run.std * scaled.normal();
      g += weight * cost;
      run.dynamics.step(s, a, scaled, next);
      s.set(next);
      weight *= run.discount;
    }
    g /= eps * eps;
    sum += g;
    squares += g * g;
  }
  const mean = sum / run.rollouts;
  return { value: mean, standardError: Math.sqrt((squares / run.rollouts - mean * mean) / (run.rollouts - 1)) };
}
