/**
 * perDecisionData regroups the weight table's entries from episode-major to step-major (step t's
 * entries in episode order) by a blocked transpose, a chunk of episodes at a time. It is a copy, so
 * it must place every number exactly where the plain regrouping does — one pass over the episodes,
 * each entry to the next free place of its step (written out here as the reference) — bit for bit,
 * on runs of many different lengths across several chunks of episodes (invented numbers).
 */
import { describe, expect, it } from 'vitest';
import type { ImportanceWeightTable } from '../../../src/core/offPolicy/importanceWeights';
import { perDecisionData } from '../../../src/core/offPolicy/perDecisionEstimators';

/** A weight table of `e` runs of lengths 1 + (7k mod 23), with invented weights, rewards and no absorbed run. */
function table(e: number): ImportanceWeightTable {
  const lengths = Array.from({ length: e }, (_, k) => 1 + ((7 * k) % 23)), offsets = new Int32Array(e + 1);
  lengths.forEach((l, k) => { offsets[k + 1] = offsets[k] + l; });
  const n = offsets[e], horizon = Math.max(...lengths), step = new Int32Array(n);
  for (let k = 0; k < e; k++) for (let p = offsets[k]; p < offsets[k + 1]; p++) step[p] = p - offsets[k];
  const invented = (f: (p: number) => number) => Float64Array.from({ length: n }, (_, p) => f(p));
  const scaled = invented((p) => 0.5 + 0.5 * Math.cos(p)), scaledBefore = Float64Array.from(scaled, (_, p) => (step[p] === 0 ? 1 : scaled[p - 1]));
  return {
    index: { episodes: e, offsets, order: Int32Array.from({ length: n }, (_, p) => p) }, horizon, step, logRatio: invented(() => 0), logWeight: invented((p) => Math.log(scaled[p])),
    scaled, scaledBefore, rewards: invented((p) => Math.sin(3 * p) - 1), absorbed: new Uint8Array(e), absorbedLargest: new Float64Array(horizon + 1).fill(-Infinity),
    heldCarry: new Float64Array(horizon + 1), absorbedToBefore: new Float64Array(horizon + 1), absorbedToStep: new Float64Array(horizon + 1), liveWeighted: new Uint8Array(horizon).fill(1),
  };
}

/** The plain regrouping: episodes in order, each entry to the next free place of its step. */
function plainRegrouping(t: ImportanceWeightTable, stepOffsets: Int32Array): { order: Int32Array; episode: Int32Array } {
  const n = t.step.length, next = stepOffsets.slice(), order = new Int32Array(n), episode = new Int32Array(n);
  for (let k = 0; k < t.index.episodes; k++) {
    for (let p = t.index.offsets[k]; p < t.index.offsets[k + 1]; p++) {
      const j = next[t.step[p]]++;
      order[j] = p;
      episode[j] = k;
    }
  }
  return { order, episode };
}

describe('the step-major regrouping of the per-decision entries', () => {
  it.each([1, 63, 64, 65, 300])('places every entry where the plain regrouping does, bit for bit (%i runs)', (e) => {
    const t = table(e), n = t.step.length;
    const values = { actionValues: Float64Array.from({ length: n }, (_, p) => Math.cos(5 * p)), stateValues: Float64Array.from({ length: n }, (_, p) => Math.sin(7 * p)) };
    const d = perDecisionData(t, values), { order, episode } = plainRegrouping(t, d.stepOffsets);
    const gathered = (a: Float64Array) => Float64Array.from(order, (p) => a[p]);
    expect(d.episode).toEqual(episode);
    expect(d.scaled).toEqual(gathered(t.scaled));
    expect(d.scaledBefore).toEqual(gathered(t.scaledBefore));
    expect(d.rewards).toEqual(gathered(t.rewards));
    expect(d.actionValues).toEqual(gathered(values.actionValues));
    expect(d.stateValues).toEqual(gathered(values.stateValues));
  });
});
