/**
 * What one retune-map point's pass produces, shared by the per-row route (policyDependentSums.ts)
 * and the closed-form route (closedFormSums.ts): the policy-dependent sums M = ΦᵀΨ, H = ΨᵀΨ,
 * e = Ψᵀr in slots (the total, and per episode inside the bootstrap's packed layout,
 * episodeBellmanSums.ts), turned into BellmanStatistics with the policy-free G, b, rr.
 */
import type { EpisodeBellmanSums } from '../bootstrap/episodeBellmanSums';
import type { BellmanStatistics } from '../fqe/bellmanStatistics';
import type { PolicyFreeSums } from './policyFreeSums';

export interface PointSums {
  readonly statistics: BellmanStatistics;
  readonly episodeSums: EpisodeBellmanSums | null;
}

export interface Slot {
  readonly cross: Float64Array; // d×d
  readonly nextGram: Float64Array; // d×d (upper triangle or full, as the route says)
  readonly nextReward: Float64Array; // d
}

export function newSlot(d: number): Slot {
  return { cross: new Float64Array(d * d), nextGram: new Float64Array(d * d), nextReward: new Float64Array(d) };
}

export function addSlot(from: Slot, to: Slot, d: number): void {
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

/** The statistics (averages) of a point from its total slot; `triangle`: how nextGram was kept. */
export function statisticsOf(free: PolicyFreeSums, total: Slot, triangle: 'upper' | 'full'): BellmanStatistics {
  const n = free.count, d = free.dim;
  const nextGram = triangle === 'upper' ? mirrored(total.nextGram, d, 1 / n) : total.nextGram.map((v) => v / n);
  return {
    count: n, dim: d, gram: free.gram, featureReward: free.featureReward, rewardSquare: free.rewardSquare,
    crossNext: total.cross.map((v) => v / n), nextGram, nextFeatureReward: total.nextReward.map((v) => v / n),
  };
}

/**
 * Per-episode sums in the bootstrap's packed layout [ΦᵀΦ | ΦᵀΨ | ΨᵀΨ | Φᵀr | Ψᵀr | rᵀr | n_k]
 * (episodeBellmanSums.ts), with the policy-free parts copied in and the rest accumulated in place.
 */
export function newPacked(free: PolicyFreeSums): EpisodeBellmanSums {
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
export function packedSlot(packed: EpisodeBellmanSums, k: number, d: number): Slot {
  const dd = d * d, o = k * packed.stride;
  return {
    cross: packed.sums.subarray(o + dd, o + 2 * dd),
    nextGram: packed.sums.subarray(o + 2 * dd, o + 3 * dd),
    nextReward: packed.sums.subarray(o + 3 * dd + d, o + 3 * dd + 2 * d),
  };
}

/**
 * The bootstrap's packed layout keeps G and H as upper triangles (bellmanStatistics.ts), the lower
 * parts zero; statisticsFromSums mirrors them. Bring a packed array to that convention.
 */
export function keepUpperTriangles(packed: EpisodeBellmanSums): void {
  const d = packed.dim, dd = d * d;
  for (let k = 0; k < packed.episodes; k++) {
    for (const block of [k * packed.stride, k * packed.stride + 2 * dd]) {
      for (let a = 1; a < d; a++) for (let b = 0; b < a; b++) packed.sums[block + a * d + b] = 0;
    }
  }
}
