/**
 * The slice's line under its title names each state with its unit (GUIDE §4: units on every value),
 * two to a line so no line is squeezed to the plot's width. Found in the screen review: the exported
 * slice of the heating-loop sample said "at state (21.07, −1.904, −796.3, 81.2)".
 */
import { describe, expect, it } from 'vitest';
import { sliceStateLines } from '../../../src/renderer/src/screens/findings/plotLabels';
import { formatValue } from '../../../src/figures/parts/tickFormat';
import { newProjectDocument } from '../../../src/renderer/src/document/newProject';

describe('sliceStateLines', () => {
  it('names every state with its unit, two to a line', () => {
    const d = newProjectDocument();
    const doc = { ...d, columns: { ...d.columns, states: [
      { column: 'zone_temp_c', unit: '°C' }, { column: 'outdoor_temp_c', unit: '°C' }, { column: 'zone_error_integral', unit: 'K·s' }, { column: 'valve_prev_pct', unit: '' },
    ] } };
    expect(sliceStateLines(doc, [21.07, -1.904, -796.3, 81.2], formatValue)).toEqual([
      'at zone_temp_c = 21.07 °C, outdoor_temp_c = −1.904 °C',
      'zone_error_integral = −796.3 K·s, valve_prev_pct = 81.2',
    ]);
  });
});
