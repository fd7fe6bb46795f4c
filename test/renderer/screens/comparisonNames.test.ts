/**
 * The Findings comparison card writes a candidate's name with each number held to its unit
 * (core/unitGroups.ts), in its table and its ranking: at 1280 px the card's name columns are narrow and
 * "PI (25 %/K, 30 min)" wrapped as "PI (25 | %/K, 30 | min)" (the screen review's heating-loop
 * pictures). Rendered as the app renders it (react-dom/server); the names are the heating-loop sample's,
 * the numbers invented. The layout itself is checked in the screen review (test/e2e/screenReview.test.ts).
 */
import { createElement } from 'react';
import { describe, expect, it } from 'vitest';
import type { Assessment } from '../../../src/pipeline/assessment';
import { PRESENT_CONTROLLER_NAME } from '../../../src/pipeline/plan/presentController';
import { ComparisonTable } from '../../../src/renderer/src/screens/findings/ComparisonTable';
import { AnswerPanel } from '../../../src/renderer/src/screens/findings/AnswerPanel';
import type { Evaluation } from '../../../src/pipeline/estimates';
import { renderFindings, tableCells } from '../../support/renderFindings';

const PI = 'PI (25 %/K, 30 min)', LIMITED = 'PI with a 2 %/min rate limit';
const estimate = (value: number) => ({ value, standardError: 0.1, percentile: [value - 0.2, value + 0.2], basic: null, replicates: 100, failedReplicates: 0 });
const assessment = {
  valueSense: 'cost', settings: { level: 0.9, resamples: 1000 },
  comparison: {
    baseline: { name: PRESENT_CONTROLLER_NAME, note: '' },
    differences: [{ a: PI, b: PRESENT_CONTROLLER_NAME, difference: estimate(-0.85), probabilityBetter: 1 }, { a: PI, b: LIMITED, difference: estimate(-2.98), probabilityBetter: 0.999 }],
    ranking: { order: [PI, PRESENT_CONTROLLER_NAME, LIMITED], frequency: 0.987, neighbours: [{ better: PI, worse: PRESENT_CONTROLLER_NAME, frequency: 1 }] },
  },
} as unknown as Assessment;

describe('names in the comparison card', () => {
  const html = renderFindings(createElement(ComparisonTable, { assessment }), ['comparison']);

  it('holds 25 to %/K, 30 to min and 2 to %/min in the table, and leaves the other spaces to wrap', () => {
    const rows = tableCells(html, 'comparison-table', false).slice(1).map((r) => r.slice(0, 2));
    expect(rows).toEqual([
      ['PI (25\u00a0%/K, 30\u00a0min)', 'present controller'],
      ['PI (25\u00a0%/K, 30\u00a0min)', 'PI with a 2\u00a0%/min rate limit'],
    ]);
  });

  it('writes them the same way in the ranking and its neighbours', () => {
    const ranking = /<div data-testid="ranking">([\s\S]*?)<\/div>/.exec(html)![1];
    expect(ranking).toContain('PI (25\u00a0%/K, 30\u00a0min) › present controller › PI with a 2\u00a0%/min rate limit.');
    expect(ranking).toContain('PI (25\u00a0%/K, 30\u00a0min) ahead of present controller');
    expect(ranking).not.toMatch(/\d %\/|\d min/);
  });
});

describe('names in the answer card', () => {
  // The answer table's policy column is as narrow: at 1280 px the screen review showed "PI (25 %/K, 30 | min)" there too.
  const candidate = (name: string, value: number) => ({
    name, policyValue: estimate(value), reportedRange: null, settled: null, confirmation: { status: 'unconfirmed', text: '' },
    diagnostics: { occupancyShift: 1 }, functionClasses: null, rangeCut: null, warnings: [], crossChecks: [],
  });
  const answered = {
    ...assessment, candidates: [candidate(PI, 7.72), candidate(LIMITED, 10.69)], warnings: [], presentController: { policyValue: estimate(8.56) }, behaviour: estimate(8.51),
    comparison: { ...assessment.comparison, differences: [...assessment.comparison.differences, { a: LIMITED, b: PRESENT_CONTROLLER_NAME, difference: estimate(2.13), probabilityBetter: 0.013 }] },
  } as unknown as Assessment;
  const evaluation = { valueSense: 'cost', policies: [PI, LIMITED].map((name) => ({ name })) } as unknown as Evaluation;

  it('holds each number to its unit in the policy column', () => {
    const html = renderFindings(createElement(AnswerPanel, { evaluation, assessment: answered }), ['answer']);
    const names = tableCells(html, 'answer-table', false).slice(1, -1).map((r) => r[0]);
    expect(names).toEqual(['PI (25\u00a0%/K, 30\u00a0min)', 'PI with a 2\u00a0%/min rate limit']);
  });
});
