/**
 * The retune map's headline writes the best point's J and the present controller's at the
 * precision of the best point's interval (three significant digits of its width, the app's rule for
 * every J beside its interval; JCGM 100 §7.2.2 — common practice): "J 6.75 [4.88, 8.88]", not
 * "J 6.745 [4.88, 8.88]". The map here is invented (drawing data, not a result).
 */
import { describe, expect, it } from 'vitest';
import type { RetuneMapPoint, RetuneMapResult } from '../../../src/pipeline/retuneMaps';
import { headline } from '../../../src/renderer/src/screens/findings/retuneMapWords';
import { retuneMapSummary } from '../../../src/figures/charts/retuneMap';
import { formatRetuneMap } from '../../../src/cli/retuneMapFormat';

function map(interval: [number, number] | null, best: boolean): RetuneMapResult {
  const point: RetuneMapPoint = { coordinates: [90, 6000], value: 6.7449, interval, status: 'converged', occupancyShift: 1, support: null, route: 'closedForm' as never };
  return {
    candidate: 'PI', features: 'polynomial degree 2', notes: [], presentController: 8.5651,
    axes: [{ parameter: 'a', label: 'proportional gain K_c (%/°C)', values: [90] }, { parameter: 'b', label: 'integral time T_i (s)', values: [6000] }],
    points: [point], best: best ? { index: 0, coordinates: [90, 6000], value: 6.7449 } : null,
  };
}

describe('the retune map headline', () => {
  it('writes both J at the precision of the best point’s interval', () => {
    expect(headline(map([4.8812, 8.8794], true))).toBe('Best supported point: proportional gain K_c (%/°C) = 90, integral time T_i (s) = 6,000, J 6.74 [4.88, 8.88]. Present controller: J 8.57.');
  });

  it('names the interval\'s level where the map keeps it (results saved before it was kept read as above)', () => {
    expect(headline({ ...map([4.8812, 8.8794], true), level: 0.9 })).toBe('Best supported point: proportional gain K_c (%/°C) = 90, integral time T_i (s) = 6,000, J 6.74, 90\u00a0% interval [4.88, 8.88]. Present controller: J 8.57.');
    expect(headline({ ...map(null, true), level: 0.9 })).toContain('J 6.745. Present controller');
  });

  it('falls back to four significant digits without an interval or a best point', () => {
    expect(headline(map(null, true))).toContain('J 6.745. Present controller: J 8.565.');
    expect(headline(map(null, false))).toBe('No point of this map is both converged and supported by the logs. Present controller: J 8.565.');
  });
});

describe('one writer of the best J for every host (bestValueText)', () => {
  // The app's headline, the figure's text alternative, the report's caption and the command line all read the
  // best point's J with its interval's level; the command line with its ASCII minus and plain space.
  it('says "J 6.74, 90 % interval [4.88, 8.88]" in the app, the figure, the report and on the terminal', () => {
    const m = { ...map([4.8812, 8.8794], true), level: 0.9 }, words = 'J 6.74, 90\u00a0% interval [4.88, 8.88]';
    expect(headline(m)).toContain(words);
    expect(retuneMapSummary({ map: m, valueLabel: 'J, discounted cost (kWh)', sense: 'cost', title: 'Retune map', theme: 'light' })).toContain(words);
    expect(formatRetuneMap(map([4.8812, 8.8794], true), 0.9)).toContain(words); // the level passed where the map keeps none
    expect(formatRetuneMap(map([-8.8794, -4.8812], true), 0.9)).toContain('interval [-8.88, -4.88]');
  });
});
