/**
 * Recorded streams (src/core/recordedRandom.ts) against the straightforward route, a fresh
 * createRandom(seed) per stream (src/core/random.ts): the same numbers to the last bit for every
 * sequence of calls — replayed, parting from the record, interleaved with another stream of the same
 * seed, and past the budget of recorded draws.
 */
import { describe, expect, it } from 'vitest';
import { createRandom, type RandomSource } from '../../src/core/random';
import { recordedStreams, RECORDED_DRAWS } from '../../src/core/recordedRandom';

type Kind = 'normal' | 'uniform' | 'integer';
const call = (source: RandomSource, kind: Kind) => (kind === 'integer' ? source.integer(7) : source[kind]());
const draws = (source: RandomSource, kinds: readonly Kind[]) => kinds.map((k) => call(source, k));

/** A seeded sequence of call kinds, mostly normals as a simulation makes them. */
function kindsFrom(seed: number, length: number): Kind[] {
  const rng = createRandom(seed);
  return Array.from({ length }, () => { const u = rng.uniform(); return u < 0.7 ? 'normal' : u < 0.9 ? 'uniform' : 'integer'; });
}

describe('recorded random streams', () => {
  it('give createRandom’s numbers when replayed, shortened, lengthened and when their calls part from the record', () => {
    const streams = recordedStreams(), base = kindsFrom(1, 400);
    const variants: Kind[][] = [base, base, base.slice(0, 100), [...base, ...kindsFrom(2, 300)], [...base.slice(0, 150), ...kindsFrom(3, 200)], kindsFrom(4, 500)];
    for (const seed of [0, 17, 2 ** 31 + 5]) {
      for (const kinds of variants) expect(draws(streams(seed), kinds)).toEqual(draws(createRandom(seed), kinds));
    }
  });

  it('give the same numbers when two streams of one seed are drawn in turn', () => {
    const streams = recordedStreams(), kinds = kindsFrom(5, 300), a = streams(9), b = streams(9), ra = createRandom(9), rb = createRandom(9);
    const first = kinds.map((k, i) => (i % 3 === 0 ? [call(a, k), call(ra, k)] : [call(b, k), call(rb, k)]));
    for (const [got, want] of first) expect(got).toBe(want);
    expect(draws(streams(9), kinds)).toEqual(draws(createRandom(9), kinds));
  });

  it('give the same numbers past the budget of recorded draws', () => {
    const streams = recordedStreams(), kinds = kindsFrom(6, 1000), seeds = Math.ceil(RECORDED_DRAWS / kinds.length) + 2;
    for (let seed = 0; seed < seeds; seed++) draws(streams(seed), kinds);
    for (const seed of [0, seeds - 2, seeds - 1]) expect(draws(streams(seed), [...kinds, ...kinds])).toEqual(draws(createRandom(seed), [...kinds, ...kinds]));
  });
});
