/** Results go stale when what the numbers depend on changes, and only then. */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseProjectText } from '../../../src/project/projectFile';
import { approximatorSchema } from '../../../src/project/approximatorSchema';
import type { CsvSettings, ProjectDocument } from '../../../src/project/schema';
import { importKey, runFingerprint, runKey, runKeyWithNotes } from '../../../src/shared/runKey';

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

  // A reason given for what is left out is a note: it changes no row or number, so editing it must
  // neither import again nor mark results out of date; the runs and times it names must do both.
  describe('what is left out: the ends are data, the reason is a note', () => {
    const withCsv = (csv: Partial<CsvSettings>): ProjectDocument => ({ ...doc, data: { ...doc.data, csv: { ...doc.data.csv, ...csv } } });
    const runs = (from: string, to: string | undefined, reason: string) => withCsv({ excludedRuns: [{ from, ...(to ? { to } : {}), reason }] });
    const times = (from: number, to: number, reason: string) => withCsv({ excludedTimes: [{ from, to, reason }] });

    it('a changed reason keeps both keys', () => {
      for (const [a, b] of [[runs('3', '5', ''), runs('3', '5', 'before the retune')], [times(0, 600, 'start-up'), times(0, 600, 'valve test')]]) {
        expect(runKey(b, 'f')).toBe(runKey(a, 'f'));
        expect(importKey(b, 1)).toBe(importKey(a, 1));
      }
    });

    it('a changed, added or removed end changes both keys', () => {
      const base = runs('3', '5', 'retune');
      for (const other of [runs('3', '6', 'retune'), runs('2', '5', 'retune'), runs('3', undefined, 'retune'), withCsv({ excludedRuns: [] }), withCsv({})]) {
        expect(runKey(other, 'f')).not.toBe(runKey(base, 'f'));
        expect(importKey(other, 1)).not.toBe(importKey(base, 1));
      }
      expect(runKey(times(0, 900, 'x'), 'f')).not.toBe(runKey(times(0, 600, 'x'), 'f'));
      expect(importKey(times(60, 600, 'x'), 1)).not.toBe(importKey(times(0, 600, 'x'), 1));
    });

    it('the user\'s notes and the fields carried over from an older format are notes too', () => {
      expect(runKey({ ...doc, notes: { comment: 'checked by the shift lead' }, carriedOver: { old: 1 } }, 'f')).toBe(runKey(doc, 'f'));
    });

    // Results kept by an earlier version carry the fingerprint of its key (reasons and notes in it).
    it('keeps the earlier form for a project without reasons or notes, and can still write it', () => {
      expect(runKey(runs('3', '5', ''), 'f')).toBe(runKeyWithNotes(runs('3', '5', ''), 'f'));
      expect(runKeyWithNotes(runs('3', '5', 'trip'), 'f')).not.toBe(runKey(runs('3', '5', 'trip'), 'f'));
      expect(JSON.parse(runKeyWithNotes(runs('3', '5', 'trip'), 'f')).csv.excludedRuns[0].reason).toBe('trip');
    });

    // Pinned to what the earlier version wrote: the SHA-256 below was computed by runKey and runFingerprint
    // as they stood at commit d0c1cb7 (before reasons and notes left the key), on this very document, so a later
    // change to the key's form cannot silently mark such saved results out of date, nor accept others.
    it('the earlier form is exactly the fingerprint the earlier version saved', () => {
      const earlier = { ...withCsv({ excludedRuns: [{ from: '3', to: '5', reason: 'trip' }], excludedTimes: [{ from: 0, to: 600, reason: 'start-up' }] }),
        notes: { comment: 'checked by the shift lead' }, carriedOver: { old: 1 } } as ProjectDocument;
      const saved = '18182c374509f4df93ab89ddd024fb796fdac7114c1e1959fa9a36934c6305f1';
      expect(runFingerprint(runKeyWithNotes(earlier, 'f'))).toBe(saved);
      expect(runFingerprint(runKey(earlier, 'f'))).not.toBe(saved);
    });
  });
});
