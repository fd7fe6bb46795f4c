/**
 * Runs that really end: transitions into an absorbing state (terminal = 1 in a TransitionSet — the
 * batch is done, the unit is shut down — after which nothing more is paid; V = 0 there). Where a log
 * holds any, a run's discounted return stops at a random step T ≥ 1 instead of going on forever,
 * which changes what a value can be (diagnostics/possibleValues.ts), what a model of the plant must
 * simulate (the chance of the end as well as the next state: offPolicy/endChanceModel.ts; the
 * linear-quadratic closed form has none and does not apply), and how importance
 * weights are normalised: weighted per-decision importance sampling normalises step t over the
 * runs present at t, and a run that ended pays 0 from there and must stay among them, else the
 * estimate is E_π[r_t | the run still going] without the factor P_π(still going at t); such runs
 * are padded with the absorbing state (Thomas & Brunskill, ICML 2016), weighted where other runs' logs
 * are cut early by a time limit by the chance that their log would have gone on
 * (offPolicy/perDecisionEstimators.ts, offPolicy/importanceWeights.ts).
 */

/** Transitions whose next state is absorbing. terminal: n, 0/1. */
export function absorbingEndCount(terminal: Uint8Array): number {
  let count = 0;
  for (let i = 0; i < terminal.length; i++) if (terminal[i] !== 0) count++;
  return count;
}

function endsText(count: number): string {
  return count === 1 ? '1 logged transition ends its run' : `${count.toLocaleString('en-US')} logged transitions end their run`;
}

/** Why the linear-quadratic closed form does not apply to a log whose runs end (count ≥ 1 such transitions). */
export function absorbingEndsReason(count: number): string {
  return `${endsText(count)} in an end state (the end-of-run column), and this closed form is for a plant that goes on, not one whose runs end: it would go on paying past the end`;
}
