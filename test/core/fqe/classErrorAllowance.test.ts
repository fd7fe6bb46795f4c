/**
 * The class-error allowance (classErrorAllowance.ts) against the bound it rests on. Under the
 * saturation assumption of hierarchical a-posteriori error estimation (from memory: Bank & Weiser,
 * Math. Comp. 1985; Dörfler & Nochetto, Numer. Math. 2002) — the richer class's error at most β
 * times the poorer one's — the triangle inequality gives |e_rich| ≤ β/(1 − β)·|J_rich − J_poor|,
 * with equality when the two errors have the same sign. Worked cases by hand below.
 */
import { describe, expect, it } from 'vitest';
import {
  CLASS_ERROR_SHARE, classErrorAllowance, classErrorSentence, disagreementBeyondSampling, withClassErrorAllowance,
} from '../../../src/core/fqe/classErrorAllowance';

const beta = CLASS_ERROR_SHARE / (1 + CLASS_ERROR_SHARE); // share = β/(1 − β)  ⇔  β = share/(1 + share)
const point = (x: number) => ({ lower: x, upper: x });

describe('classErrorAllowance', () => {
  it('states β = 0.2, the share 0.25 of the rule', () => {
    expect(beta).toBeCloseTo(0.2, 15);
  });

  it('reaches the truth exactly when both errors have the same sign and |e_net| = β|e_lin| (the bound is tight)', () => {
    // truth 10, quadratic 12 (error 2), network 10.4 (error 0.4 = β·2), no sampling error
    const truth = 10, linear = 12, network = truth + beta * (linear - truth);
    const a = classErrorAllowance(point(network - linear));
    expect(a).toBeCloseTo(network - truth, 12);
    const iv = withClassErrorAllowance({ level: 0.9, lower: network, upper: network, standardError: 0 }, a);
    expect(iv.lower).toBeCloseTo(truth, 12);
  });

  it('holds the truth with room when the errors have opposite signs', () => {
    // truth 10, quadratic 8 (error −2), network 10.4 (error +0.4): difference 2.4, allowance 0.6 ≥ 0.4
    const a = classErrorAllowance(point(2.4));
    expect(a).toBeCloseTo(0.6, 12);
    expect(10.4 - a).toBeLessThan(10);
  });

  it('counts only the disagreement beyond sampling: 0 when the difference interval holds 0, the gap to 0 otherwise', () => {
    expect(disagreementBeyondSampling({ lower: -0.5, upper: 1 })).toBe(0);
    expect(classErrorAllowance({ lower: -0.5, upper: 1 })).toBe(0);
    expect(disagreementBeyondSampling({ lower: 0.5, upper: 1.5 })).toBe(0.5);
    expect(disagreementBeyondSampling({ lower: -3, upper: -1 })).toBe(1);
    expect(classErrorAllowance({ lower: -3, upper: -1 })).toBeCloseTo(0.25, 15);
  });

  it('adds the allowance to both ends and to the standard error as an independent part; none leaves the interval as it is', () => {
    const iv = { level: 0.9, lower: 9, upper: 11, standardError: 0.6 };
    expect(withClassErrorAllowance(iv, 0)).toBe(iv);
    expect(withClassErrorAllowance(iv, 0.8)).toEqual({ level: 0.9, lower: 8.2, upper: 11.8, standardError: 1 });
  });

  it('says what it adds in words built from the share', () => {
    expect(classErrorSentence()).toMatch(/by a quarter of that excess/);
    expect(classErrorSentence(0.1)).toMatch(/by 10\u00a0% of that excess/);
  });
});
