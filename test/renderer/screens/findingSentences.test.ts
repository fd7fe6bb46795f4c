/**
 * The sentences under the Coverage panel's matrix (FindingSentences.tsx), rendered as the app renders
 * them (react-dom/server): a serious finding is never inside a disclosure; a group's cautions fold
 * behind one line naming their kinds only where a serious finding is with them; a finding said alike
 * of several candidates is one sentence whose names are the anchors the matrix marks go to. Invented
 * warnings; the rules checked are our own.
 */
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import type { AssessmentWarning, CandidateAssessment } from '../../../src/pipeline/assessment';
import { findingLines } from '../../../src/pipeline/findingLines';
import { findingMatrix } from '../../../src/pipeline/findingMatrix';
import { OwnFindings, SharedFindings } from '../../../src/renderer/src/screens/findings/FindingSentences';

const w = (severity: 'serious' | 'caution', topic: string, message: string): AssessmentWarning => ({ severity, topic, message });
const candidate = (name: string, warnings: AssessmentWarning[]) => ({ name, warnings }) as unknown as CandidateAssessment;

const matrix = findingMatrix({
  warnings: [],
  candidates: [
    candidate('PI A', [w('caution', 'importanceWeights', 'Few runs carry the weight.'), w('serious', 'functionClass', 'Classes differ.'), w('caution', 'bootstrap', 'Skewed.')]),
    candidate('PI B', [w('caution', 'importanceWeights', 'Few runs carry the weight.'), w('caution', 'bootstrap', 'Some resamples failed.')]),
  ],
});
const lines = findingLines(matrix);
/** The markup inside the first closed disclosure, or '' where there is none. */
const folded = (html: string): string => /<details[^>]*>([\s\S]*?)<\/details>/.exec(html)?.[1] ?? '';

describe('the sentences under the findings matrix', () => {
  it('keeps a serious finding in view and folds the cautions beside it behind one line of their kinds', () => {
    const html = renderToStaticMarkup(createElement(OwnFindings, { lines: lines.own[1], testId: 'a' }));
    expect(html.replace(folded(html), '')).toContain('Classes differ.');
    expect(folded(html)).toContain('<summary>1 caution: Intervals</summary>');
    expect(folded(html)).toContain('id="finding-candidate-0-2"');
  });

  it('shows a group’s cautions as they are where no serious finding is with them (the group itself is the fold)', () => {
    const html = renderToStaticMarkup(createElement(OwnFindings, { lines: lines.own[2], testId: 'b' }));
    expect(html).not.toContain('<details');
    expect(html).toContain('Some resamples failed.');
  });

  it('says a finding alike for several candidates once, each name the anchor its mark links to, described by the finding’s words', () => {
    const html = renderToStaticMarkup(createElement(SharedFindings, { lines: lines.shared }));
    expect(html.split('Few runs carry the weight.').length).toBe(2);
    expect(html).toMatch(/<strong>Caution<\/strong> for <span><span id="finding-candidate-0-\d" tabindex="-1" aria-describedby="(words-finding-candidate-0-\d)">PI A<\/span><\/span><span> and <span id="finding-candidate-1-\d" tabindex="-1" aria-describedby="\1">PI B<\/span><\/span>: <span id="\1">Few runs/);
  });
});
