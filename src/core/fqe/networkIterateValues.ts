/**
 * What one outer iteration measures and regresses on, given its last layer v = [linear; hidden]
 * (Q = φᵀ·linear + hᵀ·hidden):
 *   J_k = mean over start states of ξ(s0)ᵀv, and Q_k on the probe rows (networkValueRows.ts);
 *   the Bellman targets of Q_k in network units, t_i = (r_i + P_iᵀv − φ_iᵀw1)/scale, which the
 *   network output f = (Q − φᵀw1)/scale is regressed on (P_i: discounted next-state features);
 *   the mean squared Bellman residual of Q_k on held-out episodes, a diagnostic only.
 */
import * as tf from '@tensorflow/tfjs';
import type { IterationValues } from './networkConvergence';
import type { FitSession, LinearRows } from './networkFitSession';
import { hiddenFeatureRows, type HiddenFeatureRows } from './networkHiddenFeatures';
import type { LastLayer } from './networkOutputLayer';
import { partCancellation } from './networkPartCancellation';
import { jointRowsAt, rowValues, startFeatureRows, type FeatureNetwork } from './networkValueRows';

export interface MeasuredIterate extends IterationValues {
  /** max |V| over the start states and |Q| over the probe rows, for the divergence check. */
  readonly reach: number;
  /** κ of networkPartCancellation.ts on the probe rows: how much the polynomial and hidden parts cancel. */
  readonly cancellation: number;
}

export function featureNetwork(s: FitSession, theta: tf.Tensor1D = s.net.theta): FeatureNetwork {
  return { theta, layout: s.layout, activation: s.net.activation, standardiser: s.standardiser, linearFeatures: s.linear.training.part.features };
}

export function jointWeights(lastLayer: LastLayer): Float64Array {
  const v = new Float64Array(lastLayer.linear.length + lastLayer.hidden.length);
  v.set(lastLayer.linear, 0);
  v.set(lastLayer.hidden, lastLayer.linear.length);
  return v;
}

export function measureIterate(s: FitSession, lastLayer: LastLayer, startStates: Float64Array, ds: number): MeasuredIterate {
  const net = featureNetwork(s), v = jointWeights(lastLayer), d = v.length;
  const starts = rowValues(startFeatureRows(net, s.quadrature, startStates, ds), v, d);
  const probeRows = jointRowsAt(net, s.probe.inputs, s.probe.linear), probe = rowValues(probeRows, v, d);
  let sum = 0, reach = 0;
  for (const x of starts) {
    sum += x;
    reach = Math.max(reach, Math.abs(x));
  }
  for (const x of probe) reach = Math.max(reach, Math.abs(x));
  if (!starts.every(Number.isFinite) || !probe.every(Number.isFinite)) reach = NaN;
  return { policyValue: sum / starts.length, probe, reach, cancellation: partCancellation(probeRows, v, d, lastLayer.linear.length) };
}

/** t (n, network units) for the training rows; w1: the quadratic weights the network output sits on. */
export function regressionTargets(s: FitSession, features: HiddenFeatureRows, lastLayer: LastLayer, w1: Float64Array): tf.Tensor1D {
  const { part, rewards } = s.linear.training, d1 = part.dim, n = rewards.length, scale = s.output.scale;
  const base = new Float32Array(n);
  for (let i = 0; i < n; i++) {
    let next = 0, here = 0;
    for (let f = 0; f < d1; f++) {
      next += part.nextRows[i * d1 + f] * lastLayer.linear[f];
      here += part.rows[i * d1 + f] * w1[f];
    }
    base[i] = (rewards[i] + next - here) / scale;
  }
  const hidden = Float32Array.from(lastLayer.hidden, (w) => w / scale);
  return tf.tidy(() => {
    const nextValue = tf.matMul(features.nextHidden, tf.tensor2d(hidden, [hidden.length, 1]));
    return tf.add(tf.tensor1d(base), tf.reshape(nextValue, [-1])) as tf.Tensor1D;
  });
}

/** Mean of (r + γE Q(s', a') − Q(s, a))² over held-out rows, reward units²; null without hold-out. */
export function heldOutBellmanError(s: FitSession, lastLayer: LastLayer): number | null {
  const rows = s.rows.heldOut, next = s.next.heldOut, linear = s.linear.heldOut;
  if (!rows || !next || !linear) return null;
  const features = hiddenFeatureRows(s.net.theta, s.layout, s.net.activation, rows.inputs, next);
  try {
    return residualMeanSquare(linear, features, lastLayer);
  } finally {
    features.dispose();
  }
}

function residualMeanSquare(linear: LinearRows, features: HiddenFeatureRows, lastLayer: LastLayer): number {
  const { linear: l, hidden: h } = lastLayer;
  return tf.tidy(() => {
    const lv = tf.tensor2d(Float32Array.from(l), [l.length, 1]), hv = tf.tensor2d(Float32Array.from(h), [h.length, 1]);
    const q = tf.add(tf.matMul(linear.tensors.rows, lv), tf.matMul(features.hidden, hv));
    const y = tf.add(linear.tensors.rewards, tf.add(tf.matMul(linear.tensors.nextRows, lv), tf.matMul(features.nextHidden, hv)));
    return tf.mean(tf.squaredDifference(q, y)).dataSync()[0];
  });
}
