/**
 * The nested-class pointer on hand-made class results: it fires only when the verdict is not settled,
 * degrees 2, 3 and 4 were all fitted, 3 and 4 agree by the class rule on paired resamples and could
 * have seen a 10 % gap, and degree 2 disagrees with both. Each case below breaks one condition.
 * Replicates are built from fixed ramps so each pair's paired spread is set by one scale: the
 * normalised interquartile range of an even ramp over [−1, 1] is 1/1.349 = 0.741 (IQR 1; the 1.349
 * of the normal distribution, common practice).
 */
import { describe, expect, it } from 'vitest';
import { functionClassVerdict, type ClassEstimate } from '../../../src/core/diagnostics/functionClassRange';
import { nestedClassesPoint } from '../../../src/core/diagnostics/nestedClassPointer';

const N = 200;
/** An even ramp over [−1, 1], read in the order k ↦ (k·step) mod N (steps coprime with N decorrelate the ramps). */
const ramp = (step: number) => Float64Array.from({ length: N }, (_, k) => (((k * step) % N) - (N - 1) / 2) / ((N - 1) / 2));
const u = ramp(1), w = ramp(7), x = ramp(13);
const labels = { own: 'polynomial, degree 2', middle: 'polynomial, degree 3', top: 'polynomial, degree 4' };

/**
 * Degree 2 at v2 with shared noise a·u; degree 3 adds b·w (the 2–3 paired spread is 0.741·b);
 * degree 4 adds c·x on top (the 3–4 paired spread is 0.741·c).
 */
function classes(v2: number, v3: number, v4: number, b = 0.5, c = 0.5, a = 3, paired = true): ClassEstimate[] {
  const reps = [
    Float64Array.from(u, (uk) => v2 + a * uk),
    Float64Array.from(u, (uk, k) => v3 + a * uk + b * w[k]),
    Float64Array.from(u, (uk, k) => v4 + a * uk + b * w[k] + c * x[k]),
  ];
  return [v2, v3, v4].map((value, i) => {
    const r = reps[i], mean = r.reduce((s, v) => s + v, 0) / N, sd = Math.sqrt(r.reduce((s, v) => s + (v - mean) ** 2, 0) / (N - 1));
    const label = [labels.own, labels.middle, labels.top][i];
    return { label, value, standardError: sd, interval: [value - 1.645 * sd, value + 1.645 * sd] as const, ...(paired ? { replicates: r } : {}) };
  });
}

const points = (estimates: ClassEstimate[]) => nestedClassesPoint(functionClassVerdict(estimates), labels);

describe('nested-class pointer', () => {
  it('fires: degree 2 off by 10 %, degrees 3 and 4 half a percent apart with a paired spread of 0.4 % of J', () => {
    const verdict = functionClassVerdict(classes(90, 100, 100.5));
    expect(verdict.settled).toBe(false);
    expect(nestedClassesPoint(verdict, labels)).toBe(true);
  });

  it('does not fire when the classes are settled', () => {
    const verdict = functionClassVerdict(classes(100, 100.2, 100.4));
    expect(verdict.settled).toBe(true);
    expect(nestedClassesPoint(verdict, labels)).toBe(false);
  });

  it('does not fire when degrees 3 and 4 disagree with each other', () => {
    expect(points(classes(90, 100, 110))).toBe(false);
  });

  it('does not fire when degrees 3 and 4 agree but could not have seen a 10 % gap', () => {
    // 3–4 paired spread 0.741·10 = 7.4 (of J ≈ 100): the smallest gap the pair could see is 15 %.
    const estimates = classes(70, 100, 100.5, 0.5, 10);
    expect(functionClassVerdict(estimates).settled).toBe(false);
    expect(points(estimates)).toBe(false);
    // The same values with a tight 3–4 pair do fire: the detectable gap alone decided.
    expect(points(classes(70, 100, 100.5, 0.5, 0.5))).toBe(true);
  });

  it('does not fire when degree 2 disagrees with degree 3 but not with degree 4', () => {
    // 2–3: 2.5 % of J at many standard errors; 2–4: 1.3 % (under the 2 % of the rule); 3–4: 1.2 %.
    const estimates = classes(97.5, 100, 98.8);
    expect(functionClassVerdict(estimates).settled).toBe(false);
    expect(points(estimates)).toBe(false);
  });

  it('does not fire when degree 4 was not fitted', () => {
    const verdict = functionClassVerdict(classes(90, 100, 100.5).slice(0, 2));
    expect(verdict.settled).toBe(false);
    expect(nestedClassesPoint(verdict, labels)).toBe(false);
  });

  it('does not fire without paired replicates (the 3–4 agreement must be paired)', () => {
    // Unpaired standard errors √(se3² + se4²) from small class spreads: the 3–4 pair still agrees and could see 10 %.
    const verdict = functionClassVerdict(classes(90, 100, 100.5, 0.5, 0.5, 0.5, false));
    expect(verdict.settled).toBe(false);
    expect(verdict.gaps.every((g) => !g.paired)).toBe(true);
    expect(nestedClassesPoint(verdict, labels)).toBe(false);
  });

  it('reads the pairs in either order', () => {
    const verdict = functionClassVerdict(classes(90, 100, 100.5).reverse());
    expect(nestedClassesPoint(verdict, labels)).toBe(true);
  });
});
