/**
 * Timestamp cells and the file-wide day/month decision. ISO 8601 instants with a zone are
 * checked against Date.parse, whose format is fixed by ECMA-262 §21.4.3.2 ("Date Time String
 * Format"); wall-clock forms against Date.UTC (same calendar arithmetic, no zone).
 */
import { describe, expect, it } from 'vitest';
import { readTimestamp } from '../../src/data/timestampCell';
import { detectDecimalMark, detectDelimiter, sampleRecords } from '../../src/data/csvDialect';
import { importDataset } from '../../src/data/importDataset';
import type { ColumnRoles } from '../../src/project/schema';

const seconds = (text: string): number => {
  const reading = readTimestamp(text, '.');
  if (!reading || reading.dayFirst !== reading.monthFirst) throw new Error(`"${text}" should read one way`);
  return reading.dayFirst;
};

describe('timestamp forms', () => {
  it.each([
    '2024-03-01T12:00:00Z',
    '2024-03-01T12:00:00+01:00',
    '2024-03-01T12:00:00-0530',
    '2024-03-01T12:00:00.250Z',
    '2024-03-01',
  ])('ISO 8601 %s agrees with Date.parse (ECMA-262 §21.4.3.2)', (text) => {
    expect(seconds(text)).toBeCloseTo(Date.parse(text.replace('-0530', '-05:30')) / 1000, 9);
  });

  it.each([
    ['2024-03-01 12:34:56', Date.UTC(2024, 2, 1, 12, 34, 56)],
    ['2024-03-01T12:34', Date.UTC(2024, 2, 1, 12, 34)],
    ['29.02.2024 23:59:59', Date.UTC(2024, 1, 29, 23, 59, 59)],
    ['15/07/2023 08:05', Date.UTC(2023, 6, 15, 8, 5)],
  ])('wall-clock form %s', (text, ms) => {
    const reading = readTimestamp(text, '.')!;
    expect(reading.dayFirst).toBe(ms / 1000);
  });

  it('an ambiguous local date is read both ways', () => {
    const reading = readTimestamp('03/04/2024 10:00', '.')!;
    expect(reading.dayFirst).toBe(Date.UTC(2024, 3, 3, 10) / 1000);
    expect(reading.monthFirst).toBe(Date.UTC(2024, 2, 4, 10) / 1000);
  });

  it('plain numbers are seconds, in the file decimal mark', () => {
    expect(seconds('12.5')).toBe(12.5);
    expect(readTimestamp('12,5', ',')!.dayFirst).toBe(12.5);
  });

  it('impossible dates read as NaN both ways; non-dates are not timestamps at all', () => {
    const leap = readTimestamp('29.02.2023 00:00', '.')!; // 2023 is not a leap year
    expect([leap.dayFirst, leap.monthFirst]).toEqual([NaN, NaN]);
    expect(readTimestamp('2024-03-01 25:00:00', '.')).toEqual({ dayFirst: NaN, monthFirst: NaN });
    expect(readTimestamp('yesterday', '.')).toBeUndefined();
    expect(readTimestamp('2024/03/01', '.')).toBeUndefined();
  });
});

describe('day/month order per file', () => {
  const roles: ColumnRoles = {
    states: [{ column: 'level', unit: '' }],
    actions: [{ column: 'valve', unit: '' }],
    reward: { kind: 'column', column: 'reward', sense: 'reward' },
    nextState: { kind: 'nextRow' },
    episode: { kind: 'timeGap', column: 'time', maxGapSeconds: 1e9 },
  };
  const importTimes = (times: string[]) => {
    const text = ['time,level,valve,reward', ...times.map((t, i) => `${t},${i},${i},0`)].join('\n');
    const result = importDataset(text, 'dates.csv', { delimiter: ',', decimalMark: '.', badRows: 'stop' }, roles);
    if (!result.ok) throw new Error(result.problems[0].message);
    return result.value;
  };

  it('a day above 12 in first place means day first', () => {
    const d = importTimes(['12/01/2024 10:00', '13/01/2024 10:00', '14/01/2024 10:00']);
    expect(d.summary.dateOrder).toBe('dayFirst');
    expect(d.summary.samplingPeriodSeconds).toBe(86400);
    expect(d.episodeReport).toContain('Dates in column time: line 3 has a day above 12 in first place, so dates read day first (dd/mm/yyyy).');
  });

  it('a day above 12 in second place means month first', () => {
    const d = importTimes(['01/12/2024 10:00', '01/13/2024 10:00']);
    expect(d.summary.dateOrder).toBe('monthFirst');
    expect(d.summary.samplingPeriodSeconds).toBe(86400);
  });

  it('with every day 12 or below, the order that keeps time running forwards wins', () => {
    // Month first: 5 Jan, 6 Jan, 1 Feb (forwards). Day first: 1 May, 1 Jun, 2 Jan (backwards).
    const d = importTimes(['01/05/2024 10:00', '01/06/2024 10:00', '02/01/2024 10:00']);
    expect(d.summary.dateOrder).toBe('monthFirst');
    expect(d.episodeReport).toContain('Dates in column time: every day is 12 or below; timestamps run forwards more often when read month first (mm/dd/yyyy).');
  });

  it('otherwise day first, and the report says it is the default', () => {
    const d = importTimes(['01.02.2024 10:00', '01.03.2024 10:00']);
    expect(d.summary.dateOrder).toBe('dayFirst');
    expect(d.episodeReport.join('\n')).toContain('dates read day first (dd/mm/yyyy), the documented default');
  });

  it('ISO dates depend on no order: dateOrder is null and nothing is said', () => {
    const d = importTimes(['2024-01-05 10:00', '2024-01-06 10:00']);
    expect(d.summary.dateOrder).toBeNull();
    expect(d.episodeReport.join('\n')).not.toContain('Dates in column');
  });
});

describe('dialect detection', () => {
  it.each([
    ['a,b,c\n1.5,2,3\n', ','],
    ['a;b;c\n1,5;2;3\n', ';'],
    ['a\tb\tc\n1.5\t2\t3\n', '\t'],
    ['"x;y",b\n1,2\n', ','], // the semicolon is inside a quoted name (RFC 4180 §2.6)
  ] as const)('%j → %j', (text, delimiter) => {
    expect(detectDelimiter(text)).toBe(delimiter);
  });

  it('decimal comma only where such cells outnumber decimal points', () => {
    expect(detectDecimalMark(sampleRecords('a;b\n1,5;2,5\n3,5;4\n', ';'))).toBe(',');
    expect(detectDecimalMark(sampleRecords('a;b\n1.5;2.5\n3,5;4\n', ';'))).toBe('.');
    expect(detectDecimalMark(sampleRecords('a;b\n1;2\n', ';'))).toBe('.');
  });
});
