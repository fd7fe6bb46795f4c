/**
 * The present controller's coefficients carry units (GUIDE §4: units on every value), the same the
 * candidate editor gives the same quantities (ActionFormFields: "Gain on <state> (<action unit> per
 * <state unit>)"). Found in the screen review: the panel showed "164.6 ± 5.4" and "−2.18 ± 0.22"
 * with no unit anywhere.
 */
import { describe, expect, it } from 'vitest';
import { actionCoefficientUnits, gainUnits } from '../../../src/renderer/src/screens/candidates/behaviourUnits';

const temp = { column: 'tank_temp_c', unit: '°C' };

describe('units of the present controller’s coefficients', () => {
  it('puts a unit shared by every action in the row label once', () => {
    const valves = [{ column: 'hot_valve_pct', unit: '%' }, { column: 'cold_valve_pct', unit: '%' }];
    expect(actionCoefficientUnits(valves).label).toBe(' (%)');
    expect(gainUnits(valves, temp).label).toBe(' (% per °C)');
    expect(gainUnits(valves, temp).cell(1)).toBe('');
  });

  it('puts differing units after each cell, and "unit" where a column has none, as the editor does', () => {
    const mixed = [{ column: 'valve', unit: '%' }, { column: 'pump_speed', unit: 'rpm' }];
    expect(actionCoefficientUnits(mixed).label).toBe('');
    expect(actionCoefficientUnits(mixed).cell(1)).toBe(' rpm');
    expect(gainUnits(mixed, { column: 'level', unit: '' }).cell(0)).toBe(' % per unit');
    expect(actionCoefficientUnits([{ column: 'a', unit: '' }]).label).toBe('');
  });
});
