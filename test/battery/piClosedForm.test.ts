/**
 * A PI candidate, written as an engineer writes it, on the invented first-order loop of piLoop.ts:
 * through the project document, the import (the error integral derived from the log), the compile
 * step and linear FQE, against the closed form of the augmented linear-quadratic system (plant
 * plus integrator; Lyapunov equation, src/core/lq.ts; Bertsekas, "Dynamic Programming and Optimal
 * Control", Vol. I, §4.1). The true Q is quadratic in (y, I, u), so degree-2 features hold it
 * exactly and what is left is sampling error: J within 1 % at 100,000 transitions.
 */
import { describe, expect, it } from 'vitest';
import { closedFormPolicyCost, lqClosedForm, rewardFromCost } from '../../src/core/lq';
import { candidatePolicy } from '../../src/pipeline/candidatePolicy';
import { PI_LOOP_DISCOUNT, piLoopCsv, piLoopOperatingPoint, piLoopPlant } from './piLoop';
import { piLoopData, piLoopFqe, piLoopProject } from './piProject';

const pi = (name: string, proportionalGain: number, integral: Record<string, number>, bias = 50) => ({
  name, form: { kind: 'pi', loops: [{ measurement: 'temp_c', setpoint: 50, bias, proportionalGain, ...integral, integralState: 'temp_integral', action: 'reverse' }] }, dither: [1],
});

describe('a PI candidate on a first-order loop with integral action', () => {
  const project = piLoopProject([
    pi('retuned PI', 4, { integralTimeSeconds: 100 }),
    pi('PI by integral gain, biased', 3, { integralGain: 0.02 }, 52),
  ]);
  // 2000 runs × 51 rows under the gentler logging PI: 100,000 transitions (fixed seed). Short runs
  // from upsets put more of the log where the starts are (y0 ~ N(50, 3²)), which J weighs most.
  const data = piLoopData(project, piLoopCsv(2000, 51, 2));

  // Tolerance: the 1 %. Over seeds 1–8 of this setup, measured during development, the
  // relative error of J had mean +0.18 % and largest 0.88 % (retuned PI), mean −0.09 % and largest
  // 0.52 % (biased PI); at this seed −0.59 % and −0.24 %.
  it.each([0, 1])('estimates J of candidate %i within 1 % of the closed form', (i) => {
    expect(data.count).toBe(100_000);
    const policy = candidatePolicy(project.candidates[i], data);
    const exact = rewardFromCost(closedFormPolicyCost(lqClosedForm(piLoopPlant, piLoopOperatingPoint, policy, PI_LOOP_DISCOUNT), data.startStates, data.episodeCount));
    const fit = piLoopFqe(project, data, i);
    expect(fit.status).toBe('converged');
    expect(Math.abs(fit.value - exact) / Math.abs(exact)).toBeLessThan(0.01);
    expect(Math.abs(fit.fixedPoint - exact) / Math.abs(exact)).toBeLessThan(0.01);
  });
});
