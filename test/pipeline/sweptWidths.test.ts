import { describe, expect, it } from 'vitest';
import { sweptWidths } from '../../src/pipeline/assessSensitivity';
import { NETWORK_LIMITS } from '../../src/core/fqe/networkSettings';

// The width sweep's networks: each hidden layer halved and doubled (rounded to whole units, held to the
// schema's unit range), beside the project's own. The figure's setting is the first layer's units, so a
// scaled network whose first layer comes out as the project's would be drawn at the project's setting
// as if it were the project's fit; it is left out. Expected values are worked by hand.
describe('sweptWidths', () => {
  const firstLayers = (layers: number[]) => sweptWidths(layers).map((w) => w.hiddenLayers[0]);

  it('halves and doubles every layer beside the project’s own', () => {
    expect(sweptWidths([6, 4])).toEqual([
      { factor: 0.5, hiddenLayers: [3, 2] }, { factor: 1, hiddenLayers: [6, 4] }, { factor: 2, hiddenLayers: [12, 8] },
    ]);
  });

  it('leaves out a scaled network whose first layer is the project’s: one unit halved, the largest doubled', () => {
    expect(NETWORK_LIMITS.units).toEqual({ min: 1, max: 1024 });
    expect(firstLayers([1])).toEqual([1, 2]); // Math.round(0.5) = 1, held at the limit's 1
    expect(firstLayers([1024, 8])).toEqual([512, 1024]); // 2048 held at 1,024
    expect(sweptWidths([1024]).filter((w) => w.factor === 1)).toEqual([{ factor: 1, hiddenLayers: [1024] }]);
  });

  it('keeps three distinct settings, in order, from 2 units to 512', () => {
    for (let units = 2; units <= 512; units++) {
      const settings = firstLayers([units]);
      expect(settings).toHaveLength(3);
      expect(new Set(settings).size).toBe(3);
      expect(settings[1]).toBe(units);
    }
  });
});
