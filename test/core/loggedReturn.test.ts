import { describe, expect, it } from 'vitest';
import { loggedDiscountedReturn, loggedDiscountedReturns, loggedReturnRole, truncationSentence } from '../../src/core/loggedReturn';
import { lawFittedOnMovingRows } from '../../src/pipeline/heldActionsCheck';
import type { TransitionSet } from '../../src/core/transitions';

function episodes(lengths: number[], reward: number): TransitionSet {
  const n = lengths.reduce((a, b) => a + b, 0);
  const episode = new Int32Array(n);
  let i = 0;
  lengths.forEach((len, k) => { for (let t = 0; t < len; t++) episode[i++] = k; });
  return {
    count: n, stateDim: 1, actionDim: 1, stateNames: ['x'], actionNames: ['u'],
    states: new Float64Array(n), actions: new Float64Array(n), rewards: new Float64Array(n).fill(reward),
    nextStates: new Float64Array(n), terminal: new Uint8Array(n), episode, episodeCount: lengths.length,
    startStates: new Float64Array(lengths.length), sourceLine: new Int32Array(n),
  };
}

describe('logged discounted return', () => {
  it('equals the geometric sum r(1 − γ^T)/(1 − γ) per episode', () => {
    // Finite geometric series (common practice).
    const g = 0.9;
    const result = loggedDiscountedReturn(episodes([10, 20], 2), g);
    const expected = [10, 20].map((t) => (2 * (1 - g ** t)) / (1 - g));
    expect(Array.from(result.perEpisode)).toEqual(expected.map((v) => expect.closeTo(v, 12)));
    expect(result.value).toBeCloseTo((expected[0] + expected[1]) / 2, 12);
    expect(result.largestTruncationWeight).toBeCloseTo(g ** 10, 14);
    expect(result.meanTruncationWeight).toBeCloseTo((g ** 10 + g ** 20) / 2, 14);
    // Two values: s.e. = |a − b| / 2.
    expect(result.standardError).toBeCloseTo(Math.abs(expected[0] - expected[1]) / 2, 12);
  });
});

describe('logged discounted returns at several discounts in one pass', () => {
  /** The plain route: one episode's G = Σ_t γ^t r_t summed step by step in file order, γ^t carried by repeated products. */
  function plainReturn(data: TransitionSet, g: number): { perEpisode: number[]; weights: number[] } {
    const perEpisode = new Array<number>(data.episodeCount).fill(0), weights = new Array<number>(data.episodeCount).fill(1);
    for (let i = 0; i < data.count; i++) {
      const k = data.episode[i];
      perEpisode[k] += weights[k] * data.rewards[i];
      weights[k] *= g;
    }
    return { perEpisode, weights };
  }

  it('gives each discount the single-discount pass to the last bit, interleaved episodes and a terminal run included', () => {
    // Invented log: three runs whose rows interleave, rewards of mixed sign and size; the sweep's discounts γ^(1/f).
    const data = episodes([7, 12, 5], 1), n = data.count;
    for (let i = 0; i < n; i++) {
      data.episode[i] = [0, 1, 2, 1][i % 4] % 3;
      data.rewards[i] = Math.sin(1.7 * i) * 10 ** ((i % 5) - 2);
    }
    data.terminal[n - 1] = 1;
    const discounts = [0.5, 0.75, 1, 1.5, 2].map((f) => 0.97 ** (1 / f));
    const together = loggedDiscountedReturns(data, discounts);
    discounts.forEach((g, j) => {
      const alone = loggedDiscountedReturn(data, g), plain = plainReturn(data, g);
      expect(Array.from(together[j].perEpisode)).toEqual(plain.perEpisode);
      expect(together[j]).toEqual(alone);
      expect(together[j].largestTruncationWeight).toBe(Math.max(...plain.weights.filter((_, k) => k !== data.episode[n - 1])));
    });
  });
});

describe('the sentence on runs cut short', () => {
  it('sizes the bias by the mean missing weight: one short run among long ones is stated but does not decide it', () => {
    // The mean return's missing part is the mean of γ^T·V(s_T) (finite geometric series; common practice): with equal
    // values it is the mean of γ^T, so 99 runs of 500 steps and one of 5 at γ = 0.98 miss (99·0.98^500 + 0.98^5)/100 of it.
    const g = 0.98, oneShort = loggedDiscountedReturn(episodes([...Array(99).fill(500), 5], -1), g);
    expect(oneShort.meanTruncationWeight).toBeCloseTo((99 * g ** 500 + g ** 5) / 100, 14);
    expect(oneShort.largestTruncationWeight).toBeCloseTo(g ** 5, 14);
    expect(truncationSentence(oneShort)).toBe(
      'Logged runs are short for this discount: on average 0.91\u00a0% of the return’s weight lies beyond their end (90.39\u00a0% on the shortest run cut short, by a time limit or the end of the log), so the logged return is biased toward zero',
    );
    expect(truncationSentence(loggedDiscountedReturn(episodes(Array(100).fill(500), -1), g))).toBeNull(); // 0.98^500 = 4.1e-5
  });
});

describe('the logged return’s role beside the present controller', () => {
  it('is a check, except where the present controller’s law was fitted on the rows not held: then the months as logged, no check', () => {
    expect(loggedReturnRole(false)).toBe('check');
    expect(loggedReturnRole(true)).toBe('check; cut short at time limits');
    expect(loggedReturnRole(false, true)).toBe('as logged, held stretches included; not a check');
    expect(lawFittedOnMovingRows({ rows: 900, share: 0.1, stretches: 30, longest: 40, effect: 0.6, severity: 'serious', lawFittedOn: 'movingRows', rowsUsed: 8100 })).toBe(true);
    expect(lawFittedOnMovingRows({ rows: 0, share: 0, stretches: 0, longest: 0, effect: 0, severity: null, lawFittedOn: 'everyRow', rowsUsed: 9000 })).toBe(false);
    expect(lawFittedOnMovingRows({ reason: 'the log has fewer than two transitions' })).toBe(false);
    expect(lawFittedOnMovingRows(undefined)).toBe(false);
  });
});
