/**
 * Limits of a reward/cost expression (the language is src/data/expressionSyntax.ts; the project
 * schema checks the length too). Choices: a plant's reward formula is a few terms over a few
 * columns; these bounds are two orders of magnitude above that and keep the recursive parser and
 * the column-wise evaluation (one n-long array per operation) far from any stack or memory limit.
 */
/** Characters of the expression's text. */
export const MAX_EXPRESSION_LENGTH = 2000;
/** Nesting of parentheses, function calls, signs and powers. */
export const MAX_EXPRESSION_DEPTH = 40;
/** Operations (operators and function calls) in the whole expression. */
export const MAX_EXPRESSION_OPERATIONS = 200;
