/** Dispatch a candidate's fit to the approximator the project asks for. */
import type { CandidateFit, CandidateFitRequest } from './candidateFit';
import { fitLinearCandidate } from './fitLinearCandidate';
import { fitNetworkCandidate } from './fitNetworkCandidate';

export async function fitCandidate(request: CandidateFitRequest): Promise<CandidateFit> {
  switch (request.approximator.kind) {
    case 'linear':
      return fitLinearCandidate(request);
    case 'network':
      return fitNetworkCandidate(request);
  }
}
