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
import type { FeatureMap } from '../features/featureMap';
import { throwIfCancelled, type CancellationCheck } from '../fqe/cancellation';
import type { PolicyFreeSums } from './policyFreeSums';
import { loggedStateAction, type TransitionSet } from '../transitions';
import type { PolicyFeatureAverage } from '../features/policyFeatureAverage';
import { addSlot, keepUpperTriangles, newPacked, newSlot, packedSlot, statisticsOf, type PointSums, type Slot } from './pointSums';

const BLOCK_VALUES = 1 << 16;

export function policyDependentSums(
  data: TransitionSet, features: FeatureMap, free: PolicyFreeSums, average: PolicyFeatureAverage,
  options: { cancel?: CancellationCheck; withNextGram?: boolean } = {},
): PointSums {
  const cancel = options.cancel, withNextGram = options.withNextGram !== false;
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
      if (withNextGram) addBlock(block.phi, block.psi, block.reward, size, rows, d, slot);
      else addCrossBlock(block.phi, block.psi, size, rows, d, slot);
    }
    if (packed) addSlot(slot, total, d);
  }
  if (packed) keepUpperTriangles(packed);
  return { statistics: statisticsOf(free, total, 'upper'), episodeSums: packed };
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
      loggedStateAction(data, i, block.input);
      features.evaluate(block.input, 0, row, 0);
      for (let a = 0; a < d; a++) block.phi[a * rows + t] = row[a];
    }
    if (data.terminal[i] !== 0) row.fill(0);
    else average.average(data.nextStates, i * ds, row, 0);
    for (let a = 0; a < d; a++) block.psi[a * rows + t] = row[a];
    block.reward[t] = data.rewards[i];
  }
}

/** slot.cross += block sums of ΦᵀΨ only (no Bellman residual wanted), four columns at a time. */
function addCrossBlock(phi: Float64Array, psi: Float64Array, size: number, rows: number, d: number, slot: Slot): void {
  const cross = slot.cross;
  for (let a = 0; a < d; a++) {
    const oa = a * rows;
    let b = 0;
    for (; b + 3 < d; b += 4) {
      const o0 = b * rows, o1 = o0 + rows, o2 = o1 + rows, o3 = o2 + rows;
      let m0 = 0, m1 = 0, m2 = 0, m3 = 0;
      for (let t = 0; t < size; t++) {
        const pa = phi[oa + t];
        m0 += pa * psi[o0 + t]; m1 += pa * psi[o1 + t]; m2 += pa * psi[o2 + t]; m3 += pa * psi[o3 + t];
      }
      const r = a * d + b;
      cross[r] += m0; cross[r + 1] += m1; cross[r + 2] += m2; cross[r + 3] += m3;
    }
    for (; b < d; b++) {
      let m = 0;
      for (let t = 0; t < size; t++) m += phi[oa + t] * psi[b * rows + t];
      cross[a * d + b] += m;
    }
  }
}

/**
 * slot += block sums of ΦᵀΨ, ΨᵀΨ (upper triangle) and Ψᵀr over the first `size` rows. Four
 * columns b of Ψ at a time share each load of φ_a and ψ_a (register blocking), which roughly
 * halves the memory traffic of the plain inner product; the arithmetic is the same.
 */
function addBlock(phi: Float64Array, psi: Float64Array, reward: Float64Array, size: number, rows: number, d: number, slot: Slot): void {
  const { cross, nextGram, nextReward } = slot;
  for (let a = 0; a < d; a++) {
    const oa = a * rows;
    let b = 0;
    for (; b + 3 < d; b += 4) {
      const o0 = b * rows, o1 = o0 + rows, o2 = o1 + rows, o3 = o2 + rows;
      let m0 = 0, m1 = 0, m2 = 0, m3 = 0, h0 = 0, h1 = 0, h2 = 0, h3 = 0;
      for (let t = 0; t < size; t++) {
        const pa = phi[oa + t], qa = psi[oa + t];
        const q0 = psi[o0 + t], q1 = psi[o1 + t], q2 = psi[o2 + t], q3 = psi[o3 + t];
        m0 += pa * q0; m1 += pa * q1; m2 += pa * q2; m3 += pa * q3;
        h0 += qa * q0; h1 += qa * q1; h2 += qa * q2; h3 += qa * q3;
      }
      const r = a * d + b;
      cross[r] += m0; cross[r + 1] += m1; cross[r + 2] += m2; cross[r + 3] += m3;
      // ΨᵀΨ is kept in its upper triangle (b ≥ a) only.
      if (b >= a) nextGram[r] += h0;
      if (b + 1 >= a) nextGram[r + 1] += h1;
      if (b + 2 >= a) nextGram[r + 2] += h2;
      if (b + 3 >= a) nextGram[r + 3] += h3;
    }
    for (; b < d; b++) {
      const ob = b * rows;
      let m = 0, h = 0;
      for (let t = 0; t < size; t++) {
        const q = psi[ob + t];
        m += phi[oa + t] * q;
        h += psi[oa + t] * q;
      }
      cross[a * d + b] += m;
      if (b >= a) nextGram[a * d + b] += h;
    }
    let e = 0;
    for (let t = 0; t < size; t++) e += psi[oa + t] * reward[t];
    nextReward[a] += e;
  }
}

