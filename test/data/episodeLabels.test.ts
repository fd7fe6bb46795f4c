/**
 * Each run's label reaches the transitions (TransitionSet.episodeLabels), so the run-order finding can name the
 * run where the log changed as the run column reads (src/core/diagnostics/runOrderChangeWords.ts). Expected
 * values by hand from the row layout.
 */
import { describe, expect, it } from 'vitest';
import { importDataset, type ImportedDataset } from '../../src/data/importDataset';
import type { ColumnRoles } from '../../src/project/schema';

const ROLES: ColumnRoles = {
  states: [{ column: 'level', unit: 'm' }], actions: [{ column: 'valve', unit: '%' }], reward: { kind: 'column', column: 'reward', sense: 'reward' },
  nextState: { kind: 'nextRow' }, episode: { kind: 'column', column: 'run' },
};

function imported(text: string, roles: Partial<ColumnRoles> = {}): ImportedDataset {
  const result = importDataset(text, 'log.csv', { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' }, { ...ROLES, ...roles });
  if (!result.ok) throw new Error(result.problems.map((p) => `${p.where}: ${p.message}`).join('\n'));
  return result.value;
}

describe('run labels carried to the transitions', () => {
  const runs = ['007', '007', 'B 2', 'B 2', 'B 2', '007', '007'];
  const csv = ['level,valve,reward,run', ...runs.map((r, i) => `${i + 1},${10 * (i + 1)},${-(i + 1)},${r}`)].join('\n') + '\n';

  it('one label per run, as the cells read (never re-written as a number), a reappearing label once per run it starts', () => {
    const { transitions: t } = imported(csv);
    expect(t.episodeCount).toBe(3);
    expect(t.episodeLabels).toEqual(['007', 'B 2', '007']);
  });

  it('none where runs are not cut by a run column', () => {
    expect(imported(csv, { episode: { kind: 'single' } }).transitions.episodeLabels).toBeUndefined();
  });
});
