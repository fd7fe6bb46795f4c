/**
 * The plant-memory rule (src/core/diagnostics/plantMemoryFinding.ts):
 *   - the adjusted partial R² by hand: 1 − (1 − R²)(N − p)/(N − p − q) (the adjusted R² of the added
 *     block; common practice);
 *   - the F guard's Wilson–Hilferty points against tabulated χ² quantiles: χ²_{10; 0.999} = 29.588,
 *     χ²_{24; 0.999} = 51.179 (Abramowitz & Stegun table 26.8; from memory), divided by q;
 *   - quiet, caution and serious either side of the thresholds, naming the state and the earlier signal.
 */
import { describe, expect, it } from 'vitest';
import type { ComponentMemory, PlantMemoryResult } from '../../../src/core/diagnostics/plantMemory';
import {
  adjustedPartialRSquared, MEMORY_CAUTION, MEMORY_SERIOUS, memoryFCritical, plantMemoryFinding, plantMemoryRuleText,
} from '../../../src/core/diagnostics/plantMemoryFinding';

const names = { stateNames: ['vessel_temp_c', 'jacket_temp_c'], actionNames: ['steam_valve_pct'] };

function component(partialRSquared: number, q = 24, residualDf = 19_000, j = 1): ComponentMemory {
  const f = (partialRSquared / q) / ((1 - partialRSquared) / residualDf);
  return { component: j, partialRSquared, fStatistic: f, numeratorDf: q, denominatorDf: residualDf, strongest: { kind: 'action', index: 0, lag: 3, partialRSquared: partialRSquared * 0.9 } };
}

const result = (...components: ComponentMemory[]): PlantMemoryResult => ({ rows: 19_030, usableRows: 19_030, lags: 8, components });

describe('plant memory rule', () => {
  it('adjusts the partial R² for chance by the adjusted-R² formula', () => {
    // R² = 0.02, q = 24, N − p − q = 1676: 1 − 0.98 · 1700/1676 = 0.005967…
    expect(adjustedPartialRSquared(component(0.02, 24, 1676))).toBeCloseTo(1 - (0.98 * 1700) / 1676, 12);
    expect(adjustedPartialRSquared(component(0.001, 24, 1676))).toBe(0);
  });

  it('puts the F guard at the tabulated 0.1\u00a0% points of χ²_q / q (Wilson–Hilferty within 1\u00a0%)', () => {
    expect(memoryFCritical(10) * 10).toBeCloseTo(29.588, 0);
    expect(Math.abs(memoryFCritical(10) * 10 / 29.588 - 1)).toBeLessThan(0.01);
    expect(Math.abs(memoryFCritical(24) * 24 / 51.179 - 1)).toBeLessThan(0.01);
  });

  it('is quiet at the Markov plants’ level, a caution above 5\u00a0%, serious above 50\u00a0%, naming the state and the signal', () => {
    expect(plantMemoryFinding(result(component(0.003), component(0.002, 24, 19_000, 0)), names)).toBeNull();
    const caution = plantMemoryFinding(result(component(MEMORY_CAUTION + 0.03)), names);
    expect(caution?.severity).toBe('caution');
    expect(caution?.topic).toBe('plantMemory');
    expect(caution?.message).toContain('jacket_temp_c');
    expect(caution?.message).toContain('steam_valve_pct 3 rows back');
    expect(caution?.message).toContain('"previous"');
    expect(plantMemoryFinding(result(component(MEMORY_SERIOUS + 0.05)), names)?.severity).toBe('serious');
    expect(plantMemoryFinding({ reason: 'too few rows' }, names)).toBeNull();
  });

  it('stays quiet on a large share that its F does not support (a tiny log)', () => {
    // R² = 0.2 with q = 24 on 40 residual degrees of freedom: F = 0.42, far below its 0.1 % point.
    expect(plantMemoryFinding(result(component(0.2, 24, 40)), names)).toBeNull();
  });

  it('states its thresholds from the constants the rule applies', () => {
    expect(plantMemoryRuleText()).toContain('above 5\u00a0%'); // the one share writer (core/shareText.ts): not '5.0 %' beside '50 %'
    expect(plantMemoryRuleText()).toContain('above 50\u00a0%');
  });
});
