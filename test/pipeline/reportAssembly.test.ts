/** The shared report input (CLI `report` and the app's "Write report…"): a failed assessment becomes its reasons, the time an ISO stamp. */
import { describe, expect, it } from 'vitest';
import { failure, success } from '../../src/core/result';
import type { Assessment } from '../../src/pipeline/assessment';
import { reportInputFrom } from '../../src/pipeline/report/reportAssembly';

const parts = {
  project: { name: 'p' } as never, projectFile: 'p.spcritic', evaluation: {} as never,
  data: { summary: {} as never, episodeReport: ['40 episodes'] }, generatedAt: new Date(Date.UTC(2026, 0, 2, 3, 4, 5)),
};

describe('reportInputFrom', () => {
  it('keeps a successful assessment and no problems', () => {
    const assessment = { valueSense: 'cost' } as Assessment;
    const input = reportInputFrom({ ...parts, assessment: success(assessment) });
    expect(input.assessment).toBe(assessment);
    expect(input.assessmentProblems).toEqual([]);
    expect(input.generatedAt).toBe('2026-01-02T03:04:05.000Z');
    expect(input.data.episodeReport).toEqual(['40 episodes']);
  });

  it('turns a failed assessment into its messages', () => {
    const input = reportInputFrom({ ...parts, assessment: failure({ where: 'assessment', message: 'needs at least 10 episodes' }) });
    expect(input.assessment).toBeNull();
    expect(input.assessmentProblems).toEqual(['needs at least 10 episodes']);
  });
});
