/**
 * The start guard on the degree choice (src/core/fqe/degreeChoiceStartGuard.ts), checked where the
 * answer is known from the start-coverage rule's own behaviour (src/core/diagnostics/startCoverage.ts):
 * a start drawn like the logged states scores above the yardstick at most 1 time in q + 1 on average
 * and below 0.35 % in 999 logs of 1000 (the conformal p-value; Vovk, Gammerman & Shafer, "Algorithmic
 * learning in a random world", 2005, ch. 2), so a start set drawn inside the logs passes (≤ 2 %
 * outside, the caution limit of severity.ts); a start set 5 standard deviations out lies where a
 * standard normal cloud of 10,000 states holds none (P(|z| > 5) ≈ 5.7·10⁻⁷ per coordinate; common
 * practice, normal tables), so all of it is outside and the default degree is kept. Run starts pass
 * by construction. In the fit: the invented quartic-cost log (quarticCostLog.ts), where the criterion
 * picks 4, keeps 4 for J over its run starts and falls back to 2 — the default fit to the bit — for
 * starts 5 sd out; and on a linear-quadratic battery log the guarded choice keeps 2 and the fit is the
 * default one to the bit.
 */
import { describe, expect, it } from 'vitest';
import { START_OUTSIDE_LIMITS } from '../../../src/core/diagnostics/severity';
import { guardDegreeChoice, startGuard } from '../../../src/core/fqe/degreeChoiceStartGuard';
import { chooseLinearPartDegree } from '../../../src/core/fqe/networkDegreeChoice';
import { fitNetworkFqe, type NetworkFqeInput } from '../../../src/core/fqe/networkFqe';
import { defaultNetworkSettings, type NetworkFqeSettings } from '../../../src/core/fqe/networkSettings';
import { createGaussianPolicy } from '../../../src/core/policy';
import { createRandom } from '../../../src/core/random';
import { batteryPlant } from '../../battery/catalogue';
import { wasmDirectory } from './networkTestEnvironment';
import { quarticCostLog } from './quarticCostLog';

/** A standard normal cloud in two dimensions, 200 runs of 50 (exchangeable with fresh draws). */
function cloud(seed: number) {
  const rng = createRandom(seed), count = 10_000, states = new Float64Array(2 * count);
  for (let i = 0; i < states.length; i++) states[i] = rng.normal();
  return { count, stateDim: 2, states, episode: Int32Array.from({ length: count }, (_, i) => Math.floor(i / 50)) };
}

function draws(count: number, seed: number, shift: number): Float64Array {
  const rng = createRandom(seed), out = new Float64Array(2 * count);
  for (let i = 0; i < out.length; i++) out[i] = shift + 0.2 * rng.normal();
  return out;
}

describe('the degree choice guarded by where J\'s starts lie', () => {
  const data = cloud(3);

  it('passes a start set drawn inside the logs and stops one 5 standard deviations out', () => {
    const inside = startGuard(data, (() => { const rng = createRandom(11), s = new Float64Array(400); for (let i = 0; i < 400; i++) s[i] = rng.normal(); return s; })(), false);
    expect(inside.starts).toBe(200);
    expect(inside.outside / inside.starts).toBeLessThanOrEqual(START_OUTSIDE_LIMITS.caution);
    expect(inside.inside).toBe(true);
    const far = startGuard(data, draws(200, 12, 5), false);
    expect(far.outside).toBe(200);
    expect(far.inside).toBe(false);
  });

  it('passes the logged runs\' own first rows by construction, without scoring them', () => {
    const g = startGuard(data, draws(200, 12, 5), true);
    expect(g).toEqual({ runStarts: true, starts: 200, outside: 0, inside: true });
  });

  it('keeps the criterion\'s degree 4 only when the guard passes, and says why when it does not', () => {
    const choice = chooseLinearPartDegree({ data: quarticCostLog(200, 100, 7), discount: 0.9, seed: 1 });
    expect(choice.chosen).toBe(4);
    const kept = guardDegreeChoice(choice, () => startGuard(data, draws(200, 12, 5), false));
    expect(kept).toMatchObject({ chosen: 2, criterionChose: 4, startGuard: { outside: 200, inside: false } });
    expect(kept.sentence).toMatch(/^Polynomial part of degree 2, the default: degree 4 predicted .* but 200 of the 200 start states of J \(100\s?%\) lie outside the logged states, more than the 2\s?%/);
    expect(guardDegreeChoice(choice, () => startGuard(data, draws(200, 12, 0), false))).toMatchObject({ chosen: 4, criterionChose: 4 });
    // Nothing to guard when the criterion keeps the default: the guard is not even computed.
    const two = { ...choice, chosen: 2 };
    expect(guardDegreeChoice(two, () => { throw new Error('not called'); })).toMatchObject({ chosen: 2, startGuard: null });
  });
});

const tiny: NetworkFqeSettings = { ...defaultNetworkSettings, hiddenLayers: [8], batchSize: 64, stepsPerIteration: 10, outerIterations: 2, heldOutFraction: 0, patience: 0, averageLast: 1 };

describe('the guarded choice in the network fit', () => {
  const log = quarticCostLog(200, 100, 7), policy = createGaussianPolicy({ offset: [0], gain: [[-0.3]], std: [0.3] }, 1);
  const input = (extra: Partial<NetworkFqeInput>): NetworkFqeInput => ({
    data: log, policy, discount: 0.9, quadratureNodes: 3, seed: 1, settings: tiny, wasmPath: wasmDirectory, method: { members: 1, intervalResamples: 20 }, ...extra,
  });
  const farStarts = Float64Array.from({ length: 50 }, (_, i) => 12 + 0.01 * i); // the log's states: sd about 0.4 around 0

  it('uses degree 4 over the run starts and the default fit, to the bit, over starts far outside; the message says which and why', async () => {
    const own = await fitNetworkFqe(input({ method: { members: 1, intervalResamples: 20, linearPartDegree: 'choose' } }));
    expect(own.degreeChoice).toMatchObject({ chosen: 4, criterionChose: 4, startGuard: { runStarts: true, inside: true } });
    expect(own.linearStart.features.dim).toBe(15);
    expect(own.message).toMatch(/Polynomial part of degree 4/);
    own.dispose();
    const guarded = await fitNetworkFqe(input({ startStates: farStarts, method: { members: 1, intervalResamples: 20, linearPartDegree: 'choose' } }));
    const plain = await fitNetworkFqe(input({ startStates: farStarts, method: { members: 1, intervalResamples: 20, linearPartDegree: 2 } }));
    expect(guarded.degreeChoice).toMatchObject({ chosen: 2, criterionChose: 4, startGuard: { runStarts: false, outside: 50, inside: false } });
    expect(guarded.linearStart.features.dim).toBe(6);
    expect(guarded.message).toMatch(/degree 2, the default: degree 4 predicted .* 50 of the 50 start states of J/);
    expect(guarded.estimate(farStarts).value).toBe(plain.estimate(farStarts).value);
    guarded.dispose();
    plain.dispose();
  }, 120_000);

  it('keeps degree 2 on a linear-quadratic battery log (lq2-vessel, seed 1), the default fit to the bit', async () => {
    const plant = batteryPlant('lq2-vessel-g0.90'), data = plant.simulate({ transitions: 20_000, seed: 1 });
    const lq = { data, policy: createGaussianPolicy(plant.candidates[0].spec, plant.stateDim), discount: plant.discount, startStates: plant.startSets()[1].states };
    const chosen = await fitNetworkFqe(input({ ...lq, method: { members: 1, intervalResamples: 20 } })); // the default method chooses
    const plain = await fitNetworkFqe(input({ ...lq, method: { members: 1, intervalResamples: 20, linearPartDegree: 2 } }));
    expect(chosen.degreeChoice).toMatchObject({ chosen: 2, criterionChose: 2, startGuard: null });
    expect(chosen.estimate(lq.startStates).value).toBe(plain.estimate(lq.startStates).value);
    expect(chosen.estimate(lq.startStates).interval).toEqual(plain.estimate(lq.startStates).interval);
    chosen.dispose();
    plain.dispose();
  }, 120_000);
});
