/**
 * `--json` carries every part of the assessment, the present controller's included (its interval,
 * cross-checks and confirmation were missing: a script reading the baseline's interval found none).
 * A consistency check of our own published interface; no outside source applies.
 */
import { describe, expect, it } from 'vitest';
import { assessmentToJson } from '../../src/pipeline/assessmentJson';
import type { Assessment } from '../../src/pipeline/assessment';

describe('the assessment as JSON', () => {
  it('has every field, the present controller among them, in the published order', () => {
    const fields = ['settings', 'valueSense', 'behaviour', 'presentController', 'candidates', 'comparison', 'sensitivity', 'unvisitedShare', 'plantMemory', 'runOrder', 'heldActions', 'warnings', 'method'];
    const marked = Object.fromEntries(fields.map((f) => [f, { field: f }])) as unknown as Assessment;
    const json = assessmentToJson(marked);
    expect(Object.keys(json)).toEqual(fields);
    expect(json.presentController).toEqual({ field: 'presentController' });
  });
});
