/**
 * A battery plant whose logged state does NOT carry the plant's memory: an invented jacketed vessel
 * (the numbers of lq2-vessel, linearQuadraticCatalogue.ts) whose steam valve acts after a dead time
 * of d samples,
 *   x_{t+1} = x_sp + A(x_t − x_sp) + B(a_{t−d} − u_sp) + w_t,   cost x̃ᵀQx̃ + ṽᵀRṽ, ṽ = a_t − u_sp,
 * (or, with a late share f < 1, a share 1 − f of the valve's effect at once and f after the dead time:
 * B(a_{t−d} − u_sp) becomes B((1 − f)(a_t − u_sp) + f(a_{t−d} − u_sp)), a milder memory), logged, as an engineer typically logs it, as (vessel and jacket temperature, valve) only. Its exact
 * value comes from the augmented state z = (x, a_{t−1}, …, a_{t−d}), which is Markov and linear:
 *   z' = Ā z + B̄ a,  Ā = [A 0 … B; 0 0 … 0; I 0 … 0; …],  B̄ = [0; 1; 0; …],  Q̄ = diag(Q, 0),  W̄ = diag(W, 0)
 * (the standard state augmentation for an input delay; Åström & Wittenmark, "Computer-Controlled
 * Systems", 3rd ed., 1997, §2.3, from memory), solved by the closed form of src/core/lq.ts for a
 * candidate acting on the logged x only (gain [K, 0]) at the augmented start states each logged run
 * really had. So the truth is exact at the starts the product's J is taken over. Invented for the
 * battery (the plant-memory check's threshold was chosen on it); not a hold-out.
 */
import { closedFormPolicyCost, lqClosedForm, rewardFromCost, type LinearQuadraticPlant, type OperatingPoint } from '../../src/core/lq';
import { createGaussianPolicy, type GaussianPolicySpec } from '../../src/core/policy';
import type { TransitionSet } from '../../src/core/transitions';
import { burnInStart, logEpisodes, type PlantDynamics } from './episodeLog';
import { projectSchema, type ProjectDocument } from '../../src/project/schema';

const A = [0.9, 0.08, 0.15, 0.75], B = [0, 0.4], XSP = [60, 45], USP = 35;
const Q = [1, 0.2], R = 0.05, NOISE_STD = [0.15, 0.1];
export const DEAD_TIME_DISCOUNT = 0.95;
export const DEAD_TIME_STEPS = 200;

/** a = u_sp − K(x − x_sp) + N(0, std²) on the logged x, as the engine's affine form; gain 0 on the remembered actions. */
function feedback(k: number[], std: number, delay: number): GaussianPolicySpec {
  return { offset: [USP + k[0] * XSP[0] + k[1] * XSP[1]], gain: [[-k[0], -k[1], ...new Array<number>(delay).fill(0)]], std: [std] };
}

export const DEAD_TIME_BEHAVIOUR = { gain: [0.4, 0.2], std: 1.0 } as const;
export const DEAD_TIME_CANDIDATES = [
  { name: 'firmer', gain: [0.9, 0.35], std: 0.4 },
  { name: 'softer', gain: [0.2, 0.1], std: 0.6 },
] as const;

/** The augmented plant in deviation coordinates (n = 2 + d states). */
export function augmentedPlant(delay: number, late = 1): { plant: LinearQuadraticPlant; point: OperatingPoint } {
  const n = 2 + delay, dynamics = new Float64Array(n * n), inputGain = new Float64Array(n);
  for (let i = 0; i < 2; i++) for (let k = 0; k < 2; k++) dynamics[i * n + k] = A[i * 2 + k];
  if (delay === 0) { inputGain[0] = B[0]; inputGain[1] = B[1]; } else {
    for (let i = 0; i < 2; i++) {
      dynamics[i * n + n - 1] = late * B[i];
      inputGain[i] = (1 - late) * B[i];
    }
    inputGain[2] = 1;
    for (let k = 3; k < n; k++) dynamics[k * n + k - 1] = 1;
  }
  const diag = (v: number[]) => { const out = new Float64Array(n * n); v.forEach((x, i) => (out[i * n + i] = x)); return out; };
  return {
    plant: {
      stateDim: n, actionDim: 1, dynamics, inputGain, processNoiseCovariance: diag(NOISE_STD.map((s) => s * s)),
      stateWeight: diag(Q), actionWeight: Float64Array.of(R),
    },
    point: { state: Float64Array.from([...XSP, ...new Array<number>(delay).fill(USP)]), action: Float64Array.of(USP) },
  };
}

/** The augmented plant as a simulator (noise on the temperatures only). */
export function augmentedDynamics(delay: number, late = 1): PlantDynamics {
  const n = 2 + delay;
  return {
    stateDim: n, actionDim: 1,
    step(s, a, rng, next) {
      const x0 = s[0] - XSP[0], x1 = s[1] - XSP[1], v = a[0] - USP, u = late * ((delay === 0 ? a[0] : s[n - 1]) - USP) + (1 - late) * v;
      next[0] = XSP[0] + A[0] * x0 + A[1] * x1 + B[0] * u + NOISE_STD[0] * rng.normal();
      next[1] = XSP[1] + A[2] * x0 + A[3] * x1 + B[1] * u + NOISE_STD[1] * rng.normal();
      for (let k = n - 1; k >= 3; k--) next[k] = s[k - 1];
      if (delay > 0) next[2] = a[0];
      return Q[0] * x0 * x0 + Q[1] * x1 * x1 + R * v * v;
    },
  };
}

export interface DeadTimeLog {
  /** What the engineer logged: (vessel, jacket temperature) and the valve, no earlier valve positions. */
  readonly logged: TransitionSet;
  /** Each logged run's augmented start state (runs × (2 + d)), for the exact truth. */
  readonly augmentedStarts: Float64Array;
}

export function deadTimeLog(delay: number, runs: number, seed: number, late = 1): DeadTimeLog {
  const dynamics = augmentedDynamics(delay, late), n = 2 + delay;
  const behaviour = createGaussianPolicy(feedback([...DEAD_TIME_BEHAVIOUR.gain], DEAD_TIME_BEHAVIOUR.std, delay), n);
  const centre = [...XSP, ...new Array<number>(delay).fill(USP)];
  const full = logEpisodes(dynamics, behaviour, burnInStart(dynamics, behaviour, centre, 100), {
    episodes: runs, stepsPerEpisode: DEAD_TIME_STEPS, seed, stateNames: ['vessel_temp_c', 'jacket_temp_c', ...Array.from({ length: delay }, (_, k) => `valve_${k + 1}_back`)], actionNames: ['steam_valve_pct'],
  });
  const keep = (values: Float64Array) => Float64Array.from({ length: (values.length / n) * 2 }, (_, k) => values[Math.floor(k / 2) * n + (k % 2)]);
  const logged: TransitionSet = {
    ...full, stateDim: 2, stateNames: full.stateNames.slice(0, 2), states: keep(full.states), nextStates: keep(full.nextStates), startStates: keep(full.startStates),
  };
  return { logged, augmentedStarts: full.startStates };
}

/** The exact J (reward sense) of a candidate over the logged runs' real (augmented) start states. */
export function deadTimeTruth(delay: number, candidate: (typeof DEAD_TIME_CANDIDATES)[number], augmentedStarts: Float64Array, late = 1): number {
  const { plant, point } = augmentedPlant(delay, late), n = 2 + delay;
  const policy = createGaussianPolicy(augmentedCandidate(delay, candidate), n);
  const form = lqClosedForm(plant, point, policy, DEAD_TIME_DISCOUNT);
  return rewardFromCost(closedFormPolicyCost(form, augmentedStarts, augmentedStarts.length / n));
}

/** The candidate on the augmented state (gain 0 on the remembered valve positions). */
export function augmentedCandidate(delay: number, candidate: (typeof DEAD_TIME_CANDIDATES)[number]): GaussianPolicySpec {
  return feedback([...candidate.gain], candidate.std, delay);
}

/** The candidate as the product sees it: a policy on the logged (vessel, jacket) state. */
export function loggedCandidate(candidate: (typeof DEAD_TIME_CANDIDATES)[number]): GaussianPolicySpec {
  return feedback([...candidate.gain], candidate.std, 0);
}

/** A project on the logged vessel (its two temperatures and the valve) with one candidate, linear degree 2: for pipeline tests. */
export function deadTimeProject(candidate: (typeof DEAD_TIME_CANDIDATES)[number] = DEAD_TIME_CANDIDATES[1]): ProjectDocument {
  const { offset, gain, std } = loggedCandidate(candidate);
  return projectSchema.parse({
    format: 'setpoint-critic-project', version: 1, name: 'dead time', data: { path: 'none.csv' },
    columns: { states: [{ column: 'vessel_temp_c' }, { column: 'jacket_temp_c' }], actions: [{ column: 'steam_valve_pct' }], reward: { kind: 'column', column: 'r', sense: 'reward' } },
    discount: DEAD_TIME_DISCOUNT, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
    candidates: [{ name: candidate.name, offset, gain, std }],
  });
}
