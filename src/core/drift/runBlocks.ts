/**
 * The runs of a log, in run order, split into K consecutive blocks for a per-block estimate whose trend
 * is then forecast (runBlockValues.ts, weightedTrendForecast.ts). The rule (ours; DRIFT_FORECAST in
 * ../limits.ts): K = min(blocks, ⌊E / minBlockRuns⌋), so every block holds enough runs for its own fit;
 * sizes as equal as possible, the earlier blocks taking the extra run (⌊E/K⌋ or ⌈E/K⌉); fewer than
 * `fewestBlocks` blocks: no split (a reason instead). A block's position is the mean 0-based index of its
 * runs, so a forecast at the last run's index E − 1 reads the line where the log ends.
 *
 * Run order is the episodes' order (0 … E − 1): the order the runs first appear in the log.
 */
import { DRIFT_FORECAST } from '../limits';

export interface RunBlocks {
  /** First run of block b and its run count (K each). */
  readonly first: Int32Array;
  readonly size: Int32Array;
  /** Mean run index of block b (K). */
  readonly position: Float64Array;
  /** Index of the last run: where the forecast is read. */
  readonly lastRun: number;
}

export interface RunBlockSettings {
  readonly blocks: number;
  readonly minBlockRuns: number;
  readonly fewestBlocks: number;
}

export function runBlocks(runs: number, settings: RunBlockSettings = DRIFT_FORECAST): RunBlocks | { readonly reason: string } {
  const k = Math.min(settings.blocks, Math.floor(runs / settings.minBlockRuns));
  if (!(k >= settings.fewestBlocks)) {
    return { reason: `${runs} runs make ${Math.max(0, k)} blocks of at least ${settings.minBlockRuns} runs; a trend needs ${settings.fewestBlocks}` };
  }
  const first = new Int32Array(k), size = new Int32Array(k), position = new Float64Array(k), base = Math.floor(runs / k), extra = runs - base * k;
  for (let b = 0, at = 0; b < k; b++) {
    first[b] = at;
    size[b] = base + (b < extra ? 1 : 0);
    position[b] = at + (size[b] - 1) / 2;
    at += size[b];
  }
  return { first, size, position, lastRun: runs - 1 };
}
