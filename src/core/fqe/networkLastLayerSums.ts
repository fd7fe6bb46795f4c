/**
 * Sums of the last layer's least-squares system. With the joint features F_i = [φ_i, h_i]
 * (d = d1 + dh: the quadratic part and the hidden features) and their discounted next-state
 * averages P_i = [ψφ_i, ψh_i], a set of rows R contributes
 *   G_R = Σ_{i∈R} F_i F_iᵀ,   M_R = Σ_{i∈R} F_i P_iᵀ,   b_R = Σ_{i∈R} F_i r_i,   n_R = |R|,
 * the LSTD-Q sums (Lagoudakis & Parr 2003, §5) on these features.
 *
 * Two ways to form them, both reusing the exact double-precision sums of the quadratic part
 * (linearPartSums; φ never changes, so they are formed once per fit):
 *   - lastLayerTotals, every outer iteration: the blocks that involve h by six float32 matrix
 *     products over all training rows in TF.js (Φᵀ kept transposed; Hᵀ formed once per call).
 *     Why not per-block products added in double: measured on wasm, every fresh operand of a
 *     product is repacked and every slice, transpose or concat copies element by element, so
 *     fewer, larger products are several times faster. Their float32 rounding grows like √n·u
 *     for typical sums (u = 2⁻²⁴; Higham, "Accuracy and Stability of Numerical Algorithms", 2nd
 *     ed., §4.2), and it touches only the hidden feature's correction to Q; the test compares
 *     the resulting J with a double-precision solve.
 *   - episodeLastLayerSums, once per fit, per episode for the bootstrap, in double precision
 *     from the downloaded features.
 *
 * Packed layout (stride = d(2d+1) + 1): row a holds [G_a· | M_a· | b_a], then n_R.
 */
import * as tf from '@tensorflow/tfjs';
import type { HiddenFeatureRows } from './networkHiddenFeatures';
import type { LinearPart } from './networkLinearPart';

export interface LastLayerSums {
  readonly dim: number; // d = d1 + dh
  readonly linearDim: number; // d1
  readonly ranges: number;
  readonly stride: number; // d(2d + 1) + 1
  readonly sums: Float64Array; // ranges×stride
}

/** The fixed tensors of the quadratic part, uploaded once per fit. */
export interface LinearPartTensors {
  readonly rows: tf.Tensor2D; // n×d1 φ
  readonly rowsTransposed: tf.Tensor2D; // d1×n φᵀ
  readonly nextRows: tf.Tensor2D; // n×d1 discounted next φ
  readonly rewards: tf.Tensor2D; // n×1
}

export function lastLayerStride(d: number): number {
  return d * (2 * d + 1) + 1;
}

/** Sums over all training rows. linearTotal: linearPartSums over one range covering them. */
export function lastLayerTotals(tensors: LinearPartTensors, features: HiddenFeatureRows, linearTotal: LastLayerSums): LastLayerSums {
  const d1 = linearTotal.dim, dh = features.hidden.shape[1], d = d1 + dh, stride = lastLayerStride(d), width = 2 * d + 1;
  const parts = tf.tidy(() => {
    const { hidden: h, nextHidden: ph } = features, ht = tf.transpose(h);
    return [
      tf.matMul(tensors.rowsTransposed, h), tf.matMul(tensors.rowsTransposed, ph), // Φᵀh, Φᵀψh: d1×dh
      tf.matMul(ht, h), tf.matMul(ht, ph), tf.matMul(ht, tensors.nextRows), tf.matMul(ht, tensors.rewards), // hᵀh, hᵀψh: dh×dh; hᵀψφ: dh×d1; hᵀr: dh×1
    ];
  });
  const [gLh, mLh, gHh, mHh, mHl, bH] = parts.map((t) => t.dataSync());
  tf.dispose(parts);
  const out = new Float64Array(stride);
  copyLinearBlocks(linearTotal, 0, out, 0, d);
  for (let a = 0; a < d1; a++) {
    for (let j = 0; j < dh; j++) {
      out[a * width + d1 + j] = gLh[a * dh + j];
      out[(d1 + j) * width + a] = gLh[a * dh + j];
      out[a * width + d + d1 + j] = mLh[a * dh + j];
    }
  }
  for (let i = 0; i < dh; i++) {
    const row = (d1 + i) * width;
    for (let j = 0; j < dh; j++) {
      out[row + d1 + j] = gHh[i * dh + j];
      out[row + d + d1 + j] = mHh[i * dh + j];
    }
    for (let a = 0; a < d1; a++) out[row + d + a] = mHl[i * d1 + a];
    out[row + 2 * d] = bH[i];
  }
  out[stride - 1] = linearTotal.sums[linearTotal.stride - 1];
  return { dim: d, linearDim: d1, ranges: 1, stride, sums: out };
}

/**
 * Sums per range (ranges: [start, end) pairs, flattened) in double precision. hidden, nextHidden:
 * n×dh downloaded features; linear: linearPartSums over the same ranges.
 */
export function episodeLastLayerSums(
  part: LinearPart, rewards: Float64Array, hidden: Float32Array, nextHidden: Float32Array, dh: number, linear: LastLayerSums, ranges: Int32Array,
): LastLayerSums {
  const d1 = part.dim, d = d1 + dh, stride = lastLayerStride(d), width = 2 * d + 1, count = ranges.length / 2;
  const sums = new Float64Array(count * stride), f = new Float64Array(d), p = new Float64Array(d);
  for (let r = 0; r < count; r++) {
    const o = r * stride;
    for (let i = ranges[2 * r]; i < ranges[2 * r + 1]; i++) {
      for (let a = 0; a < d1; a++) {
        f[a] = part.rows[i * d1 + a];
        p[a] = part.nextRows[i * d1 + a];
      }
      for (let j = 0; j < dh; j++) {
        f[d1 + j] = hidden[i * dh + j];
        p[d1 + j] = nextHidden[i * dh + j];
      }
      addRow(f, p, rewards[i], d, d1, sums, o, width);
    }
    for (let a = d1; a < d; a++) for (let b = d1; b < a; b++) sums[o + a * width + b] = sums[o + b * width + a];
    for (let a = 0; a < d1; a++) for (let j = d1; j < d; j++) sums[o + j * width + a] = sums[o + a * width + j];
    copyLinearBlocks(linear, r, sums, o, d);
    sums[o + stride - 1] = ranges[2 * r + 1] - ranges[2 * r];
  }
  return { dim: d, linearDim: d1, ranges: count, stride, sums };
}

/** One row into the hidden blocks: G (upper part of the rows a ≥ d1 and the φh block), all of M's hidden rows and columns, b_h. */
function addRow(f: Float64Array, p: Float64Array, reward: number, d: number, d1: number, out: Float64Array, o: number, width: number): void {
  for (let a = 0; a < d; a++) {
    const fa = f[a], row = o + a * width;
    if (a < d1) {
      for (let b = d1; b < d; b++) {
        out[row + b] += fa * f[b];
        out[row + d + b] += fa * p[b];
      }
      continue;
    }
    for (let b = a; b < d; b++) out[row + b] += fa * f[b];
    for (let b = 0; b < d; b++) out[row + d + b] += fa * p[b];
    out[row + 2 * d] += fa * reward;
  }
}

/** The φφ blocks of G and M and φ's part of b, from linear range r into a packed system of dimension d at offset o. */
function copyLinearBlocks(linear: LastLayerSums, r: number, out: Float64Array, o: number, d: number): void {
  const d1 = linear.dim, lw = 2 * d1 + 1, width = 2 * d + 1, lo = r * linear.stride;
  for (let a = 0; a < d1; a++) {
    for (let b = 0; b < d1; b++) {
      out[o + a * width + b] = linear.sums[lo + a * lw + b];
      out[o + a * width + d + b] = linear.sums[lo + a * lw + d1 + b];
    }
    out[o + a * width + 2 * d] = linear.sums[lo + a * lw + 2 * d1];
  }
}

/**
 * The sums of the quadratic part alone per range, in double precision and in the same layout
 * with d = d1: the linear LSTD-Q system, whose solve is the linear estimate. rewards: n.
 */
export function linearPartSums(linear: LinearPart, rewards: Float64Array, ranges: Int32Array): LastLayerSums {
  const d1 = linear.dim, width = 2 * d1 + 1, stride = lastLayerStride(d1), count = ranges.length / 2;
  const phi = linear.rows, psi = linear.nextRows, out = new Float64Array(count * stride);
  for (let r = 0; r < count; r++) {
    const o = r * stride;
    for (let i = ranges[2 * r]; i < ranges[2 * r + 1]; i++) {
      const row = i * d1;
      for (let a = 0; a < d1; a++) {
        const pa = phi[row + a], oa = o + a * width;
        for (let b = 0; b < d1; b++) {
          out[oa + b] += pa * phi[row + b];
          out[oa + d1 + b] += pa * psi[row + b];
        }
        out[oa + 2 * d1] += pa * rewards[i];
      }
    }
    out[o + stride - 1] = ranges[2 * r + 1] - ranges[2 * r];
  }
  return { dim: d1, linearDim: d1, ranges: count, stride, sums: out };
}

/** Σ_r c_r S_r over ranges (c omitted: all 1), written to out (stride). */
export function combineSums(sums: LastLayerSums, weights?: ArrayLike<number>, out = new Float64Array(sums.stride)): Float64Array {
  out.fill(0);
  for (let r = 0; r < sums.ranges; r++) {
    const c = weights ? weights[r] : 1;
    if (c === 0) continue;
    const o = r * sums.stride;
    for (let k = 0; k < sums.stride; k++) out[k] += c * sums.sums[o + k];
  }
  return out;
}
