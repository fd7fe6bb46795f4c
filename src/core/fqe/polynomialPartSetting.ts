/**
 * The project's setting of the network's polynomial part (networkLinearPart.ts): the part the hidden
 * features correct, whose linear fixed point the fit starts from. "chosen" (the default): the guarded
 * per-project choice between degree 2 and 4 (networkDegreeChoice.ts, degreeChoiceStartGuard.ts;
 * why it is the default: networkMethod.ts, `linearPartDegree`). A number: that degree, fixed, for a
 * comparison run. The degrees allowed are the ones the choice compares and the battery measured
 * (DEGREE_CHOICES: 2 and 4); a cubic part was never measured, so it is not offered.
 *
 * The schema (src/project/schema.ts) takes its values and default from here.
 */
import { DEGREE_CHOICES } from './networkDegreeChoice';

/** The setting's value for the guarded choice from the log. */
export const POLYNOMIAL_DEGREE_CHOSEN = 'chosen';

export type PolynomialDegreeSetting = typeof POLYNOMIAL_DEGREE_CHOSEN | number;

/** Degrees the part may be fixed at, the default degree first. */
export const FIXED_POLYNOMIAL_DEGREES: readonly number[] = DEGREE_CHOICES;

/** Every value the setting takes, the default first: ["chosen", 2, 4]. */
export const POLYNOMIAL_DEGREE_VALUES: readonly PolynomialDegreeSetting[] = [POLYNOMIAL_DEGREE_CHOSEN, ...FIXED_POLYNOMIAL_DEGREES];

/** The default: the guarded choice (networkMethod.ts says why). */
export const DEFAULT_POLYNOMIAL_DEGREE: PolynomialDegreeSetting = POLYNOMIAL_DEGREE_CHOSEN;

/** The allowed values in words, for messages: `"chosen", 2 or 4`. */
export const POLYNOMIAL_DEGREE_VALUES_TEXT = `"${POLYNOMIAL_DEGREE_CHOSEN}", ${FIXED_POLYNOMIAL_DEGREES.slice(0, -1).join(', ')} or ${FIXED_POLYNOMIAL_DEGREES[FIXED_POLYNOMIAL_DEGREES.length - 1]}`;

export function isPolynomialDegreeSetting(value: unknown): value is PolynomialDegreeSetting {
  return POLYNOMIAL_DEGREE_VALUES.includes(value as PolynomialDegreeSetting);
}

/** The method's linearPartDegree (networkMethod.ts) the setting asks for: 'choose' or the fixed degree. */
export function linearPartDegreeOf(setting: PolynomialDegreeSetting): number | 'choose' {
  return setting === POLYNOMIAL_DEGREE_CHOSEN ? 'choose' : setting;
}

/** What the fit says of a degree it did not choose (the chosen one's sentence is the choice's own, networkDegreeChoice.ts). */
export function fixedDegreeSentence(degree: number): string {
  return `Polynomial part of degree ${degree}, as set in the project (not chosen from the log).`;
}
