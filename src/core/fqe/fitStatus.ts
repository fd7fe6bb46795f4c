/**
 * How a fit ended, one name for every approximator and host:
 *   converged      the fit met its stated convergence rule (linear: src/pipeline/model/linearModel.ts;
 *                  network: networkIterations.ts), so its value is the fit's answer;
 *   maxIterations  it stopped at its iteration limit without meeting the rule: not converged;
 *   diverged       it stopped because its values left any possible range; what is kept is flagged.
 * A fit the user stops ends 'cancelled' and reports no value. A linear bootstrap resample may also be
 * 'singular' (no solution on that resample; linearFqeReplicate.ts).
 */
export type FitStatus = 'converged' | 'maxIterations' | 'diverged';

/** The words a reader sees for each status, in the app, the report and the command line's notes (one source). */
export const FIT_STATUS_WORDS: Readonly<Record<FitStatus, string>> = { converged: 'converged', maxIterations: 'stopped at its iteration limit', diverged: 'diverged' };

/** A fit that may also have been stopped by the user. */
export type FitOutcome = FitStatus | 'cancelled';

/** The linear FQE iteration's name for the same statuses. */
export type FqeStatus = FitStatus;
