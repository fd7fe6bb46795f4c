/**
 * Checks of the settings against the data that no schema can make: a discount whose horizon is
 * longer than the logs, a network's fixed polynomial part too large for the inputs, and logged
 * columns that never change.
 */
import { monomialCount } from '../../core/features/monomials';
import { POLYNOMIAL_PART_CHOSEN } from '../../core/fqe/polynomialPartSetting';
import { horizonSteps, MAX_FEATURES } from '../../core/limits';
import type { ApproximatorSettings } from '../../project/approximatorSchema';
import { stepsText } from '../../core/horizonText';
import type { Problem } from '../../core/result';
import type { TransitionSet } from '../../core/transitions';
import { HORIZON_FORMULA } from '../../core/formulaText';

/**
 * The effective horizon 1/(1 − γ) may not exceed the number of logged transitions (our rule,
 * src/core/limits.ts): such a value weighs the future over more steps than the logs hold in all.
 */
export function discountProblems(discount: number, transitions: number): Problem[] {
  const horizon = horizonSteps(discount);
  if (horizon <= transitions) return [];
  return [{
    where: 'discount', field: ['discount'],
    message: `γ = ${discount} weighs the future over about ${stepsText(horizon)} logged steps (${HORIZON_FORMULA}), more than the ` +
      `${transitions.toLocaleString('en-US')} transitions the logs hold in all, so the value would be extrapolated rather than estimated; ` +
      discountAdvice(transitions),
  }];
}

/** 1/(1 − γ) ≤ n ⇔ γ ≤ 1 − 1/n; with a single transition no discount in (0, 1) meets it ("at most 0.00000" before). */
function discountAdvice(transitions: number): string {
  const most = 1 - 1 / transitions;
  return most > 0 ? `use a discount of at most ${Number(most.toPrecision(6))}, or more data` : 'no discount is short enough for a single transition: more data is needed';
}

/**
 * A network's polynomial part fixed at a degree whose features exceed the feature limit for these
 * inputs (the limit of polynomialFeatures.ts, core/limits.ts): said before any fit, at the setting.
 * The guarded choice needs no check: it compares degrees only up to a smaller limit (networkDegreeChoice.ts).
 */
export function polynomialPartProblems(approximator: ApproximatorSettings, inputs: number): Problem[] {
  if (approximator.kind !== 'network' || approximator.polynomialDegree === POLYNOMIAL_PART_CHOSEN) return [];
  const degree = approximator.polynomialDegree, count = monomialCount(inputs, degree);
  if (count <= MAX_FEATURES) return [];
  return [{
    where: 'approximator.polynomialDegree', field: ['approximator', 'polynomialDegree'],
    message: `a polynomial part of degree ${degree} in ${inputs} states and actions has ${count.toLocaleString('en-US')} features, more than the ${MAX_FEATURES.toLocaleString('en-US')} supported; use "${POLYNOMIAL_PART_CHOSEN}" or a lower degree`,
  }];
}

/**
 * A logged action that never changes leaves Q unidentified in the action: the fit can say nothing
 * about what a different action would have done, whatever a candidate asks for (common practice:
 * off-policy evaluation needs the logged actions to cover the candidate's). A state that never
 * changes carries no information and is standardised away.
 */
export function dataWarnings(data: TransitionSet): Problem[] {
  const out: Problem[] = [];
  for (let j = 0; j < data.actionDim; j++) {
    if (isConstant(data.actions, data.count, data.actionDim, j)) {
      out.push({
        where: `action ${data.actionNames[j]}`, kind: 'constant-action',
        message: 'the logged action never changes, so the logs say nothing about what another action would do: every candidate that acts differently is extrapolated, and its value cannot be trusted',
      });
    }
  }
  for (let j = 0; j < data.stateDim; j++) {
    if (isConstant(data.states, data.count, data.stateDim, j)) {
      out.push({ where: `state ${data.stateNames[j]}`, kind: 'constant-state', message: 'the logged state never changes; it carries no information and is left out of the features' });
    }
  }
  return out;
}

function isConstant(values: Float64Array, n: number, width: number, column: number): boolean {
  const first = values[column];
  for (let i = 1; i < n; i++) if (values[i * width + column] !== first) return false;
  return true;
}
