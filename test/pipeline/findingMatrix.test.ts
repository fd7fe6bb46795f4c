/**
 * The findings matrix (src/pipeline/findingMatrix.ts): columns only for the kinds of finding that
 * occur, in the stated order of findingTopicWords.ts; a cell's mark is its worst severity; the rows
 * (whole log, each candidate, the present controller where it has findings) and which warning lands
 * in which; the report draws the same rows; the merged form (findingLines.ts) says a finding of the
 * same words once for the candidates it concerns. Invented warnings; the rules checked are our own.
 */
import { describe, expect, it } from 'vitest';
import type { AssessmentWarning, CandidateAssessment } from '../../src/pipeline/assessment';
import { BASELINE_NOT_SETTLED_TOPIC } from '../../src/pipeline/baselineClassWarning';
import { BASELINE_CONTRADICTED_TOPIC, BASELINE_UNCONFIRMED_TOPIC } from '../../src/pipeline/crossCheckWarnings';
import { PRESENT_CONTROLLER_TOPICS, cellText, findingAnchor, findingCountText, findingMatrix } from '../../src/pipeline/findingMatrix';
import { FINDING_COLUMNS } from '../../src/pipeline/findingTopicWords';
import { SHARED_LINES_HEADING, cautionsSummaryText, findingLines, groupCountText, namesText, sharedCountOf } from '../../src/pipeline/findingLines';
import { findingsHtml } from '../../src/pipeline/report/reportFindings';

const w = (severity: 'serious' | 'caution', topic: string, message: string, candidate?: string): AssessmentWarning => ({ severity, topic, message, ...(candidate ? { candidate } : {}) });
const candidate = (name: string, warnings: AssessmentWarning[]) => ({ name, warnings }) as unknown as CandidateAssessment;

describe('the findings matrix', () => {
  const assessment = {
    warnings: [
      w('caution', 'runOrder', 'The plant drifted.'),
      w('serious', 'plantMemory', 'Earlier rows explain the next step.'),
      w('caution', 'confirmation', 'PI A: nothing confirms it.', 'PI A'),
      w('caution', 'presentController', 'Its dithers move together.'),
      w('serious', BASELINE_CONTRADICTED_TOPIC, 'Present controller: a check contradicts it.'),
    ],
    candidates: [
      candidate('PI A', [w('caution', 'importanceWeights', 'Few runs carry the weight.'), w('serious', 'occupancyShift', 'Far from the logs.'), w('caution', 'occupancyShift', 'A second shift sentence.')]),
      candidate('PI B', []),
    ],
  };
  const m = findingMatrix(assessment);

  it('has a column for each kind that occurs, in the stated order, and none for the rest', () => {
    const order = FINDING_COLUMNS.map((c) => c.key);
    expect(m.columns.map((c) => c.key)).toEqual(['whereItRuns', 'weightSpread', 'crossChecks', 'baseline', 'plantMemory', 'runOrder']);
    const places = m.columns.map((c) => order.indexOf(c.key));
    expect(places).toEqual([...places].sort((a, b) => a - b));
  });

  it('rows: the whole log, each candidate (with none too), the present controller with its findings', () => {
    expect(m.rows.map((r) => [r.key, r.label, r.candidateIndex])).toEqual([
      ['log', 'Whole log', null], ['candidate-0', 'PI A', 0], ['candidate-1', 'PI B', 1], ['present', 'Present controller', null]]);
    // The whole-log caution that names PI A is PI A's; the present controller's topics are its own.
    expect(m.rows[0].findings.map((f) => f.topic)).toEqual(['plantMemory', 'runOrder']);
    expect(m.rows[1].findings.map((f) => f.message)).toEqual(['Far from the logs.', 'Few runs carry the weight.', 'A second shift sentence.', 'PI A: nothing confirms it.']);
    expect(m.rows[3].findings.map((f) => f.topic)).toEqual([BASELINE_CONTRADICTED_TOPIC, 'presentController']);
    expect(m.rows.map(findingCountText)).toEqual(['1 serious, 1 caution', '1 serious, 3 cautions', 'no findings', '1 serious, 1 caution']);
  });

  it('marks a cell by its worst finding, links it to the first, and "—" where there is none', () => {
    const at = (row: number, column: string) => m.cells[row][m.columns.findIndex((c) => c.key === column)];
    expect(at(1, 'whereItRuns')).toEqual({ severity: 'serious', count: 2, first: 0 });
    expect(cellText(at(1, 'whereItRuns'))).toBe('serious');
    expect(at(1, 'crossChecks')).toEqual({ severity: 'caution', count: 1, first: 3 });
    expect(cellText(at(2, 'crossChecks'))).toBe('—');
    expect(at(3, 'crossChecks').severity).toBe('serious'); // the present controller's contradiction shares the candidates' column
    expect(at(0, 'plantMemory')).toEqual({ severity: 'serious', count: 1, first: 0 });
    expect(findingAnchor(m.rows[1], 3)).toBe('finding-candidate-0-3');
  });

  it('leaves out the present controller row when it has no findings, and has no columns for a clean assessment', () => {
    const clean = findingMatrix({ warnings: [], candidates: [candidate('PI', [])] });
    expect(clean.rows.map((r) => r.key)).toEqual(['log', 'candidate-0']);
    expect(clean.columns).toEqual([]);
    expect(findingsHtml({ warnings: [], candidates: [candidate('PI', [])] }).html).toBe('<p>None.</p>');
  });

  it('writes out the present controller’s topics as the pipeline names them', () => {
    expect([...PRESENT_CONTROLLER_TOPICS].sort()).toEqual(['presentController', BASELINE_NOT_SETTLED_TOPIC, BASELINE_CONTRADICTED_TOPIC, BASELINE_UNCONFIRMED_TOPIC].sort());
  });

  it('the report draws the matrix with every sentence once, each mark linked to an anchor that exists', () => {
    const text = findingsHtml(assessment).html;
    expect(text).toMatch(/<table class="finding-table"><caption>/);
    const links = [...text.matchAll(/href="#([^"]+)"/g)].map((x) => x[1]);
    expect(links.length).toBe(7); // marks in the matrix: 2 log, 3 PI A, 2 present controller
    for (const id of links) expect(text).toContain(`id="${id}"`);
    for (const warning of [...assessment.warnings, ...assessment.candidates.flatMap((c) => c.warnings)]) expect(text.split(warning.message).length).toBe(2);
  });
});

describe('the merged form: a finding said alike of several candidates is said once, naming them', () => {
  // Invented: two candidates share a caution word for word, and a cross-check caution that differs only by the name it opens with.
  const shared = 'Importance weights at step 20: effective size 1 of 40 runs.';
  const assessment = {
    warnings: [
      w('caution', 'confirmation', 'PI A: nothing confirms it.', 'PI A'),
      w('caution', 'confirmation', 'PI B: nothing confirms it.', 'PI B'),
      w('serious', 'plantMemory', 'Earlier rows explain the next step.'),
    ],
    candidates: [
      candidate('PI A', [w('serious', 'functionClass', 'Classes differ by 7 %.'), w('caution', 'importanceWeights', shared)]),
      candidate('PI B', [w('serious', 'functionClass', 'Classes differ by 4 %.'), w('caution', 'importanceWeights', shared)]),
      candidate('PI C', [w('caution', 'importanceWeights', 'Importance weights at step 20: effective size 9 of 40 runs.')]),
    ],
  };
  const m = findingMatrix(assessment), lines = findingLines(m);
  const everyWarning = [...assessment.warnings, ...assessment.candidates.flatMap((c) => c.warnings)];

  it('puts every warning in exactly one line, and each line keeps every place it stands for', () => {
    const places = [...lines.shared, ...lines.own.flat()].flatMap((l) => l.places.map((p) => findingAnchor(p.row, p.index)));
    expect(places.length).toBe(everyWarning.length);
    expect(new Set(places).size).toBe(places.length);
    // Every mark of the matrix goes to one of them.
    m.rows.forEach((row, r) => m.cells[r].forEach((cell) => { if (cell.severity) expect(places).toContain(findingAnchor(row, cell.first)); }));
  });

  it('says the same words once for the candidates they concern, the name taken off; different words stay apart', () => {
    expect(lines.shared.map((l) => [l.message, l.places.map((p) => p.row.label)])).toEqual([
      [shared, ['PI A', 'PI B']],
      ['nothing confirms it.', ['PI A', 'PI B']],
    ]);
    expect(lines.own.map((own) => own.map((l) => l.message))).toEqual([
      ['Earlier rows explain the next step.'], ['Classes differ by 7 %.'], ['Classes differ by 4 %.'], ['Importance weights at step 20: effective size 9 of 40 runs.']]);
    expect(groupCountText(m.rows[1], sharedCountOf(lines, m.rows[1]))).toBe('1 serious, 2 cautions, 2 said above with other candidates');
    expect(groupCountText(m.rows[3], sharedCountOf(lines, m.rows[3]))).toBe('1 caution');
    expect(namesText(['PI A', 'PI B', 'PI C'])).toBe('PI A, PI B and PI C');
    expect(cautionsSummaryText(lines.shared)).toBe('2 cautions: Weight spread, Cross-checks');
  });

  it('the report says each shared sentence once, naming each candidate at the anchor its mark links to', () => {
    const text = findingsHtml(assessment).html;
    expect(text.split(shared).length).toBe(2);
    expect(text.split('nothing confirms it.').length).toBe(2);
    expect(text).toContain(`<h4>${SHARED_LINES_HEADING}</h4>`);
    expect(text).toMatch(/<strong>Caution<\/strong> for <span id="finding-candidate-0-\d">PI A<\/span> and <span id="finding-candidate-1-\d">PI B<\/span>: nothing confirms it\./);
    for (const id of [...text.matchAll(/href="#([^"]+)"/g)].map((x) => x[1])) expect(text).toContain(`id="${id}"`);
    // The whole log's group comes before the shared lines, the candidates' groups after.
    expect(text.indexOf('<h4>Whole log')).toBeLessThan(text.indexOf(SHARED_LINES_HEADING));
    expect(text.indexOf(SHARED_LINES_HEADING)).toBeLessThan(text.indexOf('<h4>PI A'));
  });
});
