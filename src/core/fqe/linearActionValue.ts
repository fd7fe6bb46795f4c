/**
 * A linear action-value function Q(s, a) = φ(s, a)ᵀw, and its plain-JSON form (the feature map's
 * specification plus the weights) so a fitted Q can be saved and rebuilt exactly.
 */
import type { ActionValueFunction } from '../actionValue';
import { createFeatureMap, type FeatureMap, type FeatureMapSpec } from '../features/featureMap';
import { FqeOptionsError } from './fqeErrors';

export interface LinearActionValueSpec {
  kind: 'linear';
  stateDim: number;
  actionDim: number;
  features: FeatureMapSpec;
  weights: number[];
}

export interface LinearActionValue extends ActionValueFunction {
  readonly features: FeatureMap;
  readonly weights: Float64Array; // d
  toSpec(): LinearActionValueSpec;
}

export function linearActionValue(features: FeatureMap, weights: ArrayLike<number>, stateDim: number, actionDim: number): LinearActionValue {
  const d = features.dim, p = stateDim + actionDim;
  if (weights.length !== d) throw new FqeOptionsError(`weights: expected ${d} (one per feature), got ${weights.length}`);
  if (features.inputDim !== p) throw new FqeOptionsError(`features: take ${features.inputDim} inputs, but states and actions make ${p}`);
  const w = Float64Array.from(weights);
  w.forEach((v, i) => {
    if (!Number.isFinite(v)) throw new FqeOptionsError(`weights[${i}]: not a finite number (${v})`);
  });
  const phi = new Float64Array(d); // scratch for synchronous evaluate
  return {
    stateDim,
    actionDim,
    features,
    weights: w,
    evaluate(inputs, count, out) {
      for (let i = 0; i < count; i++) {
        features.evaluate(inputs, i * p, phi, 0);
        let q = 0;
        for (let a = 0; a < d; a++) q += w[a] * phi[a];
        out[i] = q;
      }
    },
    toSpec: () => ({ kind: 'linear', stateDim, actionDim, features: features.toSpec(), weights: Array.from(w) }),
  };
}

/** Rebuild from JSON; messages name the field at fault. */
export function createLinearActionValue(spec: LinearActionValueSpec): LinearActionValue {
  if (!spec || spec.kind !== 'linear') throw new FqeOptionsError('action value: expected {"kind": "linear", ...}');
  for (const key of ['stateDim', 'actionDim'] as const) {
    if (!Number.isInteger(spec[key]) || spec[key] < 1) throw new FqeOptionsError(`action value ${key}: expected a whole number ≥ 1, got ${spec[key]}`);
  }
  if (!Array.isArray(spec.weights)) throw new FqeOptionsError('action value weights: expected an array of numbers');
  return linearActionValue(createFeatureMap(spec.features), spec.weights, spec.stateDim, spec.actionDim);
}
