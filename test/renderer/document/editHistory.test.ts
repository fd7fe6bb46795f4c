/**
 * Undo/redo over snapshots: the behaviour every editor's undo stack has (common practice): undo
 * walks back, redo forward, a new edit drops the redo branch, and typing into one field is one step.
 */
import { describe, expect, it } from 'vitest';
import { applyEdit, closeStep, createHistory, HISTORY_LIMIT, mapHistory, redo, redoLabel, undo, undoLabel } from '../../../src/renderer/src/document/editHistory';

describe('edit history', () => {
  it('undoes and redoes edits in order, with their labels', () => {
    let h = createHistory('a');
    h = applyEdit(h, 'b', 'to b');
    h = applyEdit(h, 'c', 'to c');
    expect(undoLabel(h)).toBe('to c');
    h = undo(h);
    expect(h.present).toBe('b');
    expect(redoLabel(h)).toBe('to c');
    h = undo(h);
    expect(h.present).toBe('a');
    expect(undo(h)).toBe(h); // nothing left to undo
    h = redo(redo(h));
    expect(h.present).toBe('c');
    expect(redo(h)).toBe(h);
  });

  it('drops the redo branch when a new edit is made after an undo', () => {
    let h = applyEdit(applyEdit(createHistory(1), 2, 'two'), 3, 'three');
    h = applyEdit(undo(h), 4, 'four');
    expect(h.future).toHaveLength(0);
    expect(undo(h).present).toBe(2);
  });

  it('merges edits with the same key into one step until the step is closed', () => {
    let h = createHistory('');
    for (const text of ['1', '18', '189']) h = applyEdit(h, text, 'set the offset', 'offset');
    expect(h.past).toHaveLength(1);
    expect(undo(h).present).toBe('');
    h = applyEdit(closeStep(h), '1890', 'set the offset', 'offset');
    expect(h.past).toHaveLength(2);
    expect(undo(h).present).toBe('189');
  });

  it('ignores an edit that changes nothing and keeps at most HISTORY_LIMIT steps', () => {
    const h0 = createHistory(0);
    expect(applyEdit(h0, 0, 'same')).toBe(h0);
    let h = h0;
    for (let i = 1; i <= HISTORY_LIMIT + 20; i++) h = applyEdit(h, i, `to ${i}`);
    expect(h.past).toHaveLength(HISTORY_LIMIT);
    expect(h.past[0].state).toBe(20);
  });

  it('applies a fact to every snapshot without adding a step', () => {
    const h = mapHistory(applyEdit(createHistory({ n: 1, path: '/a' }), { n: 2, path: '/a' }, 'n'), (s) => ({ ...s, path: 'a' }));
    expect(h.past).toHaveLength(1);
    expect(h.present.path).toBe('a');
    expect(undo(h).present).toEqual({ n: 1, path: 'a' });
  });
});
