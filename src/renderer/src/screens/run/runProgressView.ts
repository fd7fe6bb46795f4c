/** The numbers the progress panel shows, from the run's latest reports. */
import type { RunProgress } from '../../../../shared/workerMessages';
import { iterationsRemaining, iterationWithinFit, timeRemainingMs } from './timeRemaining';

export interface ProgressView {
  candidate: string;
  candidateNumber: number; // 1-based
  candidateCount: number;
  iteration: number | null;
  /** "fit 2 of 2" while a network fit of several members runs its later ones; null otherwise. */
  member: string | null;
  /** Share of the data pass done (0…1) while a linear fit reads the transitions; null otherwise. */
  dataPass: number | null;
  bellmanResidual: number | null;
  weightChange: number | null;
  elapsedMs: number;
  remainingMs: number | null;
  /** Share of the whole run done, 0…1. */
  fraction: number;
}

export function progressView(reports: readonly RunProgress[], startsMs: readonly number[]): ProgressView | null {
  const last = reports[reports.length - 1];
  if (!last) return null;
  const iteration = last.iteration?.iteration ?? null;
  const remaining = iterationsRemaining(reports);
  const position = last.iteration ? iterationWithinFit(last) : null;
  const withinCandidate = position !== null && remaining !== null ? position / (position + remaining) : 0.5 * (last.dataPass ? last.dataPass.done / last.dataPass.total : 0);
  return {
    candidate: last.candidate,
    candidateNumber: last.candidateIndex + 1,
    candidateCount: last.candidateCount,
    iteration,
    member: last.iteration?.member ? `fit ${last.iteration.member.index} of ${last.iteration.member.count}` : null,
    dataPass: last.dataPass ? last.dataPass.done / last.dataPass.total : null,
    bellmanResidual: last.iteration?.bellmanResidual ?? null,
    weightChange: last.iteration?.weightChange ?? null,
    elapsedMs: last.elapsedMs,
    remainingMs: timeRemainingMs(reports, startsMs),
    fraction: Math.min(1, (last.candidateIndex + withinCandidate) / last.candidateCount),
  };
}
