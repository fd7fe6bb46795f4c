/**
 * The retune map's headline writes the best point's J and the present controller's at the
 * precision of the best point's interval (three significant digits of its width, the app's rule for
 * every J beside its interval; JCGM 100 §7.2.2 — common practice): "J 6.75 [4.88, 8.88]", not
 * "J 6.745 [4.88, 8.88]". The map here is invented (drawing data, not a result).
 */
import { describe, expect, it } from 'vitest';
import type { RetuneMapPoint, RetuneMapResult } from '../../../src/pipeline/retuneMaps';
import { headline } from '../../../src/renderer/src/screens/findings/retuneMapWords';

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
