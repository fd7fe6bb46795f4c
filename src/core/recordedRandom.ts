/**
 * Common random numbers drawn once. Simulations that reuse a seed on purpose (the model rollouts
 * run every bootstrap refit and every policy from the same streams; Glasserman, "Monte Carlo
 * Methods in Financial Engineering", 2003, ch. 4, section from memory) would otherwise make the
 * same draws again each time: xoshiro128** and the Box–Muller transform (a logarithm, a root and a
 * cosine or sine per normal) for numbers already known. Here the first stream opened with a seed
 * records what each call returned, and later streams with that seed replay the record.
 *
 * Exact: a stream's numbers depend only on its seed and on the kinds of the calls made (normal or
 * uniform; integer(n) is ⌊n·uniform()⌋ in random.ts, so it takes a uniform), so a replay whose
 * calls are of the recorded kinds returns createRandom(seed)'s numbers to the last bit. Where a
 * simulation's calls part from the record (a rejected draw of a truncated action, a run that ended
 * sooner), that stream goes on from a fresh createRandom(seed) brought to the same point by calls
 * of the recorded kinds: the same numbers again, only not from the record.
 *
 * Memory: at most RECORDED_DRAWS numbers in all; past that, a stream reaching the end of its record
 * goes on from a fresh generator as above rather than extend it.
 */
import { createRandom, type RandomSource } from './random';

/** A source of seeded streams: createRandom itself, or one that records and replays (below). */
export type RandomStreams = (seed: number) => RandomSource;

/** Draws recorded in all by one recordedStreams (our choice: 2²¹, about 32 MiB with their kinds). */
export const RECORDED_DRAWS = 2 ** 21;

const NORMAL = 0, UNIFORM = 1;

interface DrawRecord {
  readonly kinds: number[];
  readonly values: number[];
  /** The generator after the record's last draw, which extends it. */
  readonly source: RandomSource;
}

/** Streams equal to createRandom(seed)'s, each seed's draws made once and replayed after. */
export function recordedStreams(): RandomStreams {
  const records = new Map<number, DrawRecord>(), budget = { left: RECORDED_DRAWS };
  return (seed) => {
    let record = records.get(seed);
    if (!record) records.set(seed, (record = { kinds: [], values: [], source: createRandom(seed) }));
    return replay(record, seed, budget);
  };
}

function replay(record: DrawRecord, seed: number, budget: { left: number }): RandomSource {
  let position = 0, live: RandomSource | null = null;
  const call = (source: RandomSource, kind: number) => (kind === NORMAL ? source.normal() : source.uniform());
  const draw = (kind: number): number => {
    if (live) return call(live, kind);
    if (position < record.kinds.length && record.kinds[position] === kind) return record.values[position++];
    if (position === record.kinds.length && budget.left > 0) {
      const value = call(record.source, kind);
      record.kinds.push(kind);
      record.values.push(value);
      budget.left--;
      position++;
      return value;
    }
    // Parting from the record (or past the budget): a fresh generator brought here by the recorded calls.
    live = createRandom(seed);
    for (let j = 0; j < position; j++) call(live, record.kinds[j]);
    return call(live, kind);
  };
  return { normal: () => draw(NORMAL), uniform: () => draw(UNIFORM), integer: (n) => Math.floor(draw(UNIFORM) * n) };
}
