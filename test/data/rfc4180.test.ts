/**
 * CSV records as RFC 4180 ("Common Format and MIME Type for CSV Files", 2005) §2 defines them,
 * through the same papaparse configuration the importer uses (sampleRecords), and then through
 * the importer itself (numbers in quoted fields, line numbering around quoted line breaks).
 */
import { describe, expect, it } from 'vitest';
import { sampleRecords } from '../../src/data/csvDialect';
import { importDataset } from '../../src/data/importDataset';
import type { ColumnRoles } from '../../src/project/schema';

const CRLF = '\r\n';

describe('RFC 4180 §2 records', () => {
  it('RFC 4180 §2.1: each record on its own line, delimited by CRLF', () => {
    expect(sampleRecords(`aaa,bbb,ccc${CRLF}zzz,yyy,xxx${CRLF}`, ',')).toEqual([['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]);
  });

  it('RFC 4180 §2.2: the last record may lack an ending line break', () => {
    expect(sampleRecords(`aaa,bbb,ccc${CRLF}zzz,yyy,xxx`, ',')).toEqual([['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]);
  });

  it('RFC 4180 §2.3: an optional header line with the same format as records', () => {
    expect(sampleRecords(`field_name,field_name,field_name${CRLF}aaa,bbb,ccc${CRLF}`, ',')[0]).toEqual(['field_name', 'field_name', 'field_name']);
  });

  it('RFC 4180 §2.4: spaces are part of a field', () => {
    expect(sampleRecords(`aaa, bbb ,ccc${CRLF}`, ',')).toEqual([['aaa', ' bbb ', 'ccc']]);
  });

  it('RFC 4180 §2.5: fields may or may not be enclosed in double quotes', () => {
    expect(sampleRecords(`"aaa","bbb","ccc"${CRLF}zzz,yyy,xxx`, ',')).toEqual([['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]);
  });

  it('RFC 4180 §2.6: quoted fields may hold line breaks (CRLF), double quotes and commas', () => {
    expect(sampleRecords(`"aaa","b${CRLF}bb","ccc"${CRLF}zzz,yyy,xxx`, ',')).toEqual([['aaa', `b${CRLF}bb`, 'ccc'], ['zzz', 'yyy', 'xxx']]);
    expect(sampleRecords(`"a,a","b;b"${CRLF}`, ',')).toEqual([['a,a', 'b;b']]);
  });

  it('RFC 4180 §2.7: a double quote inside a quoted field is written twice', () => {
    expect(sampleRecords(`"aaa","b""bb","ccc"${CRLF}`, ',')).toEqual([['aaa', 'b"bb', 'ccc']]);
  });

  it('RFC 4180 §2.1 with LF only (common practice on Unix; the RFC allows other line breaks for text files)', () => {
    expect(sampleRecords('aaa,bbb\nzzz,yyy\n', ',')).toEqual([['aaa', 'bbb'], ['zzz', 'yyy']]);
  });
});

describe('RFC 4180 quoting through the importer', () => {
  const roles: ColumnRoles = {
    states: [{ column: 'level, upper (m)', unit: 'm' }],
    actions: [{ column: 'valve', unit: '%' }],
    reward: { kind: 'column', column: 'reward', sense: 'reward' },
    nextState: { kind: 'nextRow' },
    episode: { kind: 'single' },
  };
  const csv = { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' } as const;

  it('RFC 4180 §2.5–2.7: quoted header names and numbers; a quoted note with a line break is one spreadsheet line', () => {
    const text = [
      '"level, upper (m)",valve,reward,note',
      '"1.5",40,-0.25,plain',
      `1.6,"41",-0.36,"two${CRLF}lines"`,
      '1.7,42,-0.49,"say ""hi"""',
      '1.8,43,-0.64,',
    ].join(CRLF);
    const result = importDataset(text, 'quoted.csv', csv, roles);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const t = result.value.transitions;
    expect(Array.from(t.states)).toEqual([1.5, 1.6, 1.7]);
    expect(Array.from(t.nextStates)).toEqual([1.6, 1.7, 1.8]);
    expect(Array.from(t.actions)).toEqual([40, 41, 42]);
    expect(Array.from(t.rewards)).toEqual([-0.25, -0.36, -0.49]);
    // Records 2–4 are spreadsheet rows 2–4 even though record 3 spans two physical lines.
    expect(Array.from(t.sourceLine)).toEqual([2, 3, 4]);
    expect(result.value.rowCount).toBe(4);
  });

  it('RFC 4180 §2.6: a comma inside a quoted cell is part of the cell, so "1,5" with "." decimals is not a number', () => {
    const text = ['"level, upper (m)",valve,reward', '1.5,40,0', '"1,5",41,0', '1.7,42,0'].join('\n');
    const result = importDataset(text, 'q.csv', csv, roles);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems[0]).toEqual(expect.objectContaining({ where: 'q.csv, line 3, column level, upper (m)' }));
    expect(result.problems[0].message).toContain('"1,5" is not a number');
  });
});
