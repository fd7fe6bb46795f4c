/**
 * The discount sweep checked against what the rewards allow (core/diagnostics/possibleChange.ts):
 * J of one policy can move between two discounts only by what the per-step rewards can add or take
 * away over the longer horizon. Each candidate's J is solved again at every swept discount on the
 * first SWEEP_CHECK_RESAMPLES of the assessment's own resamples of the runs (the statistics of a
 * resample do not depend on γ, so each is formed once), and every pair of discounts gets a paired
 * percentile interval of its change. A pair whose interval shares no point with the possible change
 * says that the two values cannot both be right (at the interval's level; common practice):
 *   - the fewest points that account for every such pair are crossed (core/diagnostics/possibleChange.ts
 *     fewestWrong: away from the project's own discount where as few will do), and the ranking
 *     verdict leaves their settings out (sweepRanking.ts);
 *   - a pair holding the project's own discount is a SERIOUS warning on the candidate (its reported
 *     J is one of the two), any other pair a CAUTION (the fit breaks down at another horizon, on the
 *     same kind of fixed point as the reported J).
 * The rewards' range is the definition's own bounds, each end on its own (a formula's, or a column's
 * as the project declares them): nothing can pass them. An end the definition leaves open is
 * unbounded, and a project with no bound is not checked — never the logged range, which a right J of a
 * candidate that takes the plant to costlier steps breaks (rewardRange).
 * Only a linear fit with exact resampling is checked, within SWEEP_CHECK_BUDGET and with at least
 * SWEEP_CHECK_MIN_PAIRED resamples; the others say so, with the reason. The budget counts what runs, by
 * one cost model (core/bootstrap/solveWork.ts): a candidate is skipped after its first block of
 * resamples where what that block ran, carried to all of them, exceeds the budget (pilotSaysOver), and
 * stopped, unchecked, wherever what its resamples ran reaches the budget (a resample that does not
 * contract iterates up to maxIterations, which no estimate foresees). The pilot replaced an estimate from
 * the full data's own solves, which foresaw no resample's extra iterations (test/battery/README.md, "The
 * sweep check's budget").
 */
import { episodeMultiplicities } from '../core/bootstrap/episodeMultiplicities';
import { linearFqeReplicateDiscounts, type LinearReplicate, type LinearReplicateSetup } from '../core/bootstrap/linearFqeReplicate';
import { bootstrapInterval } from '../core/bootstrap/bootstrapInterval';
import { overBudget, type SolveTally } from '../core/bootstrap/solveWork';
import { loggedRewardRange, POSSIBLE_SLACK } from '../core/diagnostics/possibleValues';
import { changeIntervalImpossible, fewestWrong, possibleChange, type ImpossibleChange, type PossibleChange } from '../core/diagnostics/possibleChange';
import { throwIfCancelled } from '../core/fqe/cancellation';
import { discountText } from '../core/horizonText';
import { SWEEP_CHECK_BUDGET, SWEEP_CHECK_MIN_PAIRED, SWEEP_CHECK_RESAMPLES } from '../core/limits';
import { RESAMPLE_BLOCK } from '../core/offPolicy/perDecisionResamples';
import { ASCII_MINUS, intervalAtPrecision, valueAtPrecision } from '../figures/parts/uncertainNumber';
import { boundText } from '../figures/parts/boundText';
import type { AssessmentWarning } from './assessment';
import { linearSolveSettings, type AssessmentContext, type CandidateWork } from './assessCandidate';
import type { EvaluationPlan } from './plan/evaluationPlan';
import { shareText } from '../core/shareText';


export interface SweepCheck {
  /** Per candidate (works' order): the points that cannot be right, and the warnings that say why. */
  marks: boolean[][];
  warnings: AssessmentWarning[][];
  /** Why some or all candidates were not checked; null when every one was. */
  note: string | null;
  /** Per candidate: the work its check ran, multiply-adds (core/bootstrap/solveWork.ts); 0 where none ran. */
  work: number[];
}

export interface SweepCheckSettings {
  level: number;
  seed: number;
  resamples: number;
  /** Most work the check may run per candidate, multiply-adds (solveWork.ts); SWEEP_CHECK_BUDGET unless a bench or test lifts it. */
  budget?: number;
}

export const SWEEP_CHECK_TOPIC = 'discountSweep';

/**
 * points[c][k]: candidate c's full-data solve at settings[k] by the sweep's rule (reachedSolve,
 * core/bootstrap/linearFqeReplicate.ts; J in the reward sense). The resamples are judged by the same
 * rule, started from the full data's weights at each discount; a discount whose full-data point has no
 * J takes no part in the check, and the note says so (gapsNote).
 */
export function checkDiscountSweep(
  context: AssessmentContext, works: readonly CandidateWork[], settings: readonly number[], projectIndex: number,
  points: readonly (readonly LinearReplicate[])[], check: SweepCheckSettings,
): SweepCheck {
  const { plan } = context, e = plan.episodes.episodes, b = Math.min(SWEEP_CHECK_RESAMPLES, check.resamples), budget = check.budget ?? SWEEP_CHECK_BUDGET;
  const marks = works.map(() => settings.map(() => false)), warnings: AssessmentWarning[][] = works.map(() => []);
  const bounds = rewardRange(plan), skipped: { name: string; reason: SkipReason }[] = [], partly: { name: string; pairs: number }[] = [];
  const gaps: { name: string; at: number[] }[] = [], work = works.map(() => 0);
  if (bounds === null) return { marks, warnings, note: unboundedNote(plan), work };
  const draws = Array.from({ length: b }, (_, r) => episodeMultiplicities(e, check.seed, r));
  works.forEach((w, c) => {
    throwIfCancelled(context.cancel);
    const linear = w.model.linear;
    if (!linear || linear.resampling.kind !== 'exact') return void skipped.push({ name: w.model.name, reason: 'linearised' });
    if (b < SWEEP_CHECK_MIN_PAIRED) return void skipped.push({ name: w.model.name, reason: 'resamples' });
    const setup: LinearReplicateSetup = {
      ...linearSolveSettings(plan, w.model), sums: linear.resampling.sums, startFeatures: linear.startFeatures,
      startsFollowEpisodes: plan.starts.followEpisodes, startEpisode: plan.starts.episode,
    };
    const own = points[c], values = own.map((p) => (p.status === 'converged' ? p.policyValue : null));
    const starts = own.map((p, k) => (values[k] === null ? null : p.weights));
    const missing = settings.flatMap((_, k) => (values[k] === null ? [k] : []));
    if (missing.length) gaps.push({ name: w.model.name, at: missing });
    const scratch = Array.from({ length: RESAMPLE_BLOCK }, () => new Float64Array(setup.sums.stride)), replicates: (number | null)[][] = [];
    // What runs is counted as it runs: a resample that does not contract may iterate to maxIterations, which no estimate foresees.
    const tally: SolveTally = { units: 0, limit: budget };
    let pilotOver = false;
    for (let first = 0; first < b && !overBudget(tally) && !pilotOver; first += RESAMPLE_BLOCK) {
      replicates.push(...linearFqeReplicateDiscounts(setup, draws.slice(first, first + RESAMPLE_BLOCK), scratch, settings, starts, tally));
      pilotOver = first === 0 && pilotSaysOver(tally.units, Math.min(RESAMPLE_BLOCK, b), b, budget);
    }
    work[c] = tally.units;
    if (overBudget(tally) || pilotOver) return void skipped.push({ name: w.model.name, reason: 'budget' });
    const found: Failing[] = [];
    let thin = 0;
    for (let i = 0; i < settings.length; i++) {
      for (let j = i + 1; j < settings.length; j++) {
        const vi = values[i], vj = values[j];
        if (vi === null || vj === null) continue; // a point without a J takes no part (gapsNote says so)
        const changes = replicates.flatMap((r) => (r[i] === null || r[j] === null ? [] : [r[j]! - r[i]!]));
        if (changes.length < SWEEP_CHECK_MIN_PAIRED) {
          thin++; // said in the note: a pair left unchecked must not read as one that passed
          continue;
        }
        const interval = bootstrapInterval(vj - vi, changes, check.level).percentile, range = possibleChange(bounds.lower, bounds.upper, settings[i], settings[j], plan.absorbingEnds > 0);
        const slack = POSSIBLE_SLACK * bounds.loggedWidth * Math.abs(1 / (1 - settings[j]) - 1 / (1 - settings[i]));
        if (changeIntervalImpossible(interval[0], interval[1], range, slack)) found.push({ pair: { earlier: i, later: j }, change: vj - vi, interval: [interval[0], interval[1]], range, paired: changes.length });
      }
    }
    if (thin) partly.push({ name: w.model.name, pairs: thin });
    marks[c] = fewestWrong(found.map((f) => f.pair), settings.length, projectIndex);
    const holding = found.filter((f) => f.pair.earlier === projectIndex || f.pair.later === projectIndex);
    // The pair said is the one the reader most needs: one holding the project's own J, else any; of those the nearest to the project's discount.
    const said = (holding.length ? holding : found).reduce<Failing | null>((x, y) => (x === null || near(y.pair, projectIndex) < near(x.pair, projectIndex) ? y : x), null);
    if (said) warnings[c].push(sweepWarning(plan, settings, values, said, holding.length > 0, found.length, check.level, bounds));
  });
  const notes = [
    ...(skipped.length ? [notCheckedNote(plan, skipped, works.length, b)] : []), ...gaps.map((x) => gapsNote(x.name, x.at, settings)), ...partly.map((x) => partlyCheckedNote(x.name, x.pairs, b)),
  ];
  return { marks, warnings, note: notes.length ? notes.join(' ') : null, work };
}

/**
 * The pilot: true when the `done` resamples of the first block ran `units`, carried to all b, exceed the
 * budget — so a check that cannot finish stops after one block, not at the budget. Ours; measured on the
 * battery beside the full data's own solves, which it matches where the resamples contract and exceeds
 * where one iterates to its limit (test/battery/README.md, "The sweep check's budget").
 */
function pilotSaysOver(units: number, done: number, b: number, budget: number): boolean {
  return (units * b) / done > budget;
}

/** How far a pair reaches from the project's discount: the farther of its two settings (a pair holding the project's own and its neighbour is nearest). */
function near(pair: ImpossibleChange, projectIndex: number): number {
  return Math.max(Math.abs(pair.earlier - projectIndex), Math.abs(pair.later - projectIndex));
}


/**
 * The per-step reward range the check holds a candidate to (reward sense): the definition's own bounds
 * (TransitionSet.rewardBounds: a formula's, or the project's declaration for a column), each end on its
 * own — an end the definition leaves open is unbounded. Never the logged range: a candidate that takes
 * the plant where steps cost more than any logged one changes with γ by more than the logged range
 * allows, and is right (the battery's blending-tank hold-out, `warmer`: J within 1 % of the truth at every
 * swept γ, crossed at four of five when the logged range was used; test/battery/README.md). loggedWidth
 * sets the slack. Null when the definition bounds neither end.
 */
interface RewardRange { lower: number; upper: number; source: 'formula' | 'declaration'; loggedWidth: number }

function rewardRange(plan: EvaluationPlan): RewardRange | null {
  const certain = plan.data.rewardBounds;
  if (!certain || (!Number.isFinite(certain.lower) && !Number.isFinite(certain.upper))) return null;
  const logged = loggedRewardRange(plan.data.rewards);
  return { lower: Number.isFinite(certain.lower) ? certain.lower : -Infinity, upper: Number.isFinite(certain.upper) ? certain.upper : Infinity, source: certain.from, loggedWidth: logged.upper - logged.lower };
}

function unboundedNote(plan: EvaluationPlan): string {
  const what = plan.sense === 'cost' ? 'cost' : 'reward';
  return `The discount sweep is not checked against what the ${what}s allow: the check holds J to the bounds the ${what}’s definition keeps whatever the plant does, and this project’s ${what} has none. ` +
    `Declare them on the Plant log step where the definition guarantees them (for a sum of squares or of energy used, never below 0); the logged range is no bound for a candidate that takes the plant elsewhere.`;
}

/** Why a candidate's sweep was not checked. */
type SkipReason = 'linearised' | 'resamples' | 'budget';

/** A pair of swept discounts that fails the check, with the resamples that gave its paired interval. */
interface Failing { pair: ImpossibleChange; change: number; interval: [number, number]; range: PossibleChange; paired: number }

const SKIP_WORDS: Record<SkipReason, (resamples: number) => string> = {
  linearised: () => 'the check re-solves the linear fit on resamples of the runs, which this fit does not keep exactly (its intervals come from the first-order approximation)',
  resamples: (b) => `the check needs at least ${SWEEP_CHECK_MIN_PAIRED} resamples of the runs and the project asks for ${b}`,
  budget: () => `re-solving this fit on ${SWEEP_CHECK_RESAMPLES} resamples at every swept discount would take longer than the check is given`,
};

function notCheckedNote(plan: EvaluationPlan, skipped: readonly { name: string; reason: SkipReason }[], total: number, resamples: number): string {
  const reasons = [...new Set(skipped.map((x) => x.reason))];
  const who = (names: readonly string[]) => (names.length === total ? 'the candidates' : names.map((n) => `“${n}”`).join(', '));
  const why = reasons.map((r) => `${reasons.length > 1 ? `${who(skipped.filter((x) => x.reason === r).map((x) => x.name))}: ` : ''}${SKIP_WORDS[r](resamples)}`).join('; ');
  return `The discount sweep of ${who(skipped.map((x) => x.name))} is not checked against what the ${plan.sense === 'cost' ? 'costs' : 'rewards'} allow: ${why}.`;
}

/** Swept discounts whose full-data point has no J (the iteration does not reach it, or no solution): no pair holding one is checked. */
function gapsNote(name: string, at: readonly number[], settings: readonly number[]): string {
  const list = at.map((k) => discountText(settings[k])), one = at.length === 1;
  const words = one ? list[0] : `${list.slice(0, -1).join(', ')} and ${list[list.length - 1]}`;
  return `The discount sweep of “${name}” is checked without γ ${words} (${one ? 'a gap' : 'gaps'} in the figure): the fit has no J there — its iteration does not reach one, or its equations have no solution — so no pair holding ${one ? 'it' : 'one of them'} is checked.`;
}

/** Pairs whose solves gave a J at both discounts on too few resamples (the iteration did not reach the solve, a resample without start states). */
function partlyCheckedNote(name: string, pairs: number, resamples: number): string {
  return `The discount sweep of “${name}” is checked only in part: for ${pairs === 1 ? 'one pair' : `${pairs} pairs`} of swept discounts fewer than ${SWEEP_CHECK_MIN_PAIRED} of the ${resamples} resamples of the runs gave a J at both (the fitted Q-evaluation iteration did not reach it, or a resample without start states), and ${pairs === 1 ? 'that pair is' : 'those pairs are'} not checked.`;
}

function sweepWarning(
  plan: EvaluationPlan, settings: readonly number[], values: readonly (number | null)[],
  f: Failing, ownPair: boolean, pairs: number, level: number, bounds: RewardRange,
): AssessmentWarning {
  const s = plan.sign, { earlier: i, later: j } = f.pair, g = (k: number) => discountText(settings[k]);
  const change: [number, number] = s > 0 ? f.interval : [-f.interval[1], -f.interval[0]];
  // The two J, the change and its interval are read against each other: one precision, the interval's (uncertainNumber.ts).
  const at = (k: number) => `${valueAtPrecision(s * values[k]!, change, ASCII_MINUS)} at γ ${g(k)}`;
  const allowed: [number, number] = s > 0 ? [f.range.lower, f.range.upper] : [0 - f.range.upper, 0 - f.range.lower];
  const step: [number, number] = s > 0 ? [bounds.lower, bounds.upper] : [0 - bounds.upper, 0 - bounds.lower];
  const what = plan.sense === 'cost' ? 'cost' : 'reward';
  // Where the bounds come from, as assessPossible.ts names them: a declared column's are the project's word, checked on the logged rows only.
  const source = bounds.source === 'formula' ? `the ${what} formula keeps every step’s ${what}, whatever the plant does,` : `the project declares every step’s ${what}`;
  const ends = [
    ...(Number.isFinite(step[0]) ? [`never below ${boundText(step[0], 'lower', 4, ASCII_MINUS)}`] : []),
    ...(Number.isFinite(step[1]) ? [`never above ${boundText(step[1], 'upper', 4, ASCII_MINUS)}`] : []),
  ].join(' and ');
  // The allowed change is a bound: said rounded outward (boundText), so no change it excludes reads as inside it.
  const low = boundText(allowed[0], 'lower', 4, ASCII_MINUS), high = boundText(allowed[1], 'upper', 4, ASCII_MINUS);
  const can = Number.isFinite(allowed[0]) && Number.isFinite(allowed[1]) ? `by between ${low} and ${high}`
    : Number.isFinite(allowed[0]) ? `by no less than ${low}` : `by no more than ${high}`;
  const more = pairs > 1 ? ` ${pairs} pairs of swept discounts fail this check in all.` : '';
  const which = ownPair
    ? 'One of the two is the J reported at the project’s own discount: do not use it without other evidence.'
    : 'The J reported at the project’s own discount passes this check, but it rests on the same kind of fixed point that fails at this horizon.';
  return {
    severity: ownPair ? 'serious' : 'caution', topic: SWEEP_CHECK_TOPIC,
    message: `J cannot go from ${at(i)} to ${at(j)}: the change, ${valueAtPrecision(s * f.change, change, ASCII_MINUS)} (${shareText(level)} interval ${intervalAtPrecision(change, ASCII_MINUS)} on ${f.paired} resamples of the runs), lies outside what the ${what}s allow, ` +
      `since ${source} ${ends}, so between these two discounts J can change only ${can}. ` +
      `The linear fit extrapolates at one of these discounts. ${which}${more}`,
  };
}
