import { describe, expect, it } from 'vitest';
import { compileCandidate, CandidateFormError } from '../../../src/core/policy/candidateForms';
import { logDensity, notAffineReason, policyMean, PolicyError, sampleAction } from '../../../src/core/policy';
import { normalCdf } from '../../../src/core/normalDistribution';
import { createRandom } from '../../../src/core/random';

// States: 0 zone temperature (°C), 1 outdoor temperature (°C), 2 error integral (K·s), 3 previous valve (%), 4 zone setpoint (°C).
const DS = 5;
const mean = (policy: ReturnType<typeof compileCandidate>, state: number[]) => { const out = new Float64Array(1); policyMean(policy, state, out); return out[0]; };

describe('candidate forms compiled to the Gaussian policy', () => {
  it('PI, reverse acting: a = bias + Kc·(r − y) + (Kc/Ti)·I, written out by hand', () => {
    const pi = compileCandidate({
      form: { kind: 'pi', loops: [{ measurementState: 0, setpoint: { value: 21 }, bias: 60, proportionalGain: 25, integral: { timeSeconds: 600 }, integralState: 2, action: 'reverse' }] },
      dither: [3],
    }, DS);
    // y = 20.2 °C, I = 90 K·s: 60 + 25·0.8 + (25/600)·90 = 60 + 20 + 3.75.
    expect(mean(pi, [20.2, -3, 90, 50, 0])).toBeCloseTo(83.75, 12);
    expect(Array.from(pi.gain)).toEqual([-25, 0, 25 / 600, 0, 0]);
    expect(notAffineReason(pi)).toBeNull(); // a PI form is affine in the states: affine-only methods apply
  });

  it('direct acting flips the sign; a setpoint column enters with +Kc; an integral gain is used as given', () => {
    const pi = compileCandidate({
      form: { kind: 'pi', loops: [{ measurementState: 0, setpoint: { state: 4 }, bias: 40, proportionalGain: 10, integral: { gain: 0.01 }, integralState: 2, action: 'direct' }] },
      dither: [1],
    }, DS);
    // e = y − r = 1.5; the integral state holds Σ(r − y)Δt = −300, so the direct-acting integral term is −0.01·(−300).
    expect(mean(pi, [22.5, 0, -300, 0, 21])).toBeCloseTo(40 + 15 + 3, 12);
  });

  it('P only needs no integral state', () => {
    const p = compileCandidate({ form: { kind: 'pi', loops: [{ measurementState: 0, setpoint: { value: 21 }, bias: 50, proportionalGain: 5, action: 'reverse' }] }, dither: [2] }, DS);
    expect(mean(p, [19, 0, 1e6, 0, 0])).toBeCloseTo(60, 12);
  });

  it('a schedule with PI trim: S(outdoor) + Kc·(r − y) + Ki·I, and it is not affine', () => {
    const s = compileCandidate({
      form: { kind: 'schedule', loops: [{ inputState: 1, breakpoints: [-10, 10], values: [90, 30], feedback: { measurementState: 0, setpoint: { value: 21 }, proportionalGain: 8, integral: { timeSeconds: 1200 }, integralState: 2, action: 'reverse' } }] },
      dither: [2], bounds: { lo: [0], hi: [100], mode: 'clip' },
    }, DS);
    expect(mean(s, [21.5, 0, 600, 0, 0])).toBeCloseTo(60 - 4 + 4, 12);
    expect(notAffineReason(s)).toMatch(/schedule/);
  });

  it('a rate limit clips around the previous action: point masses at the moving limits', () => {
    const limited = compileCandidate({
      form: { kind: 'affine', offset: [50], gain: [[0, 0, 0, 0, 0]] }, dither: [4],
      bounds: { lo: [0], hi: [100], mode: 'clip' }, rateLimit: { previousActionState: [3], maxStep: [2] },
    }, DS);
    const state = [0, 0, 0, 45, 0]; // band [43, 47]; mean 50 lies above it
    expect(logDensity(limited, state, [47])).toBeCloseTo(Math.log(1 - normalCdf((47 - 50) / 4)), 12);
    expect(logDensity(limited, state, [43])).toBeCloseTo(Math.log(normalCdf((43 - 50) / 4)), 12);
    expect(logDensity(limited, state, [48])).toBe(-Infinity);
    expect(notAffineReason(limited)).toMatch(/rate limit/);
    // Sampling: P(a = 47) = 1 − Φ(−0.75) ≈ 0.7734 (4 standard errors of a binomial share).
    const rng = createRandom(11), out = new Float64Array(1), n = 20_000;
    let atUpper = 0, lowest = Infinity;
    for (let i = 0; i < n; i++) { sampleAction(limited, state, rng, out); if (out[0] === 47) atUpper++; lowest = Math.min(lowest, out[0]); }
    expect(lowest).toBe(43);
    const p = 1 - normalCdf(-0.75);
    expect(Math.abs(atUpper / n - p)).toBeLessThan(4 * Math.sqrt((p * (1 - p)) / n));
  });

  it('refuses what cannot be compiled, naming the field', () => {
    const loop = { measurementState: 0, setpoint: { value: 21 }, bias: 50, proportionalGain: 5, integral: { timeSeconds: 300 }, action: 'reverse' as const };
    expect(() => compileCandidate({ form: { kind: 'pi', loops: [loop] }, dither: [1] }, DS)).toThrow(/form\.loops\[0\]\.integralState/);
    expect(() => compileCandidate({ form: { kind: 'pi', loops: [{ ...loop, proportionalGain: -5 }] }, dither: [1] }, DS)).toThrow(CandidateFormError);
    expect(() => compileCandidate({ form: { kind: 'pi', loops: [{ ...loop, integral: { timeSeconds: 0 }, integralState: 2 }] }, dither: [1] }, DS)).toThrow(/integralTimeSeconds/);
    expect(() => compileCandidate({ form: { kind: 'schedule', loops: [{ inputState: 1, breakpoints: [0, 0], values: [1, 2] }] }, dither: [1] }, DS)).toThrow(/breakpoints\[1\]: breakpoints must increase/);
    expect(() => compileCandidate({
      form: { kind: 'affine', offset: [0], gain: [[0, 0, 0, 0, 0]] }, dither: [1], bounds: { lo: [0], hi: [1], mode: 'truncate' }, rateLimit: { previousActionState: [3], maxStep: [1] },
    }, DS)).toThrow(PolicyError);
  });
});
