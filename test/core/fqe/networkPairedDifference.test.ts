/**
 * The paired difference of two network fits (networkPairedDifference.ts) on constructed fits whose
 * parts are known exactly: what both fits share — the same wander of the iterates, the same class
 * bias against the linear comparator, the same drift — must not reach D's interval; what they do not
 * share must, by the closed forms below (sample standard deviation; the percentile interval of
 * bootstrapInterval.ts, itself checked against the normal table in its own test; independent
 * variances add, common practice).
 */
import { describe, expect, it } from 'vitest';
import { bootstrapInterval } from '../../../src/core/bootstrap/bootstrapInterval';
import { pairedNetworkDifference, trainingSpread, driftOfDifference, type PairedFit } from '../../../src/core/fqe/networkPairedDifference';

const rule = { discount: 0.95, window: 5, tolerance: 0.01, level: 0.9 };
const B = 200;
/** Sampling replicates of the baseline: a fixed, uneven spread around −50. */
const base = Array.from({ length: B }, (_, i) => -50 + 2 * Math.sin(1.7 * i) + 0.5 * Math.cos(0.3 * i * i));
/** The candidate's own sampling part on top of the shared one: small, known. */
const own = Array.from({ length: B }, (_, i) => 0.1 * Math.sin(2.9 * i + 1));
/** Iterates: a wander both fits share (the same seed), then settled. */
const wander = Array.from({ length: 20 }, (_, k) => -50 + 3 * Math.sin(k) * (k < 15 ? 1 : 0.2));

function fit(value: number, offset: number, extra: { iterates?: number[]; replicates?: number[]; linearShift?: number } = {}): PairedFit {
  const shift = extra.linearShift ?? 0;
  return {
    value, linearValue: value - 4 + shift, // the network sits 4 above the linear comparator on both: a shared class bias
    iterates: extra.iterates ?? wander.map((j) => j + offset), fullStepIterations: 15,
    replicates: extra.replicates ?? base.map((r) => r + offset), linearReplicates: (extra.replicates ?? base.map((r) => r + offset)).map((r) => r - 4 + shift),
    driftAllowance: 0.01,
  };
}

describe('pairedNetworkDifference', () => {
  it('carries none of what both fits share: the interval is the paired percentile interval widened by tolerance × |D| only', () => {
    const c = 2.5, b = fit(-50, 0), a = fit(-50 + c, c, { replicates: base.map((r, i) => r + c + own[i]) });
    const d = pairedNetworkDifference(a, b, rule)!;
    expect(trainingSpread(a, b, rule.window)).toBe(0); // the shared wander cancels exactly
    expect(d.trainingSpread).toBe(0);
    expect(d.classErrorAllowance).toBe(0); // the shared class bias cancels
    expect(d.driftAllowance).toBeCloseTo(rule.tolerance * c, 12); // D̄ did not move: only the floor
    const p = bootstrapInterval(c, own.map((x) => c + x), 0.9).percentile;
    expect(d.interval.lower).toBeCloseTo(p[0] - 0.01 * c, 12);
    expect(d.interval.upper).toBeCloseTo(p[1] + 0.01 * c, 12);
    // Per J, the same fits would carry at least 1 % of |J| ≈ 0.5 at each end from each fit: 40× the paired drift here.
    expect(0.01 * (Math.abs(a.value) + Math.abs(b.value)) / d.driftAllowance).toBeGreaterThan(35);
  });

  it('takes the training spread of D from the aligned iterates: independent wanders add as variances', () => {
    const u = [0, 1, 0, -1, 0], v = [1, 0, -1, 0, 0]; // last full-step window (k = 10 … 14)
    const it = (xs: number[]) => Array.from({ length: 20 }, (_, k) => -50 + (k >= 10 && k < 15 ? xs[k - 10] : 0));
    const a = fit(-50, 0, { iterates: it(u) }), b = fit(-50, 0, { iterates: it(v) });
    const diff = u.map((x, i) => x - v[i]), mean = diff.reduce((s, x) => s + x, 0) / 5;
    const sd = Math.sqrt(diff.reduce((s, x) => s + (x - mean) ** 2, 0) / 4); // sample SD of [−1, 1, 1, −1, 0] = 1
    expect(trainingSpread(a, b, 5)).toBeCloseTo(sd, 12);
    expect(sd).toBeCloseTo(1, 12);
  });

  it('bounds the drift of D by the contraction bound on its window means, and keeps the per-J bound with too few aligned iterates', () => {
    // D_k rises by 0.1 per iterate over the last ten: window means differ by 0.5; γ^5/(1 − γ^5) at γ 0.95 = 3.4633…
    const up = Array.from({ length: 20 }, (_, k) => -48 + (k >= 10 ? 0.1 * (k - 10) : 0));
    const a = fit(-48 + 0.9, 0, { iterates: up }), b = fit(-50, 0, { iterates: Array(20).fill(-50) });
    const g5 = 0.95 ** 5, recent = 2 + 0.1 * 7; // mean of D over k = 15 … 19
    expect(driftOfDifference(a, b, rule)).toBeCloseTo((g5 / (1 - g5)) * 0.5 + Math.abs(2.9 - recent), 12);
    const short = fit(-48, 0, { iterates: up.slice(0, 9) });
    expect(driftOfDifference(short, b, rule)).toBeCloseTo(0.01 * 48 + 0.01 * 50, 12);
  });

  describe('with both fits at the same iteration (netdiff38: the fit that stopped first run on to the other\'s stop)', () => {
    // Closed form: iterates that approach their limits geometrically at the discount, x_k = x* + c·γ^k, the case the
    // a-posteriori contraction bound (Bertsekas & Tsitsiklis 1996, §2.2) is written for. On window means of W:
    // x̄_prev − x̄_last = (x̄_last − x*)·(γ^−W − 1), so γ^W/(1 − γ^W)·|x̄_last − x̄_prev| = |x̄_last − x*| exactly.
    const g = rule.discount, K = 20, W = rule.window;
    const geometric = (limit: number, c: number) => Array.from({ length: K }, (_, k) => limit + c * g ** k);
    const lastMean = (c: number) => (c * Array.from({ length: W }, (_, i) => g ** (K - W + i)).reduce((s, x) => s + x, 0)) / W;
    const aligned = (iterates: number[]) => fit(iterates[K - 1], 0, { iterates });

    it('carries none of a movement both fits share exactly: the bound is the floor, tolerance × |D|', () => {
      const common = 30; // J of both fits still moving by 30·γ^k, in step
      const a = aligned(geometric(-48, common)), b = aligned(geometric(-50, common));
      expect(driftOfDifference(a, b, rule)).toBeCloseTo(rule.tolerance * 2, 12);
      // The same fits' own bounds (networkConvergence.ts's rule on each J) carry the common movement: 30·x̄_last each.
      const ownBound = (g ** W / (1 - g ** W)) * Math.abs(lastMean(common) - lastMean(common) / g ** W);
      expect(ownBound).toBeCloseTo(lastMean(common), 9);
      expect(ownBound / driftOfDifference(a, b, rule)).toBeGreaterThan(500);
    });

    it('bounds D\'s own movement by the contraction bound, whatever movement the fits share', () => {
      const own = 0.6; // D_k = 2 + 0.6·γ^k → 2
      for (const common of [0, 30]) {
        const a = aligned(geometric(-48, common + own)), b = aligned(geometric(-50, common));
        const reported = 2 + own * g ** (K - 1), bound = driftOfDifference(a, b, rule);
        expect(bound).toBeCloseTo(lastMean(own) + Math.abs(reported - (2 + lastMean(own))), 9);
        expect(bound).toBeGreaterThanOrEqual(Math.abs(reported - 2)); // holds the limit of D
      }
    });
  });

  it('reads the class error on D: a class bias that differs between the fits is allowed for by the rule of classErrorAllowance.ts', () => {
    const b = fit(-50, 0), a = fit(-47, 3, { replicates: base.map((r, i) => r + 3 + own[i]), linearShift: -2 });
    const d = pairedNetworkDifference(a, b, rule)!;
    // (N_a − N_b) − (L_a − L_b) = 2 on every resample bar own[i]: its interval lies ≈ 2 − 0.1 − drift from 0, a quarter of that allowed.
    expect(d.classErrorAllowance).toBeGreaterThan(0.25 * (2 - 0.1 - d.driftAllowance) - 1e-9);
    expect(d.classErrorAllowance).toBeLessThan(0.25 * 2);
  });

  it('has no interval with fewer than two paired replicates', () => {
    const b = fit(-50, 0, { replicates: base.map((r, i) => (i ? null : r)) as unknown as number[] });
    expect(pairedNetworkDifference(fit(-49, 1), b, rule)).toBeNull();
  });
});
