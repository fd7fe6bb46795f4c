/**
 * The candidate forms in the project document: older files load unchanged (offset/gain/std read
 * into the affine form and dither), each form is checked against the columns by field, and the
 * retune maps name numbers of their candidate.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parseProjectText, serializeProject } from '../../src/project/projectFile';
import { candidateParameter, tunableParameters, withCandidateParameter } from '../../src/project/candidateParameters';
import { retuneMapCandidates } from '../../src/project/retuneMapCandidates';
import { summariseCandidate } from '../../src/project/candidateSummary';

const base = () => ({
  format: 'setpoint-critic-project', version: 1, name: 'p', data: { path: 'log.csv' },
  columns: {
    states: [{ column: 'temp', unit: '°C' }, { column: 'outdoor', unit: '°C' }, { column: 'ie', unit: 'K·s' }, { column: 'valve_prev', unit: '%' }],
    actions: [{ column: 'valve', unit: '%' }], reward: { kind: 'column', column: 'cost', sense: 'cost' },
    derived: [
      { kind: 'errorIntegral', name: 'ie', measurement: 'temp', setpoint: 21, periodSeconds: 60 },
      { kind: 'previous', name: 'valve_prev', source: 'valve' },
    ],
  },
  discount: 0.95, approximator: { kind: 'linear', features: { kind: 'polynomial', degree: 2 } },
  candidates: [] as unknown[],
});
const pi = { kind: 'pi', loops: [{ measurement: 'temp', setpoint: 21, bias: 80, proportionalGain: 25, integralTimeSeconds: 1800, integralState: 'ie', action: 'reverse' }] };
const parse = (doc: unknown) => parseProjectText(JSON.stringify(doc), 'p.spcritic');
const problems = (doc: unknown) => { const r = parse(doc); return r.ok ? [] : r.problems.map((p) => `${p.where}: ${p.message}`); };

describe('candidate forms in the project document', () => {
  it('reads an older affine candidate unchanged, as the affine form with its std as dither', () => {
    const tank = readFileSync(new URL('../../sample-projects/tank-levels/tank-levels.spcritic', import.meta.url), 'utf8');
    const r = parseProjectText(tank, 'tank.spcritic');
    if (!r.ok) throw new Error('tank sample did not load');
    expect(r.value.document.candidates[0]).toMatchObject({ form: { kind: 'affine', offset: [189], gain: [[-60, -90]] }, dither: [1.5] });
    const again = parseProjectText(serializeProject(r.value.document), 'tank.spcritic');
    expect(again.ok && again.value.document).toEqual(r.value.document);
  });

  it('names older fields as written when they are wrong, and refuses both shapes at once', () => {
    const doc = base();
    doc.candidates = [{ name: 'A', offset: [0], gain: [[1, 2]], std: [1] }];
    expect(problems(doc)).toContain('p.spcritic, candidates[0] "A".gain[0]: expected 4 value(s), one per state column, found 2');
    doc.candidates = [{ name: 'A', form: pi, offset: [0], dither: [1] }];
    expect(problems(doc).join('\n')).toMatch(/candidates\[0\]\.offset: give the mean once/);
    doc.candidates = [{ name: 'A', form: pi, dither: [1], std: [1] }];
    expect(problems(doc).join('\n')).toMatch(/candidates\[0\]\.std: give the dither once/);
  });

  it('accepts P/PI, a schedule with a P trim, and a rate limit on the previous action', () => {
    const doc = base();
    doc.candidates = [
      { name: 'PI', form: pi, dither: [3], bounds: { lo: [0], hi: [100], mode: 'clip' } },
      { name: 'reset', form: { kind: 'schedule', loops: [{ input: 'outdoor', breakpoints: [-10, 0, 10], values: [90, 75, 55], feedback: { measurement: 'temp', setpoint: 21, proportionalGain: 10, action: 'reverse' } }] }, dither: [3] },
      { name: 'slew', form: pi, dither: [3], rateLimit: { maxStep: [2], previousAction: ['valve_prev'] } },
    ];
    expect(problems(doc)).toEqual([]);
  });

  it('checks each form against the columns, naming the field', () => {
    const doc = base();
    doc.candidates = [
      { name: 'A', form: { kind: 'pi', loops: [{ ...pi.loops[0], measurement: 'tmep' }] }, dither: [1] },
      { name: 'B', form: { kind: 'pi', loops: [{ ...pi.loops[0], integralState: undefined }] }, dither: [1] },
      { name: 'C', form: { kind: 'pi', loops: [{ ...pi.loops[0], setpoint: 20 }] }, dither: [1] },
      { name: 'D', form: { kind: 'schedule', loops: [{ input: 'outdoor', breakpoints: [0, 0], values: [1, 2] }] }, dither: [1] },
      { name: 'E', form: pi, dither: [1], rateLimit: { maxStep: [2], previousAction: ['ie'] } },
      { name: 'F', form: pi, dither: [1], bounds: { lo: [0], hi: [1], mode: 'truncate' }, rateLimit: { maxStep: [2], previousAction: ['valve_prev'] } },
    ];
    const found = problems(doc).join('\n');
    expect(found).toMatch(/"A"\.form\.loops\[0\]\.measurement: "tmep" is not one of the state columns/);
    expect(found).toMatch(/"B"\.form\.loops\[0\]\.integralState: integral action needs the error-integral state/);
    expect(found).toMatch(/"C"\.form\.loops\[0\]\.integralState: "ie" integrates 21 − temp, but this loop’s error is 20 − temp/);
    expect(found).toMatch(/"D"\.form\.loops\[0\]\.breakpoints\[1\]: breakpoints must increase strictly/);
    expect(found).toMatch(/"E"\.rateLimit\.previousAction\[0\]: "ie" is not the previous value of valve; choose the state that holds valve one sample earlier/);
    expect(found).toMatch(/"F"\.rateLimit: a rate limit clips the action, so the actuator limits must clip too: set "At a limit" to Clip/);
  });

  it('describes each form in the trade\'s words, with units', () => {
    const r = parse({ ...base(), candidates: [{ name: 'PI', form: pi, dither: [3], bounds: { lo: [0], hi: [100], mode: 'clip' }, rateLimit: { maxStep: [2], previousAction: ['valve_prev'] } }] });
    if (!r.ok) throw new Error('did not parse');
    const s = summariseCandidate(r.value.document.candidates[0], r.value.document.columns);
    // A number and its unit held by a no-break space (U+00A0), as core/shareText.ts holds a share to its "%":
    // SI Brochure (9th ed., 2019) §5.4.3 puts a space between a number and its unit, §5.4.7 before "%";
    // keeping the two on one line is common practice in typesetting.
    const nb = '\u00a0';
    expect(s.mean[0]).toBe(`valve: PI, reverse acting, on 21${nb}°C − temp: K_c 25${nb}% per °C, T_i 1800${nb}s (integral state ie); bias 80${nb}%`);
    expect(s.dither).toBe(`dither 3${nb}% (standard deviation)`);
    expect(s.limits).toBe(`clipped to 0 … 100${nb}%; valve moves at most 2${nb}% per step from valve_prev`);
  });

  it('never leaves a line free to break between a number and its unit, in any sample candidate', () => {
    const broken: string[] = [];
    for (const sample of ['heating-loop', 'tank-levels', 'heating-historian']) {
      const r = parseProjectText(readFileSync(new URL(`../../sample-projects/${sample}/${sample}.spcritic`, import.meta.url), 'utf8'), `${sample}.spcritic`);
      if (!r.ok) throw new Error(`${sample} did not load`);
      for (const c of r.value.document.candidates) {
        const s = summariseCandidate(c, r.value.document.columns);
        for (const line of [...s.mean, s.dither, s.limits]) if (/\d (?:%|°C|K\b|s\b|m\b|unit\b)/.test(line)) broken.push(`${sample} "${c.name}": ${line}`);
      }
    }
    expect(broken).toEqual([]);
  });
});

describe('retune maps', () => {
  const withMap = (axes: unknown[]) => ({ ...base(), candidates: [{ name: 'PI', form: pi, dither: [3] }], retuneMaps: [{ candidate: 'PI', axes }] });

  it('sweeps numbers of the candidate by path, row-major', () => {
    const r = parse(withMap([
      { parameter: 'form.loops.0.proportionalGain', from: 10, to: 30, count: 3 },
      { parameter: 'form.loops.0.integralTimeSeconds', from: 600, to: 2400, count: 2, spacing: 'logarithmic' },
    ]));
    if (!r.ok) throw new Error(r.problems.map((p) => p.message).join('\n'));
    const { candidates, coordinates } = retuneMapCandidates(r.value.document, r.value.document.retuneMaps![0]);
    expect(coordinates).toEqual([[10, 20, 30], [600, 2400]]);
    expect(candidates.map((c) => [candidateParameter(c, 'form.loops.0.proportionalGain'), candidateParameter(c, 'form.loops.0.integralTimeSeconds')]))
      .toEqual([[10, 600], [10, 2400], [20, 600], [20, 2400], [30, 600], [30, 2400]]);
    expect(candidateParameter(r.value.document.candidates[0], 'form.loops.0.proportionalGain')).toBe(25); // the original is untouched
  });

  it('names an axis that is not a number of the candidate, listing the ones that are', () => {
    const found = problems(withMap([{ parameter: 'form.loops.0.gain', from: 1, to: 2, count: 3 }])).join('\n');
    expect(found).toMatch(/retuneMaps\[0\]\.axes\[0\]\.parameter: "form\.loops\.0\.gain" is not a number of candidate "PI"; its tunable numbers are form\.loops\.0\.proportionalGain, form\.loops\.0\.integralTimeSeconds, form\.loops\.0\.bias, dither\.0/);
    expect(problems(withMap([{ parameter: 'dither.0', from: -1, to: 2, count: 3, spacing: 'logarithmic' }])).join('\n')).toMatch(/logarithmic axis needs positive/);
  });

  it('lists tunable numbers with units and sets one without touching the rest', () => {
    const r = parse(withMap([{ parameter: 'dither.0', from: 1, to: 2, count: 2 }]));
    if (!r.ok) throw new Error('did not parse');
    const c = r.value.document.candidates[0];
    expect(tunableParameters(c, r.value.document.columns)[0]).toEqual({ path: 'form.loops.0.proportionalGain', label: 'proportional gain K_c', unit: '% per °C' });
    expect(candidateParameter(withCandidateParameter(c, 'dither.0', 5), 'dither.0')).toBe(5);
    expect(() => withCandidateParameter(c, 'form.loops.0.action', 1)).toThrow(/not a number/);
  });
});

describe('problem locations as data', () => {
  it('gives each form problem the field path as keys and indices', () => {
    const doc = base();
    doc.candidates = [{ name: 'A', form: { kind: 'pi', loops: [{ ...pi.loops[0], measurement: 'tmep' }] }, dither: [1] }];
    const r = parse(doc);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0].field).toEqual(['candidates', 0, 'form', 'loops', 0, 'measurement']);
  });
});

describe('candidate checks speak the editor’s words', () => {
  it('names no file field in the message, and keeps the field path as data', () => {
    const doc = base();
    doc.candidates = [
      { name: 'G', form: { kind: 'pi', loops: [{ ...pi.loops[0], integralGain: 0.1 }] }, dither: [1] },
      { name: 'H', form: { kind: 'pi', loops: [{ ...pi.loops[0], proportionalGain: 0 }] }, dither: [1] },
      { name: 'I', form: { kind: 'pi', loops: [{ ...pi.loops[0], integralState: undefined }] }, dither: [1] },
      { name: 'J', form: pi, dither: [1], bounds: { lo: [5], hi: [1], mode: 'clip' } },
      { name: 'K', form: pi, dither: [1], bounds: { lo: [0], hi: [1], mode: 'truncate' }, rateLimit: { maxStep: [2], previousAction: [null] } },
    ];
    const r = parse(doc), found = r.ok ? [] : r.problems;
    expect(found.length).toBeGreaterThanOrEqual(5);
    for (const p of found) {
      // Quoted text is a value the user typed or a kind to write in the file; outside quotes, no camelCase field name.
      expect(p.message.replace(/"[^"]*"/g, ''), p.message).not.toMatch(/\b[a-z]+[A-Z][A-Za-z]*\b|\bcolumns\.|\bbounds\.|\bnull\b/);
      expect(p.field?.[0], p.where).toBe('candidates');
    }
    const messages = found.map((p) => p.message).join('\n');
    expect(messages).toContain('give the integral action once, as an integral time T_i or as an integral gain K_i, not both');
    expect(messages).toContain('with a proportional gain K_c of 0');
    expect(messages).toContain('the lowest valve (5) must be below the highest (1)');
    expect(found.find((p) => p.message.startsWith('the lowest'))?.field).toEqual(['candidates', 3, 'bounds', 'lo', 0]);
  });
});
