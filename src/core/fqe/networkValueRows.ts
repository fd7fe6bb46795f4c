/**
 * Joint feature rows F = [φ, h] (quadratic part, hidden features) at given points, in double
 * precision, so that values are inner products with the last layer v:
 *   start states:  ξ(s0) = Σ_j ω_j F(s0, a_j)  by the action quadrature, V(s0) = ξ(s0)ᵀv, J = ξ̄ᵀv
 *                  (value.ts, by linearity; the same form as ../bootstrap/startFeatures.ts);
 *   probe rows:    F(s_i, a_i) at fixed logged (s, a), so Q on the probe set is F·v.
 *
 * Shapes: states count×ds row-major; results count×d row-major (d = d1 + dh).
 */
import * as tf from '@tensorflow/tfjs';
import type { ActionQuadrature } from '../actionQuadrature';
import type { FeatureMap } from '../features/featureMap';
import { hiddenFeatures } from './networkForward';
import type { NetworkLayout } from './networkParameters';
import type { NetworkActivation } from './networkSettings';
import { standardiseInto, type InputStandardiser } from './networkTrainingSet';

export interface FeatureNetwork {
  readonly theta: tf.Tensor1D;
  readonly layout: NetworkLayout;
  readonly activation: NetworkActivation;
  readonly standardiser: InputStandardiser;
  readonly linearFeatures: FeatureMap;
}

/** Hidden features of raw rows (count×p, unstandardised), downloaded: count×dh. */
function hiddenRowsOf(net: FeatureNetwork, raw: Float64Array, count: number): Float32Array {
  const p = net.layout.inputDim, z = new Float32Array(count * p);
  for (let r = 0; r < count; r++) standardiseInto(raw, r * p, 0, p, net.standardiser, z, r * p);
  // dataSync outside tf.tidy: tidy walks a returned typed array element by element.
  const h = tf.tidy(() => hiddenFeatures(net.theta, net.layout, net.activation, tf.tensor2d(z, [count, p])));
  const values = h.dataSync() as Float32Array;
  h.dispose();
  return values;
}

/** ξ(s0) per start state: count×d. */
export function startFeatureRows(net: FeatureNetwork, quadrature: ActionQuadrature, states: Float64Array, ds: number): Float64Array {
  const m = quadrature.actionDim, p = ds + m, k = quadrature.maxPoints, count = states.length / ds;
  const d1 = net.linearFeatures.dim, dh = net.layout.layers[net.layout.layers.length - 1].inputs, d = d1 + dh;
  const raw = new Float64Array(count * k * p), weights = new Float64Array(count * k);
  const points = new Float64Array(k * m), nodeWeights = new Float64Array(k);
  for (let s = 0; s < count; s++) {
    const used = quadrature.at(states, s * ds, points, nodeWeights);
    for (let j = 0; j < k; j++) {
      const row = (s * k + j) * p, node = j < used ? j : 0; // unused slots repeat node 0 at weight 0
      for (let c = 0; c < ds; c++) raw[row + c] = states[s * ds + c];
      for (let c = 0; c < m; c++) raw[row + ds + c] = points[node * m + c];
      weights[s * k + j] = j < used ? nodeWeights[j] : 0;
    }
  }
  const hidden = hiddenRowsOf(net, raw, count * k), phi = new Float64Array(d1), out = new Float64Array(count * d);
  for (let r = 0; r < count * k; r++) {
    const w = weights[r], o = Math.floor(r / k) * d;
    if (w === 0) continue;
    net.linearFeatures.evaluate(raw, r * p, phi, 0);
    for (let f = 0; f < d1; f++) out[o + f] += w * phi[f];
    for (let f = 0; f < dh; f++) out[o + d1 + f] += w * hidden[r * dh + f];
  }
  return out;
}

/** F at standardised inputs (count×p tensor) whose φ rows are known (count×d1): count×d. */
export function jointRowsAt(net: FeatureNetwork, inputs: tf.Tensor2D, linearRows: Float64Array): Float64Array {
  const count = inputs.shape[0], d1 = net.linearFeatures.dim;
  const h = tf.tidy(() => hiddenFeatures(net.theta, net.layout, net.activation, inputs));
  const hidden = h.dataSync();
  h.dispose();
  const dh = hidden.length / count, d = d1 + dh, out = new Float64Array(count * d);
  for (let r = 0; r < count; r++) {
    for (let f = 0; f < d1; f++) out[r * d + f] = linearRows[r * d1 + f];
    for (let f = 0; f < dh; f++) out[r * d + d1 + f] = hidden[r * dh + f];
  }
  return out;
}

/** rows (count×d) · v, written to a new array of count values. */
export function rowValues(rows: Float64Array, v: ArrayLike<number>, d: number): Float64Array {
  const count = rows.length / d, out = new Float64Array(count);
  for (let r = 0; r < count; r++) {
    let s = 0;
    for (let f = 0; f < d; f++) s += rows[r * d + f] * v[f];
    out[r] = s;
  }
  return out;
}

/** Mean of rows (count×d) weighted by per-row counts (all 1 when omitted): ξ̄. */
export function meanRow(rows: Float64Array, d: number, weights?: ArrayLike<number>): Float64Array {
  const count = rows.length / d, out = new Float64Array(d);
  let total = 0;
  for (let r = 0; r < count; r++) {
    const c = weights ? weights[r] : 1;
    if (c === 0) continue;
    total += c;
    for (let f = 0; f < d; f++) out[f] += c * rows[r * d + f];
  }
  for (let f = 0; f < d; f++) out[f] /= total;
  return out;
}
