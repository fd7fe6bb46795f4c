/**
 * A derived previous value k rows back (`steps`), as a dead time asks for: the values worked out by
 * hand from the row layout, the shift x_{t+1−k} = p^{k−1}_t between a row and the next (the reason
 * the lags 1 … k − 1 make it Markov; common practice for a delay line in state-space form), and the
 * refusals, each naming the field.
 */
import { describe, expect, it } from 'vitest';
import { importDataset, type ImportedDataset } from '../../src/data/importDataset';
import { parseProjectText } from '../../src/project/projectFile';
import type { CsvSettings, DerivedStateSpec } from '../../src/project/schema';

const CSV: CsvSettings = { delimiter: 'auto', decimalMark: 'auto', badRows: 'stop' };
// Two runs; the valve by hand: run 1 10 … 60, run 2 1 … 5.
const LOG = ['run,temp,valve,reward', ...[10, 20, 30, 40, 50, 60].map((v, i) => `1,${20 + i},${v},0`), ...[1, 2, 3, 4, 5].map((v, i) => `2,${30 + i},${v},0`)].join('\n') + '\n';
const lag = (steps: number, initial?: number): DerivedStateSpec => ({ kind: 'previous', name: `valve_${steps}`, unit: '%', source: 'valve', steps, ...(initial === undefined ? {} : { initial }) });

function imported(derived: DerivedStateSpec[]): ImportedDataset {
  const result = importDataset(LOG, 'log.csv', CSV, {
    states: [{ column: 'temp', unit: '' }, ...derived.map((d) => ({ column: d.name, unit: '' }))], actions: [{ column: 'valve', unit: '%' }],
    reward: { kind: 'column', column: 'reward', sense: 'reward' }, nextState: { kind: 'nextRow' }, episode: { kind: 'column', column: 'run' }, derived,
  });
  if (!result.ok) throw new Error(result.problems.map((p) => `${p.where}: ${p.message}`).join('\n'));
  return result.value;
}
const rowsOf = (values: Float64Array, width: number) => Array.from({ length: values.length / width }, (_, i) => Array.from(values.subarray(i * width, i * width + width)));

describe('a derived previous value k rows back', () => {
  it('holds the valve 1, 2 and 3 rows back; without initial values each run starts 3 rows later', () => {
    const d = imported([lag(1), lag(2), lag(3)]);
    // run 1: rows 3 and 4 start transitions (row 5 has no successor); run 2: row 3 only.
    expect(rowsOf(d.transitions.states, 4)).toEqual([[23, 30, 20, 10], [24, 40, 30, 20], [33, 3, 2, 1]]);
    expect(Array.from(d.transitions.actions)).toEqual([40, 50, 4]);
    // the next row's lags are this row's action and lags shifted by one: p¹' = a, p²' = p¹, p³' = p²
    expect(rowsOf(d.transitions.nextStates, 4)).toEqual([[24, 40, 30, 20], [25, 50, 40, 30], [34, 4, 3, 2]]);
    expect(rowsOf(d.transitions.startStates, 4)).toEqual([[23, 30, 20, 10], [33, 3, 2, 1]]);
    expect(d.episodeReport.join(' ')).toMatch(/valve_1, valve_2, valve_3 have no initial value, so the first 3 rows of each run only supply the values before them: 6 rows start no transition/);
  });

  it('takes the stated initial value on the first k rows of each run, and k = 1 by default', () => {
    const d = imported([{ kind: 'previous', name: 'valve_1', unit: '%', source: 'valve', initial: 0 }, lag(2, -1)]);
    const states = rowsOf(d.transitions.states, 3);
    expect(states.map((s) => s[1])).toEqual([0, 10, 20, 30, 40, 0, 1, 2, 3]);
    expect(states.map((s) => s[2])).toEqual([-1, -1, 10, 20, 30, -1, -1, 1, 2]);
  });
});

describe('a derived previous value k rows back in the project document', () => {
  const project = (derived: unknown[], states: string[], extra: Record<string, unknown> = {}) => JSON.stringify({
    format: 'setpoint-critic-project', version: 1, name: 'p', data: { path: 'log.csv' },
    columns: { states: [{ column: 'temp' }, ...states.map((column) => ({ column }))], actions: [{ column: 'valve' }], reward: { kind: 'column', column: 'reward', sense: 'reward' }, derived },
    discount: 0.9, candidates: [{ name: 'A', offset: [0], gain: [[0, ...states.map(() => 0)]], std: [1] }],
    approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } }, ...extra,
  });
  const problems = (text: string) => { const r = parseProjectText(text, 'p.spcritic'); return r.ok ? [] : r.problems.map((p) => `${p.where}: ${p.message}`); };

  it('accepts the action k rows back with the lags before it among the states', () => {
    expect(problems(project([lag(1), lag(2), lag(3)], ['valve_1', 'valve_2', 'valve_3']))).toEqual([]);
  });

  it('refuses a lag without the lags 1 … k − 1 among the states, naming the field and the missing rows', () => {
    const found = problems(project([lag(1), lag(3)], ['valve_1', 'valve_3'])).join('\n');
    expect(found).toMatch(/columns\.derived\[1\]\.steps: "valve_3", the value of "valve" 3 rows back, is a valid state only with its values 1 to 2 rows back among the states.*missing: 2 row\(s\) back/);
    // declared but not a state does not count
    expect(problems(project([lag(1), lag(2)], ['valve_2'])).join('\n')).toMatch(/columns\.derived\[1\]\.steps: .*missing: 1 row\(s\) back/);
  });

  it('refuses steps below 1, fractional steps, and steps on another kind, naming the field', () => {
    expect(problems(project([{ ...lag(1), steps: 0 }], ['valve_1'])).join('\n')).toMatch(/columns\.derived\[0\]\.steps: expected at least 1 row back/);
    expect(problems(project([{ ...lag(1), steps: 1.5 }], ['valve_1'])).join('\n')).toMatch(/columns\.derived\[0\]\.steps: expected a whole number of rows/);
    expect(problems(project([{ kind: 'difference', name: 'dt', source: 'temp', steps: 2 }], ['dt'])).join('\n')).toMatch(/columns\.derived\[0\]/);
  });

  it('refuses a lag of 2 or more as the previous action of a rate limit', () => {
    const rate = { candidates: [{ name: 'A', offset: [0], gain: [[0, 0, 0]], std: [1], bounds: { lo: [0], hi: [100], mode: 'clip' }, rateLimit: { maxStep: [2], previousAction: ['valve_2'] } }] };
    expect(problems(project([lag(1), lag(2)], ['valve_1', 'valve_2'], rate)).join('\n')).toMatch(/"A"\.rateLimit\.previousAction\[0\]: "valve_2" is not the previous value of valve/);
  });
});
