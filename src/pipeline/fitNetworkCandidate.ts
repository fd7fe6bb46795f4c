/**
 * One candidate by neural-network fitted Q-evaluation with TensorFlow.js (src/core/fqe/networkFqe.ts):
 * the fit, its J with an interval over the request's start states, the linear estimate beside it
 * (src/core/fqe/networkComparator.ts), and whether the two agree (src/core/fqe/approximatorAgreement.ts).
 *
 * TensorFlow.js is loaded with the first network fit, not with this file: a linear project never
 * loads it (its import is about 0.7 s of a command-line run's start on these machines).
 */
import { createActionQuadrature } from '../core/actionQuadrature';
import { FqeCancelledError } from '../core/fqe/fqeErrors';
import { policyValue } from '../core/value';
import { approximatorAgreement } from '../core/fqe/approximatorAgreement';
import { fixedDegreeSentence } from '../core/fqe/polynomialPartSetting';
import type { NetworkFit, NetworkIterationRecord } from '../core/fqe/networkFqe';
import type { CandidateFit, CandidateFitRequest } from './candidateFit';
import type { FitIteration } from './estimates';

type NetworkLayoutOf = typeof import('../core/fqe/networkParameters').networkLayout;

export async function fitNetworkCandidate(request: CandidateFitRequest): Promise<CandidateFit> {
  const settings = request.approximator;
  if (settings.kind !== 'network') throw new Error('fitNetworkCandidate: expected network approximator settings');
  const { kind: _kind, ...networkSettings } = settings;
  const [{ fitNetworkFqe }, { networkLayout }] = await Promise.all([import('../core/fqe/networkFqe'), import('../core/fqe/networkParameters')]);
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
    return candidateFitOf(fit, request, networkLayout);
  } catch (e) {
    fit.dispose();
    throw e;
  }
}

function candidateFitOf(fit: NetworkFit, request: CandidateFitRequest, layout: NetworkLayoutOf): CandidateFit {
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
    featureCount: parameterCount(fit, request, layout),
    backend: fit.backend === 'wasm' ? 'TensorFlow.js (WebAssembly)' : 'TensorFlow.js (plain JavaScript)',
    // Said to the user only when it matters to them: the fit ran slower than it could.
    warnings: fit.backendFallback ? [`Computed with plain JavaScript instead of WebAssembly (${fit.backendFallback}): the same numbers, several times slower.`] : [],
    dispose: () => fit.dispose(),
    convergence: {
      converged: fit.convergence.converged, iterations: fit.convergence.iterations, remainingBound: fit.convergence.remainingBound,
      tolerance: rule.tolerance, window: rule.window, discount: rule.discount, fullStepIterations: fit.convergence.fullStepIterations,
    },
    interval: estimate.interval,
    intervalCovers: estimate.covers,
    polynomialPart: { degree: fit.linearPartDegree, sentence: fit.degreeChoice?.sentence ?? fixedDegreeSentence(fit.linearPartDegree) },
    resampleByRuns: (options) => fit.estimate(request.startStates, options),
    linearComparison: {
      value: estimate.linear.value, interval: estimate.linear.interval, difference: estimate.difference,
      agreement: approximatorAgreement({ network: estimate, linear: estimate.linear, difference: estimate.difference }),
    },
  };
}

function iterationOf(p: NetworkIterationRecord): FitIteration {
  return { iteration: p.iteration, weightChange: null, bellmanResidual: p.heldOutBellmanError, policyValue: p.policyValue, loss: p.loss };
}

/** Weights and biases of the network plus the weights of its polynomial part. */
function parameterCount(fit: NetworkFit, request: CandidateFitRequest, layout: NetworkLayoutOf): number {
  const hidden = request.approximator.kind === 'network' ? request.approximator.hiddenLayers : [];
  return layout(request.data.stateDim + request.data.actionDim, hidden).size + fit.linearStart.features.dim;
}
