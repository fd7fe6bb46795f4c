/**
 * Logs with stretches in MANUAL (probe40; defined before any estimator ran on them: /work/notes/probe40-rule.md):
 * a plant under its automatic law on every run, but with an operator holding the valve at its last value for
 * 10–40 steps at a time, in stretches scattered through the months (a disturbance, a start-up, an instrument
 * fault), logged in the same columns with no mode flag. The plant and the cost are the same on every row, so
 * the one broken assumption is that every logged action came from one law. The plants: manualStretchPlants.ts.
 *
 * The stretches (`manualStretches`): K = round(share·N / 25) for N logged rows; each draws its length L
 * uniformly from the whole numbers 10..40 (mean 25), then its first row uniformly over the whole log (not in
 * run order), redrawn with the same L until it lies inside one run, begins at the run's second row or later
 * and keeps at least one automatic row between it and every other stretch. The held share is then
 * ΣL / N, whose mean is K·25/N exactly. On a held row the logged action is the action of the row before the
 * stretch (the automatic output when manual began, its dither included); the plant and the cost see it.
 *
 * The log draws the automatic action on every row, held or not, in episodeLog.ts's order (the run's burn-in
 * start; per step the action, then the process noise; brokenLog.ts's logger keeps it), so its random stream is
 * the plant's own log's: with share 0 the log is the plant's, bit for bit, and the run starts are the same.
 */
import type { GaussianPolicySpec } from '../../../src/core/policy';
import { createRandom } from '../../../src/core/random';
import type { TransitionSet } from '../../../src/core/transitions';
import type { PlantDynamics } from '../episodeLog';
import { logBrokenRuns, steadyRun } from './brokenLog';

/** A stretch's length in steps, drawn uniformly from the whole numbers shortest..longest. */
export const MANUAL_STEPS = { shortest: 10, longest: 40 } as const;
export const MEAN_MANUAL_STEPS = (MANUAL_STEPS.shortest + MANUAL_STEPS.longest) / 2;
/** Added to the log's seed for the stretches' own random stream, so the log's stream is the control's. */
const STRETCH_SEED_OFFSET = 0x4d414e55;
const MAX_PLACEMENT_TRIES = 1_000_000;

/** Rows [start, start + length) of the log are held; start is a row index over the whole log. */
export interface ManualStretch {
  readonly start: number;
  readonly length: number;
}

/** The stretches of a log of `runs` runs of `steps` rows holding `share` of its rows on average (the rule above). */
export function manualStretches(runs: number, steps: number, share: number, seed: number): ManualStretch[] {
  const rows = runs * steps, count = Math.round((share * rows) / MEAN_MANUAL_STEPS);
  const rng = createRandom(seed + STRETCH_SEED_OFFSET), taken = new Uint8Array(rows), out: ManualStretch[] = [];
  const span = MANUAL_STEPS.longest - MANUAL_STEPS.shortest + 1;
  for (let k = 0; k < count; k++) {
    const length = MANUAL_STEPS.shortest + rng.integer(span);
    for (let tries = 0; ; tries++) {
      if (tries === MAX_PLACEMENT_TRIES) throw new Error(`manualStretches: no room for stretch ${k} of ${count}`);
      const start = rng.integer(rows), step = start % steps;
      if (step < 1 || step + length > steps || !clear(taken, start - 1, start + length)) continue;
      taken.fill(1, start, start + length);
      out.push({ start, length });
      break;
    }
  }
  return out;
}

/** No held row in [from, to] (both ends included; rows past the log are clear). */
function clear(taken: Uint8Array, from: number, to: number): boolean {
  for (let i = from; i <= Math.min(to, taken.length - 1); i++) if (taken[i]) return false;
  return true;
}

/** The log and which of its rows were held (1) — the mask a project never sees. */
export interface ManualLog {
  readonly data: TransitionSet;
  readonly held: Uint8Array;
  readonly stretches: readonly ManualStretch[];
}

/** What the logger needs of a plant: its dynamics, automatic law, and the burn-in its runs start from. */
export interface ManualLogPlant {
  readonly dynamics: PlantDynamics;
  readonly behaviour: GaussianPolicySpec;
  readonly operatingState: readonly number[];
  readonly burnIn: number;
  readonly stateNames: readonly string[];
  readonly actionNames: readonly string[];
}

/**
 * `runs` runs of `steps` rows of the plant under its automatic law from its burn-in start, the stretches' rows
 * held: brokenLog.ts's logger with one run condition whose plant, on a held row, replaces the action it is handed
 * (the law's draw) by the action logged before the stretch — in place, so the log records what the plant got.
 */
export function logManualRuns(plant: ManualLogPlant, runs: number, steps: number, share: number, seed: number): ManualLog {
  const m = plant.dynamics.actionDim, count = runs * steps;
  const stretches = manualStretches(runs, steps, share, seed), held = new Uint8Array(count), heldFrom = new Int32Array(count).fill(-1);
  for (const s of stretches) { held.fill(1, s.start, s.start + s.length); heldFrom.fill(s.start - 1, s.start, s.start + s.length); }
  const given = new Float64Array(count * m);
  let row = 0;
  const dynamics: PlantDynamics = {
    stateDim: plant.dynamics.stateDim, actionDim: m,
    step(x, a, rng, next) {
      if (held[row]) a.set(given.subarray(heldFrom[row] * m, heldFrom[row] * m + m));
      given.set(a, row++ * m);
      return plant.dynamics.step(x, a, rng, next);
    },
  };
  const automatic = steadyRun(plant.dynamics, plant.behaviour, plant.operatingState, plant.burnIn), run = { ...automatic, dynamics };
  const data = logBrokenRuns({ episodes: runs, stepsPerEpisode: steps, seed, stateNames: plant.stateNames, actionNames: plant.actionNames, runConditions: () => run });
  return { data, held, stretches };
}
