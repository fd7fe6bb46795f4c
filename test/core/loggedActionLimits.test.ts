/**
 * Actuator limits read from the log (src/core/loggedActionLimits.ts): repeated extremes, or a
 * logged extreme exactly at a bound a candidate declares, even below the 0.1 % floor.
 * Outside references: the upper tail of the standard normal, 1 − Φ(3.5) = 2.3263e-4 (Abramowitz &
 * Stegun, table 26.1, from memory), which is the share at the valve's end of a logger whose
 * unclipped command is N(0.3, 0.2²) (0.3 + 0.12·s + 0.16·e with s, e independent standard normals:
 * 0.12² + 0.16² = 0.2²; a closed form); the binomial standard error of a share (common practice);
 * and the Radon–Nikodym rule that a point mass of the candidate needs one of the logger's
 * (Billingsley, "Probability and Measure", §32).
 */
import { describe, expect, it } from 'vitest';
import { fitBehaviourModel } from '../../src/core/behaviourModel';
import { DECLARED_LIMIT_ROWS, LIMIT_SHARE, loggedActionLimits, loggedLimitRuleText } from '../../src/core/loggedActionLimits';
import { normalSurvival } from '../../src/core/normalDistribution';
import { fittedBehaviourPolicy } from '../../src/core/offPolicy/behaviourPolicy';
import { ImportanceRatioError, logImportanceRatio } from '../../src/core/offPolicy/importanceRatio';
import { createGaussianPolicy } from '../../src/core/policy';
import { createRandom } from '../../src/core/random';
import type { TransitionSet } from '../../src/core/transitions';

const TAIL_AT_3_5 = 2.3263e-4; // 1 − Φ(3.5), A&S table 26.1 (from memory)
const VALVE_END = { lo: [[0]], hi: [[1]] }; // what a candidate clipped at [0, 1] declares

/** a = min(1, 0.3 + 0.12·s + 0.16·e): the valve reaches its end on about 0.023 % of rows, below the 0.1 % floor. */
function tinyShareLog(n: number, seed: number): { states: Float64Array; actions: Float64Array } {
  const rng = createRandom(seed), states = new Float64Array(n), actions = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    states[i] = rng.normal();
    actions[i] = Math.min(1, 0.3 + 0.12 * states[i] + 0.16 * rng.normal());
  }
  return { states, actions };
}

function asTransitions(states: Float64Array, actions: Float64Array): TransitionSet {
  const n = actions.length;
  return {
    count: n, stateDim: 1, actionDim: 1, stateNames: ['s'], actionNames: ['valve'], states, actions, rewards: new Float64Array(n),
    nextStates: states, terminal: new Uint8Array(n), episode: new Int32Array(n), episodeCount: 1, startStates: states.slice(0, 1),
    sourceLine: Int32Array.from({ length: n }, (_, i) => i + 2),
  };
}

describe('a limit at a bound a candidate declares', () => {
  const n = 200_000, log = tinyShareLog(n, 11);
  const atEnd = log.actions.reduce((k, a) => k + (a === 1 ? 1 : 0), 0);

  it('is read at the valve end below the 0.1\u00a0% floor only when a candidate declares it there', () => {
    expect(atEnd).toBeGreaterThanOrEqual(DECLARED_LIMIT_ROWS);
    expect(atEnd).toBeLessThan(LIMIT_SHARE * n); // the floor alone misses it: the defect's condition
    expect(loggedActionLimits(log.actions, n, 1).hi).toEqual([Infinity]);
    const limits = loggedActionLimits(log.actions, n, 1, VALVE_END);
    expect(limits.hi).toEqual([1]);
    expect(limits.evidence.hi).toEqual(['declared']);
    expect(limits.lo).toEqual([-Infinity]); // the smallest value is not a declared bound, and not repeated
    expect(limits.shareAtLimit[0]).toBeCloseTo(atEnd / n, 12);
  });

  it('lets the censored fit estimate the tiny mass there: 1 − Φ(3.5) within 10\u00a0% and within 3 binomial errors of the logged share', () => {
    const model = fitBehaviourModel(log.states, log.actions, n, 1, 1, VALVE_END);
    let predicted = 0;
    for (let i = 0; i < n; i++) predicted += normalSurvival((1 - model.offset[0] - model.gain[0][0] * log.states[i]) / model.std[0]) / n;
    console.info(`share at the valve end: fitted ${predicted.toExponential(4)}, 1 − Φ(3.5) = ${TAIL_AT_3_5}, logged ${(atEnd / n).toExponential(4)}`);
    // The fitted tail's own error: σ̂ to about 0.16/√(2n), moving z = 3.5 by 0.2 % and the tail by about 2 %; 10 % is 5 of those.
    expect(Math.abs(predicted / TAIL_AT_3_5 - 1)).toBeLessThan(0.1);
    expect(Math.abs(atEnd / n - predicted)).toBeLessThan(3 * Math.sqrt(predicted / n));
    expect(Math.abs(model.gain[0][0] - 0.12)).toBeLessThan(3 * model.gainStandardError[0][0]);
    expect(Math.abs(model.std[0] - 0.16)).toBeLessThan(0.002);
  });

  it('gives the importance ratio of a candidate clipped at [0, 1] on the rows at the end, which has none without the rule', () => {
    const data = asTransitions(log.states, log.actions);
    const candidate = createGaussianPolicy({ offset: [0.35], gain: [[0.12]], std: [0.16], bounds: { lo: [0], hi: [1], mode: 'clip' } }, 1);
    const i = log.actions.indexOf(1), s = log.states.subarray(i, i + 1), a = log.actions.subarray(i, i + 1);
    expect(() => logImportanceRatio(candidate, fittedBehaviourPolicy(data).policy, s, a)).toThrow(ImportanceRatioError);
    const ratio = logImportanceRatio(candidate, fittedBehaviourPolicy(data, VALVE_END).policy, s, a);
    expect(Number.isFinite(ratio)).toBe(true); // a ratio of two upper-tail masses, both positive
  });
});

describe('one row at the declared bound', () => {
  function oneAtEnd(): { states: Float64Array; actions: Float64Array } {
    const rng = createRandom(5), n = 2000, states = new Float64Array(n), actions = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      states[i] = rng.normal();
      actions[i] = Math.min(0.95, 0.4 + 0.1 * states[i] + 0.1 * rng.normal()); // one repeated 0.95 would be a limit; none reaches it
    }
    const top = states.indexOf(Math.max(...states));
    actions[top] = 1; // the valve at its end once, at the state that asks most
    return { states, actions };
  }

  it('is a limit (and a fit stays well posed: Olsen 1978 concavity) when declared, and is not when no candidate declares it', () => {
    const { states, actions } = oneAtEnd(), n = actions.length;
    expect(loggedActionLimits(actions, n, 1).evidence.hi).toEqual(['none']);
    expect(loggedActionLimits(actions, n, 1, { lo: [[0]], hi: [[0.99]] }).evidence.hi).toEqual(['none']); // a different declared value
    const declared = fitBehaviourModel(states, actions, n, 1, 1, VALVE_END), plain = fitBehaviourModel(states, actions, n, 1, 1);
    expect(declared.limits.evidence.hi).toEqual(['declared']);
    expect(declared.bounds).toEqual({ lo: [-Infinity], hi: [1], mode: 'clip' });
    // One censored row of 2,000 moves the fit by a fraction of its standard errors.
    expect(Math.abs(declared.gain[0][0] - plain.gain[0][0])).toBeLessThan(declared.gainStandardError[0][0]);
    expect(Math.abs(declared.std[0] / plain.std[0] - 1)).toBeLessThan(0.05);
  });

  it('keeps the floor rule for repeated extremes: two values at an undeclared extreme of 2,000 rows are a limit', () => {
    const actions = Float64Array.from({ length: 2000 }, (_, i) => (i < 2 ? 0.95 : 0.5 + 0.4 * Math.sin(i)));
    expect(loggedActionLimits(actions, 2000, 1).evidence.hi).toEqual(['repeated']);
  });
});

describe('the rule in words', () => {
  it('states both ways with the thresholds the code applies', () => {
    const text = loggedLimitRuleText();
    expect(text).toContain(`max(2, ${100 * LIMIT_SHARE}\u00a0% of the rows)`);
    expect(text).toContain(`at least ${DECLARED_LIMIT_ROWS} logged value`);
    expect(text).toContain('the bound a candidate declares for that action');
  });
});
