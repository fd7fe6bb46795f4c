/** Results go stale when what the numbers depend on changes, and only then. */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseProjectText } from '../../../src/project/projectFile';
import { approximatorSchema } from '../../../src/project/approximatorSchema';
import { importKey, runKey } from '../../../src/shared/runKey';

const loaded = parseProjectText(readFileSync(resolve(__dirname, '../../../sample-projects/tank-levels/tank-levels.spcritic'), 'utf8'), 'p');
if (!loaded.ok) throw new Error('sample does not load');
const doc = loaded.value.document;

describe('run key', () => {
  it('ignores the name, descriptions, surface axes and where the data file lives', () => {
    const renamed = {
      ...doc, name: 'Other', description: 'x', surface: undefined, data: { ...doc.data, path: '/abs/tank-levels.csv', sha256: 'a'.repeat(64) },
      candidates: doc.candidates.map((c) => ({ ...c, description: 'changed' })),
    };
    expect(runKey(renamed, 'f')).toBe(runKey(doc, 'f'));
  });

  it('changes with the data, a candidate, a setting or how the CSV is read', () => {
    expect(runKey(doc, 'g')).not.toBe(runKey(doc, 'f'));
    expect(runKey({ ...doc, seed: 2 }, 'f')).not.toBe(runKey(doc, 'f'));
    expect(runKey({ ...doc, candidates: [{ ...doc.candidates[0], dither: [2] }, doc.candidates[1]] }, 'f')).not.toBe(runKey(doc, 'f'));
    expect(runKey({ ...doc, data: { ...doc.data, csv: { ...doc.data.csv, badRows: 'exclude' } } }, 'f')).not.toBe(runKey(doc, 'f'));
  });

  // A network file saved before the polynomial part's setting existed has no such field; read with the
  // default it gives the numbers it gave, so its kept results must stay current (the key it was saved under).
  it('keeps a network file from before the polynomial part setting current, and goes stale when the setting changes', () => {
    const { polynomialDegree: _absent, ...before } = approximatorSchema.parse({ kind: 'network' }) as Record<string, unknown>;
    const keyBefore = JSON.stringify({ ...JSON.parse(runKey(doc, 'f')), approximator: before });
    const network = { ...doc, approximator: approximatorSchema.parse({ kind: 'network' }) };
    expect(runKey(network, 'f')).toBe(keyBefore);
    expect(runKey({ ...network, approximator: { ...network.approximator, polynomialDegree: 2 } } as never, 'f')).not.toBe(runKey(network, 'f'));
    expect(runKey({ ...network, approximator: { ...network.approximator, polynomialDegree: 4 } } as never, 'f')).not.toBe(runKey({ ...network, approximator: { ...network.approximator, polynomialDegree: 2 } } as never, 'f'));
  });

  it('imports again for new bytes or roles, not for a new name', () => {
    expect(importKey({ ...doc, name: 'x' }, 1)).toBe(importKey(doc, 1));
    expect(importKey(doc, 2)).not.toBe(importKey(doc, 1));
  });

  // The import's summary carries the present controller's model, which reads a logged extreme exactly at a
  // bound a candidate declares as an actuator limit (src/core/loggedActionLimits.ts): a changed bound changes
  // that model, so the panel and the "like the present controller" draft must be imported again, or they show
  // a model the evaluation no longer uses.
  it('imports again when a candidate declares another actuator bound, not for its dither or limit mode', () => {
    const bounded = (lo: number | null, mode: 'clip' | 'truncate' = 'clip') =>
      ({ ...doc, candidates: [{ ...doc.candidates[0], bounds: { lo: [lo], hi: [null], mode } }, ...doc.candidates.slice(1)] });
    expect(importKey(bounded(0), 1)).not.toBe(importKey(doc, 1));
    expect(importKey(bounded(0), 1)).not.toBe(importKey(bounded(5), 1));
    expect(importKey(bounded(0, 'truncate'), 1)).toBe(importKey(bounded(0), 1));
    expect(importKey({ ...doc, candidates: [{ ...doc.candidates[0], dither: [2] }, ...doc.candidates.slice(1)] }, 1)).toBe(importKey(doc, 1));
  });
});
