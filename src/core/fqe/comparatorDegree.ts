/**
 * The degree of the linear estimate set beside the network's (networkComparator.ts builds it) and
 * its name in the user's words. Kept apart from the comparator's numerics, which need TensorFlow.js,
 * so the command line's text and the agreement rule can name it without loading TensorFlow.js
 * (test/cli/startupImports.test.ts).
 */
import { DEFAULT_POLYNOMIAL_DEGREE } from '../limits';

/** Degree of the comparator's polynomial features: the linear approximator's default (one source). */
export const COMPARATOR_DEGREE = DEFAULT_POLYNOMIAL_DEGREE;

/** The comparator's name in the user's words, from its degree. */
export function comparatorName(degree = COMPARATOR_DEGREE): string {
  return degree === 2 ? 'linear (quadratic)' : `linear (degree-${degree} polynomial)`;
}
