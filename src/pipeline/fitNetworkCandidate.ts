/**
 * One candidate by neural-network fitted Q-evaluation with TensorFlow.js (src/core/fqe/networkFqe.ts):
 * the fit, its J with an interval over the request's start states, the linear estimate it started
 * from, and whether the two agree (src/core/fqe/approximatorAgreement.ts).
 */
import { createActionQuadrature } from '../core/actionQuadrature';
import { FqeCancelledError } from '../core/fqe/fqeErrors';
import { policyValue } from '../core/value';
import { approximatorAgreement } from '../core/fqe/approximatorAgreement';
import { fitNetworkFqe, type NetworkFit, type NetworkIterationRecord } from '../core/fqe/networkFqe';
import { networkLayout } from '../core/fqe/networkParameters';
import type { CandidateFit, CandidateFitRequest } from './candidateFit';
import type { FitIteration } from './estimates';

export async function fitNetworkCandidate(request: CandidateFitRequest): Promise<CandidateFit> {
  const settings = request.approximator;
  if (settings.kind !== 'network') throw new Error('fitNetworkCandidate: expected network approximator settings');
  const { kind: _kind, ...networkSettings } = settings;
  const fit = await fitNetworkFqe({
    data: request.data, policy: request.policy, discount: request.discount, quadratureNodes: request.quadratureNodes,
    seed: request.seed, settings: networkSettings, startStates: request.startStates, isCancelled: request.cancel, wasmPath: request.wasmPath,
    onProgress: request.onIteration && ((p) => request.onIteration!({ ...iterationOf(p), ...(p.members > 1 ? { member: { index: p.member, count: p.members } } : {}) })),
  });
  if (fit.status === 'cancelled') {
    fit.dispose();
    throw new FqeCancelledError();
  }
  try {
    return candidateFitOf(fit, request);
  } catch (e) {
    fit.dispose();
    throw e;
  }
}

function candidateFitOf(fit: NetworkFit, request: CandidateFitRequest): CandidateFit {
  const estimate = fit.estimate(request.startStates);
  const { rule } = fit.convergence;
  return {
    q: fit.actionValue,
    status: fit.status === 'cancelled' ? 'maxIterations' : fit.status,
    message: fit.message,
    history: fit.history.map(iterationOf),
    policyValue: estimate.value,
    // As for the linear path: the start-state sampling part only; the fit's own uncertainty is in `interval`.
    standardError: policyValue(fit.actionValue, request.policy, request.startStates, createActionQuadrature(request.policy, request.quadratureNodes)).standardError,
    fixedPointValue: null,
    featureCount: parameterCount(fit, request),
    backend: fit.backend === 'wasm' ? 'TensorFlow.js (WebAssembly)' : 'TensorFlow.js (plain JavaScript)',
    // Said to the user only when it matters to them: the fit ran slower than it could.
    warnings: fit.backendFallback ? [`Computed with plain JavaScript instead of WebAssembly (${fit.backendFallback}): the same numbers, several times slower.`] : [],
    dispose: () => fit.dispose(),
    convergence: {
      converged: fit.convergence.converged, iterations: fit.convergence.iterations, remainingBound: fit.convergence.remainingBound,
      tolerance: rule.tolerance, window: rule.window, discount: rule.discount,
    },
    interval: estimate.interval,
    intervalCovers: estimate.covers,
    linearComparison: {
      value: estimate.linear.value, interval: estimate.linear.interval, difference: estimate.difference,
      agreement: approximatorAgreement({ network: estimate, linear: estimate.linear, difference: estimate.difference }),
    },
  };
}

function iterationOf(p: NetworkIterationRecord): FitIteration {
  return { iteration: p.iteration, weightChange: null, bellmanResidual: p.heldOutBellmanError, policyValue: p.policyValue, loss: p.loss };
}

/** Weights and biases of the network plus the weights of its quadratic part. */
function parameterCount(fit: NetworkFit, request: CandidateFitRequest): number {
  const hidden = request.approximator.kind === 'network' ? request.approximator.hiddenLayers : [];
  return networkLayout(request.data.stateDim + request.data.actionDim, hidden).size + fit.linearStart.features.dim;
}
