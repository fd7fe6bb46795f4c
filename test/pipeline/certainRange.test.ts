/**
 * A reward formula's own bounds (src/data/expressionBounds.ts) turned into the range of J no policy
 * can leave whatever it does, J ∈ [r_lo/(1 − γ), r_hi/(1 − γ)] (the geometric series; common practice),
 * and what the assessment does with it: a range to report cut there with a sentence saying so, and J
 * past it named in words stronger than the logged-range finding. A confidence set cut to a set that
 * holds the truth for sure keeps its coverage, P(J ∈ C ∩ R) = P(J ∈ C) (common practice).
 * The numbers are invented; the sample is the historian export's formula (sample-projects/heating-historian).
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { certainValues } from '../../src/core/diagnostics/possibleValues';
import { certainFinding, cutToCertain, impossibleValue } from '../../src/pipeline/assessPossible';
import type { IntervalEstimate } from '../../src/pipeline/assessment';
import type { CandidateModel } from '../../src/pipeline/model/candidateModel';
import { openProject } from '../../src/pipeline/openProject';
import type { EvaluationPlan } from '../../src/pipeline/plan/evaluationPlan';

const plan = (sense: 'cost' | 'reward', bounds: [number, number] | undefined, discount = 0.95, absorbingEnds = 0, from: 'formula' | 'declaration' = 'formula') =>
  ({ sense, sign: sense === 'cost' ? -1 : 1, discount, absorbingEnds, data: { rewardBounds: bounds && { lower: bounds[0], upper: bounds[1], from } } }) as unknown as EvaluationPlan;
const rb = (lower: number, upper: number) => ({ lower, upper, from: 'formula' as const });

describe('the range of J a reward formula allows whatever the plant does', () => {
  it('is the geometric bound of the per-step bounds, with a run that may end paying at least one step', () => {
    expect(certainValues(rb(-Infinity, -2), 0.9)).toEqual({ lower: -Infinity, upper: expect.closeTo(-20, 12) });
    expect(certainValues(rb(-Infinity, -2), 0.9, true)).toEqual({ lower: -Infinity, upper: -2 }); // max(−2, −20)
    expect(certainValues(rb(1, 3), 0.5)).toEqual({ lower: 2, upper: 6 });
    expect(certainValues(undefined, 0.9)).toBeNull();
  });

  it('is read from the historian sample\'s cost formula at import: cost per step never below −0.1/19', async () => {
    const folder = join(__dirname, '..', '..', 'sample-projects', 'heating-historian');
    const opened = await openProject(await readFile(join(folder, 'heating-historian.spcritic'), 'utf8'), 'heating-historian.spcritic', async (p) => new Uint8Array(await readFile(join(folder, p))));
    if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
    const bounds = opened.value.dataset.rewardBounds!;
    expect(bounds.lower).toBe(-Infinity); // a cost with no ceiling
    expect(bounds.upper).toBeCloseTo(0.1 / 19, 10); // reward sense: the cost's floor −0.1/19, negated
    expect(bounds.from).toBe('formula');
    for (const r of opened.value.dataset.rewards) expect(r).toBeLessThanOrEqual(bounds.upper);
  });
});

describe('a range to report cut to what any policy can have', () => {
  it('cuts a cost range below 0 at 0 when the cost formula is never negative, and says so', () => {
    const cut = cutToCertain(plan('cost', [-Infinity, 0]), [-8.04, 14.1]);
    expect(cut.range).toEqual([0, 14.1]);
    expect(cut.note).toBe('The range to report is cut below at 0 (it was [-8.0, 14.1]): the cost formula is never below 0 on any row, whatever the plant does, so no policy’s discounted cost lies beyond. The cut keeps the range’s coverage, since the true value lies inside it for sure.');
  });

  it('cuts at the discounted floor, −(0.1/19)/(1 − 0.95) for the heating formula at γ 0.95', () => {
    const cut = cutToCertain(plan('cost', [-Infinity, 0.1 / 19]), [-8.04, 14.1]);
    expect(cut.range![0]).toBeCloseTo(-0.1 / 19 / 0.05, 12);
    expect(cut.note).toContain('cut below at -0.1053');
    expect(cut.note).toContain('never below -0.005264'); // −0.0052631… rounded outward, so the sentence holds on every row
  });

  it('names a declared bound of a cost column as the project\'s declaration', () => {
    const cut = cutToCertain(plan('cost', [-Infinity, 0], 0.95, 0, 'declaration'), [-8.04, 14.1]);
    expect(cut.note).toContain('the cost column is, as the project declares, never below 0 on any row');
  });

  it('cuts a reward range above the formula\'s ceiling, and leaves a range inside or wholly outside alone', () => {
    const reward = plan('reward', [-Infinity, 0]);
    expect(cutToCertain(reward, [-30, 2.5])).toMatchObject({ range: [-30, 0], note: expect.stringContaining('cut above at 0') });
    expect(cutToCertain(reward, [-30, -2])).toEqual({ range: [-30, -2], note: null });
    expect(cutToCertain(reward, [1, 2])).toEqual({ range: [1, 2], note: null }); // impossibleValue names it
    expect(cutToCertain(plan('reward', undefined), [-30, 2.5])).toEqual({ range: [-30, 2.5], note: null });
    expect(cutToCertain(reward, null)).toEqual({ range: null, note: null });
  });
});

describe('a cut never leaves J outside its own range to report', () => {
  it('stops at J where J lies past the certain end by less than the impossible-value slack, and says so', () => {
    // A cost formula never below 0; J = −0.5 is within the logged-range rule's slack, so no finding
    // names it, and a cut at 0 would print J = −0.5 beside a range [0, 14.1] that excludes it.
    // Logged costs 0.1 to 2 per step at γ 0.95: reward-sense range [−40, −2], slack 1 % of 38 = 0.38.
    const logged = { lower: -40, upper: -2 };
    const cut = cutToCertain(plan('cost', [-Infinity, 0]), [-8.04, 14.1], -0.2, logged);
    expect(cut.range).toEqual([-0.2, 14.1]);
    expect(cut.note).toContain('cut below at -0.2');
    expect(cut.note).toContain('so it stops at J = -0.2 to keep the estimate inside its range');
    // J inside the certain range: the cut is the plain one.
    expect(cutToCertain(plan('cost', [-Infinity, 0]), [-8.04, 14.1], 3, logged).range).toEqual([0, 14.1]);
    // A reward ceiling of 0 and J = 0.2 above it: the range keeps J.
    expect(cutToCertain(plan('reward', [-Infinity, 0]), [-30, 2.5], 0.2, logged).range).toEqual([-30, 0.2]);
  });

  it('keeps J inside the range to report whenever the uncut range held it and no finding names J (random ranges, both senses)', () => {
    // The property asked of the cut (ours): it never hides the estimate a reader sees beside it.
    const logged = { lower: -40, upper: -2 };
    let seed = 7;
    const next = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
    for (let k = 0; k < 2000; k++) {
      const sense = k % 2 ? 'cost' : 'reward', p = plan(sense, k % 4 < 2 ? [-Infinity, 0] : [0, Infinity]);
      const j = (next() - 0.5) * 4, lo = j - next() * 20, hi = j + next() * 20;
      const flagged = impossibleValue(p, logged, { fit: { policyValue: (sense === 'cost' ? -1 : 1) * j } } as unknown as CandidateModel, { percentile: [lo, hi], standardError: null } as unknown as IntervalEstimate)
        .some((w) => w.message.includes('any policy can have'));
      const cut = cutToCertain(p, [lo, hi], j, logged).range!;
      if (!flagged) {
        expect(cut[0]).toBeLessThanOrEqual(j);
        expect(cut[1]).toBeGreaterThanOrEqual(j);
      }
    }
  });

  it('cuts at the end where J lies past it by more than the slack, which certainFinding names, and does not say J was kept', () => {
    const logged = { lower: -40, upper: -2 };
    const cut = cutToCertain(plan('cost', [-Infinity, 0]), [-8.04, 14.1], -0.5, logged);
    expect(cut.range).toEqual([0, 14.1]);
    expect(cut.note).not.toContain('stops at J');
    expect(impossibleValue(plan('cost', [-Infinity, 0]), logged, { fit: { policyValue: 0.5 } } as unknown as CandidateModel, { percentile: [-3.1, 2.0], standardError: null } as unknown as IntervalEstimate)[0].message).toContain('do not use this value');
  });
});

describe('J past what any policy can have', () => {
  const model = (j: number) => ({ fit: { policyValue: j } }) as unknown as CandidateModel;
  const estimate = (interval: [number, number]) => ({ percentile: interval, standardError: null }) as unknown as IntervalEstimate;
  const logged = { lower: -40, upper: -2 }; // reward sense: logged costs 0.1 to 2 per step at γ 0.95

  it('is named in words that say no policy can have it, before the logged-range finding', () => {
    const p = plan('cost', [-Infinity, 0]);
    const [w] = impossibleValue(p, logged, model(0.52), estimate([-3.1, 2.0]));
    expect(w.severity).toBe('serious');
    expect(w.message).toBe('J = -0.52 lies below 0, the least discounted cost any policy can have whatever it does (the cost formula is never below 0 on any row). The fit extrapolates far from the logs: do not use this value.');
    expect(certainFinding(p, { lower: -Infinity, upper: 0 }, 0.52, [-3.1, 2.0]).message).toBe(w.message);
  });

  it('leaves J within the slack to the logged-range rule (1 % of the logged range\'s width)', () => {
    const p = plan('cost', [-Infinity, 0]);
    expect(impossibleValue(p, logged, model(0.2), estimate([-1, 0.5]))[0]?.message ?? '').not.toContain('any policy can have');
  });
});
