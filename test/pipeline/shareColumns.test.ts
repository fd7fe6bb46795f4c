/**
 * A column of shares in a table is read down the column, digit by digit, so it is written at one
 * precision (core/shareText.ts, sharesText): "how often the first came out better" in the command
 * line's table of differences, in the report's two comparison tables, and in the app's answer and
 * comparison tables. The shares are invented; the digits are worked by hand from the rule: 0.995,
 * 0.5 and 0.871 alone read 99.5 %, 50 % and 87.1 %; at the column's one decimal, 99.5 %, 50.0 % and
 * 87.1 %; 0.62 and 0.9375 read 62.0 % and 93.8 % (93.75 is exact in binary, a tie: ECMA-262's
 * Number.prototype.toFixed then takes the larger n).
 */
import { createElement } from 'react';
import { describe, expect, it } from 'vitest';
import { formatAssessment } from '../../src/cli/assessmentFormat';
import { terminalText } from '../../src/cli/terminal';
import type { Assessment } from '../../src/pipeline/assessment';
import { comparisonSection } from '../../src/pipeline/report/reportComparison';
import type { ReportInput } from '../../src/pipeline/report/reportInput';
import { shareText, sharesText } from '../../src/core/shareText';
import type { Evaluation } from '../../src/pipeline/estimates';
import { AnswerPanel } from '../../src/renderer/src/screens/findings/AnswerPanel';
import { ComparisonTable } from '../../src/renderer/src/screens/findings/ComparisonTable';
import { renderFindings, tableCells } from '../support/renderFindings';

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

/** The same assessment as the app holds it: in the project's sense, its baseline the logged return, J's intervals. */
const rendered = {
  ...assessment, valueSense: 'cost',
  comparison: { ...assessment.comparison, ranking: { ...assessment.comparison.ranking, order: ['A', 'B', 'C', 'logged return'] } },
} as unknown as Assessment;
const evaluation = { valueSense: 'cost', policies: ['A', 'B', 'C'].map((name) => ({ name })) } as unknown as Evaluation;

/** The distinct counts of decimals among a column's shares ("99.5 %" → 1, "50 %" → 0); cells without a share are skipped. */
const decimals = (column: readonly string[]): number[] => [...new Set(column.flatMap((c) => {
  const m = /^(?:above )?\d+(?:\.(\d+))? %$/.exec(c);
  return m ? [m[1]?.length ?? 0] : [];
}))];

describe('a column of shares at one precision', () => {
  it('the command line’s table of differences: first better in', () => {
    const lines = terminalText(formatAssessment(assessment)).split('\n');
    const shares = ['A − logged return', 'B − logged return', 'C − logged return', 'A − B', 'A − C'].map((row) => lines.find((l) => l.trimStart().startsWith(row))!.trim().split(/\s{2,}/).at(-1));
    expect(shares).toEqual(['99.5 %', '50.0 %', '87.1 %', '62.0 %', '93.8 %']);
  });

  it('the report’s comparison against the baseline and its table of candidates against each other', () => {
    const html = comparisonSection({ assessment, evaluation: { valueSense: 'cost', behaviour: { meanTruncationWeight: 0.2 } }, project: { columns: { reward: {} } } } as unknown as ReportInput, { next: () => 1 } as never).html;
    expect(resampleCells(html)).toEqual(['99.5 % of resamples', '50.0 % of resamples', '87.1 % of resamples', '62.0 % of resamples', '93.8 % of resamples']);
  });

  it('the app’s answer table and comparison table, rendered: one precision down each share column', () => {
    // Rendered as the app renders them (react-dom/server), so a cell that formats its share alone shows as "50 %" under "99.5 %".
    const answer = tableCells(renderFindings(createElement(AnswerPanel, { evaluation, assessment: rendered }), ['answer']), 'answer-table');
    expect(answer[0]).toEqual(['Policy', 'J', '90 % interval', 'Minus baseline', 'Better in', 'Cross-checks', 'Warnings']);
    const betterIn = answer.slice(1).map((row) => row[4]);
    expect(betterIn).toEqual(['99.5 %', '50.0 %', '87.1 %', '—']); // the baseline's own row has none
    expect(decimals(betterIn)).toEqual([1]);
    const comparison = tableCells(renderFindings(createElement(ComparisonTable, { assessment: rendered }), ['comparison']), 'comparison-table');
    expect(comparison[0]).toEqual(['First', 'Second', 'Difference', '90 % interval', 'First better in']);
    const firstBetterIn = comparison.slice(1).map((row) => row[4]);
    expect(firstBetterIn).toEqual(['99.5 %', '50.0 %', '87.1 %', '62.0 %', '93.8 %']);
    expect(decimals(firstBetterIn)).toEqual([1]);
  });
});

/**
 * A share below 1 never reads "100": 1999 of 2000 resamples is 0.9995, which three significant digits
 * round to "100 %" — "better in 100 % of resamples" would say no resample went the other way. The
 * bound (k − 1)/k < 1 is arithmetic; the resample counts are the project's range (BOOTSTRAP_RESAMPLES).
 */
describe('a share below 1 never reads 100 %, alone or in a column', () => {
  const hundred = (text: string) => /^100(\.0+)?\u00a0%$/.test(text);

  it('alone: 1999 of 2000 reads 99.95 %, one closer than 0.01 % reads above 99.99 %', () => {
    expect(shareText(0.9995)).toBe('99.95\u00a0%');
    expect(shareText(0.9996)).toBe('99.96\u00a0%');
    expect(shareText(0.99996)).toBe('above 99.99\u00a0%');
    expect(shareText(0.9994)).toBe('99.9\u00a0%');
    expect(shareText(1)).toBe('100\u00a0%');
  });

  it('in a column: 0.9995 beside 0.503 reads 99.95 % beside 50.30 %, never 100.0 %', () => {
    expect(sharesText([0.9995, 0.503])).toEqual(['99.95\u00a0%', '50.30\u00a0%']);
    expect(sharesText([0.99996, 0.503])).toEqual(['above 99.99\u00a0%', '50.3\u00a0%']);
  });

  it('(k − 1) of k resamples, for every k the settings allow up to 100 000, never reads 100', () => {
    const wrong: string[] = [];
    for (let k = 20; k <= 100_000; k++) {
      const s = (k - 1) / k, [alone, column] = [shareText(s), sharesText([s, 0.5])[0]];
      if (hundred(alone) || hundred(column)) wrong.push(`${k - 1}/${k}: ${alone} | ${column}`);
    }
    expect(wrong.slice(0, 5)).toEqual([]);
  });
});

/**
 * The report's standard errors are written at the decimal place of their row's interval, as the value
 * and the interval's ends are (figures/parts/uncertainNumber.ts valueInInterval: the place that gives
 * the interval's width three significant digits), trailing zeros kept, so a column never mixes "0.9"
 * with "0.15" (the heating-loop sample's table once read "0.15, 0.9, 0.97"). JCGM 100:2008 §7.2.6
 * (common practice): the estimate and its uncertainty are given to the same place, without excess
 * digits. Here every interval is ±0.2 (0.400 wide: three decimals). The errors are invented.
 */
describe('the report’s s.e. column is written at its row’s interval’s place', () => {
  it('reads 0.150 above 0.900 in the table of candidates against each other, and 1.000 for a J', () => {
    const withErrors = {
      ...assessment,
      candidates: assessment.candidates.map((c, i) => (i === 0 ? { ...c, policyValue: { ...c.policyValue, standardError: 1 } } : c)),
      comparison: {
        ...assessment.comparison,
        differences: assessment.comparison.differences.map((d, i) => ({ ...d, difference: { ...d.difference, standardError: [0.2, 0.2, 0.2, 0.15, 0.9][i] } })),
      },
    } as unknown as Assessment;
    const html = comparisonSection({ assessment: withErrors, evaluation: { valueSense: 'cost', behaviour: { meanTruncationWeight: 0.2 } }, project: { columns: { reward: {} } } } as unknown as ReportInput, { next: () => 1 } as never).html;
    const pairwise = html.slice(html.indexOf('Candidates against each other'));
    const errors = [...pairwise.matchAll(/<tr><td>[^<]*<\/td><td class="num">[^<]*<\/td><td class="num">([^<]*)<\/td>/g)].map((m) => m[1]);
    expect(errors).toEqual(['0.150', '0.900']);
    expect(html).toMatch(/<td>A<\/td><td class="num">5\.000<\/td><td class="num">1\.000<\/td>/);
  });
});
