/**
 * The network's last layer kept within the values a policy can have. The LSTD-Q fixed point over
 * [quadratic part, hidden features] (networkLastLayer.ts) solves (G − M + Λ)v = b; off-policy, G − M
 * need not be positive definite (Sutton, Maei & Szepesvári, NeurIPS 2008, on the instability of
 * off-policy linear TD), and with many random hidden features at the first iterate it can be nearly
 * singular in a few hidden directions, so v is huge there and Q leaves the range no policy can
 * reach (|Q| ≤ max|r|/(1 − γ) on every row; the loop's check allows twice that). Seen on an invented
 * steam-drum hold-out (test/battery/holdout/steamDrumPlant.ts, seed 1, the candidate within the
 * logged actions): |Q| = 190 at the first iterate against a limit of 102, and the whole fit stopped
 * there with no value, while the quadratic part alone and later iterates were sound.
 *
 * The rule (ours, a stated choice): when the iterate at the default hidden ridge λ_h fails the
 * value check (or cannot be solved), solve again with λ_h × RIDGE_LADDER_FACTOR, up to
 * RIDGE_LADDER_RUNGS times, and keep the first rung that passes. Ridge-regularised LSTD is the
 * usual cure for an ill-posed fixed point (Farahmand, Ghavamzadeh, Szepesvári & Mannor, NeurIPS
 * 2008, regularised policy iteration); as λ_h grows the hidden weights shrink to zero and the
 * iterate tends to the polynomial part's own fixed point, which the loop started from. An iterate
 * that passes at the default λ_h is solved exactly as before, so every fit that never needed it is
 * unchanged; the rungs used are reported with the fit (the message names them).
 */
import type { HigherTermRidge } from './networkHigherTermRidge';
import { solveLastLayer } from './networkLastLayer';
import type { LastLayer } from './networkOutputLayer';

/** Factor between rungs, and how many rungs above the default (10⁻² → 10² at the default λ_h). */
export const RIDGE_LADDER_FACTOR = 10;
export const RIDGE_LADDER_RUNGS = 4;

export interface LadderStep<V> {
  readonly lastLayer: LastLayer;
  readonly values: V;
  /** The hidden ridge used; the default unless the ladder was climbed. */
  readonly hiddenRidge: number;
}

/**
 * The first rung whose iterate `passes`, or the failure at the default ridge (its words are what the
 * user reads when no rung passes). `measure` gives the values of an iterate; `passes` applies the
 * loop's value check to them.
 */
export function climbRidgeLadder<V>(
  sums: { readonly sums: Float64Array; readonly dim: number; readonly linearDim: number }, hiddenRidge: number,
  measure: (lastLayer: LastLayer) => V, passes: (values: V) => boolean, higher?: HigherTermRidge, rungs = RIDGE_LADDER_RUNGS,
): LadderStep<V> | { failure: string } | { failing: LadderStep<V> } {
  let first: { failure: string } | { failing: LadderStep<V> } | null = null;
  for (let rung = 0; rung <= rungs; rung++) {
    const ridge = hiddenRidge * RIDGE_LADDER_FACTOR ** rung;
    const solved = solveLastLayer(sums.sums, sums.dim, sums.linearDim, ridge, higher);
    if ('failure' in solved) {
      first ??= solved;
      continue;
    }
    const lastLayer = { linear: solved.weights.slice(0, sums.linearDim), hidden: solved.weights.slice(sums.linearDim) };
    const values = measure(lastLayer);
    if (passes(values)) return { lastLayer, values, hiddenRidge: ridge };
    first ??= { failing: { lastLayer, values, hiddenRidge: ridge } };
  }
  return first!;
}

/** The sentence the fit's message carries when the ladder was climbed; null when it never was. */
export function ridgeLadderSentence(
  raised: readonly { readonly iteration: number; readonly hiddenRidge: number; readonly why?: 'reach' | 'cancellation' | 'held' }[], defaultRidge: number,
): string | null {
  const held = raised.filter((r) => r.why === 'held').length;
  raised = raised.filter((r) => r.why !== 'held');
  if (raised.length === 0) return null;
  const top = Math.max(...raised.map((r) => r.hiddenRidge));
  const at = raised.length === 1 ? `At outer iteration ${raised[0].iteration}` : raised.length <= 3
    ? `At outer iterations ${raised.map((r) => r.iteration).join(', ')}` : `At ${raised.length} outer iterations (the first at iteration ${raised[0].iteration})`;
  const reach = raised.some((r) => r.why !== 'cancellation'), cancel = raised.some((r) => r.why === 'cancellation');
  const what = [reach ? 'values no policy can have' : null, cancel ? 'a polynomial part and a hidden-feature part that largely cancel (a direction the data hardly determine)' : null]
    .filter((x) => x !== null).join(', or ');
  return `${at} the last layer gave ${what} with the hidden ridge in use (default ${defaultRidge}), ` +
    `so it was solved again with a larger one (up to ${top}, ×${RIDGE_LADDER_FACTOR} per step, at most ${RIDGE_LADDER_RUNGS} steps), which pulls those iterates toward the polynomial part’s own fixed point (the network’s linear start).` +
    (held > 0 ? ` ${held} later iterate${held === 1 ? ' was' : 's were'} solved with the raised ridge kept, not lowered again.` : '');
}
