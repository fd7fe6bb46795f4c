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

  it('gives exactly, bit for bit, what one resample at a time gives when the runs span several chunks (odd and even entry counts, part blocks)', () => {
    // More runs than one chunk of the block sums (2,048) and not a multiple of it; 11 summed entries (odd) and 22 (even).
    const many = simulateLinearPlant({
      dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1], actionWeight: [0.1],
      behaviourGain: [-0.3, -0.1], behaviourStd: [0.5], startStd: 1, episodes: 4500, stepsPerEpisode: 2, seed: 11,
    });
    const index = indexEpisodes(many);
    const odd = episodeMoments(index, 3, 1, (i, x, y) => {
      x.set([1, many.states[2 * i], many.actions[i]]);
      y[0] = many.rewards[i];
      return true;
    });
    const even = episodeMoments(index, 4, 2, (i, x, y) => {
      x.set([1, many.states[2 * i], many.states[2 * i + 1], many.actions[i]]);
      y.set([many.nextStates[2 * i], many.nextStates[2 * i + 1]]);
      return true;
    });
    const bits = (m: { xx: Float64Array; xy: Float64Array; yy: Float64Array; count: number }) =>
      [...new BigUint64Array(Float64Array.from([...m.xx, ...m.xy, ...m.yy, m.count]).buffer)];
    for (const moments of [odd, even]) {
      for (const resamples of [1, 3, 5]) {
        const block = Array.from({ length: resamples }, (_, b) => episodeMultiplicities(many.episodeCount, 9, b));
        resampleMomentsBlock(moments, block).forEach((fast, b) => expect(bits(fast)).toEqual(bits(resampleMoments(moments, block[b]))));
      }
    }
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

  it('sums in chunks exactly as adding each row’s products straight into the totals (runs longer than a chunk, rows left out)', () => {
    const long = simulateLinearPlant({
      dynamics: [0.9, 0.1, 0, 0.8], inputGain: [0.5, 0.2], processNoiseStd: [0.1, 0.1], stateWeight: [1, 0, 0, 1], actionWeight: [0.1],
      behaviourGain: [-0.3, -0.1], behaviourStd: [0.5], startStd: 1, episodes: 3, stepsPerEpisode: 600, seed: 8,
    });
    const index = indexEpisodes(long), p = 5, q = 2;
    const row = (i: number, x: Float64Array, y: Float64Array) => {
      const s0 = long.states[2 * i], s1 = long.states[2 * i + 1];
      x.set([1, s0, s1, long.actions[i], s0 * long.actions[i]]);
      y.set([long.nextStates[2 * i], long.rewards[i]]);
      return i % 7 !== 3;
    };
    // The straightforward route: every product added to its total as the row is read.
    const stride = p * p + p * q + q * q + 1, plain = new Float64Array(index.episodes * stride), x = new Float64Array(p), y = new Float64Array(q);
    for (let k = 0; k < index.episodes; k++) {
      const o = k * stride;
      for (let r = index.offsets[k]; r < index.offsets[k + 1]; r++) {
        if (!row(index.order[r], x, y)) continue;
        for (let a = 0; a < p; a++) {
          for (let b = a; b < p; b++) plain[o + a * p + b] += x[a] * x[b];
          for (let b = 0; b < q; b++) plain[o + p * p + a * q + b] += x[a] * y[b];
        }
        for (let a = 0; a < q; a++) for (let b = a; b < q; b++) plain[o + p * p + p * q + a * q + b] += y[a] * y[b];
        plain[o + stride - 1]++;
      }
      for (let a = 1; a < p; a++) for (let b = 0; b < a; b++) plain[o + a * p + b] = plain[o + b * p + a];
      for (let a = 1; a < q; a++) for (let b = 0; b < a; b++) plain[o + p * p + p * q + a * q + b] = plain[o + p * p + p * q + b * q + a];
    }
    expect(episodeMoments(index, p, q, row).sums).toEqual(plain);
  });
});
