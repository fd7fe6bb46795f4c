/**
 * Per-episode regression moments reweighted by multiplicities equal the moments of the resample
 * materialised as data, computed by ml-matrix (an independent library) from the explicit design.
 */
import { Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { episodeMoments, resampleMoments, resampleMomentsBlock } from '../../../src/core/bootstrap/episodeMoments';
import { episodeMultiplicities } from '../../../src/core/bootstrap/episodeMultiplicities';
import { indexEpisodes, resampledTransitions } from '../../../src/core/bootstrap/episodeTransitions';
import { simulateLinearPlant } from '../fqe/simulatedTransitions';

const data = simulateLinearPlant({
  dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1], actionWeight: [0.1],
  behaviourGain: [-0.3, -0.1], behaviourStd: [0.5], startStd: 1, episodes: 12, stepsPerEpisode: 30, seed: 4,
});

describe('episodeMoments', () => {
  it('gives XᵀX, XᵀY and YᵀY of a resample as ml-matrix does on the copied rows', () => {
    const index = indexEpisodes(data);
    const design = (states: Float64Array, actions: Float64Array, i: number) => [1, states[2 * i], states[2 * i + 1], actions[i]];
    const moments = episodeMoments(index, 4, 2, (i, x, y) => {
      x.set(design(data.states, data.actions, i));
      y.set([data.nextStates[2 * i], data.nextStates[2 * i + 1]]);
      return true;
    });
    const counts = episodeMultiplicities(data.episodeCount, 3, 0);
    const r = resampledTransitions(data, index, counts);
    const x = new Matrix(Array.from({ length: r.count }, (_, i) => design(r.states, r.actions, i)));
    const y = new Matrix(Array.from({ length: r.count }, (_, i) => [r.nextStates[2 * i], r.nextStates[2 * i + 1]]));
    const fast = resampleMoments(moments, counts);
    expect(fast.count).toBe(r.count);
    const close = (a: Float64Array, m: Matrix) => a.forEach((v, k) => expect(v).toBeCloseTo(m.get(Math.floor(k / m.columns), k % m.columns), 9));
    close(fast.xx, x.transpose().mmul(x));
    close(fast.xy, x.transpose().mmul(y));
    close(fast.yy, y.transpose().mmul(y));
  });

  it('gives on a block of resamples exactly what it gives on each alone (the same sums in the same order)', () => {
    const index = indexEpisodes(data);
    const moments = episodeMoments(index, 3, 1, (i, x, y) => {
      x.set([1, data.states[2 * i], data.actions[i]]);
      y[0] = data.rewards[i];
      return true;
    });
    // Six resamples: a full block of four and a part block of two.
    const block = [0, 1, 2, 3, 4, 5].map((b) => episodeMultiplicities(data.episodeCount, 5, b));
    resampleMomentsBlock(moments, block).forEach((fast, b) => expect(fast).toEqual(resampleMoments(moments, block[b])));
  });

  it('keeps a non-finite run out of the resamples that do not draw it, as one resample at a time does', () => {
    const index = indexEpisodes(data);
    const moments = episodeMoments(index, 3, 1, (i, x, y) => {
      x.set([1, data.states[2 * i], data.actions[i]]);
      y[0] = index.order[index.offsets[1]] === i ? Infinity : data.rewards[i]; // one value of run 2 overflows
      return true;
    });
    const block = [0, 1, 2].map((b) => episodeMultiplicities(data.episodeCount, 5, b));
    block[0][1] = 0;
    const fast = resampleMomentsBlock(moments, block);
    fast.forEach((f, b) => expect(f).toEqual(resampleMoments(moments, block[b])));
    expect(fast[0].yy.every(Number.isFinite)).toBe(true);
  });
});
