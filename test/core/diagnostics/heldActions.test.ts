/**
 * The held-actions check (src/core/diagnostics/heldActions.ts): detection on hand-built sequences, and the effect on
 * a constructed log whose two laws are known in closed form (the ordinary least-squares slope and intercept,
 * β = S_sa / S_ss, b = ā − β s̄: any regression textbook, e.g. Seber & Lee, "Linear Regression Analysis", 2nd ed.,
 * 2003, §3.1; from memory).
 */
import { describe, expect, it } from 'vitest';
import { heldActionEffect, heldRowMask, heldStretches, type ActionLimits, type HeldActionData } from '../../../src/core/diagnostics/heldActions';
import { loggedActionLimits } from '../../../src/core/loggedActionLimits';
import { shareText } from '../../../src/core/shareText';
import { heldActionsFinding, heldLawRepaired, heldSeverity, HELD_MIN_ROWS } from '../../../src/core/diagnostics/heldActionsFinding';

/** No limit read, and the log's own extremes (loggedActionLimits.ts reads them on every row). */
function none(data: HeldActionData): ActionLimits {
  const { extremes } = loggedActionLimits(data.actions, data.count, data.actionDim);
  return { lo: extremes.min.map(() => -Infinity), hi: extremes.max.map(() => Infinity), extremes };
}

function log(actions: number[], m: number, episode?: number[], states?: number[]): HeldActionData {
  const n = actions.length / m;
  return { count: n, stateDim: 1, actionDim: m, actions, states: states ?? Array.from({ length: n }, (_, i) => i), episode: episode ?? new Array(n).fill(0) };
}

describe('held rows', () => {
  it('a row repeating the row before exactly is held; stretches are maximal runs of them', () => {
    // 0.5 0.3 0.3 0.3 0.2 0.6 0.6 0.1 (extremes 0.1 and 0.6 are logged stops: the 0.6 repeat is not held)
    const data = log([0.5, 0.3, 0.3, 0.3, 0.2, 0.6, 0.6, 0.1], 1);
    expect(Array.from(heldRowMask(data, none(data)))).toEqual([0, 0, 1, 1, 0, 0, 0, 0]);
    expect(heldStretches(heldRowMask(data, none(data)))).toEqual({ rows: 2, share: 2 / 8, stretches: 1, longest: 2 });
    const two = log([0.5, 0.3, 0.3, 0.2, 0.4, 0.4, 0.4, 0.1, 0.9], 1);
    expect(heldStretches(heldRowMask(two, none(two)))).toEqual({ rows: 3, share: 3 / 9, stretches: 2, longest: 2 });
  });

  it('a repeat at a limit read from the log, or at an action’s logged extreme, is a valve at its stop, not held', () => {
    const data = log([0.5, 1, 1, 1, 0.4, 0.3, 0.3, 0.2], 1);
    expect(Array.from(heldRowMask(data, none(data)))).toEqual([0, 0, 0, 0, 0, 0, 1, 0]); // 1 is the logged largest
    expect(Array.from(heldRowMask(data, { ...none(data), lo: [0.3] }))).toEqual(new Array(8).fill(0)); // 0.3 a read limit
  });

  it('a repeat across a run boundary is not held (each run’s first row has no row before)', () => {
    const data = log([0.5, 0.3, 0.3, 0.3, 0.2, 0.1], 1, [0, 0, 1, 1, 1, 1]);
    expect(Array.from(heldRowMask(data, none(data)))).toEqual([0, 0, 0, 1, 0, 0]);
  });

  it('several actions: held only when every component repeats', () => {
    const data = log([0.5, 5, 0.3, 3, 0.3, 4, 0.3, 4, 0.2, 1, 0.9, 9], 2);
    expect(Array.from(heldRowMask(data, none(data)))).toEqual([0, 0, 0, 1, 0, 0]);
  });
});

describe('the effect on the law', () => {
  it('a held stretch at a constant action: the pooled least-squares law against the law the other rows follow, in closed form', () => {
    // Moving rows: a = 0.3·s + e, s ∈ {±1, ±2} twice each, e = ±0.1 once each per state (Σe = Σse = 0): OLS gives 0.3, 0 exactly;
    // RSS = 8·0.01, σ = √(0.08/6). Then 0.4 (s = 1, e = +0.1) held for 3 rows at s = 3.
    const rows: [number, number][] = [[-2, -0.5], [-1, -0.2], [1, 0.2], [2, 0.7], [-2, -0.7], [-1, -0.4], [2, 0.5], [1, 0.4], [3, 0.4], [3, 0.4], [3, 0.4]];
    const data = log(rows.map((r) => r[1]), 1, undefined, rows.map((r) => r[0]));
    const held = heldRowMask(data, none(data));
    expect(Array.from(held)).toEqual([0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1]);
    // Pooled: n = 11, Σs = 9, Σs² = 47, Σa = 1.2, Σsa = 6 + 3.6 = 9.6.
    const sBar = 9 / 11, aBar = 1.2 / 11, sss = 47 - 81 / 11, ssa = 9.6 - (9 * 1.2) / 11;
    const slope = ssa / sss, offset = aBar - slope * sBar, sigma = Math.sqrt(0.08 / 6);
    // RMS over the moving states (mean s = 0, mean s² = 2.5) of offset + (slope − 0.3)·s.
    const expected = Math.sqrt(offset ** 2 + (slope - 0.3) ** 2 * 2.5) / sigma;
    const effect = heldActionEffect(data, none(data), held);
    expect('effect' in effect && effect.effect).toBeCloseTo(expected, 10);
  });

  it('no held rows: no effect; too few rows to fit: a reason, not a crash', () => {
    const data = log([0.5, 0.3, 0.2, 0.6, 0.1, 0.45], 1);
    const effect = heldActionEffect(data, none(data), heldRowMask(data, none(data)));
    expect('effect' in effect && effect.effect).toBe(0);
    const tiny = log([0.5, 0.5, 0.5], 1, undefined, [1, 1, 1]);
    expect('reason' in heldActionEffect(tiny, none(tiny), heldRowMask(tiny, none(tiny)))).toBe(true);
  });

  it('collinear states or too few rows: the shared least-squares law refuses them, and the effect gives its reason, not a crash', () => {
    // Two states with s₂ = 2·s₁ exactly: the centred scatter is singular (behaviourModel.ts, leastSquaresLaw).
    const n = 80, s1 = Array.from({ length: n }, (_, i) => Math.sin(i)), states = s1.flatMap((v) => [v, 2 * v]);
    const actions = s1.map((v, i) => 0.3 * v + 0.05 * Math.cos(3 * i));
    for (let i = 40; i < 60; i++) actions[i] = actions[39]; // a held stretch of 20 rows
    const data: HeldActionData = { count: n, stateDim: 2, actionDim: 1, states, actions, episode: new Array(n).fill(0) };
    const effect = heldActionEffect(data, none(data), heldRowMask(data, none(data)));
    expect('reason' in effect && effect.reason).toMatch(/linear combination of the states before it/);
    // Two states, three moving rows (the logged extremes 0.9 and 0 and the row before the stretch): the law needs ds + 2 = 4.
    const few: HeldActionData = { count: 5, stateDim: 2, actionDim: 1, actions: [0.9, 0.5, 0.5, 0.5, 0], states: [0, 1, 1, 0, 2, 3, 3, 1, 4, 2], episode: [0, 0, 0, 0, 0] };
    expect(Array.from(heldRowMask(few, none(few)))).toEqual([0, 0, 1, 1, 0]);
    const fewEffect = heldActionEffect(few, none(few), heldRowMask(few, none(few)));
    expect('reason' in fewEffect && fewEffect.reason).toMatch(/needs at least 4 transitions, got 3/);
  });

  it('rows not held that follow the states with no dither at all: the effect is unbounded and the rule serious, never silent', () => {
    // a = 0.3·s exactly on the moving rows, then 60 rows held at one value: every row's law has dither only from the held rows.
    const n = 200, s = Array.from({ length: n }, (_, i) => Math.sin(i)), actions = s.map((v) => 0.3 * v);
    for (let i = 100; i < 160; i++) actions[i] = actions[99];
    const data = log(actions, 1, undefined, s);
    const held = heldRowMask(data, none(data)), stretches = heldStretches(held);
    expect(stretches.rows).toBe(60);
    const effect = heldActionEffect(data, none(data), held);
    expect('effect' in effect && effect.effect).toBe(Infinity);
    expect(heldSeverity(stretches, effect)).toBe('serious');
    expect(heldActionsFinding(stretches, effect)?.message).toContain('by more than any multiple (the rows not held follow the states with no dither at all) of its dither');
  });

  it('enough held rows whose pull cannot be read: a caution that says so, and no repair', () => {
    const n = 200, s1 = Array.from({ length: n }, (_, i) => Math.sin(i)), states = s1.flatMap((v) => [v, 2 * v]);
    const actions = s1.map((v, i) => 0.3 * v + 0.05 * Math.cos(3 * i));
    for (let i = 100; i < 160; i++) actions[i] = actions[99];
    const data: HeldActionData = { count: n, stateDim: 2, actionDim: 1, states, actions, episode: new Array(n).fill(0) };
    const held = heldRowMask(data, none(data)), stretches = heldStretches(held), effect = heldActionEffect(data, none(data), held);
    expect('reason' in effect).toBe(true);
    expect(heldSeverity(stretches, effect)).toBe('caution');
    expect(heldLawRepaired(stretches, effect)).toBe(false);
    expect(heldActionsFinding(stretches, effect)?.message).toMatch(/How far they pull the present controller’s law could not be read \(.*linear combination of the states before it.*\), so its law is fitted on every row/);
  });

  it('a repair the rule called for that could not be fitted says so, with the law fitted on every row', () => {
    const finding = heldActionsFinding({ rows: 1234, share: 0.1, stretches: 40, longest: 37 }, { effect: 0.7, action: 0 }, null, 'action 1 is constant in the log');
    expect(finding?.severity).toBe('serious');
    expect(finding?.message).toContain('could not be fitted on the rows not held (action 1 is constant in the log), so it is fitted on every row.');
  });

  it('the rule: nothing below the minimum of held rows, caution and serious by the effect', () => {
    const many = { rows: HELD_MIN_ROWS, share: 0.1, stretches: 3, longest: 30 };
    expect(heldSeverity({ ...many, rows: HELD_MIN_ROWS - 1 }, { effect: 3, action: 0 })).toBeNull();
    expect(heldSeverity(many, { effect: 0.09, action: 0 })).toBeNull();
    expect(heldSeverity(many, { effect: 0.1, action: 0 })).toBe('caution');
    expect(heldSeverity(many, { effect: 0.5, action: 0 })).toBe('serious');
    const finding = heldActionsFinding({ rows: 1234, share: 0.1, stretches: 40, longest: 37 }, { effect: 0.56, action: 0 });
    expect(finding?.message).toContain(`1,234 rows (${shareText(0.1)}) in 40 stretches of up to 37 rows repeat the action of the row before exactly, away from the actuator limits.`);
    expect(finding?.message).toContain('differs from the law the other rows follow by 0.56 of its dither');
    const repaired = heldActionsFinding({ rows: 1234, share: 0.1, stretches: 40, longest: 37 }, { effect: 0.2, action: 0 }, { rowsUsed: 8766, runs: { withHeld: 7, total: 25 } });
    expect(repaired?.severity).toBe('caution');
    expect(repaired?.message).toContain('so the present controller’s law is fitted on the 8,766 rows not held; fitted Q-evaluation still uses every row.');
    expect(repaired?.message).toContain('not applicable (actions held in 7 of 25 runs)');
    expect(repaired?.message).toContain('(serious from 0.5).');
    expect(finding?.message).not.toContain("'");
  });
});
