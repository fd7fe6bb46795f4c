/** A candidate as written in the project document → the engine's Gaussian policy. */
import { createGaussianPolicy, type GaussianPolicy } from '../core/policy';
import type { CandidateSpec } from '../project/schema';

export function candidatePolicy(candidate: CandidateSpec, stateDim: number): GaussianPolicy {
  const bounds = candidate.bounds && {
    lo: candidate.bounds.lo.map((v) => v ?? -Infinity),
    hi: candidate.bounds.hi.map((v) => v ?? Infinity),
    mode: candidate.bounds.mode,
  };
  return createGaussianPolicy({ offset: candidate.offset, gain: candidate.gain, std: candidate.std, bounds }, stateDim);
}
