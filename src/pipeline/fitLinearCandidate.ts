/** One candidate by linear fitted Q-evaluation (src/core/fqe/linearFqe.ts). */
import { describeProblems } from '../core/result';
import { fitLinearFqe } from '../core/fqe/linearFqe';
import { FqeDataError } from '../core/fqe/fqeErrors';
import { checkEnoughTransitions } from '../data/datasetChecks';
import type { CandidateFit, CandidateFitRequest } from './candidateFit';
import { featureMapFor } from './featureMapFor';

export function fitLinearCandidate(request: CandidateFitRequest): CandidateFit {
  const settings = request.approximator;
  if (settings.kind !== 'linear') throw new Error('fitLinearCandidate: expected linear approximator settings');
  const features = featureMapFor(settings, request.data);
  const enough = checkEnoughTransitions(request.data.count, features.dim);
  if (!enough.ok) throw new FqeDataError(describeProblems(enough.problems));
  const result = fitLinearFqe({
    data: request.data, policy: request.policy, features, discount: request.discount, ridge: settings.ridge,
    quadratureNodes: request.quadratureNodes, tolerance: settings.tolerance, maxIterations: settings.maxIterations,
    startStates: request.startStates, cancel: request.cancel,
    onIteration: request.onIteration && ((p) => request.onIteration!({
      iteration: p.iteration, weightChange: p.weightChange, bellmanResidual: p.bellmanResidual, policyValue: p.policyValue, loss: null,
    })),
  });
  // A diverged iteration leaves no iterate; the fixed point, when it exists, is reported with its warning.
  const chosen = result.iterative ?? result.fixedPoint;
  if (!chosen) throw new FqeDataError(`${result.message} ${result.fixedPointMessage}`);
  const warnings = enough.warnings.map((w) => w.message);
  if (!result.iterative && result.fixedPoint?.warning) warnings.push(`Reported value is the fixed-point solution: ${result.fixedPoint.warning}.`);
  return {
    q: chosen.q,
    status: result.status,
    message: result.message,
    history: result.history.map((p) => ({ iteration: p.iteration, weightChange: p.weightChange, bellmanResidual: p.bellmanResidual, policyValue: p.policyValue, loss: null })),
    policyValue: chosen.policyValue.value,
    standardError: chosen.policyValue.standardError,
    fixedPointValue: result.fixedPoint?.policyValue.value ?? null,
    featureCount: features.dim,
    backend: 'linear least squares (double precision)',
    warnings,
    dispose: () => undefined,
  };
}
