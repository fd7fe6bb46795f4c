/**
 * The share of the resample loop (assessResamples.ts) a helper thread can take — the per-decision
 * cross-checks and, where the loop has them, the linear-quadratic model (modelBlocks.ts) and, after
 * the last block, the rollout check's simulations (rolloutValues.ts) — written once for whichever
 * thread runs it: block by block, the same multiplicities (episodeMultiplicities draws resample b
 * from its own seeded stream, so any thread draws the same ones) and the same perDecisionResamples
 * on the same ranked entries (modelBlock on the same moments). A helper thread runs `helperBlocks`
 * ahead of the loop; the loop's own route calls `shareOfBlock` (and rolloutValues); the numbers are
 * the same to the last bit because the functions and their inputs are.
 *
 * What crosses a thread boundary is plain data: the job (its ranked tables and moments transferred,
 * not copied: `transferables`) and each block's outcomes, an ImportanceSamplingError as its
 * message, the model's values, and the rollouts' values or reasons.
 */
import { episodeMultiplicities } from '../core/bootstrap/episodeMultiplicities';
import { ImportanceSamplingError, type PerDecisionEstimates } from '../core/offPolicy/perDecisionEstimators';
import { perDecisionResamples, RESAMPLE_BLOCK, type ResampleEntries } from '../core/offPolicy/perDecisionResamples';
import { spanBuffers } from '../core/offPolicy/unitWeightSpans';
import { modelBlock, modelTransferables, type ModelBlockValues, type ModelJob } from './modelBlocks';
import { rolloutValues, type RolloutJob, type RolloutValues } from './rolloutValues';

/** Everything a thread needs to compute every block's share on its own. */
export interface ResampleJob {
  /** One per policy with per-decision inputs, in the loop's order. */
  readonly entries: readonly ResampleEntries[];
  readonly discount: number;
  readonly episodes: number;
  readonly seed: number;
  readonly resamples: number;
  /** The linear-quadratic model's replicates, where the loop has the model; else null. */
  readonly model: ModelJob | null;
  /** The rollout check's simulations (rolloutValues.ts), answered after the last block; null without a one-step model. */
  readonly rollouts: RolloutJob | null;
}

/** The rollout check's simulations as a helper answers them, after the last block. */
export interface SentRollouts {
  readonly rollouts: RolloutValues[];
}

export type PerDecisionOutcome = PerDecisionEstimates | ImportanceSamplingError;
/** An outcome as it crosses a thread boundary: the estimates, or the error's message. */
export type SentOutcome = PerDecisionEstimates | { failure: string };

/** One block's outcomes, per job entry then per resample of the block; the model's values (null without a model job). */
export interface SentBlock {
  readonly first: number;
  readonly outcomes: SentOutcome[][];
  readonly models: ModelBlockValues | null;
}

/** One block's share as the loop takes it. */
export interface BlockShare {
  readonly perDecision: PerDecisionOutcome[][];
  readonly models: ModelBlockValues | null;
}

/** Resamples first … first + count − 1 drawn into `block`'s arrays (count ≤ RESAMPLE_BLOCK); returns the ones used. */
export function drawBlock(episodes: number, seed: number, first: number, resamples: number, block: Uint32Array<ArrayBuffer>[]): Uint32Array<ArrayBuffer>[] {
  const drawn = block.slice(0, Math.min(RESAMPLE_BLOCK, resamples - first));
  drawn.forEach((c, i) => episodeMultiplicities(episodes, seed, first + i, c));
  return drawn;
}

/** Per job entry, the block's per-decision outcomes. */
export function perDecisionBlock(job: Pick<ResampleJob, 'entries' | 'discount'>, drawn: readonly Uint32Array[]): PerDecisionOutcome[][] {
  return job.entries.map((entries) => perDecisionResamples(entries, job.discount, drawn));
}

/** The block's share: its per-decision outcomes, then the model's values. */
export function shareOfBlock(job: Pick<ResampleJob, 'entries' | 'discount' | 'model'>, drawn: readonly Uint32Array[]): BlockShare {
  const perDecision = perDecisionBlock(job, drawn);
  return { perDecision, models: job.model && modelBlock(job.model, drawn) };
}

/** Every block of the job in order, then the rollouts, ready to send: what a helper thread runs. */
export function* helperBlocks(job: ResampleJob): Generator<SentBlock | SentRollouts, void, void> {
  const block = Array.from({ length: RESAMPLE_BLOCK }, () => new Uint32Array(job.episodes));
  for (let first = 0; first < job.resamples; first += RESAMPLE_BLOCK) {
    const share = shareOfBlock(job, drawBlock(job.episodes, job.seed, first, job.resamples, block));
    yield { first, outcomes: share.perDecision.map((row) => row.map(sendOutcome)), models: share.models };
  }
  if (job.rollouts) yield { rollouts: rolloutValues(job.rollouts) };
}

export function sendOutcome(outcome: PerDecisionOutcome): SentOutcome {
  return outcome instanceof ImportanceSamplingError ? { failure: outcome.message } : outcome;
}

export function receiveOutcome(sent: SentOutcome): PerDecisionOutcome {
  return 'failure' in sent ? new ImportanceSamplingError(sent.failure) : sent;
}

/**
 * The buffers of the job's ranked tables and models' moments, each once: a host transfers these
 * instead of copying them. The rollouts' columns are the loop's own data and are copied.
 */
export function transferables(job: ResampleJob): ArrayBuffer[] {
  const buffers = new Set<ArrayBuffer>(job.model ? modelTransferables(job.model) : []);
  for (const en of job.entries) {
    for (const a of [en.reaching, en.offsets, en.rankOf, en.weight, en.weightedReward, en.weightedAction, en.weightedState, en.endRank, en.endWeightedValue, en.absorbedRank, en.cutRank]) {
      if (a && a.buffer instanceof ArrayBuffer) buffers.add(a.buffer);
    }
    for (const b of spanBuffers(en.spans)) if (b instanceof ArrayBuffer) buffers.add(b);
  }
  return [...buffers];
}
