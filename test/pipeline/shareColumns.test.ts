/**
 * A column of shares in a table is read down the column, digit by digit, so it is written at one
 * precision (core/shareText.ts, sharesText): "how often the first came out better" in the command
 * line's table of differences, in the report's two comparison tables, and in the app's answer and
 * comparison tables. The shares are invented; the digits are worked by hand from the rule: 0.995,
 * 0.5 and 0.871 alone read 99.5 %, 50 % and 87.1 %; at the column's one decimal, 99.5 %, 50.0 % and
 * 87.1 %; 0.62 and 0.9375 read 62.0 % and 93.8 % (93.75 is exact in binary, a tie: ECMA-262's
 * Number.prototype.toFixed then takes the larger n).
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatAssessment } from '../../src/cli/assessmentFormat';
import { terminalText } from '../../src/cli/terminal';
import type { Assessment } from '../../src/pipeline/assessment';
import { comparisonSection } from '../../src/pipeline/report/reportComparison';
import type { ReportInput } from '../../src/pipeline/report/reportInput';

const estimate = (value: number) => ({ value, standardError: 0.1, percentile: [value - 0.2, value + 0.2] as [number, number], basic: [value - 0.2, value + 0.2] as [number, number], replicates: 100, failedReplicates: 0 });
const difference = (a: string, b: string, probabilityBetter: number) => ({ a, b, difference: estimate(-1), probabilityBetter });
const candidate = (name: string, value: number) => ({
  name, policyValue: estimate(value), reportedRange: null, settled: null, confirmation: { status: 'confirmed', text: 'Confirmed.' },
  diagnostics: { occupancyShift: 1.2 }, functionClasses: null, rangeCut: null, warnings: [], crossChecks: [],
});
const assessment = {
  settings: { level: 0.9, episodes: 40, resamples: 1000, seed: 1, threads: 'one thread' },
  candidates: [candidate('A', 5), candidate('B', 6), candidate('C', 7)],
  presentController: null,
  behaviour: estimate(8),
  comparison: {
    baseline: { name: 'logged return', note: '' },
    differences: [difference('A', 'logged return', 0.995), difference('B', 'logged return', 0.5), difference('C', 'logged return', 0.871), difference('A', 'B', 0.62), difference('A', 'C', 0.9375)],
    ranking: { order: ['A', 'B', 'C'], frequency: 0.4, neighbours: [] },
  },
  warnings: [],
} as unknown as Assessment;

/** Each `<td class="num">` of the report's tables that ends "of resamples", in order. */
const resampleCells = (html: string): string[] => [...html.matchAll(/<td class="num">([^<]*of resamples)<\/td>/g)].map((m) => m[1].replace(/\u00a0/g, ' '));

describe('a column of shares at one precision', () => {
  it('the command line’s table of differences: first better in', () => {
    const lines = terminalText(formatAssessment(assessment)).split('\n');
    const shares = ['A − logged return', 'B − logged return', 'C − logged return', 'A − B', 'A − C'].map((row) => lines.find((l) => l.trimStart().startsWith(row))!.trim().split(/\s{2,}/).at(-1));
    expect(shares).toEqual(['99.5 %', '50.0 %', '87.1 %', '62.0 %', '93.8 %']);
  });

  it('the report’s comparison against the baseline and its table of candidates against each other', () => {
    const html = comparisonSection({ assessment, evaluation: { valueSense: 'cost' }, project: { columns: { reward: {} } } } as unknown as ReportInput, { next: () => 1 } as never).html;
    expect(resampleCells(html)).toEqual(['99.5 % of resamples', '50.0 % of resamples', '87.1 % of resamples', '62.0 % of resamples', '93.8 % of resamples']);
  });

  it('the app’s tables write no share cell by cell (a table cell calling shareText)', () => {
    const root = resolve(__dirname, '../../src/renderer/src');
    const files = (folder: string): string[] => readdirSync(folder).flatMap((n) => (statSync(join(folder, n)).isDirectory() ? files(join(folder, n)) : /\.tsx$/.test(n) ? [join(folder, n)] : []));
    const cellByCell = files(root).flatMap((path) => readFileSync(path, 'utf8').split('\n').flatMap((line, i) => (/<td\b[^>]*>[^<]*\bshareText\(/.test(line) ? [`${relative(root, path)}:${i + 1}`] : [])));
    expect(cellByCell).toEqual([]);
  });
});
