/**
 * Which linear FQE solution is reported and what it is called (the rule is stated in
 * linearModel.ts): the converged iterate; the fixed point when the iteration provably contracts but
 * stopped at its limit; the last iterate, not converged, when it stopped without that proof; the
 * fixed point with a warning when it diverged.
 */
import { FqeDataError } from '../../core/fqe/fqeErrors';
import type { LinearFqeSolution, LinearSolveResult } from '../../core/fqe/linearFqeSolve';
import type { FitStatus } from '../estimates';

export interface ReportedSolution {
  readonly solution: LinearFqeSolution;
  readonly status: FitStatus;
  readonly message: string;
  readonly warnings: string[];
}

export function reportedSolution(solved: LinearSolveResult, tolerance: number): ReportedSolution {
  const { iterative, fixedPoint, status, spectralRadiusBound: rho } = solved;
  if (status === 'converged' && iterative) return { solution: iterative, status, message: solved.message, warnings: [] };
  if (status === 'maxIterations' && rho < 1 && fixedPoint) {
    const last = solved.history[solved.history.length - 1]?.weightChange ?? 1;
    const more = Math.max(1, Math.ceil(Math.log(tolerance / last) / Math.log(rho)));
    return {
      solution: fixedPoint, status: 'converged', warnings: [],
      message: `Fitted Q-evaluation solved at its fixed point: the iteration provably contracts (by a factor of at most ${rho.toPrecision(3)} per step), ` +
        `so its limit is the LSTD-Q fixed point, solved directly; iterating to the tolerance would have taken about ${more.toLocaleString('en-US')} more steps.`,
    };
  }
  if (iterative) return { solution: iterative, status, message: solved.message, warnings: [] };
  if (!fixedPoint) throw new FqeDataError(`${solved.message} ${solved.fixedPointMessage}`);
  return { solution: fixedPoint, status, message: solved.message, warnings: [`Reported value is the fixed-point solution: ${fixedPoint.warning}.`] };
}
