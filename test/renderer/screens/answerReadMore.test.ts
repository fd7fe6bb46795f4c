/**
 * The answer card's "Read more" line (AnswerPanel.tsx), rendered as the app renders it (react-dom/server):
 * the sweeps' verdict beside its link carries parentheses of its own where some J are crossed ("some J
 * are crossed (at odds with J at another discount)"), so wrapped in parentheses it read "(… (…))". It
 * stands after a dash, and no parenthesis in the line opens inside another. Invented numbers.
 */
import { createElement } from 'react';
import { describe, expect, it } from 'vitest';
import type { Assessment } from '../../../src/pipeline/assessment';
import type { Evaluation } from '../../../src/pipeline/estimates';
import { AnswerPanel } from '../../../src/renderer/src/screens/findings/AnswerPanel';
import { renderFindings } from '../../support/renderFindings';

const estimate = (value: number) => ({ value, standardError: 0.1, percentile: [value - 0.2, value + 0.2], basic: null, replicates: 100, failedReplicates: 0 });
const candidate = (name: string, value: number) => ({
  name, policyValue: estimate(value), reportedRange: null, settled: null, confirmation: { status: 'unconfirmed', text: '' },
  diagnostics: { occupancyShift: 1 }, functionClasses: null, warnings: [], crossChecks: [],
});
/** A discount sweep: "B" crossed at 0.975, the ranking turned round at 0.902 (sweepsVerdict reads rankingStable and the crosses). */
const curve = (rankingStable: boolean, crossed: boolean) => ({
  parameter: 'discount', label: 'discount factor', settings: [0.9025, 0.95, 0.975], projectIndex: 1, rankingStable,
  series: [{ name: 'A', values: [3, 6, 7], status: [] }, { name: 'B', values: [4, 5, 6], status: [], ...(crossed ? { beyondPossible: [false, false, true] } : {}) }],
});
const assessment = (rankingStable: boolean, crossed: boolean) => ({
  valueSense: 'cost', settings: { level: 0.9, resamples: 1000 }, warnings: [], presentController: null, behaviour: estimate(8.5),
  candidates: [candidate('A', 6), candidate('B', 5)],
  comparison: { baseline: { name: 'logged return', note: '' }, differences: [], ranking: { order: ['B', 'A'], frequency: 0.9, neighbours: [] } },
  sensitivity: { curves: [curve(rankingStable, crossed)], notes: [] },
} as unknown as Assessment);
const evaluation = { valueSense: 'cost', policies: [{ name: 'A' }, { name: 'B' }] } as unknown as Evaluation;

function readMore(a: Assessment): string {
  const html = renderFindings(createElement(AnswerPanel, { evaluation, assessment: a }), ['answer']);
  const line = /<p[^>]*answer-more"[^>]*>([\s\S]*?)<\/p>/.exec(html);
  if (!line) throw new Error('no Read more line in the answer card');
  return line[1].replace(/<[^>]+>/g, '').replace(/&#x27;/g, "'");
}

/** The deepest nesting of parentheses in a text. */
function parenthesisDepth(text: string): number {
  let depth = 0, deepest = 0;
  for (const ch of text) {
    depth += ch === '(' ? 1 : ch === ')' ? -1 : 0;
    deepest = Math.max(deepest, depth);
  }
  return deepest;
}

describe('the answer card’s Read more line', () => {
  it('names the sweeps’ verdict after a dash, with no parenthesis inside another, where some J are crossed', () => {
    const text = readMore(assessment(false, true));
    expect(text).toBe('Read more: paired comparison · cross-checks · coverage and warnings · sensitivity — '
      + 'the ranking changes within the range; some J are crossed (at odds with J at another discount)');
    expect(parenthesisDepth(text)).toBeLessThanOrEqual(1);
    expect(parenthesisDepth(readMore(assessment(true, true)))).toBeLessThanOrEqual(1);
  });

  it('reads the same way without crosses', () => {
    expect(readMore(assessment(true, false))).toBe('Read more: paired comparison · cross-checks · coverage and warnings · sensitivity — the ranking is the same at every setting shown');
  });
});
