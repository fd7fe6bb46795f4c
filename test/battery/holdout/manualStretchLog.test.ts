/**
 * Logs with manual stretches (manualStretchLog.ts, the plants in manualStretchPlants.ts) are what their doc comments say:
 * the held share is the sum of K independent lengths uniform on 10..40, whose mean is 25·K and variance 80·K
 * (the discrete uniform's variance (n² − 1)/12 with n = 31: common practice); the stretches' starts are
 * uniform over the log, so the number starting in its first half is Binomial(K, ½) (to within the placement
 * rule's one row at each run's ends); each held row repeats the action before its stretch exactly; the
 * automatic rows keep today's law, as least squares recovers it (unbiased when the dither is independent of
 * the state: common practice); and with share 0 each log is its control's (the plant's own log), bit for bit.
 */
import { describe, expect, it } from 'vitest';
import type { RandomSource } from '../../../src/core/random';
import { RETUNE, coldStoreRetunedPlant, coldStoreDynamics } from './coldStoreRetunedPlant';
import { coolingTowerPlant } from './coolingTowerPlant';
import { MANUAL_STEPS, logManualRuns, manualStretches } from './manualStretchLog';
import { coldStoreManualPlant, coolingTowerManualPlant } from './manualStretchPlants';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };
const RUNS = 250, STEPS = 400;
const coldStore = { dynamics: coldStoreDynamics, behaviour: RETUNE, operatingState: [-20, 0], burnIn: 200, stateNames: ['t', 'q'], actionNames: ['u'] };

describe('hold-out logs with stretches in manual', () => {
  it('holds 25·K rows on average with K = round(share·N/25), starts uniform over the log, each stretch inside one run', () => {
    for (const [share, seed] of [[0.1, 1], [0.3, 2], [0.3, 3]]) {
      const stretches = manualStretches(RUNS, STEPS, share, seed), k = stretches.length, rows = RUNS * STEPS;
      expect(k).toBe(Math.round((share * rows) / 25));
      const held = stretches.reduce((sum, s) => sum + s.length, 0);
      // The sum of K independent discrete uniforms on 10..40: mean 25·K, variance 80·K; 4 standard deviations.
      expect(Math.abs(held - 25 * k)).toBeLessThan(4 * Math.sqrt(80 * k));
      // Starts uniform over the whole log, not in run order: Binomial(K, ½) in the first half, 4 standard deviations.
      const early = stretches.filter((s) => s.start < rows / 2).length;
      expect(Math.abs(early - k / 2)).toBeLessThan(4 * Math.sqrt(k / 4));
      const sorted = [...stretches].sort((a, b) => a.start - b.start);
      sorted.forEach((s, i) => {
        expect(s.length).toBeGreaterThanOrEqual(MANUAL_STEPS.shortest);
        expect(s.length).toBeLessThanOrEqual(MANUAL_STEPS.longest);
        expect(s.start % STEPS).toBeGreaterThanOrEqual(1);
        expect(Math.floor(s.start / STEPS)).toBe(Math.floor((s.start + s.length - 1) / STEPS));
        if (i > 0) expect(s.start).toBeGreaterThan(sorted[i - 1].start + sorted[i - 1].length);
      });
    }
  });

  it('repeats the action before each stretch on its held rows; the automatic rows keep today’s law; the reward is the cost', () => {
    const { data, held, stretches } = logManualRuns(coldStore, RUNS, STEPS, 0.3, 4);
    for (const s of stretches) for (let i = s.start; i < s.start + s.length; i++) expect(data.actions[i]).toBe(data.actions[s.start - 1]);
    // Ordinary least squares of u on T + 20 over the automatic rows within 1 K of the setpoint, where the law is
    // unclipped (u = 0.5 + 0.3·(T + 20) within [0.2, 0.8], 6 dithers from either end; selecting on the regressor
    // leaves least squares unbiased: common practice): u = 0.5 + 0.3·(T + 20), dither 0.05. After a stretch the store
    // can lie kelvins off its setpoint, where the law clips, so the rows beyond 1 K are left out of this check.
    let n = 0, sx = 0, sy = 0, sxx = 0, sxy = 0, syy = 0;
    for (let i = 0; i < data.count; i++) {
      if (held[i] || Math.abs(data.states[2 * i] + 20) > 1) continue;
      const x = data.states[2 * i] + 20, y = data.actions[i];
      n++; sx += x; sy += y; sxx += x * x; sxy += x * y; syy += y * y;
    }
    const cxx = sxx / n - (sx / n) ** 2, cxy = sxy / n - (sx / n) * (sy / n), cyy = syy / n - (sy / n) ** 2, slope = cxy / cxx;
    expect(Math.abs(slope - 0.3)).toBeLessThan(0.01);
    expect(Math.abs(sy / n - slope * (sx / n) - 0.5)).toBeLessThan(0.01);
    expect(Math.abs(Math.sqrt(cyy - slope * cxy) - 0.05)).toBeLessThan(0.003);
    for (const i of [stretches[0].start, stretches[0].start + 3, data.count - 1]) {
      const next = new Float64Array(2), cost = coldStoreDynamics.step(data.states.slice(2 * i, 2 * i + 2), data.actions.slice(i, i + 1), quiet, next);
      expect(-data.rewards[i]).toBeCloseTo(cost, 12);
    }
  });

  it('with share 0 is its control’s log, bit for bit (the one-tuning cold store; the cooling tower)', () => {
    for (const [mine, control] of [[coldStoreManualPlant(0), coldStoreRetunedPlant(true)], [coolingTowerManualPlant(0), coolingTowerPlant()]] as const) {
      const a = mine.simulate({ transitions: 8_000, seed: 5 }), b = control.simulate({ transitions: 8_000, seed: 5 });
      for (const key of ['states', 'actions', 'rewards', 'nextStates', 'episode', 'startStates'] as const) expect(a[key]).toEqual(b[key]);
      expect(a.count).toBe(b.count);
    }
  });
});
