/**
 * The candidate editor's pure edits: plain starting values per form, switching form (name,
 * description, dither, actuator limits and rate limit kept), integral action modes (K_i = K_c/T_i,
 * the standard relation of a PI controller in ideal form; common practice), rate-limit edits,
 * schedule rows, and where leftover problems are placed in words. Every candidate the edits make is
 * accepted by the project's own checks (src/project), on the heating-loop sample's columns.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseProjectText } from '../../../src/project/projectFile';
import type { CandidateSpec, ProjectDocument } from '../../../src/project/schema';
import { projectProblems } from '../../../src/renderer/src/document/projectProblems';
import {
  defaultFeedback, defaultPiForm, defaultScheduleForm, errorIntegralsFor, firstMeasuredState, fixedSetpointFor, integralMode,
  previousActionState, withFormKind, withIntegralMode, withoutRateLimit, withRateLimit, type PiLoop,
} from '../../../src/renderer/src/screens/candidates/formDrafts';
import { withRowAdded, withRowRemoved } from '../../../src/renderer/src/screens/candidates/scheduleRows';
import { problemPlace, shownBesideField } from '../../../src/renderer/src/screens/candidates/candidateProblemPlaces';
import type { DataImport } from '../../../src/shared/workerMessages';

const SAMPLE = resolve(__dirname, '../../../sample-projects/heating-loop/heating-loop.spcritic');

function heating(): ProjectDocument {
  const loaded = parseProjectText(readFileSync(SAMPLE, 'utf8'), 'heating-loop.spcritic');
  if (!loaded.ok) throw new Error('sample did not parse');
  return loaded.value.document;
}

/** An import summary with invented statistics (demo values only). */
const imported = {
  summary: {
    columns: [
      { name: 'heating_valve_pct', mean: 61.23456, std: 12, min: 0, max: 100 },
      { name: 'zone_temp_c', mean: 20.61234, std: 0.5, min: 19, max: 22 },
    ],
  },
} as unknown as DataImport;

const affineCandidate: CandidateSpec = {
  name: 'Mine', description: 'kept', form: { kind: 'affine', offset: [50], gain: [[1, 2, 3, 4]] }, dither: [2.5],
  bounds: { lo: [0], hi: [100], mode: 'clip' },
};

function candidateProblems(doc: ProjectDocument, c: CandidateSpec): string[] {
  const withIt = { ...doc, candidates: [c] };
  return projectProblems(withIt).filter((p) => p.path.startsWith('candidates.0')).map((p) => `${p.path}: ${p.message}`);
}

describe('starting values of each form', () => {
  it('starts a PI loop at the logged mean action, gain 0, P only, on a measured (not derived) state', () => {
    const doc = heating();
    expect(firstMeasuredState(doc)).toBe('zone_temp_c');
    // The sample's error integral of zone_temp_c has setpoint 21, so the loop starts there.
    expect(defaultPiForm(doc, imported)).toEqual({
      kind: 'pi', loops: [{ bias: 61.23, measurement: 'zone_temp_c', setpoint: 21, proportionalGain: 0, action: 'reverse' }],
    });
    expect(defaultPiForm(doc, null).loops[0].bias).toBe(0);
  });

  it('takes the logged mean as setpoint when no error integral names the measurement', () => {
    const doc = heating();
    doc.columns.derived = doc.columns.derived?.filter((d) => d.kind !== 'errorIntegral');
    expect(defaultFeedback(doc, imported).setpoint).toBe(20.61);
  });

  it('starts a schedule flat at the logged mean, breakpoints one standard deviation either side', () => {
    expect(defaultScheduleForm(heating(), imported).loops[0]).toEqual({ input: 'zone_temp_c', breakpoints: [20.11, 21.11], values: [61.23, 61.23] });
    expect(defaultScheduleForm(heating(), null).loops[0].breakpoints).toEqual([0, 1]);
  });
});

describe('switching form', () => {
  it('keeps name, description, dither, limits and rate limit', () => {
    const doc = heating();
    const start = { ...affineCandidate, rateLimit: { maxStep: [2], previousAction: ['valve_prev_pct'] } };
    for (const kind of ['pi', 'schedule', 'affine'] as const) {
      const next = withFormKind(kind === 'affine' ? withFormKind(start, 'pi', doc, imported) : start, kind, doc, imported);
      expect(next.form.kind).toBe(kind);
      expect(next).toMatchObject({ name: 'Mine', description: 'kept', dither: [2.5], bounds: start.bounds, rateLimit: start.rateLimit });
      expect(candidateProblems(doc, next)).toEqual([]);
    }
  });

  it('from affine to PI starts from plain values, not the affine gains', () => {
    const next = withFormKind(affineCandidate, 'pi', heating(), imported);
    expect(next.form).toEqual(defaultPiForm(heating(), imported));
    expect(withFormKind(affineCandidate, 'affine', heating(), imported)).toBe(affineCandidate);
  });

  it('carries a PI loop over as a schedule trim and back', () => {
    const doc = heating();
    const pi = doc.candidates[0];
    const schedule = withFormKind(pi, 'schedule', doc, imported);
    const loop = schedule.form.kind === 'schedule' ? schedule.form.loops[0] : undefined;
    expect(loop?.values).toEqual([82.7, 82.7]);
    expect(loop?.feedback).toEqual({ measurement: 'zone_temp_c', setpoint: 21, proportionalGain: 25, integralTimeSeconds: 1800, integralState: 'zone_error_integral', action: 'reverse' });
    expect(candidateProblems(doc, schedule)).toEqual([]);
    expect(withFormKind(schedule, 'pi', doc, imported).form).toEqual(pi.form);
  });
});

describe('integral action', () => {
  const doc = heating();
  const p: PiLoop = { bias: 80, measurement: 'zone_temp_c', setpoint: 21, proportionalGain: 25, action: 'reverse' };

  it('switches on with the matching error-integral state and a starting integral time', () => {
    const withTime = withIntegralMode(p, 'time', doc);
    expect(withTime).toMatchObject({ bias: 80, integralTimeSeconds: 600, integralState: 'zone_error_integral' });
    expect(integralMode(withTime)).toBe('time');
    expect(candidateProblems(doc, { ...affineCandidate, form: { kind: 'pi', loops: [withTime] } })).toEqual([]);
  });

  it('converts between T_i and K_i by K_i = K_c/T_i and switches off again', () => {
    const withGain = withIntegralMode({ ...p, integralTimeSeconds: 1250 }, 'gain', doc);
    expect(withGain.integralGain).toBe(0.02); // 25 / 1250 = 0.02 (hand arithmetic)
    expect(withGain.integralTimeSeconds).toBeUndefined();
    expect(withIntegralMode(withGain, 'time', doc).integralTimeSeconds).toBe(1250);
    const off = withIntegralMode(withGain, 'none', doc);
    expect(integralMode(off)).toBe('none');
    expect(off.integralGain).toBeUndefined();
  });

  it('finds error integrals of a measurement, the same setpoint first', () => {
    expect(errorIntegralsFor(doc, 'zone_temp_c', 21)).toEqual(['zone_error_integral']);
    expect(errorIntegralsFor(doc, 'outdoor_temp_c', 21)).toEqual([]);
  });
});

describe('rate limit', () => {
  const doc = heating();
  it('fills in the previous-action state and removes the limit when emptied', () => {
    expect(previousActionState(doc, 'heating_valve_pct')).toBe('valve_prev_pct');
    const limited = withRateLimit(affineCandidate, doc, 0, { maxStep: 2 });
    expect(limited.rateLimit).toEqual({ maxStep: [2], previousAction: ['valve_prev_pct'] });
    expect(candidateProblems(doc, limited)).toEqual([]);
    const cleared = withRateLimit(withRateLimit(limited, doc, 0, { maxStep: null }), doc, 0, { previousAction: null });
    expect(cleared.rateLimit).toBeUndefined();
    expect(cleared).toMatchObject({ name: 'Mine', dither: [2.5] });
  });

  it('does not take the action two rows back for the previous action (a dead-time lag is not a rate limit\'s state)', () => {
    const lagged = { ...doc, columns: { ...doc.columns, derived: doc.columns.derived?.map((d) => (d.kind === 'previous' ? { ...d, steps: 2 } : d)) } };
    expect(previousActionState(lagged, 'heating_valve_pct')).toBeNull();
  });

  it('reports a missing previous-action state beside the field', () => {
    const noPrevious = { ...doc, columns: { ...doc.columns, derived: doc.columns.derived?.filter((d) => d.kind !== 'previous') } };
    const limited = withRateLimit(affineCandidate, noPrevious, 0, { maxStep: 2 });
    expect(limited.rateLimit?.previousAction).toEqual([null]);
    const paths = projectProblems({ ...noPrevious, candidates: [limited] }).map((p) => p.path);
    expect(paths).toContain('candidates.0.rateLimit.previousAction.0');
    expect(paths.filter((x) => x.startsWith('candidates.0')).every((x) => shownBesideField(x.slice('candidates.0.'.length)))).toBe(true);
  });
});

describe('schedule rows and problem places', () => {
  it('continues the last step and never removes the last row', () => {
    const loop = { input: 'x', breakpoints: [-10, -6], values: [92, 88] };
    expect(withRowAdded(loop)).toEqual({ input: 'x', breakpoints: [-10, -6, -2], values: [92, 88, 88] });
    expect(withRowAdded({ input: 'x', breakpoints: [0.1], values: [1] }).breakpoints).toEqual([0.1, 1.1]);
    expect(withRowRemoved(loop, 0)).toEqual({ input: 'x', breakpoints: [-6], values: [88] });
    expect(withRowRemoved(withRowRemoved(loop, 0), 0).breakpoints).toEqual([-6]);
  });

  it('shows a non-increasing breakpoint beside its field', () => {
    const doc = heating();
    const c: CandidateSpec = { ...affineCandidate, form: { kind: 'schedule', loops: [{ input: 'outdoor_temp_c', breakpoints: [0, 0], values: [1, 2] }] } };
    const problems = projectProblems({ ...doc, candidates: [c] }).filter((p) => p.path.startsWith('candidates.0'));
    expect(problems.map((p) => p.path)).toEqual(['candidates.0.form.loops.0.breakpoints.1']);
    expect(shownBesideField('form.loops.0.breakpoints.1')).toBe(true);
  });

  it('names the place of a problem no field shows in words', () => {
    expect(shownBesideField('form.loops')).toBe(false);
    expect(problemPlace('form.loops', ['valve'])).toBe('Form');
    expect(problemPlace('form.loops.0', ['valve'])).toBe('Form, valve');
    expect(problemPlace('dither', ['valve'])).toBe('Dither');
    expect(shownBesideField('form.loops.0.feedback.integralState')).toBe(true);
  });
});

describe('a fixed setpoint to start from', () => {
  it('is the error integral’s setpoint of the measurement, or 0', () => {
    expect(fixedSetpointFor(heating(), 'zone_temp_c')).toBe(21);
    expect(fixedSetpointFor(heating(), 'outdoor_temp_c')).toBe(0);
  });
});

describe('removing a rate limit', () => {
  it('keeps everything else', () => {
    const limited = { ...affineCandidate, rateLimit: { maxStep: [2], previousAction: ['valve_prev_pct'] } };
    expect(withoutRateLimit(limited)).toEqual(affineCandidate);
  });
});
