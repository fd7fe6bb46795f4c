/**
 * Results kept in a project file by an earlier version must never crash the Findings panels: an
 * evaluation without the present controller's baseline is shown with the reason, an assessment
 * without the class verdict, the confirmation or the occupancy shift is not shown (a rerun
 * computes it). Invented minimal results, shaped as the JSON the app writes.
 */
import { describe, expect, it } from 'vitest';
import { assessmentFromJson, evaluationFromJson, fittedBeforeHeldRepair, restoreResults, resultsOf, retuneMapsFromJson, withAxisUnits } from '../../../src/renderer/src/session/savedResults';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { parseProjectText } from '../../../src/project/projectFile';
import { createSessionStore } from '../../../src/renderer/src/session/sessionStore';
import { newProjectDocument } from '../../../src/renderer/src/document/newProject';
import { runKey, runKeyWithNotes } from '../../../src/shared/runKey';
import { rankingVerdict } from '../../../src/figures/charts/sensitivity';
import { trialAnswer, trialChoice } from '../../../src/pipeline/trialChoice';
import type { FunctionClassAssessment } from '../../../src/pipeline/assessment';
import { CrossChecksPanel } from '../../../src/renderer/src/screens/findings/CrossChecksPanel';
import { renderFindings } from '../../support/renderFindings';
import { createElement } from 'react';

const evaluation = {
  project: 'p', evaluatedAt: '2026-11-01T00:00:00.000Z', valueSense: 'cost', behaviour: { value: 3, standardError: 0.1, episodes: 10, largestTruncationWeight: 0, meanTruncationWeight: 0 },
  policies: [{ name: 'A', policyValue: 2, standardError: 0.1, fixedPointValue: 2, status: 'converged', message: '', iterations: 5, history: [], surface: null, featureCount: 6, backend: 'linear' }],
};

describe('results saved by an earlier version', () => {
  it('shows an evaluation without a baseline, saying why', () => {
    const e = evaluationFromJson(evaluation)!;
    expect(e.presentController).toBeNull();
    expect(e.presentControllerReason).toMatch(/earlier version; run again/);
  });

  it('does not show an assessment without the current fields', () => {
    const old = { settings: {}, comparison: {}, candidates: [{ name: 'A', diagnostics: { distributionShiftStart: 2 } }] };
    expect(assessmentFromJson(old)).toBeNull();
    const current = { settings: {}, comparison: {}, presentController: null, candidates: [{ name: 'A', confirmation: { status: 'unconfirmed', text: '' }, reportedRange: null, diagnostics: { occupancyShift: 1.1 } }] };
    expect(assessmentFromJson(current)).not.toBeNull();
  });

  it('opens an assessment saved before the class pairs and the sweep’s ranking changes were kept, and says what it can', () => {
    const classes = { classes: [], settled: false, range: [1, 2], coverage: '', reason: 'Not settled: …' }; // no `pairs`
    const curve = { parameter: 'polynomialDegree', label: 'degree', settings: [1, 2, 3], projectIndex: 1, series: [], rankingStable: false }; // no `rankingChanges`
    const saved = {
      settings: {}, valueSense: 'cost', warnings: [], presentController: null, sensitivity: { curves: [curve], notes: [] },
      comparison: { baseline: { name: 'logged return', note: '' }, differences: [], ranking: { order: ['A'], frequency: null, neighbours: [] } },
      candidates: [{ name: 'A', policyValue: { value: 2, percentile: [1, 3] }, warnings: [], functionClasses: classes, confirmation: { status: 'unconfirmed', text: '' }, reportedRange: [1, 2], diagnostics: { occupancyShift: 1.1 } }],
    };
    const a = assessmentFromJson(saved)!;
    expect(a).not.toBeNull();
    expect(rankingVerdict(a.sensitivity!.curves[0])).toBe('the ranking changes within this range'); // the words before this version, no pairs to name
    expect(trialAnswer(a, trialChoice(a), { cautions: 'above', warnings: 'under Coverage' })?.headline).toBe('No candidate is named for a trial.');
  });

  it('reopens a class verdict saved without its pairs and shows it with no pointer sentence', () => {
    // As the app wrote it before b03f1f9: degrees 2, 3 and 4, not settled, its reason without the nested-class sentence.
    const k = (label: string, value: number) => ({ label, value, interval: [value - 1, value + 1] as [number, number], standardError: 0.6 });
    const classes: FunctionClassAssessment = {
      classes: [k('polynomial, degree 2', 90), k('polynomial, degree 3', 100.5), k('polynomial, degree 4', 99.8)], settled: false, range: [89, 101.5],
      coverage: 'Covers the sampling of runs and the spread between function classes.', reason: 'Not settled: polynomial, degree 2 and polynomial, degree 3 differ by 10 % of J.',
    };
    const candidate = {
      name: 'A', policyValue: { value: 90, standardError: 0.6, percentile: [89, 91], basic: null, replicates: 100, failedReplicates: 0 }, reportedRange: [89, 101.5], settled: false,
      functionClasses: classes, confirmation: { status: 'unconfirmed', text: 'No cross-check could confirm it.' }, crossChecks: [], warnings: [], diagnostics: { occupancyShift: 1.1 },
    };
    const doc = newProjectDocument(), key = runKey(doc, 'data-a');
    const results = { ...resultsOf({ evaluation: evaluationFromJson(evaluation)!, assessment: null, retuneMaps: null }, key, new Date()) };
    const assessment = { settings: { level: 0.9, resamples: 100 }, valueSense: 'cost', warnings: [], presentController: null, comparison: {}, candidates: [candidate] };
    const session = createSessionStore();
    expect(restoreResults({ ...doc, results: JSON.parse(JSON.stringify({ ...results, assessment })) }, 'data-a', session)).toBe(true);
    const restored = session.get().assessment;
    expect(restored.status).toBe('done');
    if (restored.status !== 'done') return;
    expect(restored.assessment.candidates[0].functionClasses?.pairs).toBeUndefined();
    const html = renderFindings(createElement(CrossChecksPanel, { assessment: restored.assessment }), ['crossChecks']);
    const reason = /data-testid="classes-reason-A">([^<]*)</.exec(html)![1];
    expect(reason).toMatch(/degree 2 and polynomial, degree 3 differ by 10/);
    expect(html).not.toMatch(/most likely lies|richer classes/);
  });
});

describe('retune maps kept with the results', () => {
  // An invented 1×2 map, shaped as pipeline/retuneMaps.ts writes it (not any plant's result).
  const map = {
    candidate: 'A', features: 'polynomial degree 2', notes: ['note'], presentController: 3,
    axes: [{ parameter: 'form.loops.0.proportionalGain', label: 'proportional gain', values: [1, 2] }],
    points: [
      { coordinates: [1], value: 2.5, interval: [2, 3], status: 'converged', occupancyShift: 1.2, support: null, route: 'closedForm' },
      { coordinates: [2], value: null, interval: null, status: 'diverged', occupancyShift: null, support: 'unknown', route: 'closedForm' },
    ],
    best: { index: 0, coordinates: [1], value: 2.5 },
  };
  const parsedEvaluation = evaluationFromJson(evaluation)!;

  it('writes the maps with the evaluation and reads them back unchanged', () => {
    const saved = resultsOf({ evaluation: parsedEvaluation, assessment: null, retuneMaps: [map as never] }, 'key', new Date('2026-11-02T00:00:00Z'));
    const text = JSON.parse(JSON.stringify(saved));
    expect(retuneMapsFromJson(text.retuneMaps)).toEqual([map]);
  });

  it('opens results of an older file without maps, and refuses a map missing a field', () => {
    const saved = resultsOf({ evaluation: parsedEvaluation, assessment: null, retuneMaps: null }, 'key', new Date());
    expect(saved.retuneMaps).toBeUndefined();
    expect(retuneMapsFromJson(undefined)).toBeNull();
    expect(retuneMapsFromJson([{ ...map, points: map.points.slice(1) }])).toBeNull(); // two axis values, one point
    expect(retuneMapsFromJson([{ ...map, axes: undefined } as never])).toBeNull();
  });

  it('gives a map saved before axes kept their unit the unit of its candidate’s parameter, so its integral time reads in minutes', () => {
    const loaded = parseProjectText(readFileSync(resolve(__dirname, '../../../sample-projects/heating-loop/heating-loop.spcritic'), 'utf8'), 'heating-loop.spcritic');
    if (!loaded.ok) throw new Error('sample did not parse');
    const doc = loaded.value.document, candidate = doc.retuneMaps![0].candidate;
    const old = { ...map, candidate, axes: [{ parameter: 'form.loops.0.integralTimeSeconds', label: 'integral time T_i (s)', values: [300, 6000] }], points: map.points.map((p, i) => ({ ...p, coordinates: [[300, 6000][i]] })) };
    expect(withAxisUnits(old as never, doc).axes[0].unit).toBe('s');
    expect(withAxisUnits({ ...old, candidate: 'gone' } as never, doc).axes[0].unit).toBeUndefined();
  });

  it('restores a kept map as done for the current run key, and out of date for another', () => {
    const doc = { ...newProjectDocument(), retuneMaps: undefined };
    const key = runKey(doc, 'data-a');
    const results = resultsOf({ evaluation: parsedEvaluation, assessment: null, retuneMaps: [map as never] }, key, new Date());
    for (const [fingerprint, current] of [['data-a', true], ['data-b', false]] as const) {
      const session = createSessionStore();
      expect(restoreResults({ ...doc, results }, fingerprint, session)).toBe(true);
      const state = session.get();
      expect(state.retuneMaps.status).toBe('done');
      expect(state.retuneMaps.status === 'done' && state.retuneMaps.runKey).toBe(current ? key : `out of date: ${results.fingerprint}`);
      expect(state.evaluation?.restored?.current).toBe(current);
    }
  });

  // Before the reasons and notes left the key, it held them: results kept then carry that key's
  // fingerprint, and the numbers of the same project are the same, so they open as current.
  it('restores results kept under the earlier key (reasons and notes in it) as current', () => {
    const base = { ...newProjectDocument(), retuneMaps: undefined, notes: 'reviewed' };
    const doc = { ...base, data: { ...base.data, csv: { ...base.data.csv, excludedRuns: [{ from: '3', reason: 'trip test' }] } } };
    const results = resultsOf({ evaluation: parsedEvaluation, assessment: null, retuneMaps: null }, runKeyWithNotes(doc, 'data-a'), new Date());
    expect(runKey(doc, 'data-a')).not.toBe(runKeyWithNotes(doc, 'data-a'));
    const session = createSessionStore();
    restoreResults({ ...doc, results }, 'data-a', session);
    expect(session.get().evaluation?.restored?.current).toBe(true);
    expect(session.get().evaluation?.runKey).toBe(runKey(doc, 'data-a'));
    const other = createSessionStore();
    restoreResults({ ...doc, results }, 'data-b', other);
    expect(other.get().evaluation?.restored?.current).toBe(false);
  });

  // Before the held-actions repair, a log with held rows had its present controller fitted on every row: results kept
  // then (a held-actions severity with no lawFittedOn) open out of date even under the same key.
  it('opens results kept before the held-actions repair as out of date where rows were held, and as current where none were', () => {
    expect(fittedBeforeHeldRepair({ heldActions: { rows: 900, severity: 'serious' } })).toBe(true);
    expect(fittedBeforeHeldRepair({ heldActions: { rows: 900, severity: 'serious', lawFittedOn: 'movingRows' } })).toBe(false);
    expect(fittedBeforeHeldRepair({ heldActions: { rows: 0, severity: null } })).toBe(false);
    expect(fittedBeforeHeldRepair(undefined)).toBe(false);
    const doc = { ...newProjectDocument(), retuneMaps: undefined };
    const key = runKey(doc, 'data-a');
    const results = resultsOf({ evaluation: parsedEvaluation, assessment: null, retuneMaps: null }, key, new Date());
    const session = createSessionStore();
    restoreResults({ ...doc, results: { ...results, assessment: { heldActions: { rows: 900, severity: 'caution' } } } }, 'data-a', session);
    expect(session.get().evaluation?.restored?.current).toBe(false);
  });
});
