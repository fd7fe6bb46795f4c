/**
 * The agreement rule between the network and the linear estimate: its decisions at and around
 * each threshold, on hand-made estimates (a pure decision rule; the numbers are chosen to sit on
 * either side of NEGLIGIBLE_SHARE and WIDE_SHARE). Whether the paired-difference interval itself
 * covers as it should is measured on the battery (bench/batteryBench.ts).
 */
import { describe, expect, it } from 'vitest';
import { approximatorAgreement, NEGLIGIBLE_SHARE, WIDE_SHARE, type EstimateWithInterval } from '../../../src/core/fqe/approximatorAgreement';

const at = (value: number, lower: number, upper: number): EstimateWithInterval => ({ value, interval: { lower, upper, level: 0.9 } });

describe('approximatorAgreement with a paired difference', () => {
  it('disagrees when the difference interval excludes 0 and the difference is material', () => {
    const a = approximatorAgreement({ network: at(-10, -10.3, -9.7), linear: at(-11, -11.3, -10.7), difference: at(1, 0.8, 1.2) });
    expect(a.verdict).toBe('disagree');
    expect(a.basis).toBe('pairedDifference');
    expect(a.relativeDifference).toBeCloseTo(1 / 11, 12);
    expect(a.message).toMatch(/disagree: they differ by 1\.00 \(9\.09\u00a0% of the value\).*90\u00a0% intervals.*function class/);
  });

  it('agrees when the difference is significant but below the negligible share', () => {
    const small = 0.5 * NEGLIGIBLE_SHARE * 10;
    const a = approximatorAgreement({ network: at(-10 + small, -10.2, -9.8), linear: at(-10, -10.2, -9.8), difference: at(small, 0.01, 0.09) });
    expect(a.verdict).toBe('agree');
    expect(a.message).toMatch(/agree.*under 2\.5\u00a0% of the value/);
  });

  it('agrees when the paired interval holds 0 and is narrow, even though the separate intervals barely overlap', () => {
    const a = approximatorAgreement({ network: at(-10, -10.5, -9.5), linear: at(-10.3, -10.8, -9.8), difference: at(0.3, -0.05, 0.4) });
    expect(a.verdict).toBe('agree');
  });

  it('is inconclusive when the paired interval holds 0 but reaches beyond the wide share', () => {
    const wide = (WIDE_SHARE + 0.01) * 10;
    const a = approximatorAgreement({ network: at(-10, -11, -9), linear: at(-10.2, -11, -9.4), difference: at(0.2, -wide, wide) });
    expect(a.verdict).toBe('inconclusive');
    expect(a.message).toMatch(/too little data/);
  });
});

describe('approximatorAgreement from two separate intervals', () => {
  it('disagrees only when the intervals do not overlap', () => {
    expect(approximatorAgreement({ network: at(-10, -10.2, -9.8), linear: at(-11, -11.2, -10.8) }).verdict).toBe('disagree');
    const overlapping = approximatorAgreement({ network: at(-10, -10.1, -9.9), linear: at(-10.1, -10.2, -10.0) });
    expect(overlapping.verdict).toBe('agree');
    expect(overlapping.basis).toBe('intervalOverlap');
  });

  it('calls overlapping but wide intervals inconclusive', () => {
    expect(approximatorAgreement({ network: at(-10, -11, -9), linear: at(-10.1, -11, -9.2) }).verdict).toBe('inconclusive');
  });
});
