/**
 * The per-decision cross-checks' share of the resample loop (assessResamples.ts), written once for
 * whichever thread runs it: block by block, the same multiplicities (episodeMultiplicities draws
 * resample b from its own seeded stream, so any thread draws the same ones) and the same
 * perDecisionResamples on the same ranked entries. A helper thread runs `perDecisionBlocks` ahead
 * of the loop; the loop's own route calls `perDecisionBlock`; the numbers are the same to the last
 * bit because the function and its inputs are.
 *
 * What crosses a thread boundary is plain data: the job (its ranked tables transferred, not
 * copied: `transferables`) and each block's outcomes, an ImportanceSamplingError as its message.
 */
import { episodeMultiplicities } from '../core/bootstrap/episodeMultiplicities';
import { ImportanceSamplingError, type PerDecisionEstimates } from '../core/offPolicy/perDecisionEstimators';
import { perDecisionResamples, RESAMPLE_BLOCK, type ResampleEntries } from '../core/offPolicy/perDecisionResamples';

/** Everything a thread needs to compute every block's per-decision estimates on its own. */
export interface PerDecisionJob {
  /** One per policy with per-decision inputs, in the loop's order. */
  readonly entries: readonly ResampleEntries[];
  readonly discount: number;
  readonly episodes: number;
  readonly seed: number;
  readonly resamples: number;
}

export type PerDecisionOutcome = PerDecisionEstimates | ImportanceSamplingError;
/** An outcome as it crosses a thread boundary: the estimates, or the error's message. */
export type SentOutcome = PerDecisionEstimates | { failure: string };

/** One block's outcomes, per job entry then per resample of the block. */
export interface SentBlock {
  readonly first: number;
  readonly outcomes: SentOutcome[][];
}

/** Resamples first … first + count − 1 drawn into `block`'s arrays (count ≤ RESAMPLE_BLOCK); returns the ones used. */
export function drawBlock(episodes: number, seed: number, first: number, resamples: number, block: Uint32Array<ArrayBuffer>[]): Uint32Array<ArrayBuffer>[] {
  const drawn = block.slice(0, Math.min(RESAMPLE_BLOCK, resamples - first));
  drawn.forEach((c, i) => episodeMultiplicities(episodes, seed, first + i, c));
  return drawn;
}

/** Per job entry, the block's per-decision outcomes. */
export function perDecisionBlock(job: Pick<PerDecisionJob, 'entries' | 'discount'>, drawn: readonly Uint32Array[]): PerDecisionOutcome[][] {
  return job.entries.map((entries) => perDecisionResamples(entries, job.discount, drawn));
}

/** Every block of the job in order, ready to send: what a helper thread runs. */
export function* perDecisionBlocks(job: PerDecisionJob): Generator<SentBlock, void, void> {
  const block = Array.from({ length: RESAMPLE_BLOCK }, () => new Uint32Array(job.episodes));
  for (let first = 0; first < job.resamples; first += RESAMPLE_BLOCK) {
    const outcomes = perDecisionBlock(job, drawBlock(job.episodes, job.seed, first, job.resamples, block));
    yield { first, outcomes: outcomes.map((row) => row.map(sendOutcome)) };
  }
}

export function sendOutcome(outcome: PerDecisionOutcome): SentOutcome {
  return outcome instanceof ImportanceSamplingError ? { failure: outcome.message } : outcome;
}

export function receiveOutcome(sent: SentOutcome): PerDecisionOutcome {
  return 'failure' in sent ? new ImportanceSamplingError(sent.failure) : sent;
}

/** The buffers of the job's ranked tables, each once: a host transfers these instead of copying them. */
export function transferables(job: PerDecisionJob): ArrayBuffer[] {
  const buffers = new Set<ArrayBuffer>();
  for (const en of job.entries) {
    for (const a of [en.reaching, en.offsets, en.rankOf, en.weight, en.weightedReward, en.weightedAction, en.weightedState, en.endRank, en.endWeightedValue]) {
      if (a && a.buffer instanceof ArrayBuffer) buffers.add(a.buffer);
    }
  }
  return [...buffers];
}
