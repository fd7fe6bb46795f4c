/**
 * The network approximator's polynomial part setting in the project file (src/project/schema.ts,
 * values and default from src/core/fqe/polynomialPartSetting.ts): files from before it load with the
 * default, the values allowed are the engine's, and a bad value is named at its field with the
 * values allowed. Whether the fit obeys it: test/pipeline/polynomialDegreeSetting.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { DEGREE_CHOICES } from '../../src/core/fqe/networkDegreeChoice';
import { checkNetworkSettings, defaultNetworkSettings } from '../../src/core/fqe/networkSettings';
import { DEFAULT_POLYNOMIAL_PART, POLYNOMIAL_PART_VALUES } from '../../src/core/fqe/polynomialPartSetting';
import { parseProjectText, serializeProject } from '../../src/project/projectFile';
import { PROJECT_FORMAT } from '../../src/project/schema';

// A network project as files were written before the setting existed: no polynomialDegree.
const before = (approximator: Record<string, unknown> = {}) => ({
  format: PROJECT_FORMAT, version: 1, name: 'Older network project',
  data: { path: 'log.csv' },
  columns: { states: [{ column: 'level_m', unit: 'm' }], actions: [{ column: 'valve_pct', unit: '%' }], reward: { kind: 'column', column: 'cost', sense: 'cost' } },
  discount: 0.95,
  candidates: [{ name: 'A', offset: [50], gain: [[-2]], std: [1] }],
  approximator: { kind: 'network', hiddenLayers: [16, 16], activation: 'tanh', ...approximator },
});

const parse = (doc: unknown) => parseProjectText(JSON.stringify(doc), 'p.spcritic');

describe('the network polynomial part in the project file', () => {
  it('loads a file from before the setting with the default, the guarded choice, and keeps its other settings', () => {
    const loaded = parse(before());
    expect(loaded.ok).toBe(true);
    if (!loaded.ok) return;
    const a = loaded.value.document.approximator;
    expect(a).toMatchObject({ kind: 'network', hiddenLayers: [16, 16], activation: 'tanh', polynomialDegree: 'chosen' });
    expect(DEFAULT_POLYNOMIAL_PART).toBe('chosen');
    expect(loaded.value.fromVersion).toBe(1);
  });

  it('takes "chosen", 2 and 4, the degrees the engine compares, and round-trips them', () => {
    expect(POLYNOMIAL_PART_VALUES).toEqual(['chosen', ...DEGREE_CHOICES]);
    expect(DEGREE_CHOICES).toEqual([2, 4]);
    for (const polynomialDegree of POLYNOMIAL_PART_VALUES) {
      const loaded = parse(before({ polynomialDegree }));
      expect(loaded.ok).toBe(true);
      if (!loaded.ok) continue;
      expect(loaded.value.document.approximator).toMatchObject({ polynomialDegree });
      const again = parseProjectText(serializeProject(loaded.value.document), 'p.spcritic');
      expect(again.ok && again.value.document).toEqual(loaded.value.document);
    }
  });

  it('names the field and the values allowed for a degree the engine was never measured at, a string, or the engine\'s own word', () => {
    for (const polynomialDegree of [3, 1, 6, '4', 'choose', 'auto', null, 2.5]) {
      const loaded = parse(before({ polynomialDegree }));
      expect(loaded.ok).toBe(false);
      if (loaded.ok) continue;
      expect(loaded.problems).toEqual([{ where: 'p.spcritic, approximator.polynomialDegree', message: 'expected the polynomial part’s degree: "chosen", 2 or 4' }]);
    }
  });

  it('is checked by the engine too, with the same values', () => {
    expect(() => checkNetworkSettings({ ...defaultNetworkSettings, polynomialDegree: 4 })).not.toThrow();
    expect(() => checkNetworkSettings({ ...defaultNetworkSettings, polynomialDegree: 3 })).toThrow('polynomialDegree: expected "chosen", 2 or 4, got 3');
  });
});
