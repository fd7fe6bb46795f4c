/**
 * The stopping rule of the network fit (src/core/fqe/networkConvergence.ts) on sequences whose
 * remaining change is known in closed form: a geometric approach x_k = x* + c·ρ^k has window
 * means with m_k − x* = ρ^W/(1 − ρ^W)·(m_{k−W} − m_k) exactly (geometric series), so for ρ ≤ γ
 * the rule's bound must never be below the true remaining distance, and the rule must not call
 * such a sequence converged while that distance exceeds the tolerance.
 */
import { describe, expect, it } from 'vitest';
import { convergenceRule, hasConverged, iterationChange, type IterationValues } from '../../../src/core/fqe/networkConvergence';
import { createRandom } from '../../../src/core/random';

/** J_k and a probe set that moves with it (every probe value equal to J_k). */
function iterate(j: number): IterationValues {
  return { policyValue: j, probe: new Float64Array(8).fill(j) };
}

describe('networkConvergence', () => {
  it.each([0.9, 0.97, 0.99])('bounds the remaining distance of a geometric approach at ρ = γ = %s from above', (gamma) => {
    const rule = convergenceRule(gamma, 0.01, 3), target = -10, seq: IterationValues[] = [];
    for (let k = 1; k <= 400; k++) {
      seq.push(iterate(target + 5 * gamma ** k));
      const { remainingBound } = iterationChange(rule, seq);
      if (remainingBound === null) continue;
      // The window means lag the newest iterate, so compare with the distance of the window mean.
      const recent = seq.slice(-3).reduce((s, x) => s + x.policyValue, 0) / 3;
      const remaining = Math.abs(recent - target) / Math.abs(recent);
      expect(remainingBound).toBeGreaterThanOrEqual(remaining * (1 - 1e-9) - 1e-15);
      if (hasConverged(rule, [remainingBound])) expect(remaining).toBeLessThanOrEqual(0.01);
    }
  });

  it('needs two full windows before it decides anything', () => {
    const rule = convergenceRule(0.95, 0.5, 4);
    const seq = Array.from({ length: 7 }, () => iterate(-1));
    expect(iterationChange(rule, seq).remainingBound).toBeNull();
    expect(hasConverged(rule, Array(7).fill(0))).toBe(false);
    seq.push(iterate(-1));
    expect(iterationChange(rule, seq).remainingBound).toBe(0);
    expect(hasConverged(rule, Array(8).fill(0))).toBe(true);
  });

  it('is off with a window of 0', () => {
    const rule = convergenceRule(0.95, 0.5, 0);
    expect(iterationChange(rule, [iterate(1), iterate(1)]).remainingBound).toBeNull();
    expect(hasConverged(rule, [0, 0, 0])).toBe(false);
  });

  it('averages iterate noise: the bound of pure noise shrinks with the window', () => {
    const rng = createRandom(3), spread = (w: number) => {
      const rule = convergenceRule(0.97, 0.01, w), bounds: number[] = [];
      for (let trial = 0; trial < 400; trial++) {
        const seq = Array.from({ length: 2 * w }, () => iterate(-10 * (1 + 0.003 * rng.normal())));
        bounds.push(iterationChange(rule, seq).remainingBound!);
      }
      return bounds.reduce((a, b) => a + b, 0) / bounds.length;
    };
    // Mean |N(0, 2σ²/W)|·γ^W/(1 − γ^W): from W = 2 to W = 8, √4·(0.97²/(1 − 0.97²))/(0.97⁸/(1 − 0.97⁸)) ≈ 7.2.
    const ratio = spread(2) / spread(8), expected = 2 * (0.97 ** 2 / (1 - 0.97 ** 2)) / (0.97 ** 8 / (1 - 0.97 ** 8));
    expect(ratio / expected).toBeGreaterThan(0.85);
    expect(ratio / expected).toBeLessThan(1.15);
  });
});
