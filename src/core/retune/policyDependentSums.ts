/**
 * One candidate's pass for a retune map point: Ψ (the candidate-averaged next features, ψ_i = 0
 * past a terminal state) against the kept Φ and r, giving
 *   M = ΦᵀΨ/n,  H = ΨᵀΨ/n,  e = Ψᵀr/n,
 * and with the policy-free G, b, rr (policyFreeSums.ts) the full BellmanStatistics of that
 * candidate — equal to what accumulateBellmanStatistics forms for it, up to the order of summation.
 * Rows are gathered into blocks stored feature-major so each product runs over contiguous memory
 * (blocked summation; Higham, "Accuracy and Stability of Numerical Algorithms", 2nd ed., §4.2).
 * Per episode, when asked for, the block sums also go to the episode's slot, giving the packed
 * per-episode sums the bootstrap resamples (episodeBellmanSums.ts layout).
 *
 * Cost per point: n evaluations of ψ (policyFeatureAverage.ts) plus ≈ 1.5·n·d² multiply-adds;
 * Φ is read, not recomputed, when it was kept.
 */
import type { EpisodeBellmanSums } from '../bootstrap/episodeBellmanSums';
import type { FeatureMap } from '../features/featureMap';
import type { BellmanStatistics } from '../fqe/bellmanStatistics';
import { throwIfCancelled, type CancellationCheck } from '../fqe/cancellation';
import type { TransitionSet } from '../transitions';
import { logged, type PolicyFreeSums } from './policyFreeSums';
import type { PolicyFeatureAverage } from './policyFeatureAverage';

const BLOCK_VALUES = 1 << 16;

export interface PointSums {
  readonly statistics: BellmanStatistics;
  readonly episodeSums: EpisodeBellmanSums | null;
}

interface Slot {
  readonly cross: Float64Array; // d×d
  readonly nextGram: Float64Array; // d×d, upper triangle
  readonly nextReward: Float64Array; // d
}

export function policyDependentSums(
  data: TransitionSet, features: FeatureMap, free: PolicyFreeSums, average: PolicyFeatureAverage, cancel?: CancellationCheck,
): PointSums {
  const d = free.dim, index = free.index, perEpisode = free.episodeSums !== null;
  const rows = Math.max(32, Math.min(1024, Math.floor(BLOCK_VALUES / d)));
  const block = { phi: new Float64Array(d * rows), psi: new Float64Array(d * rows), reward: new Float64Array(rows), input: new Float64Array(data.stateDim + data.actionDim), row: new Float64Array(d) };
  const total = newSlot(d), packed = perEpisode ? newPacked(free) : null;
  for (let k = 0; k < index.episodes; k++) {
    if (k % 16 === 0) throwIfCancelled(cancel);
    const slot = packed ? packedSlot(packed, k, d) : total;
    for (let from = index.offsets[k]; from < index.offsets[k + 1]; from += rows) {
      const size = Math.min(rows, index.offsets[k + 1] - from);
      gather(data, features, free, average, block, from, size, rows);
      addBlock(block.phi, block.psi, block.reward, size, rows, d, slot);
    }
    if (packed) {
      addSlot(slot, total, d);
      mirrorInPlace(slot.nextGram, d);
    }
  }
  return { statistics: statisticsOf(free, total), episodeSums: packed };
}

function newSlot(d: number): Slot {
  return { cross: new Float64Array(d * d), nextGram: new Float64Array(d * d), nextReward: new Float64Array(d) };
}

/** Block rows t = 0..size−1 hold transitions index.order[from + t], feature-major. */
function gather(
  data: TransitionSet, features: FeatureMap, free: PolicyFreeSums, average: PolicyFeatureAverage,
  block: { phi: Float64Array; psi: Float64Array; reward: Float64Array; input: Float64Array; row: Float64Array }, from: number, size: number, rows: number,
): void {
  const d = free.dim, ds = data.stateDim, order = free.index.order, stored = free.features, row = block.row;
  for (let t = 0; t < size; t++) {
    const i = order[from + t];
    if (stored) for (let a = 0; a < d; a++) block.phi[a * rows + t] = stored[(from + t) * d + a];
    else {
      logged(data, i, block.input);
      features.evaluate(block.input, 0, row, 0);
      for (let a = 0; a < d; a++) block.phi[a * rows + t] = row[a];
    }
    if (data.terminal[i] !== 0) row.fill(0);
    else average.average(data.nextStates, i * ds, row, 0);
    for (let a = 0; a < d; a++) block.psi[a * rows + t] = row[a];
    block.reward[t] = data.rewards[i];
  }
}

/** slot += block sums of ΦᵀΨ, ΨᵀΨ (upper triangle) and Ψᵀr over the first `size` rows. */
function addBlock(phi: Float64Array, psi: Float64Array, reward: Float64Array, size: number, rows: number, d: number, slot: Slot): void {
  for (let a = 0; a < d; a++) {
    const oa = a * rows;
    for (let b = 0; b < d; b++) {
      const ob = b * rows;
      let m = 0;
      for (let t = 0; t < size; t++) m += phi[oa + t] * psi[ob + t];
      slot.cross[a * d + b] += m;
      if (b < a) continue;
      let h = 0;
      for (let t = 0; t < size; t++) h += psi[oa + t] * psi[ob + t];
      slot.nextGram[a * d + b] += h;
    }
    let e = 0;
    for (let t = 0; t < size; t++) e += psi[oa + t] * reward[t];
    slot.nextReward[a] += e;
  }
}

function addSlot(from: Slot, to: Slot, d: number): void {
  for (let j = 0; j < d * d; j++) {
    to.cross[j] += from.cross[j];
    to.nextGram[j] += from.nextGram[j];
  }
  for (let j = 0; j < d; j++) to.nextReward[j] += from.nextReward[j];
}

function mirrored(upper: Float64Array, d: number, scale: number): Float64Array {
  const out = new Float64Array(d * d);
  for (let a = 0; a < d; a++) for (let b = a; b < d; b++) out[a * d + b] = out[b * d + a] = upper[a * d + b] * scale;
  return out;
}

function statisticsOf(free: PolicyFreeSums, total: Slot): BellmanStatistics {
  const n = free.count, d = free.dim;
  return {
    count: n, dim: d, gram: free.gram, featureReward: free.featureReward, rewardSquare: free.rewardSquare,
    crossNext: total.cross.map((v) => v / n), nextGram: mirrored(total.nextGram, d, 1 / n), nextFeatureReward: total.nextReward.map((v) => v / n),
  };
}

/**
 * Per-episode sums in the bootstrap's packed layout [ΦᵀΦ | ΦᵀΨ | ΨᵀΨ | Φᵀr | Ψᵀr | rᵀr | n_k]
 * (episodeBellmanSums.ts), with the policy-free parts copied in and the rest accumulated in place.
 */
function newPacked(free: PolicyFreeSums): EpisodeBellmanSums {
  const d = free.dim, dd = d * d, stride = 3 * dd + 2 * d + 2, freeStride = dd + d + 2, source = free.episodeSums!;
  const e = free.index.episodes, sums = new Float64Array(e * stride);
  for (let k = 0; k < e; k++) {
    const o = k * stride, f = k * freeStride;
    sums.set(source.subarray(f, f + dd), o);
    sums.set(source.subarray(f + dd, f + dd + d), o + 3 * dd);
    sums[o + 3 * dd + 2 * d] = source[f + dd + d];
    sums[o + 3 * dd + 2 * d + 1] = source[f + dd + d + 1];
  }
  return { episodes: e, dim: d, stride, sums };
}

/** Views of episode k's policy-dependent parts inside the packed sums. */
function packedSlot(packed: EpisodeBellmanSums, k: number, d: number): Slot {
  const dd = d * d, o = k * packed.stride;
  return {
    cross: packed.sums.subarray(o + dd, o + 2 * dd),
    nextGram: packed.sums.subarray(o + 2 * dd, o + 3 * dd),
    nextReward: packed.sums.subarray(o + 3 * dd + d, o + 3 * dd + 2 * d),
  };
}

function mirrorInPlace(upper: Float64Array, d: number): void {
  for (let a = 0; a < d; a++) for (let b = a + 1; b < d; b++) upper[b * d + a] = upper[a * d + b];
}
