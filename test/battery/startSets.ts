/**
 * The two start sets every battery plant offers, both fixed (their own seed, independent of any
 * data seed), so the truth of a candidate is one number per plant, not one per data set:
 *   steady — START_COUNT draws from the plant's logged start distribution (its steady state
 *            under the logging controller), i.e. inside the data cloud;
 *   wide   — the same states moved WIDE_FACTOR times further from the operating point, outside the
 *            logged spread, where an approximator must extrapolate.
 */
import { createRandom } from '../../src/core/random';
import type { StartSet } from './batteryPlant';
import type { StartSampler } from './episodeLog';

export const START_COUNT = 200;
/**
 * 2×: the low end of the 2–3× range the battery is asked to cover. Measured during development at
 * 2.5×: on the pendulum the network then missed by 12–14 % (the quadratic by 1 %), where the data
 * hold too few states for the saturated transient; the agreement rule flags that case.
 */
export const WIDE_FACTOR = 2;
const START_SET_SEED = 60_606;

function widenCoordinate(v: number, c: number, centre: ArrayLike<number>, scaled?: readonly boolean[]): number {
  return scaled && !scaled[c] ? v : centre[c] + WIDE_FACTOR * (v - centre[c]);
}

/**
 * The logged runs' start sampler of a simulation: 'steady' draws from the logged steady state;
 * 'wide' moves each draw WIDE_FACTOR times further from the operating point, as logs that hold
 * start-ups and upsets do — each run then settles from there, so the wide start set lies inside
 * the logged states (as the first rows of runs always are in a project, where J is taken over them).
 */
export function runStartSampler(sample: StartSampler, centre: ArrayLike<number>, runStarts: 'steady' | 'wide' = 'steady', scaled?: readonly boolean[]): StartSampler {
  if (runStarts === 'steady') return sample;
  return (rng, out) => {
    sample(rng, out);
    for (let c = 0; c < out.length; c++) out[c] = widenCoordinate(out[c], c, centre, scaled);
  };
}

/** centre: the operating point (ds); scaled: which state dimensions are moved (default all). */
export function standardStartSets(sample: StartSampler, centre: ArrayLike<number>, scaled?: readonly boolean[]): StartSet[] {
  const ds = centre.length, rng = createRandom(START_SET_SEED);
  const steady = new Float64Array(START_COUNT * ds), row = new Float64Array(ds);
  for (let k = 0; k < START_COUNT; k++) {
    sample(rng, row);
    steady.set(row, k * ds);
  }
  const wide = steady.map((v, i) => widenCoordinate(v, i % ds, centre, scaled));
  return [
    { name: 'steady', description: `${START_COUNT} states from the logged steady state`, states: steady, count: START_COUNT },
    { name: 'wide', description: `the same states, ${WIDE_FACTOR}× further from the operating point`, states: wide, count: START_COUNT },
  ];
}
