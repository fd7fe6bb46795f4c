/**
 * One pass over the transitions that collects every sum linear fitted Q-evaluation needs.
 *
 * With a fixed policy and Q(s, a) = φ(s, a)ᵀw, the regression target of each FQE step is
 * r_i + γ ψ_iᵀ w_k with ψ_i = (1 − done_i) Σ_j ω_ij φ(s'_i, a'_ij), the policy's expected next
 * feature vector by quadrature (nodes a'_ij, weights ω_ij). Every step and the Bellman residual
 * are then functions of these averages alone (the LSTD-Q statistics; Lagoudakis & Parr, "Least-
 * squares policy iteration", JMLR 2003, §5):
 *   G = ΦᵀΦ/n, M = ΦᵀΨ/n, H = ΨᵀΨ/n, b = Φᵀr/n, e = Ψᵀr/n, rr = rᵀr/n.
 * No n×d matrix is kept: rows are folded in as they are read.
 *
 * Shapes: n transitions, d features; all matrices d×d row-major.
 */
import type { ActionQuadrature } from '../actionQuadrature';
import type { FeatureMap } from '../features/featureMap';
import type { TransitionSet } from '../transitions';
import { runSteps, throwIfCancelled, type CancellationCheck, type PassSteps } from './cancellation';
import { createBlockProducts } from './blockProducts';
import { FqeDataError } from './fqeErrors';
import { addNextBlock, type Block } from './nextFeatureSums';
import { createTransitionFeatureReader, type TransitionFeatureReader } from './transitionFeatures';

export interface BellmanStatistics {
  readonly count: number; // n
  readonly dim: number; // d
  readonly gram: Float64Array; // G = ΦᵀΦ/n, symmetric
  readonly crossNext: Float64Array; // M = ΦᵀΨ/n
  readonly nextGram: Float64Array; // H = ΨᵀΨ/n, symmetric
  readonly featureReward: Float64Array; // b = Φᵀr/n
  readonly nextFeatureReward: Float64Array; // e = Ψᵀr/n
  readonly rewardSquare: number; // rr = rᵀr/n
}

export interface AccumulationHooks {
  onDataPass?: (rowsDone: number, rowsTotal: number) => void;
  cancel?: CancellationCheck;
}

/**
 * Rows are gathered into blocks (row-major, where blockProducts.ts's SIMD kernel reads a row's
 * features in pairs), each block's sums are formed separately and
 * then added to the totals. Besides speed this is blocked summation, whose rounding error grows
 * like (n/B + B)·u rather than n·u (Higham, "Accuracy and Stability of Numerical Algorithms",
 * 2nd ed., §4.2).
 */
const BLOCK_VALUES = 1 << 17;

/**
 * Packed sums of one segment of transitions (not yet divided by its count):
 * [ΦᵀΦ | ΦᵀΨ | ΨᵀΨ | Φᵀr | Ψᵀr | rᵀr | n], length 3d² + 2d + 2. Only the upper triangles of
 * ΦᵀΦ and ΨᵀΨ are formed; statisticsFromSums mirrors them.
 */
export function bellmanSumsStride(d: number): number {
  return 3 * d * d + 2 * d + 2;
}

/** Contiguous groups of transitions: segment k is order[offsets[k] .. offsets[k+1]). */
export interface TransitionSegments {
  readonly order: Int32Array; // n
  readonly offsets: Int32Array; // segments + 1
}

export function accumulateBellmanStatistics(
  data: TransitionSet, features: FeatureMap, quadrature: ActionQuadrature, hooks: AccumulationHooks = {},
): BellmanStatistics {
  return runSteps(bellmanStatisticsSteps(data, features, quadrature, hooks));
}

/**
 * accumulateBellmanStatistics as a pass that yields after every block (cancellation.ts).
 * policyFree: the statistics of a pass over the same data with the same feature map for another
 * policy; its G, b and rr are this pass's to the last bit (nextFeatureSums.ts), so only M, H and e
 * are formed.
 */
export function* bellmanStatisticsSteps(
  data: TransitionSet, features: FeatureMap, quadrature: ActionQuadrature, hooks: AccumulationHooks = {}, policyFree?: BellmanStatistics,
): PassSteps<BellmanStatistics> {
  const n = data.count, d = features.dim;
  if (policyFree && (policyFree.dim !== d || policyFree.count !== n)) throw new RangeError('bellmanStatisticsSteps: the shared statistics are of another size');
  const whole = { order: Int32Array.from({ length: n }, (_, i) => i), offsets: Int32Array.of(0, n) };
  const sums = new Float64Array(bellmanSumsStride(d));
  yield* segmentSumsSteps(data, features, quadrature, whole, sums, hooks, policyFree !== undefined);
  const formed = statisticsFromSums(sums, d);
  const stats = policyFree ? { ...formed, gram: policyFree.gram.slice(), featureReward: policyFree.featureReward.slice(), rewardSquare: policyFree.rewardSquare } : formed;
  checkStatisticsFinite(stats, data, features, quadrature);
  return stats;
}

/**
 * One pass over the transitions in segment order, adding each segment's packed sums to
 * out[k·stride …] (out starts at zero). The pipeline keeps one segment per episode, so that a
 * bootstrap resample's statistics are a weighted sum of them (src/core/bootstrap/
 * episodeBellmanSums.ts) and the full data's are their plain sum: one pass serves the fit and
 * every resample.
 */
export function accumulateSegmentSums(
  data: TransitionSet, features: FeatureMap, quadrature: ActionQuadrature, segments: TransitionSegments,
  out: Float64Array, hooks: AccumulationHooks = {},
): void {
  runSteps(segmentSumsSteps(data, features, quadrature, segments, out, hooks));
}

/**
 * accumulateSegmentSums as a pass that yields after every block. givenPolicyFree: out already holds
 * each segment's ΦᵀΦ, Φᵀr and rᵀr from another policy's pass (nextFeatureSums.ts); only the rest is added.
 */
export function* segmentSumsSteps(
  data: TransitionSet, features: FeatureMap, quadrature: ActionQuadrature, segments: TransitionSegments,
  out: Float64Array, hooks: AccumulationHooks = {}, givenPolicyFree = false,
): PassSteps<void> {
  const n = segments.order.length, d = features.dim, stride = bellmanSumsStride(d);
  const blockRows = blockRowsFor(d);
  const reader = createTransitionFeatureReader(data, features, quadrature), block = newBlock(d, blockRows);
  let done = 0;
  for (let k = 0; k + 1 < segments.offsets.length; k++) {
    const end = segments.offsets[k + 1], base = k * stride;
    for (let start = segments.offsets[k]; start < end; start += blockRows) {
      const size = Math.min(blockRows, end - start);
      for (let t = 0; t < size; t++) gatherTransition(reader, data, block, segments.order[start + t], t);
      if (givenPolicyFree) addNextBlock(block, size, out, base);
      else addBlock(block, size, out, base);
      done += size;
      // After every block (at most about 1.3·10⁵ feature values): hosts throttle what they show.
      throwIfCancelled(hooks.cancel);
      hooks.onDataPass?.(done, n);
      yield;
    }
    out[base + stride - 1] += end - segments.offsets[k];
  }
}

function newBlock(d: number, rows: number): Block {
  const products = createBlockProducts(d, rows);
  return { d, rows, phi: products.phi, psi: products.psi, reward: new Float64Array(rows), products };
}

/** φ_i and ψ_i of transition i (read into the reader's buffers) copied to block row t. */
function gatherTransition(reader: TransitionFeatureReader, data: TransitionSet, block: Block, i: number, t: number): void {
  reader.read(i);
  block.phi.set(reader.phi, t * block.d);
  block.psi.set(reader.psi, t * block.d);
  block.reward[t] = data.rewards[i];
}

/**
 * Add the first `size` rows of the block to the packed sums at out[base …]: G and H on and above
 * the diagonal, all of M, each entry summed over the rows in order as one dot product at a time
 * (blockProducts.ts: register tiles, the same numbers to the last bit). The entries of G and H
 * below the diagonal are left alone; statisticsFromSums mirrors the upper ones.
 */
function addBlock(block: Block, size: number, out: Float64Array, base: number): void {
  const { d, phi, psi, products } = block, dd = d * d;
  products.add(phi, phi, size, out, base, true);
  products.add(phi, psi, size, out, base + dd, false);
  products.add(psi, psi, size, out, base + 2 * dd, true);
  addVectors(block, size, out, base + 3 * dd);
}

/** Φᵀr, Ψᵀr and rᵀr of the block's rows, at out[o …] = [Φᵀr | Ψᵀr | rᵀr]. */
function addVectors(block: Block, size: number, out: Float64Array, o: number): void {
  const { d, phi, psi, reward } = block;
  for (let a = 0; a < d; a++) {
    let br = 0, er = 0;
    for (let t = 0; t < size; t++) { br += phi[t * d + a] * reward[t]; er += psi[t * d + a] * reward[t]; }
    out[o + a] += br;
    out[o + d + a] += er;
  }
  let rr = 0;
  for (let t = 0; t < size; t++) rr += reward[t] * reward[t];
  out[o + 2 * d] += rr;
}

/**
 * Averages from packed sums (one segment's, or a weighted total of several): each part divided by
 * the count, the upper triangles of G and H mirrored.
 */
export function statisticsFromSums(sums: Float64Array, d: number): BellmanStatistics {
  const dd = d * d, n = sums[bellmanSumsStride(d) - 1];
  const part = (from: number, length: number) => Float64Array.from(sums.subarray(from, from + length), (v) => v / n);
  const gram = part(0, dd), nextGram = part(2 * dd, dd);
  for (const sym of [gram, nextGram]) {
    for (let a = 0; a < d; a++) for (let b = 0; b < a; b++) sym[a * d + b] = sym[b * d + a];
  }
  return {
    count: n, dim: d, gram, crossNext: part(dd, dd), nextGram,
    featureReward: part(3 * dd, d), nextFeatureReward: part(3 * dd + d, d), rewardSquare: sums[3 * dd + 2 * d] / n,
  };
}

/** Throws FqeDataError when a sum is not finite, tracing it back to the first transition that produced it, by source line. */
export function checkStatisticsFinite(stats: BellmanStatistics, data: TransitionSet, features: FeatureMap, quadrature: ActionQuadrature): void {
  const ok = (a: Float64Array): boolean => a.every(Number.isFinite);
  const sums = [stats.gram, stats.crossNext, stats.nextGram, stats.featureReward, stats.nextFeatureReward];
  if (sums.every(ok) && Number.isFinite(stats.rewardSquare)) return;
  const reader = createTransitionFeatureReader(data, features, quadrature);
  for (let i = 0; i < data.count; i++) {
    reader.read(i);
    const r = data.rewards[i], where = `transition ${i + 1} (line ${data.sourceLine[i]})`;
    if (!Number.isFinite(r * r)) {
      throw new FqeDataError(`${where}: the reward ${r} is too large for the fit: its square overflows double precision (above about 1.3e154); rescale the reward or cost (e.g. other units)`);
    }
    if (!ok(reader.phi) || !ok(reader.psi) || !Number.isFinite(squares(reader.phi) + squares(reader.psi))) {
      throw new FqeDataError(`${where}: its features overflow double precision (the state or action lies far outside the logged range the features were scaled to); reduce the polynomial degree or check the data for extreme values`);
    }
  }
  throw new FqeDataError('the feature sums overflowed double precision; reduce the polynomial degree or check the data for extreme values');
}

function squares(v: Float64Array): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) s += v[i] * v[i];
  return s;
}

/**
 * The statistics of the first k features of a map whose leading k features are another map's (a
 * polynomial's lower-degree monomials lead in the graded order, monomials.ts): each is an entry of
 * the larger map's, summed over the same rows in the same blocks (when both maps have the same
 * rows per block, blockRowsFor), so they equal a pass with the smaller map to the last bit.
 */
export function leadingStatistics(stats: BellmanStatistics, k: number): BellmanStatistics {
  const d = stats.dim, lead = (m: Float64Array) => {
    const out = new Float64Array(k * k);
    for (let a = 0; a < k; a++) for (let b = 0; b < k; b++) out[a * k + b] = m[a * d + b];
    return out;
  };
  return {
    count: stats.count, dim: k, gram: lead(stats.gram), crossNext: lead(stats.crossNext), nextGram: lead(stats.nextGram),
    featureReward: stats.featureReward.slice(0, k), nextFeatureReward: stats.nextFeatureReward.slice(0, k), rewardSquare: stats.rewardSquare,
  };
}

/** The same as leadingStatistics on one segment's packed sums (bellmanSumsStride layout), from d features to k. */
export function leadingSums(sums: Float64Array, from: number, d: number, out: Float64Array, to: number, k: number): void {
  const dd = d * d, kk = k * k;
  for (let part = 0; part < 3; part++) {
    for (let a = 0; a < k; a++) for (let b = 0; b < k; b++) out[to + part * kk + a * k + b] = sums[from + part * dd + a * d + b];
  }
  for (let a = 0; a < k; a++) {
    out[to + 3 * kk + a] = sums[from + 3 * dd + a];
    out[to + 3 * kk + k + a] = sums[from + 3 * dd + d + a];
  }
  out[to + 3 * kk + 2 * k] = sums[from + 3 * dd + 2 * d];
  out[to + 3 * kk + 2 * k + 1] = sums[from + 3 * dd + 2 * d + 1];
}

/** Rows per block of a pass with d features (so two maps whose passes agree block for block can be recognised). */
export function blockRowsFor(d: number): number {
  return Math.max(64, Math.min(1024, Math.floor(BLOCK_VALUES / d)));
}
