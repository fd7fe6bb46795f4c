import { describe, expect, it } from 'vitest';
import { checkNetworkSettings, defaultNetworkSettings, NETWORK_LIMITS, type NetworkFqeSettings } from '../../src/core/fqe/networkSettings';
import { approximatorSchema } from '../../src/project/approximatorSchema';

// The engine keeps its own copy of the network defaults (core may not import the schema): the two
// must stay equal, or a project saved with defaults would not mean what the engine assumes.
describe('network approximator defaults', () => {
  it('are the same in the project schema and in the engine', () => {
    const { kind, ...fromSchema } = approximatorSchema.parse({ kind: 'network' }) as Record<string, unknown>;
    expect(kind).toBe('network');
    expect(fromSchema).toEqual({ ...defaultNetworkSettings });
  });

  // One table of ranges (NETWORK_LIMITS) read by both: at each end the schema and the engine's own check
  // accept the same values and refuse the same values, naming the same field.
  it('accept and refuse the same values at every end of every range', () => {
    const { hiddenLayers, units, tolerance, ...scalars } = NETWORK_LIMITS;
    const cases: [string, Partial<NetworkFqeSettings>, boolean][] = [
      ['hiddenLayers', { hiddenLayers: Array(hiddenLayers.max).fill(8) }, true],
      ['hiddenLayers', { hiddenLayers: Array(hiddenLayers.max + 1).fill(8) }, false],
      ['hiddenLayers', { hiddenLayers: [units.max] }, true],
      ['hiddenLayers', { hiddenLayers: [units.max + 1] }, false],
      ['hiddenLayers', { hiddenLayers: [units.min - 1] }, false],
      ['tolerance', { tolerance: tolerance.max }, true],
      ['tolerance', { tolerance: tolerance.above }, false],
      ...Object.entries(scalars).flatMap(([field, range]): [string, Partial<NetworkFqeSettings>, boolean][] => [
        [field, { [field]: range.min }, true], [field, { [field]: range.max }, true],
        [field, { [field]: range.max + 1 }, false],
        [field, { [field]: range.min - (Number.isInteger(range.min) ? 1 : 0.01) }, false],
      ]),
    ];
    for (const [field, change, ok] of cases) {
      const schema = approximatorSchema.safeParse({ kind: 'network', ...change });
      expect([field, schema.success]).toEqual([field, ok]);
      if (!ok) expect(schema.error!.issues[0].path[0]).toBe(field);
      const engine = () => checkNetworkSettings({ ...defaultNetworkSettings, ...change });
      if (ok) expect(engine).not.toThrow();
      else expect(engine).toThrow(new RegExp(`^${field}`));
    }
  });
});
