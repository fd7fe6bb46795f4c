import { describe, expect, it } from 'vitest';
import { defaultNetworkSettings } from '../../src/core/fqe/networkSettings';
import { approximatorSchema } from '../../src/project/approximatorSchema';

// The engine keeps its own copy of the network defaults (core may not import the schema): the two
// must stay equal, or a project saved with defaults would not mean what the engine assumes.
describe('network approximator defaults', () => {
  it('are the same in the project schema and in the engine', () => {
    const { kind, ...fromSchema } = approximatorSchema.parse({ kind: 'network' }) as Record<string, unknown>;
    expect(kind).toBe('network');
    expect(fromSchema).toEqual({ ...defaultNetworkSettings });
  });
});
