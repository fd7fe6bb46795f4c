/**
 * bench/unusedColumnEffects.ts (unused42, measure only) reads its two effects as the closed forms say, on the white
 * cold store of probe42 (coldStoreDeliveryPlant.ts; ρ 0, clipping rare at these spreads). Least squares with an
 * omitted regressor (common practice): with today's feedforward k = 0.25 on w (sd σ_w = 0.4) and dither σ_d,
 *   E_law = k·σ_w/σ_d (w_t is independent of (T_t, q_t) at ρ 0),
 *   E_plant = 0.5·√Var(w | T, q, u)/0.1 = P/√(1 + E_law²), P = 0.5·σ_w/0.1 = 2 (Var(w | u) = σ_w²σ_d²/(k²σ_w² + σ_d²)),
 * the shift of the plant's answer to the compressor, in sd(u | T, q) and the next state's noise 0.1,
 *   B = 0.5·k·σ_w²/(k²σ_w² + σ_d²)·√(k²σ_w² + σ_d²)/0.1 = P·E_law/√(1 + E_law²),
 * and without the feedforward E_law = 0, E_plant = P, B = 0. 20,000 rows, seed 1; tolerances my choice: 0.05 absolute, 3 %
 * of E_law where it is large (an effect read in a small dither's scale scatters with it: 4.91 for 5.00 at dither 0.02)
 * and 5 % of B (1.89 for 1.96 there).
 */
import { describe, expect, it } from 'vitest';
import { DELIVERY_FEEDFORWARD, deliveryLaw } from './holdout/coldStoreDeliveryPlant';
import { deliveryLog, lawAndPlantEffects, stateColumn } from '../../bench/unusedColumnEffects';

const P = (0.5 * 0.4) / 0.1;

function effects(dither: number | null): { law: number; plant: number; shift: number } {
  const d = deliveryLog('white', 20_000, 1, dither === null ? undefined : deliveryLaw(0.3, 0, DELIVERY_FEEDFORWARD, dither));
  const { law, plant, shift } = lawAndPlantEffects(d, 2, stateColumn(d, 2));
  if ('reason' in law || 'reason' in plant || shift === null) throw new Error('an effect could not be read');
  return { law: law.effect, plant: plant.effect, shift };
}

describe('effects of a logged column the project does not use (closed forms, white cold store)', () => {
  it.each([0.05, 0.02])('a fed-forward load left out, dither %s: E_law = kσ_w/σ_d, E_plant = P/√(1 + E_law²), B = P·E_law/√(1 + E_law²)', (dither) => {
    const { law, plant, shift } = effects(dither), l = (DELIVERY_FEEDFORWARD * 0.4) / dither;
    expect(Math.abs(law - l)).toBeLessThan(Math.max(0.05, 0.03 * l));
    expect(Math.abs(plant - P / Math.sqrt(1 + l * l))).toBeLessThan(0.05);
    const b = (P * l) / Math.sqrt(1 + l * l);
    expect(Math.abs(shift - b)).toBeLessThan(0.05 * b);
  });

  it('the same load with no feedforward: E_law = 0, E_plant = P, B = 0', () => {
    const { law, plant, shift } = effects(null);
    expect(law).toBeLessThan(0.05);
    expect(shift).toBeLessThan(0.05);
    expect(Math.abs(plant - P)).toBeLessThan(0.05);
  });
});
