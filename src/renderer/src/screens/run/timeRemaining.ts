/**
 * How long an evaluation still needs, from its progress reports. A linear fitted Q-evaluation
 * converges geometrically, ‖w_{k+1} − w_k‖/‖w_k‖ ≈ C·ρ^k with ρ the contraction factor of the
 * projected Bellman operator (common practice; Bertsekas & Tsitsiklis, "Neuro-Dynamic
 * Programming", 1996, §6.3), so log(weight change) falls linearly in k and the iteration that reaches
 * the tolerance is extrapolated from the last two reports. A network fit runs its outer iterations
 * (an upper bound: early stopping may end it sooner). Later candidates are assumed to take as
 * long as the ones seen so far.
 */
import type { RunProgress } from '../../../../shared/workerMessages';

/**
 * Position of a report within its candidate's fit, counting the iterations of a network fit's
 * earlier members at their limit (an upper bound, as the limit is).
 */
export function iterationWithinFit(r: RunProgress): number {
  const it = r.iteration;
  if (!it) return 0;
  return it.member && r.outerIterations !== null ? (it.member.index - 1) * r.outerIterations + it.iteration : it.iteration;
}

/** Iterations still to go for the candidate of the last report, or null when unknown. */
export function iterationsRemaining(reports: readonly RunProgress[]): number | null {
  const last = reports[reports.length - 1];
  if (!last?.iteration) return null;
  const k = last.iteration.iteration;
  if (last.outerIterations !== null) return Math.max(0, last.outerIterations * (last.iteration.member?.count ?? 1) - iterationWithinFit(last));
  if (last.maxIterations === null) return null;
  const cap = Math.max(0, last.maxIterations - k);
  const previous = [...reports].reverse().find((r) => r.candidateIndex === last.candidateIndex && r.iteration && r.iteration.iteration < k);
  const w2 = last.iteration.weightChange, w1 = previous?.iteration?.weightChange;
  if (!previous?.iteration || w1 == null || w2 == null || last.tolerance === null || !(w1 > 0) || !(w2 > 0)) return cap;
  const rate = (Math.log(w2) - Math.log(w1)) / (k - previous.iteration.iteration);
  if (!(rate < 0)) return cap;
  const needed = (Math.log(last.tolerance) - Math.log(w2)) / rate;
  return Math.min(cap, Math.max(0, Math.ceil(needed)));
}

/**
 * Milliseconds still to go for the whole evaluation, or null when it cannot be told yet.
 * startsMs[c]: elapsed time at which candidate c started (its first report).
 */
export function timeRemainingMs(reports: readonly RunProgress[], startsMs: readonly number[]): number | null {
  const last = reports[reports.length - 1];
  const remaining = iterationsRemaining(reports);
  if (!last?.iteration || remaining === null) return null;
  const oldest = reports.find((r) => r.candidateIndex === last.candidateIndex);
  const started = startsMs[last.candidateIndex] ?? oldest?.elapsedMs;
  if (!oldest || started === undefined) return null;
  const done = iterationWithinFit(last) - iterationWithinFit(oldest);
  if (done <= 0) return null;
  const perIteration = (last.elapsedMs - oldest.elapsedMs) / done;
  const current = remaining * perIteration;
  const currentTotal = last.elapsedMs - started + current;
  const later = last.candidateCount - last.candidateIndex - 1;
  // Candidates already finished say how long one takes; with none yet, the current one does.
  const perCandidate = last.candidateIndex > 0 ? (started / last.candidateIndex + currentTotal) / 2 : currentTotal;
  return current + later * perCandidate;
}
