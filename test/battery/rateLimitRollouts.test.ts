/**
 * A rate-limited PI candidate (|Δu| ≤ 2.5 % per step around the previous output, a derived state;
 * clipped to 0–100 %) on the PI loop of piLoop.ts, against seeded rollouts of its simulator from
 * the same start states. The logging controller has the same slew limit (about half its moves sit
 * at a moving limit), so the log covers the lagging states the candidate visits.
 *
 * Tolerance: 1 % of J, far above the rollouts' standard error (≈ 0.16 % of J, printed). Measured
 * during development on seeds 2 and 3: degree-4 features −0.09 % and −0.25 %; degrees 2 and 3 are
 * 3–5 % optimistic — the clipped policy's Q is not a low-degree polynomial, an approximation error
 * that a bootstrap over episodes does not show.
 */
import { describe, expect, it } from 'vitest';
import { piLoopCsv, rolloutValue, type PiLaw } from './piLoop';
import { piLoopData, piLoopFqe, piLoopProject } from './piProject';

const LOGGING: PiLaw = { bias: 50, proportionalGain: 3, integralTimeSeconds: 150, dither: 3, maxStep: 2.5, limits: [0, 100] };
const CANDIDATE: PiLaw = { bias: 50, proportionalGain: 4, integralTimeSeconds: 100, dither: 1, maxStep: 2.5, limits: [0, 100] };

describe('a rate-limited PI candidate against rollouts of its simulator', () => {
  it('estimates J within 1 % of the rollout truth (degree-4 features, 100,000 transitions)', () => {
    const project = piLoopProject([{
      name: 'PI with a slew limit',
      form: { kind: 'pi', loops: [{ measurement: 'temp_c', setpoint: 50, bias: 50, proportionalGain: 4, integralTimeSeconds: 100, integralState: 'temp_integral', action: 'reverse' }] },
      dither: [1], bounds: { lo: [0], hi: [100], mode: 'clip' }, rateLimit: { maxStep: [2.5], previousAction: ['heater_prev'] },
    }], true, 4);
    // 2000 runs × 52 rows; each run's first row only supplies the previous output: 100,000 transitions.
    const data = piLoopData(project, piLoopCsv(2000, 52, 2, LOGGING));
    expect(data.count).toBe(100_000);
    const fit = piLoopFqe(project, data, 0);
    const truth = rolloutValue(CANDIDATE, data.startStates, 5, 99);
    console.log(`rate-limited PI: FQE ${fit.value.toFixed(4)} (fixed point ${fit.fixedPoint.toFixed(4)}, ${fit.status}); rollouts ${truth.value.toFixed(4)} ± ${truth.standardError.toFixed(4)} (s.e.)`);
    expect(truth.standardError / Math.abs(truth.value)).toBeLessThan(0.003);
    expect(Math.abs(fit.fixedPoint - truth.value) / Math.abs(truth.value)).toBeLessThan(0.01);
  });
});
