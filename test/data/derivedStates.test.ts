/**
 * Derived states computed during import, checked against values worked out by hand from the row
 * layout and, for the first-order lag, against its textbook unit-step response
 * f_k = 1 − e^{−kΔt/τ} (exact for an input held between samples; common practice).
 */
import { describe, expect, it } from 'vitest';
import { importDataset, type ImportedDataset } from '../../src/data/importDataset';
import { parseProjectText } from '../../src/project/projectFile';
import type { ColumnRoles, CsvSettings, DerivedStateSpec } from '../../src/project/schema';

const CSV: CsvSettings = { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' };

function imported(text: string, derived: DerivedStateSpec[], states: string[], roles: Partial<ColumnRoles> = {}): ImportedDataset {
  const result = importDataset(text, 'log.csv', CSV, {
    states: states.map((column) => ({ column, unit: '' })), actions: [{ column: 'valve', unit: '%' }],
    reward: { kind: 'column', column: 'reward', sense: 'reward' }, nextState: { kind: 'nextRow' },
    episode: { kind: 'column', column: 'run' }, derived, ...roles,
  });
  if (!result.ok) throw new Error(result.problems.map((p) => `${p.where}: ${p.message}`).join('\n'));
  return result.value;
}

// Two runs; temp and valve by hand; t in seconds, 60 s apart except one 120 s step in run 1.
const LOG = ['run,t,temp,valve,reward', '1,0,20,50,0', '1,60,20.5,55,0', '1,180,21,58,0', '1,240,21.2,60,0', '2,0,19,40,0', '2,60,19.5,45,0', '2,120,20,47,0'].join('\n') + '\n';
const column = (d: ImportedDataset, k: number) => Array.from({ length: d.transitions.count }, (_, i) => d.transitions.states[i * d.transitions.stateDim + k]);

describe('derived states', () => {
  it('error integral: I starts at its initial value and adds (r − y)·Δt of the row before (timestamps)', () => {
    const d = imported(LOG, [{ kind: 'errorIntegral', name: 'ie', unit: 'K·s', measurement: 'temp', setpoint: 21, initial: 5 }], ['temp', 'ie'], { timestamp: 't' });
    // run 1: 5; 5 + 1·60 = 65; 65 + 0.5·120 = 125; (last row has no successor). run 2: 5; 5 + 2·60 = 125.
    expect(column(d, 1)).toEqual([5, 65, 125, 5, 125]);
    expect(Array.from(d.transitions.nextStates.filter((_, i) => i % 2 === 1))).toEqual([65, 125, 125, 125, 125 + 1.5 * 60]);
    expect(Array.from(d.transitions.startStates.filter((_, i) => i % 2 === 1))).toEqual([5, 5]);
  });

  it('error integral with a stated period and a setpoint column', () => {
    const text = LOG.replace('reward', 'reward,sp').split('\n').map((l, i) => (i === 0 || l === '' ? l : `${l},21`)).join('\n');
    const d = imported(text, [{ kind: 'errorIntegral', name: 'ie', unit: '', measurement: 'temp', setpoint: 'sp', initial: 0, periodSeconds: 60 }], ['temp', 'ie']);
    expect(column(d, 1)).toEqual([0, 60, 90, 0, 120]);
  });

  it('first-order lag: a unit step gives 1 − e^{−kΔt/τ}', () => {
    const rows = ['run,t,x,valve,reward', ...Array.from({ length: 6 }, (_, k) => `1,${30 * k},${k === 0 ? 0 : 1},0,0`)].join('\n') + '\n';
    const d = imported(rows, [{ kind: 'filtered', name: 'xf', unit: '', source: 'x', timeConstantSeconds: 90 }], ['x', 'xf'], { timestamp: 't' });
    column(d, 1).forEach((f, k) => expect(f).toBeCloseTo(k === 0 ? 0 : 1 - Math.exp((-30 * k) / 90), 14));
  });

  it('previous action: x_{t−1}; without an initial value each episode starts one row later', () => {
    const d = imported(LOG, [{ kind: 'previous', name: 'valve_prev', unit: '%', source: 'valve' }], ['temp', 'valve_prev']);
    expect(d.transitions.count).toBe(7 - 2 * 2); // 2 runs: each loses its first row and its last has no successor
    expect(column(d, 1)).toEqual([50, 55, 40]);
    expect(Array.from(d.transitions.actions)).toEqual([55, 58, 45]);
    expect(Array.from(d.transitions.startStates)).toEqual([20.5, 50, 19.5, 40]);
    expect(d.episodeReport.join(' ')).toMatch(/valve_prev has no initial value, so the first row of each run only supplies the value before it: 2 rows start no transition/);
    const stated = imported(LOG, [{ kind: 'previous', name: 'valve_prev', unit: '%', source: 'valve', initial: 52 }], ['temp', 'valve_prev']);
    expect(column(stated, 1)).toEqual([52, 50, 55, 52, 40]);
  });

  it('difference: x_t − x_{t−1}, with a stated first value', () => {
    const d = imported(LOG, [{ kind: 'difference', name: 'dtemp', unit: 'K', source: 'temp', initial: 0 }], ['temp', 'dtemp']);
    expect(column(d, 1).map((v) => +v.toFixed(12))).toEqual([0, 0.5, 0.5, 0, 0.5]);
  });

  it('a derived state may not share a name with a file column', () => {
    const result = importDataset(LOG, 'log.csv', CSV, {
      states: [{ column: 'temp', unit: '' }], actions: [{ column: 'valve', unit: '' }], reward: { kind: 'column', column: 'reward', sense: 'reward' },
      nextState: { kind: 'nextRow' }, episode: { kind: 'single' }, derived: [{ kind: 'previous', name: 'temp', unit: '', source: 'valve' }],
    });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems[0]).toMatchObject({ kind: 'derived-name-clash' });
  });
});

describe('derived states in the project document', () => {
  const project = (derived: unknown[], extra: Record<string, unknown> = {}) => JSON.stringify({
    format: 'setpoint-critic-project', version: 1, name: 'p', data: { path: 'log.csv' },
    columns: {
      states: [{ column: 'temp' }, { column: 'd' }], actions: [{ column: 'valve' }], reward: { kind: 'column', column: 'reward', sense: 'reward' }, derived,
    },
    discount: 0.9, candidates: [{ name: 'A', offset: [0], gain: [[0, 0]], std: [1] }],
    approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } }, ...extra,
  });

  it('refuses a derived state built from the action being chosen, naming the field; the previous action is allowed', () => {
    for (const fields of [{ kind: 'filtered', timeConstantSeconds: 60, periodSeconds: 60 }, { kind: 'difference' }]) {
      const bad = parseProjectText(project([{ ...fields, name: 'd', source: 'valve' }]), 'p.spcritic');
      expect(bad.ok).toBe(false);
      if (!bad.ok) expect(bad.problems[0]).toMatchObject({ where: 'p.spcritic, columns.derived[0].source', message: expect.stringMatching(/action column.*previous value/) });
    }
    const integral = parseProjectText(project([{ kind: 'errorIntegral', name: 'd', measurement: 'valve', setpoint: 50, periodSeconds: 60 }]), 'p.spcritic');
    expect(integral.ok).toBe(false);
    expect(parseProjectText(project([{ kind: 'previous', name: 'd', source: 'valve' }]), 'p.spcritic').ok).toBe(true);
  });

  it('asks for a period or a timestamp column for an integral', () => {
    const result = parseProjectText(project([{ kind: 'errorIntegral', name: 'd', measurement: 'temp', setpoint: 21 }]), 'p.spcritic');
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems[0].where).toBe('p.spcritic, columns.derived[0].periodSeconds');
  });
});
