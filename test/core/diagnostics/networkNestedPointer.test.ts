/**
 * The network project's nested-class pointer (networkNestedClassesPoint) on hand-made class results:
 * it fires only when the verdict is not settled, the network and degrees 2, 3 and 4 were all compared,
 * every pair among {network, 3, 4} agrees by the class rule and could have seen a 10 % gap, and degree 2
 * disagrees with each of the three. Each case below breaks one condition and keeps the others.
 * The arithmetic is by hand: unpaired pairs of standard errors 1 and 1 have a difference's standard
 * error of √2 = 1.414, so a gap of 3 is 2.12 standard errors (beyond the rule's 2) and 1.5 is 1.06;
 * at J ≈ 100 the smallest gap such a pair could see is 2 · 1.414 = 2.8 % (under 10 %).
 */
import { describe, expect, it } from 'vitest';
import { functionClassVerdict, unpairedGap, type ClassGap } from '../../../src/core/diagnostics/functionClassRange';
import { networkNestedClassesPoint } from '../../../src/core/diagnostics/nestedClassPointer';

const labels = { network: 'network, one hidden layer of 8 units', own: 'polynomial, degree 2', middle: 'polynomial, degree 3', top: 'polynomial, degree 4' };

/** The six pairs among the network and degrees 2, 3, 4 at these values, each class with standard error se (default 1), all unpaired. */
function gaps(v: { net: number; d2: number; d3: number; d4: number }, se: Partial<Record<'net' | 'd2' | 'd3' | 'd4', number>> = {}): ClassGap[] {
  const k = (label: string, value: number, s = 1) => ({ label, value, standardError: s });
  const net = k(labels.network, v.net, se.net), d2 = k(labels.own, v.d2, se.d2), d3 = k(labels.middle, v.d3, se.d3), d4 = k(labels.top, v.d4, se.d4);
  return [unpairedGap(net, d2), unpairedGap(net, d3), unpairedGap(net, d4), unpairedGap(d2, d3), unpairedGap(d2, d4), unpairedGap(d3, d4)];
}
const fires = (g: ClassGap[], settled = false) => networkNestedClassesPoint({ settled, gaps: g }, labels);
/** Degree 2 10 % off; the network, 3 and 4 within 0.7 of each other. */
const base = { net: 100, d2: 90, d3: 100.5, d4: 99.8 };

describe('network nested-class pointer', () => {
  it('fires: degree 2 off by 10 %, the network and degrees 3 and 4 within 0.7 % of each other', () => {
    expect(fires(gaps(base))).toBe(true);
  });

  it('does not fire when the verdict is settled', () => {
    expect(fires(gaps(base), true)).toBe(false);
  });

  it('does not fire when a class was not compared (degree 4 unconverged, or the network without a standard error)', () => {
    expect(fires(gaps(base).filter((g) => g.first !== labels.top && g.second !== labels.top))).toBe(false);
    expect(fires(gaps(base).filter((g) => g.first !== labels.network && g.second !== labels.network))).toBe(false);
  });

  it('does not fire when the network and degree 3 disagree (3 apart: 2.12 standard errors, 2.9 % of J)', () => {
    expect(fires(gaps({ net: 100, d2: 90, d3: 103, d4: 101.5 }))).toBe(false);
  });

  it('does not fire when the network and degree 4 disagree', () => {
    expect(fires(gaps({ net: 100, d2: 90, d3: 101.5, d4: 103 }))).toBe(false);
  });

  it('does not fire when degrees 3 and 4 disagree while the network agrees with each', () => {
    expect(fires(gaps({ net: 101.5, d2: 90, d3: 100, d4: 103 }))).toBe(false);
  });

  it('does not fire when an agreeing pair could not have seen a 10 % gap', () => {
    // The 3–4 pair alone made loose: a paired spread of 6 % of J, so the smallest gap it could see is 12 %.
    const loose = gaps(base).map((g) => (g.first === labels.middle && g.second === labels.top ? { ...g, paired: true, relativeStandardError: 0.06, standardErrors: 0.1 } : g));
    expect(fires(loose)).toBe(false);
    // At 4.9 % the same pair could see a 9.8 % gap: it fires.
    const tight = gaps(base).map((g) => (g.first === labels.middle && g.second === labels.top ? { ...g, relativeStandardError: 0.049 } : g));
    expect(fires(tight)).toBe(true);
  });

  it('does not fire when degree 2 agrees with the network (1.5 apart) though it differs from 3 and 4 (3.5 apart)', () => {
    expect(fires(gaps({ net: 100, d2: 98.5, d3: 102, d4: 102 }))).toBe(false);
  });

  it('does not fire when degree 2 agrees with degree 3 only', () => {
    expect(fires(gaps({ net: 100, d2: 96.8, d3: 98, d4: 100.5 }))).toBe(false);
  });

  it('does not fire when degree 2 agrees with degree 4 only', () => {
    expect(fires(gaps({ net: 100, d2: 96.8, d3: 100.5, d4: 98 }))).toBe(false);
  });

  it('reads the pairs in either order', () => {
    const swapped = gaps(base).map((g) => ({ ...g, first: g.second, second: g.first, difference: -g.difference }));
    expect(fires(swapped)).toBe(true);
  });

  it('takes the polynomial pairs from the class verdict (paired there) beside the network pairs compared unpaired', () => {
    // Degrees 2–4 with shared replicates: an even ramp over [−1, 1] (its normalised IQR is 1/1.349 = 0.741, common practice) of scale 3,
    // so each class's standard error is about 1.7 while the paired differences have no spread.
    const N = 200, ramp = Float64Array.from({ length: N }, (_, k) => (k - (N - 1) / 2) / ((N - 1) / 2));
    const cls = [[labels.own, 90], [labels.middle, 100.5], [labels.top, 99.8]] as const;
    const estimates = cls.map(([label, value]) => {
      const replicates = Float64Array.from(ramp, (r) => value + 3 * r);
      return { label, value, standardError: 1.74, interval: [value - 2.86, value + 2.86] as const, replicates };
    });
    const verdict = functionClassVerdict(estimates, [], false);
    expect(verdict.settled).toBe(false);
    expect(verdict.gaps.every((g) => g.paired)).toBe(true);
    const net = { label: labels.network, value: 100, standardError: 1 };
    const all = [...verdict.gaps, ...estimates.map((e) => unpairedGap(net, e))];
    expect(networkNestedClassesPoint({ settled: verdict.settled, gaps: all }, labels)).toBe(true);
  });
});
