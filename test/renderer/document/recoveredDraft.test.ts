/** A recovery copy comes back whole when it is a complete project, and keeps every valid part when it is not. */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { recoveredDraft } from '../../../src/renderer/src/document/recoveredDraft';

const SAMPLE = readFileSync(resolve(__dirname, '../../../sample-projects/tank-levels/tank-levels.spcritic'), 'utf8');

describe('recovered drafts', () => {
  it('loads a complete copy as the project it is', () => {
    const draft = recoveredDraft(SAMPLE)!;
    expect(draft.complete).toBe(true);
    expect(draft.document.candidates).toHaveLength(2);
  });

  it('keeps the valid parts of an unfinished copy', () => {
    const raw = JSON.parse(SAMPLE);
    raw.columns.actions = []; // not yet mapped
    raw.candidates[1].std = [-1]; // half typed
    raw.discount = 0.9;
    const draft = recoveredDraft(JSON.stringify(raw))!;
    expect(draft.complete).toBe(false);
    expect(draft.document.discount).toBe(0.9);
    expect(draft.document.columns.states.map((s) => s.column)).toEqual(['level_upper_m', 'level_lower_m']);
    expect(draft.document.columns.actions).toEqual([]);
    expect(draft.document.candidates.map((c) => c.name)).toEqual(['Tuned (60, 90 %/m)']);
  });

  it('refuses what is not a project document of this version', () => {
    expect(recoveredDraft('not json')).toBeNull();
    expect(recoveredDraft(JSON.stringify({ format: 'other' }))).toBeNull();
    expect(recoveredDraft(JSON.stringify({ ...JSON.parse(SAMPLE), version: 99 }))).toBeNull();
  });
});
