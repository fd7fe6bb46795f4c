/**
 * The fixed affine map from network output q to action value: Q = offset + scale·q.
 *
 * Why: Adam moves each weight by about the learning rate per step, so a network asked to output
 * raw values of order mean(r)/(1−γ) (hundreds, in plant cost units) would spend most of its steps
 * walking its output bias there. Regressing on standardised targets is common practice; here the
 * map is chosen once from the rewards — offset mean(r)/(1−γ) is the value of earning the average
 * logged reward forever, scale sd(r)/(1−γ) bounds how far values can spread — and kept for the
 * whole fit, so that warm-starting each outer iteration from the last network stays meaningful
 * (re-standardising every iteration would change what the weights mean).
 */
import { FqeDataError } from './fqeErrors';

export interface OutputScale {
  readonly offset: number; // reward units
  readonly scale: number; // reward units per network unit, > 0
}

/** rewards: n; discount γ ∈ [0, 1). */
export function outputScaleOf(rewards: Float64Array, discount: number): OutputScale {
  const n = rewards.length;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += rewards[i];
  const mean = sum / n;
  let squares = 0; // two-pass variance (Chan, Golub & LeVeque, 1983)
  for (let i = 0; i < n; i++) squares += (rewards[i] - mean) ** 2;
  const sd = Math.sqrt(squares / n);
  if (!Number.isFinite(mean) || !Number.isFinite(sd)) throw new FqeDataError('rewards: contain a non-finite value');
  // Constant rewards have no spread to scale by; their magnitude (or 1 for all-zero rewards) sets the scale instead.
  const spread = sd > 1e-12 * Math.abs(mean) ? sd : Math.max(Math.abs(mean), 1);
  return { offset: mean / (1 - discount), scale: spread / (1 - discount) };
}

/** max_i |r_i|: every policy's true |Q| is at most this/(1−γ) (geometric series of bounded rewards). */
export function largestReward(rewards: Float64Array): number {
  let largest = 0;
  for (let i = 0; i < rewards.length; i++) largest = Math.max(largest, Math.abs(rewards[i]));
  return largest;
}
