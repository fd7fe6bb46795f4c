/** One candidate by neural-network fitted Q-evaluation with TensorFlow.js (src/core/fqe/networkFqe.ts). */
import { createActionQuadrature } from '../core/actionQuadrature';
import { FqeCancelledError } from '../core/fqe/fqeErrors';
import { fitNetworkFqe } from '../core/fqe/networkFqe';
import { policyValue } from '../core/value';
import type { CandidateFit, CandidateFitRequest } from './candidateFit';

export async function fitNetworkCandidate(request: CandidateFitRequest): Promise<CandidateFit> {
  const settings = request.approximator;
  if (settings.kind !== 'network') throw new Error('fitNetworkCandidate: expected network approximator settings');
  const { kind: _kind, ...networkSettings } = settings;
  const fit = await fitNetworkFqe({
    data: request.data, policy: request.policy, discount: request.discount, quadratureNodes: request.quadratureNodes,
    seed: request.seed, settings: networkSettings, isCancelled: request.cancel, wasmPath: request.wasmPath,
    onProgress: request.onIteration && ((p) => request.onIteration!({
      iteration: p.iteration, weightChange: null, bellmanResidual: p.heldOutBellmanError, policyValue: null, loss: p.loss,
    })),
  });
  if (fit.status === 'cancelled') {
    fit.dispose();
    throw new FqeCancelledError();
  }
  try {
    const j = policyValue(fit.actionValue, request.policy, request.startStates, createActionQuadrature(request.policy, request.quadratureNodes));
    return {
      q: fit.actionValue,
      status: fit.status,
      message: fit.message,
      history: fit.history.map((h) => ({ iteration: h.iteration, weightChange: null, bellmanResidual: h.heldOutBellmanError, policyValue: null, loss: h.loss })),
      policyValue: j.value,
      standardError: j.standardError,
      fixedPointValue: null,
      featureCount: networkParameterCount(request.data.stateDim + request.data.actionDim, settings.hiddenLayers),
      backend: `TensorFlow.js ${fit.backend}`,
      warnings: fit.backendNote ? [fit.backendNote] : [],
      dispose: () => fit.dispose(),
    };
  } catch (e) {
    fit.dispose();
    throw e;
  }
}

/** Weights and biases of a fully connected network inputs → hidden… → 1. */
function networkParameterCount(inputs: number, hidden: readonly number[]): number {
  const widths = [inputs, ...hidden, 1];
  let count = 0;
  for (let i = 1; i < widths.length; i++) count += widths[i - 1] * widths[i] + widths[i];
  return count;
}
