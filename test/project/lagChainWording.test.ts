/**
 * The refusal of a value 2 rows back without the value 1 row back reads as English: "its value 1 row
 * back", not "its values 1 to 1 rows back" (derivedStateConsistency.ts). Wording by hand.
 */
import { describe, expect, it } from 'vitest';
import { parseProjectText } from '../../src/project/projectFile';

const text = JSON.stringify({
  format: 'setpoint-critic-project', version: 1, name: 'p', data: { path: 'log.csv' },
  columns: {
    states: [{ column: 'temp' }, { column: 'valve_2' }], actions: [{ column: 'valve' }], reward: { kind: 'column', column: 'reward', sense: 'reward' },
    derived: [{ kind: 'previous', name: 'valve_2', source: 'valve', steps: 2 }],
  },
  discount: 0.9, candidates: [{ name: 'A', offset: [0], gain: [[0, 0]], std: [1] }],
  approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
});

describe('a value 2 rows back without the value 1 row back', () => {
  it('is refused in plain words, naming the field', () => {
    const r = parseProjectText(text, 'p.spcritic');
    const found = r.ok ? '' : r.problems.map((p) => `${p.where}: ${p.message}`).join('\n');
    expect(found).toMatch(/columns\.derived\[0\]\.steps: .*only with its value 1 row back among the states \(next row it becomes the value 1 row back,/);
  });
});
