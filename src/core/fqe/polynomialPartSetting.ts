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
export const POLYNOMIAL_PART_CHOSEN = 'chosen';

export type PolynomialPartSetting = typeof POLYNOMIAL_PART_CHOSEN | number;

/** Degrees the part may be fixed at, the default degree first. */
export const FIXED_POLYNOMIAL_PART_DEGREES: readonly number[] = DEGREE_CHOICES;

/** Every value the setting takes, the default first: ["chosen", 2, 4]. */
export const POLYNOMIAL_PART_VALUES: readonly PolynomialPartSetting[] = [POLYNOMIAL_PART_CHOSEN, ...FIXED_POLYNOMIAL_PART_DEGREES];

/** The default: the guarded choice (networkMethod.ts says why). */
export const DEFAULT_POLYNOMIAL_PART: PolynomialPartSetting = POLYNOMIAL_PART_CHOSEN;

/** The allowed values in words, for messages: `"chosen", 2 or 4`. */
export const POLYNOMIAL_PART_VALUES_TEXT = `"${POLYNOMIAL_PART_CHOSEN}", ${FIXED_POLYNOMIAL_PART_DEGREES.slice(0, -1).join(', ')} or ${FIXED_POLYNOMIAL_PART_DEGREES[FIXED_POLYNOMIAL_PART_DEGREES.length - 1]}`;

export function isPolynomialPartSetting(value: unknown): value is PolynomialPartSetting {
  return POLYNOMIAL_PART_VALUES.includes(value as PolynomialPartSetting);
}

/** The method's linearPartDegree (networkMethod.ts) the setting asks for: 'choose' or the fixed degree. */
export function linearPartDegreeOf(setting: PolynomialPartSetting): number | 'choose' {
  return setting === POLYNOMIAL_PART_CHOSEN ? 'choose' : setting;
}

/** What the fit says of a degree it did not choose (the chosen one's sentence is the choice's own, networkDegreeChoice.ts). */
export function fixedDegreeSentence(degree: number): string {
  return `Polynomial part of degree ${degree}, as set in the project (not chosen from the log).`;
}
