/**
 * J(π) by simulating the candidate on a fitted one-step model (polynomialDynamicsModel.ts): from each
 * start state, R rollouts of L steps with actions drawn from π (its limits applied) and model noise,
 *   Ĵ = Σ_s c_s (1/R) Σ_r Σ_{t<L} γ^t r̂(s_t, a_t) / Σ_s c_s,
 * the direct model-based estimate (Sutton & Barto, "Reinforcement Learning", 2nd ed., §8.1; Paduraru,
 * "Off-policy evaluation in Markov decision processes", PhD thesis, McGill 2013, on its bias-variance).
 * L is the smallest with γ^L ≤ TAIL_WEIGHT, so the cut-off discards at most that share of a bounded
 * reward stream's weight.
 *
 * Leaving the logs: a fitted polynomial extrapolates without limit, so each simulated state is held
 * to the logged range widened by RANGE_MARGIN of its width on each side, and two shares are returned:
 * of the discounted steps at which that box was reached, and of the model's discounted |reward|
 * collected in held states (a reward r̂(s_t, a_t) whose s_t was held at the box),
 *   h = Σ_s c_s Σ_r Σ_t γ^t |r̂_t| [s_t held] / Σ_s c_s Σ_r Σ_t γ^t |r̂_t|,
 * the part of Ĵ that rests on extrapolated dynamics. A few held steps can carry most of the value
 * where the model runs away to states far costlier than any logged (crossCheckVerdict.ts).
 *
 * Runs that end: with an end-chance model (endChanceModel.ts) a rollout ends after step t with
 * probability P(end | s_t, a_t), drawn after the step's noise, and pays nothing more (V = 0 in the end
 * state); without one (a log with no end state) it goes on to L and draws exactly as before.
 *
 * Seeded: rollout r of start s uses the stream createRandom(seed + s·R + r), so a bootstrap
 * replicate with the same seed reuses the same random numbers (common random numbers; Glasserman,
 * "Monte Carlo Methods in Financial Engineering", 2003, ch. 4; section from memory) and its spread is the models' spread.
 * Monte Carlo standard error: from the spread of the R rollouts within each start (R ≥ 2), given the
 * fitted model and the start states.
 *
 * Shapes: startStates e×ds; weights e.
 */
import type { GaussianPolicy } from '../policy';
import { sampleAction } from '../policy';
import { leadsPolynomial } from '../features/polynomialFeatures';
import { createRandom } from '../random';
import type { RandomStreams } from '../recordedRandom';
import { endChance, type EndChanceFit } from './endChanceModel';
import { ModelValueError } from './modelBasedValue';
import type { PolynomialModelFit } from './polynomialDynamicsModel';

/** γ^L at the cut-off (our choice: a tenth of a percent of the weight). */
export const TAIL_WEIGHT = 1e-3;
/** Share of the logged range added on each side before a simulated state is held (our choice). */
export const RANGE_MARGIN = 0.25;

export interface RolloutSettings {
  readonly rolloutsPerStart: number; // R ≥ 2
  readonly seed: number;
}

export interface RolloutValue {
  readonly value: number; // Ĵ, reward sense
  readonly monteCarloError: number; // standard error of Ĵ from the rollouts' noise alone
  readonly steps: number; // L
  /** Σ_t γ^t [state held at the range box] / Σ_t γ^t over the steps simulated (to the end where a run ends), averaged over rollouts. */
  readonly shareOutsideLogs: number;
  /** Σ γ^t |r̂_t| over the rewards collected in held states / Σ γ^t |r̂_t|, summed over starts (weighted) and rollouts; 0 when no reward is collected. */
  readonly rewardShareAtEdge: number;
}

/**
 * ends: the chance that a step ends the run (fitted on the reward's features ψ), or null/omitted where runs do not end.
 * streams: where a rollout's stream comes from (createRandom; recordedStreams gives the same numbers, drawn once for many calls).
 */
export function modelRolloutValue(
  model: PolynomialModelFit, policy: GaussianPolicy, discount: number, startStates: Float64Array, settings: RolloutSettings, weights?: ArrayLike<number> | null,
  ends?: EndChanceFit | null, streams: RandomStreams = createRandom,
): RolloutValue {
  const ds = model.regressions.stateDim, e = startStates.length / ds, rolls = settings.rolloutsPerStart;
  if (!(discount > 0 && discount < 1)) throw new ModelValueError(`model rollouts: the discount must lie in (0, 1), got ${discount}`);
  if (!(Number.isInteger(rolls) && rolls >= 2)) throw new ModelValueError(`model rollouts: need at least 2 rollouts per start, got ${rolls}`);
  if (policy.stateDim !== ds || policy.actionDim !== model.regressions.actionDim) throw new ModelValueError('model rollouts: the policy does not match the model’s states and actions');
  const steps = Math.ceil(Math.log(TAIL_WEIGHT) / Math.log(discount));
  if (ends && ends.features !== model.regressions.rewardFeatures) throw new ModelValueError('model rollouts: the end chance must be fitted on the reward’s features');
  const sim = simulator(model, policy, discount, steps, ends ?? null, streams);
  let total = 0, weightSum = 0, variance = 0, outside = 0, heldMagnitude = 0, magnitude = 0;
  for (let s = 0; s < e; s++) {
    const c = weights ? weights[s] : 1;
    if (c === 0) continue;
    let sum = 0, squares = 0;
    for (let r = 0; r < rolls; r++) {
      const { value, held, size, heldSize } = sim(startStates, s * ds, settings.seed + s * rolls + r);
      sum += value;
      magnitude += c * size;
      heldMagnitude += c * heldSize;
      squares += value * value;
      outside += (c * held) / rolls;
    }
    const mean = sum / rolls;
    total += c * mean;
    weightSum += c;
    variance += (c * c * Math.max(0, squares - rolls * mean * mean)) / (rolls - 1) / rolls;
  }
  if (!(weightSum > 0)) throw new ModelValueError('model rollouts: no start state has a positive weight');
  return { value: total / weightSum, monteCarloError: Math.sqrt(variance) / weightSum, steps, shareOutsideLogs: outside / weightSum,
    rewardShareAtEdge: magnitude > 0 ? heldMagnitude / magnitude : 0 };
}

/**
 * One rollout from a start: its discounted reward sum, its discounted share of held steps, and its
 * discounted |reward| in all (size) and in held states (heldSize; the start state is never held).
 * Where the reward's monomials lead the dynamics' (a lower degree on the same standardised inputs),
 * ψ is the leading part of φ, evaluated once: the same products, so the same numbers.
 */
function simulator(model: PolynomialModelFit, policy: GaussianPolicy, discount: number, steps: number, ends: EndChanceFit | null, streams: RandomStreams) {
  const { regressions: reg, dynamicsWeights: bw, rewardWeights: cw, noiseFactor: l } = model;
  const ds = reg.stateDim, m = reg.actionDim, d = reg.dynamicsFeatures.dim, dr = reg.rewardFeatures.dim;
  const low = reg.stateLow.map((v, c) => v - RANGE_MARGIN * (reg.stateHigh[c] - v));
  const high = reg.stateHigh.map((v, c) => v + RANGE_MARGIN * (v - reg.stateLow[c]));
  const input = new Float64Array(ds + m), action = new Float64Array(m), phi = new Float64Array(d), z = new Float64Array(ds);
  const leading = leadsPolynomial(reg.rewardFeatures, reg.dynamicsFeatures), psi = leading ? phi.subarray(0, dr) : new Float64Array(dr);
  return (starts: Float64Array, offset: number, seed: number): { value: number; held: number; size: number; heldSize: number } => {
    const rng = streams(seed);
    for (let c = 0; c < ds; c++) input[c] = starts[offset + c];
    let value = 0, held = 0, power = 1, simulated = 0, size = 0, heldSize = 0, inHeldState = false;
    for (let t = 0; t < steps; t++, power *= discount) {
      sampleAction(policy, input, rng, action);
      input.set(action, ds);
      if (leading) reg.dynamicsFeatures.evaluate(input, 0, phi, 0);
      else reg.rewardFeatures.evaluate(input, 0, psi, 0);
      let r = 0;
      for (let j = 0; j < dr; j++) r += cw[j] * psi[j];
      value += power * r;
      size += power * Math.abs(r);
      if (inHeldState) heldSize += power * Math.abs(r);
      if (!leading) reg.dynamicsFeatures.evaluate(input, 0, phi, 0);
      for (let c = 0; c < ds; c++) z[c] = rng.normal();
      let atBox = false;
      for (let c = 0; c < ds; c++) {
        let next = input[c];
        for (let j = 0; j < d; j++) next += bw[j * ds + c] * phi[j];
        for (let k = 0; k <= c; k++) next += l[c * ds + k] * z[k];
        if (next < low[c] || next > high[c]) atBox = true;
        input[c] = Math.min(high[c], Math.max(low[c], next));
      }
      if (atBox) held += power;
      inHeldState = atBox;
      simulated += power;
      if (ends && rng.uniform() < endChance(ends, psi)) break;
    }
    // Over the steps this run had (L where runs do not end): one that ended early and spent them all at the box is held throughout.
    return { value, held: held / simulated, size, heldSize };
  };
}
