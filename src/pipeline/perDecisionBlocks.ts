/**
 * The share of the resample loop (assessResamples.ts) a helper thread can take — the per-decision
 * cross-checks and, where the loop has one, the linear-quadratic model (modelBlocks.ts) — written
 * once for whichever thread runs it: block by block, the same multiplicities (episodeMultiplicities draws
 * resample b from its own seeded stream, so any thread draws the same ones) and the same
 * perDecisionResamples on the same ranked entries (and modelBlock on the same moments). A helper
 * thread runs `helperBlocks` ahead of the loop; the loop's own route calls `shareOfBlock`; the numbers are the same to the last
 * bit because the function and its inputs are.
 *
 * What crosses a thread boundary is plain data: the job (its ranked tables transferred, not
 * copied: `transferables`) and each block's outcomes, an ImportanceSamplingError as its message,
 * and the model's values.
 */
import { episodeMultiplicities } from '../core/bootstrap/episodeMultiplicities';
import { ImportanceSamplingError, type PerDecisionEstimates } from '../core/offPolicy/perDecisionEstimators';
import { perDecisionResamples, RESAMPLE_BLOCK, type ResampleEntries } from '../core/offPolicy/perDecisionResamples';
import { modelBlock, modelTransferables, type ModelBlockValues, type ModelJob } from './modelBlocks';

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

/** Every block of the job in order, ready to send: what a helper thread runs. */
export function* helperBlocks(job: ResampleJob): Generator<SentBlock, void, void> {
  const block = Array.from({ length: RESAMPLE_BLOCK }, () => new Uint32Array(job.episodes));
  for (let first = 0; first < job.resamples; first += RESAMPLE_BLOCK) {
    const share = shareOfBlock(job, drawBlock(job.episodes, job.seed, first, job.resamples, block));
    yield { first, outcomes: share.perDecision.map((row) => row.map(sendOutcome)), models: share.models };
  }
}

export function sendOutcome(outcome: PerDecisionOutcome): SentOutcome {
  return outcome instanceof ImportanceSamplingError ? { failure: outcome.message } : outcome;
}

export function receiveOutcome(sent: SentOutcome): PerDecisionOutcome {
  return 'failure' in sent ? new ImportanceSamplingError(sent.failure) : sent;
}

/** The buffers of the job's ranked tables and model moments, each once: a host transfers these instead of copying them. */
export function transferables(job: ResampleJob): ArrayBuffer[] {
  const buffers = new Set<ArrayBuffer>(job.model ? modelTransferables(job.model) : []);
  for (const en of job.entries) {
    for (const a of [en.reaching, en.offsets, en.rankOf, en.weight, en.weightedReward, en.weightedAction, en.weightedState, en.endRank, en.endWeightedValue]) {
      if (a && a.buffer instanceof ArrayBuffer) buffers.add(a.buffer);
    }
  }
  return [...buffers];
}
