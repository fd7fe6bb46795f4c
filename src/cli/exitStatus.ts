/**
 * The command line's exit status once results were printed (README, "Exit status"): 0 when every
 * fit met its convergence rule; 3 when at least one did not — it diverged, or stopped at its
 * iteration limit without converging — so its value is not the fit's answer (its message says why;
 * the other results are still printed). 1, 2 and 130 end a run before any result; 141 ends it when
 * the reader of its output has gone (closedOutput.ts).
 */
import type { Evaluation } from '../pipeline/estimates';

export const EXIT = { ok: 0, badInput: 1, usage: 2, notConverged: 3, cancelled: 130, outputClosed: 141, internal: 70 } as const;

export function exitStatusOf(evaluation: Evaluation): number {
  return evaluation.policies.every((p) => p.status === 'converged') ? EXIT.ok : EXIT.notConverged;
}
