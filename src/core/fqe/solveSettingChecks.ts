/**
 * The engine's entry checks of the settings a project also sets, each held to the same range as
 * the project schema (src/core/limits.ts; the schema, src/project/schema.ts and approximatorSchema.ts,
 * reads the same constants): a caller other than the pipeline — a bench, a test, a future host — is
 * refused at the same ends, with an FqeOptionsError whose message starts with the field's name, as
 * the schema's problem names it. test/project/engineLimits.test.ts walks every end of every range.
 */
import { FqeOptionsError } from './fqeErrors';
import { hasActionLimits, type GaussianPolicy } from '../policy';
import { DISCOUNT_RANGE, MAX_BOUNDED_NORMAL_NODES, MAX_GAUSS_HERMITE_NODES, MAX_ITERATIONS, MAX_QUADRATURE_POINTS, MIN_QUADRATURE_NODES, RIDGE, TOLERANCE } from '../limits';

/** γ strictly inside DISCOUNT_RANGE: γ = 1 has no discounted value in general, γ = 0 no horizon to evaluate. */
export function checkDiscount(discount: number): void {
  if (!(discount > DISCOUNT_RANGE.above && discount < DISCOUNT_RANGE.below)) {
    throw new FqeOptionsError(`discount: expected a number above ${DISCOUNT_RANGE.above} and below ${DISCOUNT_RANGE.below}, got ${discount}`);
  }
}

export function checkRidge(ridge: number): void {
  if (!(ridge >= 0 && ridge <= RIDGE.max)) throw new FqeOptionsError(`ridge: expected a number from 0 to ${RIDGE.max}, got ${ridge}`);
}

export function checkTolerance(tolerance: number): void {
  if (!(tolerance >= TOLERANCE.min && tolerance <= TOLERANCE.max)) {
    throw new FqeOptionsError(`tolerance: expected a number from ${TOLERANCE.min} to ${TOLERANCE.max}, got ${tolerance}`);
  }
}

export function checkMaxIterations(maxIterations: number): void {
  const { min, max } = MAX_ITERATIONS;
  if (!Number.isInteger(maxIterations) || maxIterations < min || maxIterations > max) {
    throw new FqeOptionsError(`maxIterations: expected a whole number from ${min} to ${max}, got ${maxIterations}`);
  }
}

/** Nodes per action: a whole number the policy's rule can be built with (quadratureProblem), named as the project's field. */
export function checkQuadratureNodes(policy: GaussianPolicy, nodes: number): void {
  if (!Number.isInteger(nodes) || nodes < MIN_QUADRATURE_NODES || nodes > MAX_GAUSS_HERMITE_NODES) {
    throw new FqeOptionsError(`quadratureNodes: expected a whole number from ${MIN_QUADRATURE_NODES} to ${MAX_GAUSS_HERMITE_NODES}, got ${nodes}`);
  }
  const problem = quadratureProblem(policy, nodes);
  if (problem) throw new FqeOptionsError(`quadratureNodes: ${problem}`);
}

/**
 * Why the action quadrature cannot be built for this policy with n nodes per action (n within the
 * schema's MIN_QUADRATURE_NODES … MAX_GAUSS_HERMITE_NODES), or null: with actuator limits the bounded-normal rule keeps
 * its accuracy to MAX_BOUNDED_NORMAL_NODES, and no rule may put more than MAX_QUADRATURE_POINTS points
 * on one state. The plan (pipeline/plan/planPolicies.ts) words a project's candidate by it too.
 */
export function quadratureProblem(policy: GaussianPolicy, n: number): string | null {
  const bounded = hasActionLimits(policy);
  if (bounded && n > MAX_BOUNDED_NORMAL_NODES) {
    return `${n} nodes per action: with actuator limits at most ${MAX_BOUNDED_NORMAL_NODES} are supported (the bounded-normal rule keeps its accuracy up to there); use ${MAX_BOUNDED_NORMAL_NODES} or fewer`;
  }
  const points = (bounded ? n + 2 : n) ** policy.actionDim;
  if (points > MAX_QUADRATURE_POINTS) {
    const largest = Math.floor(MAX_QUADRATURE_POINTS ** (1 / policy.actionDim) + 1e-9) - (bounded ? 2 : 0);
    return `${n} nodes per action on ${policy.actionDim} actions make ${points.toLocaleString('en-US')} points per state, above the ` +
      `${MAX_QUADRATURE_POINTS.toLocaleString('en-US')} a data pass can afford; use at most ${largest} nodes per action`;
  }
  return null;
}
