/**
 * The discount sweep checked against what the per-step values allow (pipeline/assessSweepCheck.ts).
 *
 * Quiet where every value is right: the tank-levels sample is a linear-quadratic plant, degree-2
 * features hold its Q exactly, and the closed form (src/core/lq.ts; Bertsekas, "Dynamic Programming
 * and Optimal Control", vol. 1, 4th ed., §4.1, the Lyapunov equation of a linear policy) gives J of
 * the tuned candidate at every swept discount: the sweep follows it, and no point is crossed.
 *
 * Loud where a value cannot be right: on the heating-loop sample every logged cost is positive, so
 * J of any policy whose costs stay in the logged range can only grow with the horizon, by at least
 * the least cost times 1/(1 − γ₂) − 1/(1 − γ₁) (the geometric series; common practice). The linear
 * fit of "PI with a 2 %/min rate limit" falls from 10.7 at γ 0.95 to 0.66 at γ 0.975: the check must
 * cross those points, say so in a serious warning, and leave their settings out of the ranking.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { closedFormPolicyCost, lqClosedForm } from '../../src/core/lq';
import { createGaussianPolicy } from '../../src/core/policy';
import { possibleChange } from '../../src/core/diagnostics/possibleChange';
import { assessProject } from '../../src/pipeline/assessProject';
import { openProject } from '../../src/pipeline/openProject';
import { SWEEP_CHECK_TOPIC } from '../../src/pipeline/assessSweepCheck';
import { candidateWork, type AssessmentContext } from '../../src/pipeline/assessCandidate';
import { sensitivity } from '../../src/pipeline/assessSensitivity';
import { sampleRun } from '../support/sampleRun';
import { startRun } from '../../src/pipeline/projectRun';
import { diagnosticsSection } from '../../src/pipeline/report/reportEvidence';
import type { ReportInput } from '../../src/pipeline/report/reportInput';
import { tankOperatingPoint, tankPlant, tankTunedPolicy } from '../../sample-projects/tank-levels/simulate';

async function assessSample(name: string) {
  const folder = join(__dirname, '..', '..', 'sample-projects', name);
  const opened = await openProject(await readFile(join(folder, `${name}.spcritic`), 'utf8'), `${name}.spcritic`, async (p) => new Uint8Array(await readFile(join(folder, p))));
  if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
  const result = await assessProject({ project: opened.value.project, dataset: opened.value.dataset, settings: { resamples: 200, level: 0.9, seed: 1, sensitivity: true } });
  if (!result.ok) throw new Error(result.problems.map((p) => p.message).join('\n'));
  return { assessment: result.value, dataset: opened.value.dataset };
}

type Plan = AssessmentContext['plan'];

/** The heating-loop sample's sweep on a plan edited as the test says (invented edits), the run disposed after. */
async function sweepHeating(edit: (plan: Plan) => Plan, check: { level: number; seed: number; resamples: number }, only?: number) {
  const { run } = await sampleRun('heating-loop');
  try {
    const context: AssessmentContext = { plan: edit(run.plan), presentController: null, presentControllerModel: null, presentControllerReason: '' };
    const models = only === undefined ? run.models : run.models.slice(0, only);
    return { ...(await sensitivity(context, models.map((m) => candidateWork(context, m)), -1, check)), names: run.models.map((m) => m.name) };
  } finally {
    run.dispose();
  }
}

describe('the discount sweep against what the per-step values allow', () => {
  it('crosses nothing on a linear-quadratic plant, where the sweep follows the closed form', async () => {
    const { assessment, dataset } = await assessSample('tank-levels');
    const curve = assessment.sensitivity!.curves.find((c) => c.parameter === 'discount')!;
    // The check ran (a sweep left unchecked would cross nothing either): no note says it was not checked.
    expect(assessment.sensitivity!.notes.filter((n) => /not checked/.test(n))).toEqual([]);
    // Every swept point and every resample reached by the iteration (the sweep's rule, reachedSolve): no gap, no pair checked only in part.
    expect(assessment.sensitivity!.notes.filter((n) => /checked without|checked only in part/.test(n))).toEqual([]);
    expect(curve.leftOut).toBeUndefined();
    expect(curve.series.every((s) => !s.beyondPossible)).toBe(true);
    expect(assessment.candidates.flatMap((c) => c.warnings).filter((w) => w.topic === SWEEP_CHECK_TOPIC)).toEqual([]);
    const tuned = curve.series.find((s) => s.name === assessment.candidates[0].name)!, policy = createGaussianPolicy(tankTunedPolicy, 2);
    const exact = curve.settings.map((g) => closedFormPolicyCost(lqClosedForm(tankPlant, tankOperatingPoint, policy, g), dataset.startStates, dataset.episodeCount));
    const errors = tuned.values.map((v, i) => v! / exact[i] - 1);
    console.log(`tank-levels, tuned candidate over γ ${curve.settings.map((g) => g.toFixed(4)).join(', ')}: J ${tuned.values.map((v) => v!.toFixed(3)).join(', ')}; closed form ${exact.map((v) => v.toFixed(3)).join(', ')}`);
    // Within the sampling error of a J from this log (its bootstrap s.e. is a few % of J here); measured 0.9–1.3 % off.
    for (const e of errors) expect(Math.abs(e)).toBeLessThan(0.03);
  }, 600_000);

  it('crosses the values that cannot be right on the heating loop, with a serious warning and the ranking verdict without them', async () => {
    const { assessment, dataset } = await assessSample('heating-loop');
    const curve = assessment.sensitivity!.curves.find((c) => c.parameter === 'discount')!, name = 'PI with a 2 %/min rate limit';
    const series = curve.series.find((s) => s.name === name)!;
    // The bound itself, on the logged costs (rewards are costs negated): every cost is positive, so J of the cost can only grow with γ.
    let least = Infinity;
    for (const r of dataset.rewards) least = Math.min(least, -r);
    expect(least).toBeGreaterThan(0);
    const v = series.values as number[], rise = possibleChange(least, Infinity, curve.settings[2], curve.settings[3]).lower;
    expect(rise).toBeGreaterThan(0);
    expect(v[3] - v[2]).toBeLessThan(rise); // the fit's fall from γ 0.95 to 0.966, against a rise of at least `rise`
    expect(series.beyondPossible).toEqual([false, false, false, true, true]);
    expect(curve.leftOut).toEqual([3, 4]);
    const warnings = assessment.candidates.find((c) => c.name === name)!.warnings.filter((w) => w.topic === SWEEP_CHECK_TOPIC);
    expect(warnings).toHaveLength(1);
    expect(warnings[0].severity).toBe('serious');
    // The two J are written at the change's interval's precision, one precision for numbers read together (JCGM 100 §7.2.6,
    // common practice): "from 10.69 … to 7.14 …: the change, −3.56 ([−6.50, −2.57])", not "to 7.136" beside "−3.56".
    expect(warnings[0].message).toMatch(/^J cannot go from 10\.69 at γ 0\.95 to 7\.14 at γ 0\.966: the change, -3\.\d\d \(90\u00a0% interval \[-\d\.\d\d, -\d\.\d\d\]/);
    expect(warnings[0].message).toMatch(/J can change only by no less than 0\./);
    // The resamples said are those the pair's interval rests on (a resample without a value at either discount is not one of them).
    const said = Number(/ on (\d+) resamples of the runs/.exec(warnings[0].message)![1]);
    expect(said).toBeGreaterThanOrEqual(100);
    expect(said).toBeLessThanOrEqual(200);
    // In the report the warning's minus is the tables' (U+2212): "the change, -3.56 (… [-6.50, -2.57] …)" was written with the terminal's.
    const report = diagnosticsSection({ assessment, assessmentProblems: [] } as unknown as ReportInput).html;
    const written = /J cannot go from [^<]*/.exec(report)![0];
    expect(written).toMatch(/the change, \u2212\d/);
    expect(written).not.toMatch(/(^|[\s[(,=])-\d/);
    // The other candidates' sweeps are consistent with their costs: nothing crossed, nothing said.
    for (const c of assessment.candidates.filter((x) => x.name !== name)) expect(c.warnings.filter((w) => w.topic === SWEEP_CHECK_TOPIC)).toEqual([]);
  }, 600_000);

  it('says why a sweep is not checked when the project asks for fewer resamples than the check needs', async () => {
    const { sensitivity: swept, warnings } = await sweepHeating((plan) => plan, { level: 0.9, seed: 1, resamples: 50 });
    expect(warnings.flat()).toEqual([]);
    // It said "re-solves a linear fit on 200 resamples … needs exact resampling within its budget", none of which was the reason.
    expect(swept.notes[0]).toBe('The discount sweep of the candidates is not checked against what the costs allow: the check needs at least 100 resamples of the runs and the project asks for 50.');
  }, 600_000);

  it('says so when a pair of discounts is left unchecked for want of resamples with a J at both', async () => {
    // Every start state mapped to run 0 (invented): a resample holds a start only when it draws that run, about 1 − (39/40)^40 ≈ 64 % of them,
    // so of 120 resamples about 77 give a J at all — fewer than the 100 a pair needs. Before, nothing said the sweep went unchecked.
    const toRunZero = (plan: Plan) => ({ ...plan, starts: { ...plan.starts, followEpisodes: true, episode: new Int32Array(plan.starts.count) } });
    const { sensitivity: swept, names } = await sweepHeating(toRunZero, { level: 0.9, seed: 1, resamples: 120 }, 1);
    expect(swept.notes[0]).toBe(`The discount sweep of “${names[0]}” is checked only in part: for 10 pairs of swept discounts fewer than 100 of the 120 resamples of the runs gave a J at both (the fitted Q-evaluation iteration did not reach it, or a resample without start states), and those pairs are not checked.`);
  }, 600_000);

  it('names a declared column’s bounds as the project’s word, not as what holds whatever the plant does', async () => {
    // Invented: the cost column declared within [0, 11] (every logged cost is in [0.018, 10.58]); J's fall from 10.69 still fails against it.
    const declared = (plan: Plan) => ({ ...plan, data: { ...plan.data, rewardBounds: { lower: -11, upper: 0, from: 'declaration' as const } } });
    const said = (await sweepHeating(declared, { level: 0.9, seed: 1, resamples: 200 })).warnings.flat().map((w) => w.message);
    expect(said).toHaveLength(1);
    expect(said[0]).toContain('since the project declares every step’s cost never below 0 and never above 11, so between these two discounts J can change only by between');
    expect(said[0]).not.toContain('whatever the plant does');
  }, 600_000);

  it('holds J to the definition’s bounds only: with none declared it checks nothing and says how to declare one', async () => {
    // The logged range is no bound for a candidate that takes the plant elsewhere: on the battery's blending-tank hold-out it crossed
    // four right values of a candidate that settles where every step costs more than any logged one (test/battery/README.md).
    const check = { level: 0.9, seed: 1, resamples: 200 };
    const { sensitivity: swept, warnings } = await sweepHeating((plan) => ({ ...plan, data: { ...plan.data, rewardBounds: undefined } }), check);
    expect(warnings.flat()).toEqual([]);
    expect(swept.curves[0].series.every((x) => !x.beyondPossible)).toBe(true);
    expect(swept.notes[0]).toMatch(/^The discount sweep is not checked against what the costs allow: .* this project’s cost has none\. Declare them/);
    // One end declared is enough for a fall: the sample's own declaration (never below 0) crosses the rate-limited PI's fall.
    const own = await sweepHeating((plan) => plan, check);
    expect(own.warnings.flat().map((w) => w.message)[0]).toContain('since the project declares every step’s cost never below 0, so between these two discounts J can change only by no less than 0.');
  }, 600_000);
});

/**
 * The same check on a REWARD project, where J is to be maximised and the allowed change keeps its sign in
 * the user's sense: per-step rewards within [lo, hi] hold J(γ) = Σ γ^t m_t within lo/(1 − γ) .. hi/(1 − γ),
 * and the change from γ₁ to γ₂ > γ₁ within [lo·D, hi·D], D = 1/(1 − γ₂) − 1/(1 − γ₁) (the geometric
 * sum; common practice). Positive rewards let J only rise with the horizon; negative ones only fall.
 *
 * The heating-loop sample's log read as a reward (invented edits of its project): the cost column taken as
 * the reward itself (every value in the file is in [0.018, 14.26]), or the reward formula −max(cost, 0). The
 * linear fit is linear in the rewards, so the rate-limited PI's J is ±10.69 at γ 0.95 and ±7.14 at the
 * next swept discount, γ₂ = 0.95^(1/1.5) = 0.966383 (assessSensitivity.ts: γ^(1/f), f = 1.5). By hand:
 * 1/(1 − γ₂) = 1/0.0336175 = 29.7464, 1/(1 − 0.95) = 20, so D = 9.7464.
 *   - reward column declared within [0.01, 15]: the change may lie in [0.01·D, 15·D] = [0.097464, 146.197],
    said rounded outward at four digits as 0.09746 and 146.2;
 *     a fall of 3.56 is impossible, the other candidates' rises (to their larger J at longer horizons) are not.
 *   - the same column declared within [−1, 15]: the allowed change starts at −1·D = −9.746, and the fall of
 *     3.56 (interval about [−6.5, −2.6]) lies inside it: no warning for that pair.
 *   - reward −max(cost, 0), never above 0 by its formula: the change may be at most 0·D = 0; the PI's J
 *     rises from −10.69 to −7.14, which is impossible; the others fall, which is allowed.
 */
describe('the discount sweep check on a reward project: the allowed change in the reward’s own sense', () => {
  type Reward = Record<string, unknown>;
  const check = { level: 0.9, seed: 1, resamples: 200 };

  /** The heating-loop sample with its reward rule replaced, planned, fitted and swept; the run disposed after. */
  async function sweepAsReward(reward: Reward) {
    const folder = join(__dirname, '..', '..', 'sample-projects', 'heating-loop');
    const doc = JSON.parse(await readFile(join(folder, 'heating-loop.spcritic'), 'utf8')) as { columns: { reward: Reward } };
    doc.columns.reward = reward;
    const opened = await openProject(JSON.stringify(doc), 'heating-loop.spcritic', async (p) => new Uint8Array(await readFile(join(folder, p))));
    if (!opened.ok) throw new Error(opened.problems.map((p) => p.message).join('\n'));
    const started = await startRun(opened.value.project, opened.value.dataset);
    if (!started.ok) throw new Error(started.problems.map((p) => p.message).join('\n'));
    const run = started.value;
    try {
      expect(run.plan.sense).toBe('reward');
      const context: AssessmentContext = { plan: run.plan, presentController: null, presentControllerModel: null, presentControllerReason: '' };
      const swept = await sensitivity(context, run.models.map((m) => candidateWork(context, m)), 1, check);
      const curve = swept.sensitivity.curves.find((c) => c.parameter === 'discount')!;
      const names = run.models.map((m) => m.name);
      return { curve, notes: swept.sensitivity.notes, said: (name: string) => swept.warnings[names.indexOf(name)].filter((w) => w.topic === SWEEP_CHECK_TOPIC), names };
    } finally {
      run.dispose();
    }
  }
  const limited = 'PI with a 2 %/min rate limit';

  it('positive rewards: a fall of J with the horizon is crossed and said, the rises are not', async () => {
    const { curve, notes, said, names } = await sweepAsReward({ kind: 'column', column: 'cost', sense: 'reward', atLeast: 0.01, atMost: 15 });
    expect(notes.filter((n) => /not checked/.test(n))).toEqual([]);
    expect(curve.settings[3]).toBeCloseTo(0.966383, 6);
    const v = curve.series.find((s) => s.name === limited)!.values as number[];
    expect(v[2]).toBeCloseTo(10.69, 2); // the reward's J in its own sense: positive, and falling
    expect(v[3]).toBeCloseTo(7.14, 2);
    const warnings = said(limited);
    expect(warnings).toHaveLength(1);
    expect(warnings[0].severity).toBe('serious');
    expect(warnings[0].message).toMatch(/^J cannot go from 10\.69 at γ 0\.95 to 7\.14 at γ 0\.966: the change, -3\.\d\d \(90\u00a0% interval \[-\d\.\d\d, -\d\.\d\d\]/);
    expect(warnings[0].message).toContain('since the project declares every step’s reward never below 0.01 and never above 15, so between these two discounts J can change only by between 0.09746 and 146.2.');
    for (const name of names.filter((n) => n !== limited)) {
      const s = curve.series.find((x) => x.name === name)!.values as number[];
      for (let k = 1; k < s.length; k++) expect(s[k]).toBeGreaterThan(s[k - 1]); // rises, the possible way for positive rewards
      expect(said(name)).toEqual([]);
    }
  }, 600_000);

  it('a lower bound of −1 allows the same fall between γ 0.95 and 0.966: nothing crossed, nothing said', async () => {
    const { curve, notes, said } = await sweepAsReward({ kind: 'column', column: 'cost', sense: 'reward', atLeast: -1, atMost: 15 });
    expect(notes.filter((n) => /not checked/.test(n))).toEqual([]); // checked, and passed
    const v = curve.series.find((s) => s.name === limited)!.values as number[];
    expect(v[3] - v[2]).toBeGreaterThan(-9.746); // the fall, inside the allowed [−9.746, 146.2]
    expect(v[3] - v[2]).toBeLessThan(0);
    expect(curve.series.find((s) => s.name === limited)!.beyondPossible).toBeUndefined();
    expect(said(limited)).toEqual([]);
  }, 600_000);

  it('rewards never above 0 by their formula: a rise of J is crossed and said, the falls are not', async () => {
    const { curve, said, names } = await sweepAsReward({ kind: 'expression', expression: '-max(cost, 0)', sense: 'reward' });
    const v = curve.series.find((s) => s.name === limited)!.values as number[];
    expect(v[2]).toBeCloseTo(-10.69, 2);
    expect(v[3]).toBeCloseTo(-7.14, 2);
    const warnings = said(limited);
    expect(warnings).toHaveLength(1);
    expect(warnings[0].severity).toBe('serious');
    expect(warnings[0].message).toMatch(/^J cannot go from -10\.69 at γ 0\.95 to -7\.14 at γ 0\.966: the change, 3\.\d\d \(90\u00a0% interval \[\d\.\d\d, \d\.\d\d\]/);
    expect(warnings[0].message).toContain('since the reward formula keeps every step’s reward, whatever the plant does, never above 0, so between these two discounts J can change only by no more than 0.');
    for (const name of names.filter((n) => n !== limited)) {
      const s = curve.series.find((x) => x.name === name)!.values as number[];
      for (let k = 1; k < s.length; k++) expect(s[k]).toBeLessThan(s[k - 1]); // falls, the possible way for rewards never above 0
      expect(said(name)).toEqual([]);
    }
  }, 600_000);
});
