/**
 * The report's candidates table gives the present controller's row in the same words as the command
 * line's baseline line (pipeline/baselineWords.ts): where its fitted law sits — its mean action at the
 * mean logged state, before the limits where the log shows one — not "offset and gains" with no number.
 * Invented numbers.
 */
import { describe, expect, it } from 'vitest';
import { jobSection } from '../../src/pipeline/report/reportOverview';
import type { ReportInput } from '../../src/pipeline/report/reportInput';

const model = {
  offset: [392.7], gain: [[-15.2]], std: [10.07], lo: [null], hi: [100], actions: ['heating_valve_pct'], units: ['%'],
  limitEvidence: { lo: ['none'], hi: ['repeated'] }, meanAtMeanState: [81.44],
};
const input = (m: object) => ({
  project: { name: 'P', description: '', data: { path: 'p.csv' }, candidates: [], columns: { states: [], actions: [{ column: 'heating_valve_pct', unit: '%' }] } },
  projectFile: 'p.spcritic', generatedAt: new Date(0), evaluation: { evaluatedAt: 'then', presentController: { model: m } },
} as unknown as ReportInput);

describe('the report’s present-controller row', () => {
  it('says where the law sits, as the command line does', () => {
    const text = jobSection(input(model)).html.replace(/<[^>]+>/g, ' ');
    expect(text).toContain('as fitted to the log, linear in the state: mean 81.44 % at the mean logged state, before the limits');
  });
  it('falls back to the offset for results saved before the mean was kept', () => {
    const { meanAtMeanState: _, ...old } = model;
    expect(jobSection(input(old)).html).toContain('as fitted to the log, offset 392.7 %');
  });
});
