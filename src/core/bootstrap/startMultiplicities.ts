/**
 * Start states resampled with their episodes when not every episode has one (an episode whose
 * first row was excluded keeps its transitions but has no start state; TransitionSet.startEpisode).
 * A resample's multiplicities are per episode (e); the start states' are those of their episodes.
 */

/** Per-start-state multiplicities: multiplicities (e) mapped through startEpisode (k); the same array when it is absent. */
export function startMultiplicities(multiplicities: ArrayLike<number>, startEpisode?: Int32Array): ArrayLike<number> {
  if (!startEpisode) return multiplicities;
  return Float64Array.from(startEpisode, (e) => multiplicities[e]);
}

/** True when the resample holds at least one start state (some multiplicity > 0). */
export function holdsStartState(multiplicities: ArrayLike<number>): boolean {
  for (let s = 0; s < multiplicities.length; s++) if (multiplicities[s] > 0) return true;
  return false;
}
