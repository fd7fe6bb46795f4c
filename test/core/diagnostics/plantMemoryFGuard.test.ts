/**
 * The plant-memory F guard on a short log: "its F also exceeds its 0.1 % point" (plantMemoryRuleText)
 * must mean the 0.1 % point of F(q, N − p − q), the F statistic's own distribution, not of F(q, ∞).
 * Reference values from scipy.stats.f.ppf(0.999, q, d) (SciPy 1.17): F(16, 23) → 4.1618,
 * F(24, 19000) → 2.1341, F(40, 45) → 2.6180. On the shortest log the check reads (q = 16 for one state
 * and one action, 8 rows back; 23 residual degrees of freedom) the F(q, ∞) point, 2.4533, is passed by
 * chance with probability 0.024 (scipy.stats.f.sf), not 0.001.
 */
import { describe, expect, it } from 'vitest';
import type { ComponentMemory } from '../../../src/core/diagnostics/plantMemory';
import { memoryFCritical, plantMemoryFinding } from '../../../src/core/diagnostics/plantMemoryFinding';

const names = { stateNames: ['level_m'], actionNames: ['valve_pct'] };

function component(fStatistic: number, q: number, d: number): ComponentMemory {
  const partialRSquared = (fStatistic * q / d) / (1 + fStatistic * q / d);
  return { component: 0, partialRSquared, fStatistic, numeratorDf: q, denominatorDf: d, strongest: null };
}

describe('plant-memory F guard on a short log', () => {
  it('puts the guard at the 0.1 % point of F(q, N − p − q) (scipy.stats.f.ppf, within 1.5 %)', () => {
    for (const [q, d, point] of [[16, 23, 4.161845], [24, 19_000, 2.134079], [40, 45, 2.617976]]) {
      expect(Math.abs(memoryFCritical(q, d) / point - 1), `F(${q}, ${d})`).toBeLessThan(0.015);
    }
  });

  it('raises nothing for F = 3.0 on (16, 23) degrees of freedom: p = 0.0081 (scipy.stats.f.sf), not below 0.1 %', () => {
    // adjusted partial R² here is 0.45 — a caution if the guard let it through
    expect(plantMemoryFinding({ rows: 45, usableRows: 45, lags: 8, components: [component(3.0, 16, 23)] }, names)).toBeNull();
  });
});
