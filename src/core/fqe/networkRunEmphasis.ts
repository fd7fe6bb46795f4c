/**
 * Minibatch weights that lean toward the first rows of the logged runs (a method option,
 * networkMethod.ts `runStartEmphasis`; off by default). A share ρ of the rows is drawn from the logged
 * runs' own discounted occupancy from their first rows, row t of a run weighted γ^t, and the rest
 * uniformly:
 *   w_r = (1 − ρ)/n + ρ·γ^{t_r} / Σ_q γ^{t_q},   t_r = the row's place in its run (0 for the run's
 * first logged row, in data order; ../bootstrap/episodeTransitions.ts indexEpisodes).
 * Only the Adam steps (the hidden features) see these weights; the last layer is still the LSTD-Q
 * fixed point under the logged rows, so the estimator's target is unchanged — only which region the
 * features learn first. Measured on the battery (seeds 1–2, J over the start set the runs were logged
 * from, ρ = 0.5 against 0): the pendulum's wide starts went from +4.4 to +1.6 % mean error, but the
 * greenhouse's steady starts from +0.2 to +2.1 % and the pendulum's from −1.8 to −2.6 %, so it stays off.
 */
import { indexEpisodes } from '../bootstrap/episodeTransitions';
import type { TransitionSet } from '../transitions';

/**
 * The cumulative weights (rows, increasing, last = 1) of the training rows `transitions` (indices
 * into data, n of them) for ρ in (0, 1]; null for ρ = 0 (uniform epochs without replacement).
 */
export function runStartEmphasis(data: TransitionSet, transitions: Int32Array, discount: number, rho: number): Float64Array | null {
  if (!(rho > 0)) return null;
  const n = transitions.length, occupancy = new Float64Array(n), place = placeInRun(data);
  let total = 0;
  for (let r = 0; r < n; r++) {
    occupancy[r] = discount ** place[transitions[r]];
    total += occupancy[r];
  }
  const cumulative = new Float64Array(n);
  let running = 0;
  for (let r = 0; r < n; r++) {
    running += (1 - rho) / n + (rho * occupancy[r]) / total;
    cumulative[r] = running;
  }
  cumulative[n - 1] = 1; // rounding
  return cumulative;
}

/** Each transition's place in its run (n): 0, 1, … in data order. */
function placeInRun(data: TransitionSet): Int32Array {
  const { episodes, offsets, order } = indexEpisodes(data), place = new Int32Array(data.count);
  for (let k = 0; k < episodes; k++) for (let p = offsets[k]; p < offsets[k + 1]; p++) place[order[p]] = p - offsets[k];
  return place;
}
