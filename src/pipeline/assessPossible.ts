/**
 * Impossible values (core/diagnostics/possibleValues.ts, possibleStateValues.ts): J outside what any
 * policy can reach with rewards in the logged range, its interval wholly outside it, or the fitted
 * V̂ outside it at most of the logged states. One serious finding per candidate, in the project's
 * sense; the first rule that applies gives its words. Where the reward is a formula with bounds it
 * keeps whatever the plant does (TransitionSet.rewardBounds), J past the range those allow is named
 * first, in stronger words, and a range to report is cut to it (cutToCertain).
 */
import { stateValuesOutsidePossible, evenStride, type StateValuesOutside } from '../core/diagnostics/possibleStateValues';
import { certainValues, intervalOutsidePossible, outsidePossible, POSSIBLE_SLACK, type PossibleValues } from '../core/diagnostics/possibleValues';
import { linearStateValues } from '../core/features/linearStateValues';
import { MAX_VALUE_CHECK_STATES } from '../core/limits';
import { stateValues, ValueQueryError } from '../core/value';
import type { AssessmentWarning, IntervalEstimate } from './assessment';
import type { CandidateModel } from './model/candidateModel';
import type { EvaluationPlan } from './plan/evaluationPlan';
import { ASCII_MINUS, intervalAtPrecision, plainNumber, valueAtPrecision } from '../figures/parts/uncertainNumber';
import { boundSides, boundText } from '../figures/parts/boundText';
import { shareText } from '../core/shareText';

const TOPIC = 'impossibleValue';

export function impossibleValue(plan: EvaluationPlan, range: PossibleValues, model: CandidateModel, estimate: IntervalEstimate): AssessmentWarning[] {
  const j = model.fit.policyValue, interval = estimate.percentile, inReward = interval && (plan.sign > 0 ? interval : [-interval[1], -interval[0]]);
  const certain = certainOf(plan);
  if (certain && beyondCertain(j, certain, range)) return [certainFinding(plan, certain, j, interval)];
  const wholly = inReward !== null && intervalOutsidePossible(inReward[0], inReward[1], range);
  if (outsidePossible(j, range) || wholly) {
    const jText = valueAtPrecision(plan.sign * j, interval, ASCII_MINUS); // at its interval’s precision (figures/parts/uncertainNumber.ts)
    const what = wholly && interval ? `J = ${jText} and its whole interval ${intervalAtPrecision(interval, ASCII_MINUS)} lie` : `J = ${jText} lies`;
    return [{
      severity: 'serious', topic: TOPIC,
      message: `${what} outside what any policy can reach while its ${words(plan)} stay within the logged range (${rangeText(plan, range)}, discounted): either the candidate would take the plant where its steps lie outside the logged ${words(plan)}, or the fit extrapolates far from the logs. The logs cannot vouch for this value either way: do not use it without other evidence.`,
    }];
  }
  const outside = estimate.standardError === null ? null : stateCheck(plan, range, model, estimate.standardError);
  return outside ? [stateFinding(plan, range, outside, estimate.standardError!)] : [];
}

/** J (reward sense) past the values no policy can leave by more than the logged-range rule's slack (POSSIBLE_SLACK of the logged range's width): certainFinding names it. */
function beyondCertain(j: number, certain: PossibleValues, logged: PossibleValues): boolean {
  const slack = POSSIBLE_SLACK * (logged.upper - logged.lower);
  return j < certain.lower - slack || j > certain.upper + slack;
}

function words(plan: EvaluationPlan): string {
  return plan.sense === 'cost' ? 'costs' : 'rewards';
}

function rangeText(plan: EvaluationPlan, range: PossibleValues): string {
  const [lo, hi] = plan.sign > 0 ? [range.lower, range.upper] : [-range.upper, -range.lower];
  return `${plainNumber(lo, 4, ASCII_MINUS)} to ${plainNumber(hi, 4, ASCII_MINUS)}`;
}

/** V̂ at up to MAX_VALUE_CHECK_STATES logged states against the range; null when V̂ cannot be taken there (a value that is not finite). */
function stateCheck(plan: EvaluationPlan, range: PossibleValues, model: CandidateModel, standardError: number): StateValuesOutside | null {
  const data = plan.data, ds = data.stateDim, rows = evenStride(data.count, MAX_VALUE_CHECK_STATES), count = rows.length;
  const states = new Float64Array(count * ds);
  for (let i = 0; i < count; i++) for (let c = 0; c < ds; c++) states[i * ds + c] = data.states[rows[i] * ds + c];
  let values: Float64Array;
  try {
    const linear = model.linear;
    values = linear ? linearStateValues(linear.features, linear.weights, model.quadrature, states, count, ds)
      : stateValues(model.fit.q, model.policy, states, count, model.quadrature);
  } catch (error) {
    if (error instanceof ValueQueryError) return null;
    throw error;
  }
  return stateValuesOutsidePossible(values, range, standardError);
}

/** Exported for its words' test (test/pipeline/impossibleValueWords.test.ts). */
export function stateFinding(plan: EvaluationPlan, range: PossibleValues, outside: StateValuesOutside, standardError: number): AssessmentWarning {
  // Project sense: a cost project's range and values are the reward's negated, so its ends swap.
  const median = plan.sign * outside.median, past = (outside.side === 'above') === plan.sign > 0 ? 'above' : 'below';
  return {
    severity: 'serious', topic: TOPIC,
    message: `The fitted value lies outside what any policy can reach on most of the logged states: V̂ has median ${plainNumber(median, 4, ASCII_MINUS)} over ${outside.states} logged states, ` +
      `${shareText(outside.share)} of them ${past} the possible range (${rangeText(plan, range)}, discounted, while the ${words(plan)} stay within the logged range), ` +
      `more than one standard error of J (${plainNumber(standardError, 2, ASCII_MINUS)}) past its end. The fit fails where it has data, and its interval, the same fit on resampled runs, cannot show it: do not use this value.`,
  };
}

/** J past the range no policy can leave whatever it does (the reward formula's own bounds). Exported for its words' test. */
export function certainFinding(plan: EvaluationPlan, certain: PossibleValues, j: number, interval: [number, number] | null): AssessmentWarning {
  const value = plan.sign * j, bound = projectRange(plan, certain), below = value < bound[0];
  const end = below ? bound[0] : bound[1], step = formulaBounds(plan)[below ? 0 : 1], side = below ? 'below' : 'above';
  return {
    severity: 'serious', topic: TOPIC,
    message: `J = ${valueAtPrecision(value, interval, ASCII_MINUS)} lies ${side} ${boundText(end, below ? 'lower' : 'upper', 4, ASCII_MINUS)}, the ${below ? 'least' : 'most'} discounted ${plan.sense} any policy can have whatever it does (${definition(plan)} never ${side} ${boundText(step, below ? 'lower' : 'upper', 4, ASCII_MINUS)} on any row). The fit extrapolates far from the logs: do not use this value.`,
  };
}

/**
 * A range to report cut to the values some policy can have, whatever it does (the reward formula's
 * own bounds, core/diagnostics/possibleValues.ts certainValues), in the project's sense, with a
 * sentence saying where and why; unchanged, with no sentence, when nothing is cut, when nothing
 * bounds the reward, or when the range lies wholly outside (impossibleValue names that).
 * j, the point estimate in the project's sense, with logged, the logged range's possible values
 * (reward sense): J past a certain end by no more than the impossible-value slack is named by no
 * finding, and a range cut at the end would sit beside it without holding it; the range stops at J
 * instead, still holding the cut one (so its coverage), and the sentence says so. J past it by more
 * is named by certainFinding ("do not use this value"), and the range is cut at the end.
 */
export function cutToCertain(
  plan: EvaluationPlan, range: [number, number] | null, j: number | null = null, logged: PossibleValues | null = null,
): { range: [number, number] | null; note: string | null } {
  const certain = certainOf(plan);
  if (!range || !certain) return { range, note: null };
  const [lo, hi] = projectRange(plan, certain);
  if (Math.max(range[0], lo) > Math.min(range[1], hi)) return { range, note: null };
  const keep = j !== null && logged !== null && !beyondCertain(plan.sign * j, certain, logged) ? j : null;
  const floor = keep === null ? lo : Math.min(lo, keep), ceiling = keep === null ? hi : Math.max(hi, keep);
  const cut: [number, number] = [Math.max(range[0], floor), Math.min(range[1], ceiling)];
  if (cut[0] === range[0] && cut[1] === range[1]) return { range, note: null };
  const steps = formulaBounds(plan), sides = [
    ...(cut[0] !== range[0] ? [{ side: 'below', end: cut[0], step: steps[0] }] : []),
    ...(cut[1] !== range[1] ? [{ side: 'above', end: cut[1], step: steps[1] }] : []),
  ];
  // The ends said outward (boundText.ts): "never below −0.005264" of a floor at −0.00526316 stays true of every row.
  // An end stopped at J is J itself, said as J is.
  const end = (x: { side: string; end: number }) => (x.end === keep ? plainNumber(x.end, 4, ASCII_MINUS) : boundText(x.end, x.side === 'below' ? 'lower' : 'upper', 4, ASCII_MINUS));
  const where = sides.map((x) => `${x.side} at ${end(x)}`).join(' and ');
  const why = sides.map((x) => `never ${x.side} ${boundText(x.step, x.side === 'below' ? 'lower' : 'upper', 4, ASCII_MINUS)}`).join(' and ');
  const atJ = keep !== null && (cut[0] === keep || cut[1] === keep) && (keep < lo || keep > hi)
    ? ` J itself lies past that end by less than the impossible-value rule’s slack, so it stops at J = ${plainNumber(keep, 4, ASCII_MINUS)} to keep the estimate inside its range.` : '';
  return {
    range: cut,
    note: `The range to report is cut ${where} (it was ${intervalAtPrecision(range, ASCII_MINUS)}): ${definition(plan)} ${why} on any row, whatever the plant does, so no policy’s discounted ${plan.sense} lies beyond. The cut keeps the range’s coverage, since the true value lies inside it for sure.${atJ}`,
  };
}

/** The discounted values no policy can pass, in words for a note ("none below 0"); '' where the reward's definition bounds nothing. */
export function certainEnds(plan: EvaluationPlan): string {
  const certain = certainOf(plan);
  if (!certain) return '';
  const [lo, hi] = projectRange(plan, certain);
  const sides = boundSides(lo, hi, 4, ASCII_MINUS);
  return sides.length ? `none ${sides.join(' or ')}` : '';
}

/** The values no policy can leave whatever it does (core/diagnostics/possibleValues.ts certainValues), reward sense; null where the reward's definition bounds nothing. */
function certainOf(plan: EvaluationPlan): PossibleValues | null {
  return certainValues(plan.data.rewardBounds, plan.discount, plan.absorbingEnds > 0);
}

/** A range in reward sense, in the project's. */
function projectRange(plan: EvaluationPlan, range: PossibleValues): [number, number] {
  return plan.sign > 0 ? [range.lower, range.upper] : [0 - range.upper, 0 - range.lower]; // 0 − x: never −0
}

/** The definition's own bounds on one row, as the user wrote it (a cost as a cost). */
function formulaBounds(plan: EvaluationPlan): [number, number] {
  const { lower, upper } = plan.data.rewardBounds!;
  return plan.sign > 0 ? [lower, upper] : [0 - upper, 0 - lower];
}

/** Where the bounds come from, as the sentences name it: "the cost formula is", "the cost column is, as the project declares,". */
function definition(plan: EvaluationPlan): string {
  return plan.data.rewardBounds!.from === 'formula' ? `the ${plan.sense} formula is` : `the ${plan.sense} column is, as the project declares,`;
}
