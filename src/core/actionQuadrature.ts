/**
 * Quadrature over the action distribution of a Gaussian policy: for a state s, nodes a_j and
 * weights w_j (Σ w_j = 1) with E_{a~π(·|s)} f(a) ≈ Σ_j w_j f(a_j). This is how the value
 * computations take V^π(s) = E_{a~π} Q(s, a).
 *
 * Unbounded policies, a ~ N(μ(s), LLᵀ): tensor product of the n-point standard-normal
 * Gauss–Hermite rule in z ∈ R^m mapped by a = μ(s) + L z (L = policy.covarianceFactor). The
 * rule is exact for polynomials of total degree ≤ 2n−1 in each coordinate of z (common
 * practice; Davis & Rabinowitz, "Methods of Numerical Integration", §5.6 on product rules).
 *
 * Limited policies have independent action dimensions, so the action law is a product of 1-D
 * bounded normals (clipped: point masses at the limits; truncated: renormalised density), and
 * the rule is the tensor product of the 1-D rules of boundedNormal, which also have n interior
 * nodes exact to degree 2n−1. Their nodes depend on the state through μ(s) and through the
 * limits L(s), U(s) (a rate limit moves them with the previous action; policy/actionLimits.ts),
 * so they are rebuilt per state into buffers owned by the quadrature object — nothing is
 * allocated per call. Where the limits collapse (L = U) the dimension is one point of weight 1.
 *
 * Exactness for what it integrates: at a given state the rule sees only the numbers μ(s), σ,
 * L(s), U(s), so a piecewise-linear mean or moving limits change where the nodes sit, never the
 * degree to which the rule is exact in the action (test/core/policy/formQuadrature.test.ts checks
 * this against a brute-force fine rule).
 *
 * Shapes: state read from state[stateOffset .. stateOffset+ds); points: count×m row-major.
 */
import { hasActionLimits, limitsAtState, policyMean, PolicyError, type GaussianPolicy } from './policy';
import { MAX_GAUSS_HERMITE_NODES, standardNormalRule } from './quadrature/gaussHermite';
import { createBoundedNormalQuadrature, MAX_BOUNDED_NORMAL_NODES, type BoundedNormalQuadrature } from './quadrature/boundedNormal';

export interface ActionQuadrature {
  readonly actionDim: number; // m
  readonly maxPoints: number; // upper bound on points any state yields
  /** The policy and the nodes per dimension the rule was built for (so a caller can take a closed form the rule agrees with; policyFeatureAverage.ts). */
  readonly policy: GaussianPolicy;
  readonly nodesPerDimension: number;
  /** Fill points (row-major, each row an action of length m) and weights (sum to 1) for the
   *  state read from state[stateOffset .. stateOffset+ds); returns the number of points used. */
  at(state: ArrayLike<number>, stateOffset: number, points: Float64Array, weights: Float64Array): number;
}

/** The rule for one state, trimmed to the points used (for plotting nodes). */
export interface QuadratureNodes {
  readonly count: number;
  readonly points: Float64Array; // count×m row-major
  readonly weights: Float64Array; // count
}

const MAX_ACTION_DIM = 3;

export function createActionQuadrature(policy: GaussianPolicy, nodesPerDimension: number): ActionQuadrature {
  const m = policy.actionDim;
  if (!Number.isInteger(m) || m < 1 || m > MAX_ACTION_DIM) {
    throw new RangeError(`action quadrature: actionDim must be 1 to ${MAX_ACTION_DIM}, got ${m}`);
  }
  return hasActionLimits(policy) ? boundedQuadrature(policy, nodesPerDimension) : unboundedQuadrature(policy, nodesPerDimension);
}

/** a = μ(s) + L z over the tensor Gauss–Hermite grid; the offsets L z are formed once. */
function unboundedQuadrature(policy: GaussianPolicy, n: number): ActionQuadrature {
  const m = policy.actionDim, rule = standardNormalRule(n);
  const count = n ** m;
  const offsets = new Float64Array(count * m); // count×m: L z_j
  const tensorWeights = new Float64Array(count);
  const z = new Float64Array(m);
  for (let j = 0; j < count; j++) {
    let w = 1;
    for (let i = 0, rest = j; i < m; i++, rest = Math.floor(rest / n)) {
      z[i] = rule.nodes[rest % n];
      w *= rule.weights[rest % n];
    }
    tensorWeights[j] = w;
    for (let i = 0; i < m; i++) {
      let v = 0;
      for (let k = 0; k <= i; k++) v += policy.covarianceFactor[i * m + k] * z[k];
      offsets[j * m + i] = v;
    }
  }
  const mean = new Float64Array(m);
  return {
    actionDim: m,
    maxPoints: count, policy, nodesPerDimension: n,
    at(state, stateOffset, points, weights) {
      checkCall(policy, state, stateOffset, points, weights, count);
      meanAt(policy, state, stateOffset, mean);
      for (let j = 0; j < count; j++) {
        for (let i = 0; i < m; i++) points[j * m + i] = mean[i] + offsets[j * m + i];
        weights[j] = tensorWeights[j];
      }
      return count;
    },
  };
}

/** Tensor product of per-dimension bounded-normal rules, rebuilt per state in owned buffers. */
function boundedQuadrature(policy: GaussianPolicy, n: number): ActionQuadrature {
  const m = policy.actionDim, limits = limitsAtState(policy);
  const rules: BoundedNormalQuadrature[] = [], nodes: Float64Array[] = [], nodeWeights: Float64Array[] = [];
  for (let i = 0; i < m; i++) {
    rules.push(createBoundedNormalQuadrature(n));
    nodes.push(new Float64Array(rules[i].maxPoints));
    nodeWeights.push(new Float64Array(rules[i].maxPoints));
  }
  const maxPoints = rules[0].maxPoints ** m;
  const mean = new Float64Array(m), counts = new Int32Array(m), digit = new Int32Array(m);
  return {
    actionDim: m,
    maxPoints, policy, nodesPerDimension: n,
    at(state, stateOffset, points, weights) {
      checkCall(policy, state, stateOffset, points, weights, maxPoints);
      meanAt(policy, state, stateOffset, mean);
      const mode = limits.at(state, stateOffset)!;
      let total = 1;
      for (let i = 0; i < m; i++) {
        counts[i] = fillDimension(rules[i], mean[i], policy.covarianceFactor[i * m + i], limits.lo[i], limits.hi[i], mode, nodes[i], nodeWeights[i]);
        total *= counts[i];
      }
      writeTensorProduct(m, total, counts, digit, nodes, nodeWeights, points, weights);
      return total;
    },
  };
}

/** One dimension's rule; limits that collapsed onto one value (L = U) give that value with weight 1. */
function fillDimension(
  rule: BoundedNormalQuadrature, mean: number, std: number, lo: number, hi: number, mode: 'clip' | 'truncate',
  nodes: Float64Array, weights: Float64Array,
): number {
  if (lo === hi) {
    nodes[0] = lo;
    weights[0] = 1;
    return 1;
  }
  return rule.fill(mean, std, lo, hi, mode, nodes, weights);
}

/** Row j of the product grid takes node digit[i] of dimension i (first dimension fastest). */
function writeTensorProduct(
  m: number, total: number, counts: Int32Array, digit: Int32Array,
  nodes: Float64Array[], nodeWeights: Float64Array[], points: Float64Array, weights: Float64Array,
): void {
  digit.fill(0);
  for (let j = 0; j < total; j++) {
    let w = 1;
    for (let i = 0; i < m; i++) {
      points[j * m + i] = nodes[i][digit[i]];
      w *= nodeWeights[i][digit[i]];
    }
    weights[j] = w;
    for (let i = 0; i < m && ++digit[i] === counts[i]; i++) digit[i] = 0;
  }
}

/** μ(s) into mean; a PolicyError where it is not finite (every route to E_{a~π} goes through here). */
export function meanAt(policy: GaussianPolicy, state: ArrayLike<number>, stateOffset: number, mean: Float64Array): void {
  policyMean(policy, state, mean, stateOffset, 0);
  for (let i = 0; i < policy.actionDim; i++) {
    if (!Number.isFinite(mean[i])) {
      // A candidate whose offset or gains overflow at a logged state: the user's input, so a PolicyError (exit 1), not a bug.
      throw new PolicyError(`the candidate’s mean action ${i + 1} is ${mean[i]} at a state of the data (its offset or gains are too large for the states; check their units)`);
    }
  }
}

function checkCall(
  policy: GaussianPolicy, state: ArrayLike<number>, stateOffset: number,
  points: Float64Array, weights: Float64Array, maxPoints: number,
): void {
  if (stateOffset < 0 || stateOffset + policy.stateDim > state.length) {
    throw new RangeError(`action quadrature: state offset ${stateOffset} + stateDim ${policy.stateDim} exceeds the state array length ${state.length}`);
  }
  if (points.length < maxPoints * policy.actionDim || weights.length < maxPoints) {
    throw new RangeError(`action quadrature: buffers too small (points ${points.length} < ${maxPoints * policy.actionDim} or weights ${weights.length} < ${maxPoints})`);
  }
}

/** Nodes and weights of the rule at one state, copied to fresh arrays of the exact size. */
export function quadratureNodesAt(policy: GaussianPolicy, state: ArrayLike<number>, nodesPerDimension: number): QuadratureNodes {
  const quadrature = createActionQuadrature(policy, nodesPerDimension);
  const points = new Float64Array(quadrature.maxPoints * policy.actionDim), weights = new Float64Array(quadrature.maxPoints);
  const count = quadrature.at(state, 0, points, weights);
  return { count, points: points.slice(0, count * policy.actionDim), weights: weights.slice(0, count) };
}

/**
 * E_{a~π(·|s)} f(a) with the n-point rule per dimension, and errorEstimate = |value − value of
 * the 2n-point rule| (common practice). For smooth f the richer rule is far more accurate, so
 * the estimate is close to the true error of `value`; for f with a kink inside the action range
 * (e.g. |a − c|) Gauss rules converge only like 1/n and the estimate can understate the error.
 * When 2n exceeds the largest rule the comparison is with ⌈n/2⌉ nodes instead.
 * f receives a reused buffer of length m.
 */
export function expectUnderPolicy(
  policy: GaussianPolicy, state: ArrayLike<number>, f: (action: Float64Array) => number, nodesPerDimension: number,
): { value: number; errorEstimate: number; points: number } {
  const largest = hasActionLimits(policy) ? MAX_BOUNDED_NORMAL_NODES : MAX_GAUSS_HERMITE_NODES;
  const n = nodesPerDimension;
  const reference = n * 2 <= largest ? n * 2 : Math.ceil(n / 2);
  const coarse = expectWithRule(policy, state, f, n);
  const rich = expectWithRule(policy, state, f, reference);
  return { value: coarse.value, errorEstimate: Math.abs(coarse.value - rich.value), points: coarse.points };
}

function expectWithRule(
  policy: GaussianPolicy, state: ArrayLike<number>, f: (action: Float64Array) => number, n: number,
): { value: number; points: number } {
  const { count, points, weights } = quadratureNodesAt(policy, state, n);
  const m = policy.actionDim, action = new Float64Array(m);
  let value = 0;
  for (let j = 0; j < count; j++) {
    for (let i = 0; i < m; i++) action[i] = points[j * m + i];
    const fj = f(action);
    if (!Number.isFinite(fj)) throw new RangeError(`expectUnderPolicy: f returned ${fj} at action [${Array.from(action).join(', ')}]`);
    value += weights[j] * fj;
  }
  return { value, points: count };
}
