/**
 * The app's retune-map table heads J with the project's cost unit (pipeline/valueUnitWords.ts
 * valueColumnHead), as the values table does: "J (€)" where the project gives €, "J" alone where it
 * gives none, and the line above says "no unit given" then. Rendered as the app renders it
 * (react-dom/server, test/support/renderFindings.ts); the map is invented drawing data.
 */
import { createElement } from 'react';
import { describe, expect, it } from 'vitest';
import type { RetuneMapResult } from '../../../src/pipeline/retuneMaps';
import { RetuneMapTable } from '../../../src/renderer/src/screens/findings/RetuneMapTable';
import { renderFindings, tableCells } from '../../support/renderFindings';

const map: RetuneMapResult = {
  candidate: 'invented P', features: 'polynomial degree 2', notes: [], presentController: 12, best: { index: 0, value: 10, coordinates: [1] },
  axes: [{ parameter: 'form.loops.0.proportionalGain', label: 'proportional gain K_c (%/°C)', values: [1, 2] }],
  points: [1, 2].map((g) => ({ coordinates: [g], value: 9 + g, interval: [8 + g, 10 + g] as [number, number], status: 'converged', support: null, occupancyShift: 1, route: 'closedForm' as never })),
} as RetuneMapResult;

const render = (unit: string) => renderFindings(createElement(RetuneMapTable, { map, testId: 'retune-map-table', unit }), []);

describe('the app\'s retune-map table', () => {
  it('heads J "J (€)" where the project gives €, and says "in €" above', () => {
    const html = render('€');
    expect(tableCells(html, 'retune-map-table')[0][1]).toBe('J (€)');
    expect(html).toContain('J at each point, in €;');
  });

  it('heads it "J" alone where no unit is given, and says so above', () => {
    const html = render('');
    expect(tableCells(html, 'retune-map-table')[0][1]).toBe('J');
    expect(html).toContain('J at each point, no unit given;');
  });
});
