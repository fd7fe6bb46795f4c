/**
 * A cross-check's line on the command line: its value with its interval where it has one, the value
 * alone where it has none (the rollouts of a fitted plant model), and only the note where it has no
 * value — never a dash standing for a missing interval beside the dash that opens the note. The
 * numbers are invented; the precision rule is the one the tables use (JCGM 100, §7.2.6 — common practice).
 */
import { describe, expect, it } from 'vitest';
import { formatAssessment } from '../../src/cli/assessmentFormat';
import type { Assessment } from '../../src/pipeline/assessment';

const estimate = (value: number, percentile: [number, number] | null) => ({ value, standardError: 1.07, percentile, basic: percentile });
const assessment = {
  settings: { level: 0.9, episodes: 40, resamples: 1000, seed: 1, threads: 'one thread' },
  candidates: [{
    name: 'retuned PI', policyValue: estimate(8.3612, [6.6413, 10.2214]), reportedRange: [6.59, 10.25], settled: true,
    confirmation: { status: 'confirmed', text: 'Confirmed.' }, diagnostics: { occupancyShift: 3.65 }, functionClasses: null, rangeCut: null, warnings: [],
    crossChecks: [
      { label: 'Weighted doubly robust', estimate: estimate(7.4931, [6.0312, 9.4518]), note: 'Agrees.' },
      { label: 'Rollouts of a fitted plant model', estimate: estimate(8.2419, null), note: 'Uninformative: too wide.' },
      { label: 'Linear-quadratic model (closed form)', estimate: null, note: 'Not applicable here: the actuator is clipped.' },
    ],
  }],
  presentController: null,
  behaviour: estimate(13.92, [11.97, 16.03]),
  comparison: { baseline: { name: 'logged return', note: '' }, differences: [], ranking: { order: ['retuned PI'], frequency: 1 } },
  warnings: [],
} as unknown as Assessment;

describe('a cross-check’s line on the command line', () => {
  const lines = formatAssessment(assessment).split('\n');
  const line = (label: string) => lines.find((l) => l.includes(`· ${label}:`))!;
  it('writes the value with its interval where it has one', () => {
    expect(line('Weighted doubly robust')).toBe('    · Weighted doubly robust: 7.49 [6.03, 9.45] — Agrees.');
  });
  it('writes the value alone, at the candidate’s precision, where it has no interval', () => {
    expect(line('Rollouts of a fitted plant model')).toBe('    · Rollouts of a fitted plant model: 8.24 — Uninformative: too wide.');
  });
  it('writes only the note where there is no value', () => {
    expect(line('Linear-quadratic model (closed form)')).toBe('    · Linear-quadratic model (closed form): Not applicable here: the actuator is clipped.');
  });
});
