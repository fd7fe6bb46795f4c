/**
 * A network fit's J on the assessment's own resamples of the runs, so that it pairs with every
 * other estimate of the same resamples — the present controller's, the other candidates' — as the
 * linear fits' replicates do (Efron & Tibshirani 1993, §14.1, paired comparisons from common
 * resamples). Without it a network project's differences from the present controller had no
 * interval, no candidate could be named for a trial, and the ranking had no frequency.
 *
 * The last-layer solve is resampled as for the fit's own interval (src/core/fqe/networkInterval.ts),
 * which covers which runs happened to be logged. Two parts it does not see are added as the fit's own
 * interval adds them (networkValueEstimate.ts): the training's randomness, the spread of J over its
 * iterates, is drawn afresh for each resample (a normal draw of that standard deviation, independent
 * between fits since each network is trained on its own — two independent variances add; common
 * practice), so differences, "better in" shares and the ranking's frequency carry it; and the bounds
 * of unknown sign — how far the stopping rule lets J still move, and the class-error allowance where
 * the network and the linear estimate disagree — are kept apart as `allowance`, added to both ends
 * of any difference's interval (assessIntervals.ts), never averaged away.
 */
import type { ValueInterval } from '../core/fqe/networkValueEstimate';
import { resampleSeed } from '../core/bootstrap/episodeMultiplicities';
import { createRandom } from '../core/random';
import type { CandidateWork } from './assessCandidate';
import type { AssessmentSettings } from './assessSettings';
import type { Replicates } from './assessResamples';

export interface NetworkRunResamples {
  /** J's interval at the assessment's level from these resamples, widened as the fit's own (reward sense). */
  readonly interval: ValueInterval;
  readonly covers: string;
  /** J on each resample with a draw of the training's randomness added (reward sense); null where there was no solution. */
  readonly replicates: Replicates;
  /** Value units, ≥ 0: the stopping rule's drift and the class-error allowance, added to both ends of a difference's interval. */
  readonly allowance: number;
}

/** Keeps the training-noise draws apart from every resample stream (resampleSeed of the run's own seed). */
const TRAINING_NOISE_STREAM = 0x6e6f6973;

/** null for a fit that is not a network, or one whose resamples could not be drawn over the runs. */
export function networkRunResamples(work: CandidateWork, runs: number, settings: AssessmentSettings, index: number): NetworkRunResamples | null {
  const fit = work.model.fit;
  if (!fit.resampleByRuns) return null;
  const e = fit.resampleByRuns({ runs, resamples: settings.resamples, seed: settings.seed, level: settings.level });
  if (!e.replicates) return null;
  const scale = Math.abs(e.value), refitError = e.parts.iterateSpread * scale;
  const noise = createRandom(resampleSeed(settings.seed ^ TRAINING_NOISE_STREAM, index));
  return {
    interval: e.interval, covers: e.covers,
    replicates: e.replicates.map((v) => (v === null ? null : v + refitError * noise.normal())),
    allowance: (e.parts.driftAllowance + e.parts.classErrorAllowance) * scale,
  };
}
