/**
 * The present controller's panel says where the fitted law sits in the logs: its mean action at the
 * mean logged state (core/behaviourModel.ts meanActionAtMeanState), beside the offset, which is the
 * mean at the state 0. Rendered as the app renders it (react-dom/server). Invented numbers: a law
 * a = 392.7 − 15.2·zone_temp_c on a log whose zone sits at 20.5 °C gives 392.7 − 311.6 = 81.1 %.
 */
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import type { BehaviourModel } from '../../../src/core/behaviourModel';
import type { ProjectDocument } from '../../../src/project/schema';
import { BehaviourModelPanel } from '../../../src/renderer/src/screens/candidates/BehaviourModelPanel';

const doc = { columns: { states: [{ column: 'zone_temp_c', unit: '°C' }], actions: [{ column: 'heating_valve_pct', unit: '%' }] } } as unknown as ProjectDocument;
const model = (bounded: boolean): BehaviourModel => ({
  offset: [392.7], gain: [[-15.2]], std: [10.07], covariance: [[101.4]], rSquared: [0.8], offsetStandardError: [3.1], gainStandardError: [[0.15]],
  count: 19_920, stateMean: [20.5], degreesOfFreedom: 19_918,
  limits: { lo: [-Infinity], hi: [bounded ? 100 : Infinity], evidence: { lo: ['none'], hi: [bounded ? 'repeated' : 'none'] } },
  ...(bounded ? { bounds: { lo: [-Infinity], hi: [100], mode: 'clip' as const } } : {}),
} as unknown as BehaviourModel);
const row = (html: string, label: RegExp) => html.match(new RegExp(`<th scope="row">(${label.source})</th><td class="number">([^<]*)</td>`));

describe('the present controller’s panel', () => {
  it('gives the mean action at the mean logged state, before the limits where the log shows some', () => {
    const html = renderToStaticMarkup(createElement(BehaviourModelPanel, { doc, behaviour: { ok: true, model: model(true), heldRowsLeftOut: 0 }, onStart: () => {} }));
    const found = row(html, /Mean action at the mean logged state[^<]*/);
    expect(found?.[1]).toBe('Mean action at the mean logged state, before the limits (%)');
    expect(Number(found?.[2])).toBeCloseTo(81.1, 6);
  });
  it('says no "before the limits" where the log shows none', () => {
    const html = renderToStaticMarkup(createElement(BehaviourModelPanel, { doc, behaviour: { ok: true, model: model(false), heldRowsLeftOut: 0 }, onStart: () => {} }));
    expect(row(html, /Mean action at the mean logged state[^<]*/)?.[1]).toBe('Mean action at the mean logged state (%)');
  });
  it('says why its step count is short where held rows were left out of the fit, and nothing where none were', () => {
    const withHeld = renderToStaticMarkup(createElement(BehaviourModelPanel, { doc, behaviour: { ok: true, model: model(false), heldRowsLeftOut: 1234 }, onStart: () => {} }));
    expect(withHeld).toContain('The 1,234 steps whose action repeats the step before exactly');
    const without = renderToStaticMarkup(createElement(BehaviourModelPanel, { doc, behaviour: { ok: true, model: model(false), heldRowsLeftOut: 0 }, onStart: () => {} }));
    expect(without).not.toContain('behaviour-held-rows');
  });
});
