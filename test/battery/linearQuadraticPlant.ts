/**
 * Battery plants that are linear with quadratic cost and Gaussian noise, so the value of every
 * affine Gaussian candidate is known exactly (src/core/lq.ts: discrete Lyapunov equation for the
 * quadratic part, then the linear and constant parts; Bertsekas, "Dynamic Programming and Optimal
 * Control", Vol. I, ch. 4). In absolute coordinates around the operating point (x_sp, u_sp):
 *   s' = x_sp + A(s − x_sp) + B(a − u_sp) + w,  w ~ N(0, W);  cost = xᵀQx + vᵀRv, x = s − x_sp, v = a − u_sp.
 * Episodes start in the exact steady state of the logging controller a = offset + G·s + N(0, S):
 * with F = A + BG and x̄, Σ its stationary mean and covariance (deviation coordinates),
 *   x̄ = (I − F)⁻¹ B d,   Σ = FΣFᵀ + BSBᵀ + W   (d = offset + G·x_sp − u_sp; common practice for
 * linear-Gaussian systems, e.g. Anderson & Moore, "Optimal Filtering", 1979, ch. 2), so the logs
 * are stationary from their first row.
 */
import {
  closedFormPolicyCost, lqClosedForm, rewardFromCost, type LinearQuadraticPlant, type OperatingPoint,
} from '../../src/core/lq';
import { cholesky, identity, multiply, solve, transpose } from '../../src/core/linalg/dense';
import { solveDiscreteLyapunov } from '../../src/core/linalg/lyapunov';
import { createGaussianPolicy, type GaussianPolicySpec } from '../../src/core/policy';
import type { RandomSource } from '../../src/core/random';
import { candidateNamed, startSetNamed, type BatteryPlant, type PlantDescription, type BatteryTruth, type StartSet } from './batteryPlant';
import { episodesFor, logEpisodes, type PlantDynamics, type StartSampler } from './episodeLog';
import { runStartSampler, standardStartSets } from './startSets';

export interface LinearQuadraticDefinition extends PlantDescription {
  readonly plant: LinearQuadraticPlant; // deviation coordinates
  readonly operatingPoint: OperatingPoint;
  readonly behaviour: GaussianPolicySpec; // absolute coordinates, unbounded
}

/** The stationary law of the logged state under the behaviour policy, absolute coordinates. */
export interface StationaryStart {
  readonly mean: Float64Array; // ds
  readonly covariance: Float64Array; // ds×ds
}

export interface LinearQuadraticBatteryPlant extends BatteryPlant {
  readonly kind: 'linearQuadratic';
  /** Everything an exact computation needs (issue work on occupancies and PI loops builds on these). */
  readonly lq: {
    readonly plant: LinearQuadraticPlant;
    readonly operatingPoint: OperatingPoint;
    readonly stationaryStart: StationaryStart;
  };
}

export function linearQuadraticBatteryPlant(def: LinearQuadraticDefinition): LinearQuadraticBatteryPlant {
  const dynamics = linearDynamics(def.plant, def.operatingPoint);
  const stationaryStart = stationaryLaw(def);
  const sampler = gaussianSampler(stationaryStart);
  let sets: StartSet[] | null = null;
  const truths = new Map<string, BatteryTruth>();
  const plant: LinearQuadraticBatteryPlant = {
    name: def.name, description: def.description, kind: 'linearQuadratic',
    stateDim: def.plant.stateDim, actionDim: def.plant.actionDim, stateNames: def.stateNames, actionNames: def.actionNames,
    discount: def.discount, stepsPerEpisode: def.stepsPerEpisode, behaviour: def.behaviour, candidates: def.candidates,
    lq: { plant: def.plant, operatingPoint: def.operatingPoint, stationaryStart },
    simulate: (o) => {
      const steps = o.stepsPerEpisode ?? def.stepsPerEpisode;
      return logEpisodes(dynamics, createGaussianPolicy(def.behaviour, def.plant.stateDim), runStartSampler(sampler, def.operatingPoint.state, o.runStarts), {
        episodes: episodesFor(o.transitions, steps), stepsPerEpisode: steps, seed: o.seed, stateNames: def.stateNames, actionNames: def.actionNames,
      });
    },
    startSets: () => (sets ??= standardStartSets(sampler, def.operatingPoint.state)),
    truth: (candidate, setName) => {
      const key = `${candidate}|${setName}`;
      if (!truths.has(key)) {
        const spec = candidateNamed(plant, candidate).spec, set = startSetNamed(plant, setName);
        const form = lqClosedForm(def.plant, def.operatingPoint, createGaussianPolicy(spec, def.plant.stateDim), def.discount);
        const value = rewardFromCost(closedFormPolicyCost(form, set.states, set.count));
        truths.set(key, { value, standardError: 0, method: 'lyapunov', note: 'closed form (discrete Lyapunov equation, src/core/lq.ts)' });
      }
      return truths.get(key)!;
    },
  };
  return plant;
}

/** s' = x_sp + A(s − x_sp) + B(a − u_sp) + w, cost xᵀQx + vᵀRv. */
export function linearDynamics(p: LinearQuadraticPlant, point: OperatingPoint): PlantDynamics {
  const n = p.stateDim, m = p.actionDim;
  const noise = cholesky(p.processNoiseCovariance, n); // W = LLᵀ (W positive definite here)
  const x = new Float64Array(n), v = new Float64Array(m), z = new Float64Array(n);
  return {
    stateDim: n, actionDim: m,
    step(state, action, rng, next) {
      for (let i = 0; i < n; i++) x[i] = state[i] - point.state[i];
      for (let j = 0; j < m; j++) v[j] = action[j] - point.action[j];
      for (let i = 0; i < n; i++) z[i] = rng.normal();
      let cost = 0;
      for (let i = 0; i < n; i++) {
        let value = point.state[i];
        for (let k = 0; k < n; k++) value += p.dynamics[i * n + k] * x[k] + noise[i * n + k] * z[k];
        for (let j = 0; j < m; j++) value += p.inputGain[i * m + j] * v[j];
        next[i] = value;
        for (let k = 0; k < n; k++) cost += x[i] * p.stateWeight[i * n + k] * x[k];
      }
      for (let j = 0; j < m; j++) for (let k = 0; k < m; k++) cost += v[j] * p.actionWeight[j * m + k] * v[k];
      return cost;
    },
  };
}

function stationaryLaw(def: LinearQuadraticDefinition): StationaryStart {
  const { plant: p, operatingPoint: op } = def, n = p.stateDim, m = p.actionDim;
  const policy = createGaussianPolicy(def.behaviour, n);
  const g = policy.gain;
  const bg = multiply(p.inputGain, g, n, m, n);
  const f = p.dynamics.map((a, i) => a + bg[i]);
  const gx = multiply(g, op.state, m, n, 1);
  const d = policy.offset.map((o, i) => o + gx[i] - op.action[i]);
  const iMinusF = identity(n).map((v, i) => v - f[i]);
  const meanDev = solve(iMinusF, n, multiply(p.inputGain, d, n, m, 1));
  const l = policy.covarianceFactor, s = multiply(l, transpose(l, m, m), m, m, m);
  const bsbt = multiply(p.inputGain, multiply(s, transpose(p.inputGain, n, m), m, m, n), n, m, n);
  const c = bsbt.map((v, i) => v + p.processNoiseCovariance[i]);
  const covariance = solveDiscreteLyapunov(transpose(f, n, n), c, n, 1);
  return { mean: meanDev.map((v, i) => v + op.state[i]), covariance };
}

function gaussianSampler(law: StationaryStart): StartSampler {
  const n = law.mean.length, l = cholesky(law.covariance, n), z = new Float64Array(n);
  return (rng: RandomSource, out: Float64Array) => {
    for (let i = 0; i < n; i++) z[i] = rng.normal();
    for (let i = 0; i < n; i++) {
      let v = law.mean[i];
      for (let k = 0; k <= i; k++) v += l[i * n + k] * z[k];
      out[i] = v;
    }
  };
}
