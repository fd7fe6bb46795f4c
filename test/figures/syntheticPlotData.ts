/**
 * Fixed synthetic inputs for the plot tests and the e2e plot page (an invented scenario, not data):
 * - a value surface V(x, y) = 2 + (x − 0.4)² + 2 (y + 0.2)², a quadratic bowl in cost, whose upper
 *   right corner (x > 1.2 and y > 0.8) was never visited;
 * - an action slice Q(a) = 5 − (a − 0.3)² under a policy N(0.5, 0.6²) clipped to [−1, 1.2], with the
 *   quadrature nodes from the project's own bounded-normal rule;
 * - a geometric fit history and an evaluation of three candidates next to the logged behaviour.
 */
import { quadratureNodesAt } from '../../src/core/actionQuadrature';
import { normalDensity } from '../../src/core/normalDistribution';
import { createGaussianPolicy } from '../../src/core/policy';
import type { Evaluation, FitIteration, PolicyEstimate, ValueSurface } from '../../src/pipeline/estimates';
import type { ActionSliceData } from '../../src/figures/charts/actionSlice';

export function bowlSurface(nx = 40, ny = 30): ValueSurface {
  const x = Float64Array.from({ length: nx }, (_, i) => -1 + (3 * i) / (nx - 1));
  const y = Float64Array.from({ length: ny }, (_, j) => -1 + (2.5 * j) / (ny - 1));
  const values = new Float64Array(nx * ny), visits = new Uint32Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      values[j * nx + i] = 2 + (x[i] - 0.4) ** 2 + 2 * (y[j] + 0.2) ** 2;
      visits[j * nx + i] = x[i] > 1.2 && y[j] > 0.8 ? 0 : 1 + ((i * 7 + j * 3) % 5);
    }
  }
  return { xState: 'tank level', yState: 'inflow', x, y, values, heldState: [0, 0, 1.5], visits };
}

// Bounds 2.5σ below and 1σ above the mean, so the clipped masses are Φ(−2.5) and 1 − Φ(1), table values.
export const SLICE_POLICY = { mean: 0.5, std: 0.6, lo: -1, hi: 1.1 } as const;

/** The slice over [from, to] (default −2 … 2, wider than the bounds; the app cuts it at the bounds). */
export function clippedSlice(points = 81, from = -2, to = 2): ActionSliceData {
  const { mean, std, lo, hi } = SLICE_POLICY;
  const actions = Float64Array.from({ length: points }, (_, i) => (i === points - 1 ? to : from + ((to - from) * i) / (points - 1)));
  const actionValues = actions.map((a) => 5 - (a - 0.3) ** 2);
  const density = actions.map((a) => (a >= lo && a <= hi ? normalDensity((a - mean) / std) / std : 0));
  const policy = createGaussianPolicy({ offset: [mean], gain: [[0]], std: [std], bounds: { lo: [lo], hi: [hi], mode: 'clip' } }, 1);
  const nodes = quadratureNodesAt(policy, [0], 5);
  return { actions, actionValues, density, nodes: { points: nodes.points, weights: nodes.weights }, state: [1.25, -0.4], policyName: 'gentle gain', bounds: { lo, hi, mode: 'clip' } };
}

export function geometricHistory(iterations = 40): FitIteration[] {
  return Array.from({ length: iterations }, (_, k) => ({
    iteration: k + 1, weightChange: 0.5 * 0.8 ** k, bellmanResidual: 0.01 + 0.5 * 0.85 ** k, policyValue: null, loss: null,
  }));
}

function estimate(name: string, policyValue: number, standardError: number, status: PolicyEstimate['status'] = 'converged'): PolicyEstimate {
  return {
    name, policyValue, standardError, fixedPointValue: null, status, message: '', iterations: 40,
    history: geometricHistory(), surface: null, featureCount: 10, backend: 'linear least squares (double precision)',
  };
}

export function threeCandidateEvaluation(): Evaluation {
  return {
    project: 'Tank levels (synthetic)', evaluatedAt: '2025-01-15T10:00:00Z',
    policies: [estimate('gentle gain', 41.2, 1.8), estimate('aggressive gain', 47.9, 2.6, 'maxIterations'), estimate('wide noise', 44.0, 3.1)],
    behaviour: { value: 45.3, standardError: 2.2, episodes: 24, largestTruncationWeight: 0, meanTruncationWeight: 0 },
    presentController: null, presentControllerReason: 'not modelled in this synthetic evaluation',
    settings: { discount: 0.95, approximator: 'polynomial degree 2', quadratureNodes: 5, seed: 7, transitions: 4800, episodes: 24, startStates: 24 },
    valueSense: 'cost', warnings: [], cautions: [],
  };
}
