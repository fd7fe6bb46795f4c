/**
 * J's unit in the report's table heads (pipeline/valueUnitWords.ts valueColumnHead): "J (€)" where the
 * project gives the cost's unit (`columns.reward.unit`), "J" alone where it gives none — the sentence
 * above the table then says "no unit given". The tank-levels sample (invented plant) is evaluated and
 * assessed once; the report is rendered with and without a unit, the same numbers both times, and
 * the command line's value and assessment tables take the same heads.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { assessProject } from '../../src/pipeline/assessProject';
import { evaluateProject } from '../../src/pipeline/evaluateProject';
import { openProject } from '../../src/pipeline/openProject';
import { renderReport } from '../../src/pipeline/report/reportDocument';
import type { ReportInput } from '../../src/pipeline/report/reportInput';
import { retuneSection } from '../../src/pipeline/report/reportRetune';
import type { RetuneMapResult } from '../../src/pipeline/retuneMaps';
import { valueColumnHead } from '../../src/pipeline/valueUnitWords';
import { formatAssessment } from '../../src/cli/assessmentFormat';
import { formatEvaluation } from '../../src/cli/formatEvaluation';
import { formatRetuneMap } from '../../src/cli/retuneMapFormat';

const root = join(__dirname, '..', '..');

/** The report's table heads (the text of every <th> in a <thead>). */
function heads(html: string): string[] {
  return [...html.matchAll(/<thead>([\s\S]*?)<\/thead>/g)].flatMap((m) => [...m[1].matchAll(/<th[^>]*>([\s\S]*?)<\/th>/g)].map((h) => h[1].trim()));
}

describe('J\'s unit in the report\'s table heads', () => {
  let input: Omit<ReportInput, 'project'>, project: ReportInput['project'];
  beforeAll(async () => {
    const folder = join(root, 'sample-projects', 'tank-levels');
    const opened = await openProject(await readFile(join(folder, 'tank-levels.spcritic'), 'utf8'), 'tank-levels.spcritic', async (p) => new Uint8Array(await readFile(join(folder, p))));
    if (!opened.ok) throw new Error('open failed');
    const { dataset, imported } = opened.value;
    project = opened.value.project;
    const evaluation = await evaluateProject({ project, dataset, now: () => new Date('2026-01-01T00:00:00Z') });
    const assessment = await assessProject({ project, dataset, settings: { resamples: 50, level: 0.9, seed: 1, sensitivity: false } });
    if (!evaluation.ok || !assessment.ok) throw new Error('pipeline failed');
    input = { projectFile: 'tank-levels.spcritic', evaluation: evaluation.value, assessment: assessment.value, assessmentProblems: [], retuneMaps: [], retuneMapProblems: [],
      data: { summary: imported.summary, episodeReport: imported.episodeReport }, generatedAt: '2026-01-01T00:00:00.000Z' };
  }, 300_000);

  const withUnit = (unit: string | undefined) => ({ ...project, columns: { ...project.columns, reward: { ...project.columns.reward, unit } } });

  it('heads the comparison and every cross-check table "J (€)" where the project gives €', () => {
    const html = renderReport({ ...input, project: withUnit('€') } as ReportInput);
    const jHeads = heads(html).filter((h) => /^J\b/.test(h));
    expect(jHeads.length).toBe(1 + input.assessment!.candidates.length);
    expect(new Set(jHeads)).toEqual(new Set(['J (€)']));
    expect(html).toContain('in €');
  });

  it('heads them "J" alone where none is given, and says "no unit given" above', () => {
    const html = renderReport({ ...input, project: withUnit(undefined) } as ReportInput);
    expect(new Set(heads(html).filter((h) => /^J\b/.test(h)))).toEqual(new Set(['J']));
    expect(html).toContain('no unit given');
  });

  it('heads the command line\'s value and assessment tables the same way', () => {
    const head = (text: string, first: string) => text.split('\n').find((l) => l.trimStart().startsWith(first))!;
    expect(head(formatEvaluation(input.evaluation, 'tank-levels.spcritic', input.assessment, '€'), 'policy')).toContain('value J (€)');
    expect(head(formatAssessment(input.assessment!, true, '€'), 'policy')).toMatch(/\bJ \(€\)/);
    expect(head(formatAssessment(input.assessment!, true), 'policy')).not.toContain('(€)');
  });

  it('heads the point-estimate table (no assessment) the same way', () => {
    const html = renderReport({ ...input, assessment: null, assessmentProblems: ['not run'], project: withUnit('kWh') } as ReportInput);
    expect(heads(html)).toContain('J (kWh)');
  });
});

describe('J\'s unit in the report\'s retune-map table', () => {
  const map = (): RetuneMapResult => ({
    candidate: 'invented P', features: 'polynomial degree 2', notes: [], presentController: 12, best: { index: 0, value: 10, coordinates: [1] },
    axes: [{ parameter: 'form.loops.0.proportionalGain', label: 'proportional gain K_c (%/°C)', values: [1, 2] }],
    points: [1, 2].map((g) => ({ coordinates: [g], value: 9 + g, interval: [8 + g, 10 + g] as [number, number], status: 'converged', support: null, occupancyShift: 1, route: 'closedForm' as never })),
  });
  const section = (unit?: string) => {
    const input = { retuneMaps: [map()], retuneMapProblems: [], evaluation: { valueSense: 'cost' }, project: { columns: { reward: { unit } } } } as unknown as ReportInput;
    let n = 0;
    return retuneSection(input, { next: () => ++n } as never).html;
  };

  it('writes "J (€) and interval" with a unit, "J and interval" without (the invented map is drawing data)', () => {
    expect(heads(section('€'))).toContain('J (€) and interval');
    expect(heads(section())).toContain('J and interval');
    expect(formatRetuneMap(map(), 0.9, '€').split('\n')[1]).toContain('J (€)');
  });

  it('says the unit once above a two-axis grid, whose cells have no J head', () => {
    const grid: RetuneMapResult = {
      ...map(), best: null,
      axes: [{ parameter: 'form.loops.0.proportionalGain', label: 'proportional gain K_c (%/°C)', values: [1, 2] }, { parameter: 'form.loops.0.integralTime', label: 'integral time T_i (s)', values: [60, 120] }],
      points: [[1, 60], [1, 120], [2, 60], [2, 120]].map((c) => ({ coordinates: c, value: 10, interval: [9, 11] as [number, number], status: 'converged', support: null, occupancyShift: 1, route: 'closedForm' as never })),
    };
    const of = (unit?: string) => retuneSection({ retuneMaps: [grid], retuneMapProblems: [], evaluation: { valueSense: 'cost' }, project: { columns: { reward: { unit } } } } as unknown as ReportInput, { next: () => 1 } as never).html;
    expect(of('€')).toContain('Each cell: J at that point, in €');
    expect(of()).toContain('Each cell: J at that point, no unit given');
  });

  // The project schema trims every unit where the document is read (src/project/unitText.ts; its test
  // test/project/unitText.test.ts), so a head receives the unit as held: nothing downstream trims again.
  it('writes the held unit, and nothing for an empty or absent one', () => {
    expect(valueColumnHead('J', 'kWh')).toBe('J (kWh)');
    expect(valueColumnHead('J', '')).toBe('J');
    expect(valueColumnHead('J', undefined)).toBe('J');
  });
});
