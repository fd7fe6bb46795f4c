/** Dispatch a candidate's fit to the approximator the project asks for. */
import type { CandidateFit, CandidateFitRequest } from './candidateFit';
import { fitLinearCandidate } from './fitLinearCandidate';

export async function fitCandidate(request: CandidateFitRequest): Promise<CandidateFit> {
  switch (request.approximator.kind) {
    case 'linear':
      return fitLinearCandidate(request);
    case 'network':
      throw new UnsupportedApproximatorError('the network approximator is not available in this build');
  }
}

export class UnsupportedApproximatorError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UnsupportedApproximatorError';
  }
}
