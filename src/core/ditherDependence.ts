/**
 * Do the present controller's dithers on two actions move together? Where the log shows actuator
 * limits, the model of the present controller clips each action at its own limits and so takes the
 * noise as independent across actions (a clip needs independent noise: policy.ts; the censored
 * fit is per action: behaviourModel.ts). A controller with several outputs often drives them from
 * one noisy measurement, so their logged variations can be strongly correlated; the model then
 * misstates the joint law of the logged actions, which the present controller's J and the
 * importance weights rest on.
 *
 * This file measures that: over the rows where no action sits at a limit (a row at a limit holds
 * the clip, not the noise), the Pearson correlation, for every pair of actions, of the residuals
 * e_j = a_j − μ_j(s), μ_j = c_j + g_jᵀs, each standardised by the mean and variance the model gives
 * it on such a row: a normal N(0, σ_j²) cut to the window [lo_j − μ_j, hi_j − μ_j] (Johnson, Kotz &
 * Balakrishnan, "Continuous Univariate Distributions", vol. 1, 2nd ed. 1994, §10.1):
 *     mean σ(φ(α) − φ(β))/Z,  variance σ²[1 + (αφ(α) − βφ(β))/Z − ((φ(α) − φ(β))/Z)²],
 *     α = (lo − μ)/σ, β = (hi − μ)/σ, Z = Φ(β) − Φ(α).
 * Why standardise: the window moves with the state, so the raw residuals' means on the rows kept
 * move with it, and where one state drives both actions toward their limits they move together:
 * independent dithers then showed a raw correlation of 0.44 to 0.56 (limits ±1, dither 1, state spread
 * 1 to 4, seed 3) and 0.80 with dither 2, and the caution fired (test/core/ditherDependence.test.ts).
 * Standardised this way, independent dithers give residuals independent given the state, with mean 0
 * and variance 1 on every row, so any correlation left is the log's, not the selection's. Without
 * limits on an action its residual is e_j/σ_j, the plain correlation.
 *
 * The rule (a choice, stated to the user by ditherDependenceText): the simplification is named as a
 * caution when some pair's |ρ| ≥ DITHER_CORRELATION_NOTED and the correlation is clearly not
 * sampling noise, Fisher's z = atanh|ρ|·√(rows − 3) ≥ 3 (Fisher, Biometrika 1915; the standard
 * error 1/√(rows − 3) of atanh ρ is common practice). Measured on the two-valve blending tank
 * hold-out (test/battery/holdout/blendingTankPlant.ts, 20,000 transitions, seed 1, logging dithers
 * correlated 0, 0.6 and 0.9, truth by rollouts of the clipped correlated logger): the present
 * controller's J moved from −5.16 (truth −5.13) to −5.17 (−5.23) and −5.18 (−5.29), its interval
 * holding the truth each time, and the importance-sampling checks of the candidate within the
 * logged actions went from "agrees" to "uninformative". So it is a caution, not a serious finding:
 * the numbers held there, but they rest on an assumption the log contradicts.
 *
 * Shapes: states n×ds, actions n×m row-major; offset m; gain m×ds; std m; lo/hi m.
 */
import { boundedTerms } from './boundedNormalMean';

export interface DitherDependence {
  /** Pearson correlation of the standardised residuals for each pair j < k, m×m with 1 on the diagonal. */
  readonly correlation: number[][];
  /** Rows where every action is strictly inside its limits (and the model gives each a spread there): the rows the correlation is over. */
  readonly rows: number;
  /** The pair with the largest |ρ| (action indices, from 0), or null with one action. */
  readonly strongest: { readonly actions: [number, number]; readonly correlation: number } | null;
}

/** |ρ| from which the independence the clipped model assumes is named to the user (a choice; see above). */
export const DITHER_CORRELATION_NOTED = 0.3;
/** Fisher z of the strongest pair needed as well, so sampling noise on few rows is not named (about 3 standard errors). */
export const DITHER_CORRELATION_Z = 3;

export function ditherDependence(
  states: Float64Array, actions: Float64Array, n: number, ds: number, m: number,
  model: { readonly offset: readonly number[]; readonly gain: readonly (readonly number[])[]; readonly std: readonly number[] },
  limits: { readonly lo: readonly number[]; readonly hi: readonly number[] },
): DitherDependence {
  const sums = new Float64Array(m), cross = new Float64Array(m * m), u = new Float64Array(m);
  let rows = 0;
  for (let i = 0; i < n; i++) {
    if (!inside(actions, i, m, limits) || !standardisedRow(states, actions, i, ds, m, model, limits, u)) continue;
    for (let j = 0; j < m; j++) sums[j] += u[j];
    for (let j = 0; j < m; j++) for (let k = j; k < m; k++) cross[j * m + k] += u[j] * u[k];
    rows++;
  }
  const correlation: number[][] = Array.from({ length: m }, (_, j) => Array.from({ length: m }, (_, k): number => (j === k ? 1 : 0)));
  let strongest: DitherDependence['strongest'] = null;
  for (let j = 0; j < m; j++) {
    for (let k = j + 1; k < m; k++) {
      const rho = pearson(cross, sums, rows, m, j, k);
      correlation[j][k] = correlation[k][j] = rho;
      if ((strongest === null || Math.abs(rho) > Math.abs(strongest.correlation))) strongest = { actions: [j, k], correlation: rho };
    }
  }
  return { correlation, rows, strongest };
}

/**
 * Standard deviations from both limits beyond which a row's cut is not applied: φ(6) ≈ 6.1e-9, so the
 * cut normal's mean moves by under 1.3e-8 σ and its variance by under 2·6·φ(6) ≈ 7.3e-8 there
 * (Mills' ratio, A&S 26.2.12), far below what moves a correlation read against 0.3. Most rows of a log
 * sit this far from the limits (a valve near mid-travel with a dither of a few %), and the erfc calls
 * they skip were most of this pass: 10⁶ rows, two valves at 0.5 ± 0.1 with dither 0.05, 44 ms with
 * this skip, 207 ms with it at 8.5 σ, 21 ms for the raw correlation (best of 3, shared machine).
 */
const FAR_FROM_LIMITS = 6;

/**
 * Row i's residuals standardised by the cut normal's mean and variance (see above) into u (m);
 * false where some action's window holds too little of the model's mass to standardise in double
 * precision (Z below 1e-12) or the model gives it no spread: such a row is left out.
 */
function standardisedRow(
  states: Float64Array, actions: Float64Array, i: number, ds: number, m: number,
  model: { readonly offset: readonly number[]; readonly gain: readonly (readonly number[])[]; readonly std: readonly number[] },
  limits: { readonly lo: readonly number[]; readonly hi: readonly number[] }, u: Float64Array,
): boolean {
  for (let j = 0; j < m; j++) {
    let mean = model.offset[j];
    for (let p = 0; p < ds; p++) mean += model.gain[j][p] * states[i * ds + p];
    const sigma = model.std[j];
    if (!(sigma > 0)) return false;
    const alpha = (limits.lo[j] - mean) / sigma, beta = (limits.hi[j] - mean) / sigma;
    if (alpha <= -FAR_FROM_LIMITS && beta >= FAR_FROM_LIMITS) {
      u[j] = (actions[i * m + j] - mean) / sigma; // the cut changes mean and spread by under 1e-7 here: skip its erfc calls
      continue;
    }
    const { phiA, phiB, kept } = boundedTerms(mean, sigma, limits.lo[j], limits.hi[j]);
    if (!(kept > 1e-12)) return false;
    const shift = (phiA - phiB) / kept;
    const spread = 1 + ((Number.isFinite(alpha) ? alpha * phiA : 0) - (Number.isFinite(beta) ? beta * phiB : 0)) / kept - shift * shift;
    if (!(spread > 1e-12)) return false;
    u[j] = ((actions[i * m + j] - mean) / sigma - shift) / Math.sqrt(spread);
  }
  return true;
}

function inside(actions: Float64Array, i: number, m: number, limits: { readonly lo: readonly number[]; readonly hi: readonly number[] }): boolean {
  for (let j = 0; j < m; j++) {
    const a = actions[i * m + j];
    if (!(a > limits.lo[j] && a < limits.hi[j])) return false;
  }
  return true;
}

/** ρ from centred sums: (Σe_j e_k − Σe_j Σe_k / N) / √(…); 0 where a spread is zero or N < 2. */
function pearson(cross: Float64Array, sums: Float64Array, rows: number, m: number, j: number, k: number): number {
  if (rows < 2) return 0;
  const cjk = cross[j * m + k] - (sums[j] * sums[k]) / rows;
  const cjj = cross[j * m + j] - (sums[j] * sums[j]) / rows, ckk = cross[k * m + k] - (sums[k] * sums[k]) / rows;
  return cjj > 0 && ckk > 0 ? Math.max(-1, Math.min(1, cjk / Math.sqrt(cjj * ckk))) : 0;
}

/** Whether the rule above names the dependence. */
export function ditherDependenceNoted(d: DitherDependence): boolean {
  const s = d.strongest;
  if (!s || d.rows < 4) return false;
  const r = Math.abs(s.correlation);
  return r >= DITHER_CORRELATION_NOTED && Math.atanh(Math.min(r, 1 - 1e-15)) * Math.sqrt(d.rows - 3) >= DITHER_CORRELATION_Z;
}

/** The caution's words, from the same numbers the rule reads; null when the rule does not name it. */
export function ditherDependenceText(d: DitherDependence, actionNames: readonly string[]): string | null {
  if (!ditherDependenceNoted(d)) return null;
  const { actions: [j, k], correlation } = d.strongest!;
  const how = correlation > 0 ? 'move together' : 'move in opposite directions';
  const value = `${correlation < 0 ? '\u2212' : ''}${Math.abs(correlation).toFixed(2)}`;
  return `The present controller’s dithers on ${actionNames[j]} and ${actionNames[k]} ${how} (correlation ${value} over the ` +
    `${d.rows.toLocaleString('en-US')} logged rows where no action is at a limit; named from ${DITHER_CORRELATION_NOTED} in size and ${DITHER_CORRELATION_Z} standard errors of Fisher’s z), ` +
    'but its model clips each action at its own limits and so takes them as independent. ' +
    'Its J and the importance-sampling checks rest on that simplification; read them with it in mind.';
}
