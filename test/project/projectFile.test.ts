import { describe, expect, it } from 'vitest';
import { migrateDocument, MigrationError } from '../../src/project/migrations';
import { parseProjectText, serializeProject } from '../../src/project/projectFile';
import { PROJECT_FORMAT } from '../../src/project/schema';

const minimal = () => ({
  format: PROJECT_FORMAT,
  version: 1,
  name: 'Test loop',
  data: { path: 'log.csv' },
  columns: {
    states: [{ column: 'level_m', unit: 'm' }, { column: 'flow_m3h' }],
    actions: [{ column: 'valve_pct', unit: '%' }],
    reward: { kind: 'column', column: 'cost', sense: 'cost' },
  },
  discount: 0.95,
  candidates: [{ name: 'A', offset: [50], gain: [[-2, 0.1]], std: [1] }],
  approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
});

const parse = (doc: unknown) => parseProjectText(JSON.stringify(doc), 'p.spcritic');

describe('project document', () => {
  it('fills defaults and round-trips through serialise/parse', () => {
    const first = parse(minimal());
    expect(first.ok).toBe(true);
    if (!first.ok) return;
    const doc = first.value.document;
    expect(doc.quadratureNodes).toBe(10);
    expect(doc.columns.nextState).toEqual({ kind: 'nextRow' });
    expect(doc.data.csv).toEqual({ delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' });
    const again = parseProjectText(serializeProject(doc), 'p.spcritic');
    expect(again.ok && again.value.document).toEqual(doc);
  });

  it('names the field of a wrong value', () => {
    const doc = minimal();
    doc.discount = 1.2;
    const result = parse(doc);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems[0].where).toBe('p.spcritic, discount');
    expect(result.problems[0].message).toMatch(/below 1/);
  });

  it('keeps what a cost column is declared never to leave, and names crossed declarations', () => {
    const doc = minimal() as ReturnType<typeof minimal> & { columns: { reward: Record<string, unknown> } };
    doc.columns.reward = { kind: 'column', column: 'cost', sense: 'cost', atLeast: 0 };
    const kept = parse(doc);
    expect(kept.ok && kept.value.document.columns.reward).toEqual({ kind: 'column', column: 'cost', sense: 'cost', atLeast: 0 });
    doc.columns.reward = { kind: 'column', column: 'cost', sense: 'cost', atLeast: 5, atMost: 1 };
    const crossed = parse(doc);
    expect(crossed.ok).toBe(false);
    if (crossed.ok) return;
    expect(crossed.problems[0].where).toBe('p.spcritic, columns.reward.atMost');
    expect(crossed.problems[0].message).toContain('declared never above 1 but never below 5');
  });

  it('checks gain shapes against the columns', () => {
    const doc = minimal();
    doc.candidates[0].gain = [[-2]];
    const result = parse(doc);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems[0].where).toContain('candidates[0] "A".gain[0]');
    expect(result.problems[0].message).toMatch(/expected 2 value\(s\), one per state column/);
  });

  it('refuses unknown formats, bad JSON and newer versions with a clear message', () => {
    expect(parseProjectText('{not json', 'p.spcritic')).toMatchObject({ ok: false, problems: [{ where: 'p.spcritic' }] });
    expect(parse({ ...minimal(), format: 'other' })).toMatchObject({ ok: false, problems: [{ where: 'p.spcritic, format' }] });
    const newer = parse({ ...minimal(), version: 99 });
    expect(newer.ok).toBe(false);
    if (!newer.ok) expect(newer.problems[0].message).toMatch(/newer Setpoint Critic.*has not been changed/);
  });

  it('applies migration steps in order and keeps user fields', () => {
    const steps = {
      1: (d: Record<string, unknown>) => ({ ...d, renamed: d.old, carriedOver: { old: d.old } }),
      2: (d: Record<string, unknown>) => ({ ...d, added: true }),
    };
    const { document, fromVersion } = migrateDocument({ version: 1, old: 'x' }, steps, 3);
    expect(fromVersion).toBe(1);
    expect(document).toMatchObject({ version: 3, renamed: 'x', added: true, carriedOver: { old: 'x' } });
    expect(() => migrateDocument({ version: 1 }, {}, 2)).toThrow(MigrationError);
  });
});
