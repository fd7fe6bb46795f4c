/**
 * The logged behaviour as a Gaussian policy for importance weights: the fitted linear-Gaussian
 * behaviour model (../behaviourModel.ts) plus the actuator limits the logs show.
 *
 * A limit is read from the logs: when at least max(2, 0.1 % of n) logged values of an action
 * equal its smallest (largest) value exactly, the actuator saturates there (ties at the extreme of
 * a continuous law have probability zero, so repeated extremes mean a limit; the 0.1 % floor keeps
 * coarse logging resolution from looking like a limit — our rule, stated). The behaviour is then
 * clipped at that value, so a logged action at the limit carries the point mass of the clipped
 * Gaussian (importanceRatio.ts). The model itself is ordinary least squares on all rows: with
 * many saturated rows it is only approximate (a censored-regression fit would be exact; Tobin 1958).
 * Clipping needs independent action noise (policy.ts), so with limits the correlations are dropped.
 */
import { fitBehaviourModel, type BehaviourModel } from '../behaviourModel';
import { createGaussianPolicy, type GaussianPolicy } from '../policy';
import type { TransitionSet } from '../transitions';

export interface LoggedActionLimits {
  readonly lo: number[]; // m; -Infinity where no lower limit is seen
  readonly hi: number[]; // m
  /** Share of logged actions at a detected limit, per action. */
  readonly shareAtLimit: number[];
}

export interface FittedBehaviour {
  readonly model: BehaviourModel;
  readonly limits: LoggedActionLimits;
  readonly policy: GaussianPolicy;
}

export function fittedBehaviourPolicy(data: TransitionSet): FittedBehaviour {
  const { count: n, stateDim: ds, actionDim: m } = data;
  const model = fitBehaviourModel(data.states, data.actions, n, ds, m);
  const limits = loggedActionLimits(data);
  const limited = limits.lo.some(Number.isFinite) || limits.hi.some(Number.isFinite);
  const policy = createGaussianPolicy(
    limited
      ? { offset: model.offset, gain: model.gain, std: model.std, bounds: { lo: limits.lo, hi: limits.hi, mode: 'clip' } }
      : { offset: model.offset, gain: model.gain, covariance: model.covariance },
    ds,
  );
  return { model, limits, policy };
}

function loggedActionLimits(data: TransitionSet): LoggedActionLimits {
  const { count: n, actionDim: m, actions } = data;
  const needed = Math.max(2, Math.ceil(0.001 * n));
  const lo: number[] = [], hi: number[] = [], shareAtLimit: number[] = [];
  for (let j = 0; j < m; j++) {
    let min = Infinity, max = -Infinity;
    for (let i = 0; i < n; i++) {
      min = Math.min(min, actions[i * m + j]);
      max = Math.max(max, actions[i * m + j]);
    }
    let atMin = 0, atMax = 0;
    for (let i = 0; i < n; i++) {
      if (actions[i * m + j] === min) atMin++;
      if (actions[i * m + j] === max) atMax++;
    }
    lo.push(atMin >= needed ? min : -Infinity);
    hi.push(atMax >= needed ? max : Infinity);
    shareAtLimit.push(((atMin >= needed ? atMin : 0) + (atMax >= needed ? atMax : 0)) / n);
  }
  return { lo, hi, shareAtLimit };
}
