/**
 * A per-project choice of the degree of the network's polynomial part (networkLinearPart.ts) from
 * the log alone, by how well each degree predicts the returns the PRESENT controller really earned
 * on runs it was not fitted on (networkMethod.ts, `linearPartDegree: 'choose'`): the default, with
 * the start guard of degreeChoiceStartGuard.ts; measured on the battery and the hold-outs in
 * test/battery/README.md ("A per-project choice of the polynomial part's degree", "The degree
 * choice guarded by where J's starts lie").
 *
 * Why the present controller: only for the policy that logged the data is the observed discounted
 * return G_t = Σ_j γ^j r_{t+j} an unbiased sample of its action value at the logged (s_t, a_t)
 * (Monte-Carlo prediction; Sutton & Barto, "Reinforcement Learning: An Introduction", 2nd ed. 2018,
 * §5.1). So E[(G_t − Q̂(s_t, a_t))²] = E[(Q^μ − Q̂)²] + E[Var(G_t | s_t, a_t)], and the second term is
 * the same for every degree: the paired difference of two degrees' held-out squared errors
 * estimates the difference of their squared errors against the true Q^μ — a target that, unlike
 * the held-out Bellman error, does not need a second sample of the next state (the double-sampling
 * bias that makes Bellman-error model selection hard: Farahmand & Szepesvári, "Model selection in
 * reinforcement learning", Machine Learning 2011; Zhang & Jiang, "Towards hyperparameter-free
 * policy selection for offline reinforcement learning", NeurIPS 2021 — both from memory). A
 * candidate policy's returns are not in the log, so the degree that predicts the present
 * controller's value better is carried to the candidates: the same plant, the same states, the
 * same reward, a different feedback law.
 *
 * What J needs: J is a mean of V over run starts, so each held-out run is scored at its first rows
 * with weights γ^t (t steps from the run's first row), the discounted occupancy from the run start
 * that the value at the start is made of. A row is scored only when the return behind it is
 * observed to within a share TAIL_WEIGHT of its horizon (γ^(rows left) ≤ TAIL_WEIGHT, or the run
 * ended in a terminal state); its return is the observed one, not bootstrapped.
 *
 * The fits: each degree's action value of the present controller by on-policy LSTD (next action
 * the logged one: LSTD-Q of Lagoudakis & Parr, JMLR 2003, §5, with the sample next action), on the
 * standardised (s, a) of the whole log, with the linear approximator's default ridge, on the runs
 * outside a fold, scored on the fold's runs (FOLDS folds of whole runs, seeded; blocked
 * cross-validation for dependent data, Roberts et al., Ecography 2017). The degrees' features are
 * nested (polynomialFeatures.ts, leadsPolynomial), so the sums of the highest degree hold the lower
 * ones' as leading blocks: one pass over the data.
 *
 * The rule (stated before any sweep): per run the weighted mean squared error of each degree; the
 * higher degree is chosen only when its mean paired difference from the default degree's is below 0
 * by more than CHOICE_STANDARD_ERRORS of its standard error over runs (sd/√runs; runs are
 * independent). Otherwise the default degree, which is exact for linear-quadratic plants.
 *
 * What it can and cannot see: only the states the logged runs pass through. Where the candidate's
 * starts lie beyond every logged state (runs logged steady, J over wider starts) it has no rows,
 * and the choice rests on the logged region: the fit therefore keeps a higher degree only when J's
 * starts lie inside the logs (degreeChoiceStartGuard.ts).
 *
 * Cost: one pass of n·d² multiply-adds by block products (degreeChoiceSums.ts); not run above
 * DEGREE_CHOICE_MAX_FEATURES (limits.ts) quartic features, and the reason says so.
 */
import { fitStateActionStandardiser } from '../features/standardiser';
import { createFeatureMap } from '../features/featureMap';
import { polynomialFeatureSpec } from '../features/polynomialFeatures';
import { monomialCount } from '../features/monomials';
import { luFactor, luSolve, SingularMatrixError } from '../linalg/dense';
import { DEGREE_CHOICE_MAX_FEATURES, RIDGE } from '../limits';
import { createRandom } from '../random';
import { loggedStateAction, type TransitionSet } from '../transitions';
import { LINEAR_PART_DEGREE } from './networkLinearPart';
import { shareText, sharesText } from '../shareText';
import { foldLstdSums } from './degreeChoiceSums';

/** The degrees compared: the default, and the quartic measured on the battery (README, "What the network is compared with"). */
export const DEGREE_CHOICES: readonly number[] = [LINEAR_PART_DEGREE, 4];
/** Folds of whole runs (a choice: each run is scored once, on fits over half the log). */
export const DEGREE_CHOICE_FOLDS = 2;
/** A row is scored when the unobserved rest of its return weighs at most this share (γ^(rows left) ≤ it). */
export const TAIL_WEIGHT = 0.01;
/** The higher degree must be better by more than this many standard errors of the paired difference. */
export const CHOICE_STANDARD_ERRORS = 2;
/** Fewest runs with a scored row for a choice to be made at all (fewer: the default degree, and the reason). */
export const MIN_SCORED_RUNS = 10;

export interface DegreeChoice {
  /** Degrees compared, the default first. */
  readonly degrees: readonly number[];
  /** The degree the fit used. */
  readonly chosen: number;
  /** Per degree: mean over scored runs of the γ-weighted mean squared error of held-out returns, reward units². */
  readonly meanSquaredError: readonly number[];
  /** Per degree: √meanSquaredError relative to the mean |return| at the scored runs' first rows. */
  readonly relativeError: readonly number[];
  /** Mean over runs of (higher degree − default degree) squared error, and its standard error; null when not computed. */
  readonly difference: number | null;
  readonly standardError: number | null;
  readonly runsScored: number;
  readonly rowsScored: number;
  /** Why the default degree was kept without a comparison (too few runs, a singular fit, too many features); null when compared. */
  readonly notCompared: string | null;
  /** True when the comparison was not run because the quartic has more than DEGREE_CHOICE_MAX_FEATURES features (limits.ts). */
  readonly overFeatureLimit: boolean;
  /** One sentence in the user's words: what was chosen and why, from the same numbers. */
  readonly sentence: string;
}

export interface DegreeChoiceInput {
  readonly data: TransitionSet;
  readonly discount: number;
  readonly seed: number;
  /** Degrees to compare, the default first (DEGREE_CHOICES unless a test asks otherwise). */
  readonly degrees?: readonly number[];
}

/**
 * chooseLinearPartDegree made once per log: the choice reads the log, the discount and the fold seed
 * only — never the candidate — so every network fit of a project (each candidate and the present
 * controller) takes the same answer, and computing it again per fit cost 0.2–1.2 s of CPU each at
 * 100,000 rows. Keyed by the log object (logs are read-only by the house's convention, as for the
 * standardiser's cache) and the other inputs; the answer is the very object the first call made.
 */
export function chooseLinearPartDegreeOnce(input: DegreeChoiceInput): DegreeChoice {
  const key = `${input.discount}|${input.seed}|${(input.degrees ?? DEGREE_CHOICES).join(',')}`;
  let byKey = choicesMade.get(input.data);
  if (!byKey) choicesMade.set(input.data, (byKey = new Map()));
  const made = byKey.get(key);
  if (made) return made;
  const choice = chooseLinearPartDegree(input);
  byKey.set(key, choice);
  return choice;
}

const choicesMade = new WeakMap<TransitionSet, Map<string, DegreeChoice>>();

export function chooseLinearPartDegree(input: DegreeChoiceInput): DegreeChoice {
  const { data, discount: gamma } = input, degrees = input.degrees ?? DEGREE_CHOICES;
  const base = degrees[0], top = Math.max(...degrees), p = data.stateDim + data.actionDim;
  const keep = (why: string) => notCompared(degrees, base, why);
  // The choice's cost grows as n·d² in the top degree's features (degreeChoiceSums.ts): skipped above the limit, and said so.
  const topFeatures = monomialCount(p, top);
  if (topFeatures > DEGREE_CHOICE_MAX_FEATURES) {
    return { ...keep(`a degree-${top} polynomial in ${p} inputs has ${topFeatures} features, more than the ${DEGREE_CHOICE_MAX_FEATURES} up to which the comparison is cheap enough to run on every fit`), overFeatureLimit: true };
  }
  const n = data.count, ds = data.stateDim, e = data.episodeCount;
  if (e < DEGREE_CHOICE_FOLDS) return keep(`the log has ${e} run${e === 1 ? '' : 's'}; at least ${DEGREE_CHOICE_FOLDS} are needed to fit on some and score on others`);

  // Which rows continue into the next row (the same run, and the next row starts where this one ended).
  const continues = new Uint8Array(n);
  for (let i = 0; i + 1 < n; i++) {
    if (data.terminal[i] !== 0 || data.episode[i + 1] !== data.episode[i]) continue;
    let same = true;
    for (let c = 0; c < ds && same; c++) {
      const a = data.nextStates[i * ds + c], b = data.states[(i + 1) * ds + c];
      same = Math.abs(a - b) <= 1e-9 * (1 + Math.abs(a));
    }
    continues[i] = same ? 1 : 0;
  }
  // Observed returns and the weight of their unobserved rest, backwards.
  const returns = new Float64Array(n), tail = new Float64Array(n);
  for (let i = n - 1; i >= 0; i--) {
    if (data.terminal[i] !== 0) { returns[i] = data.rewards[i]; tail[i] = 0; }
    else if (continues[i]) { returns[i] = data.rewards[i] + gamma * returns[i + 1]; tail[i] = gamma * tail[i + 1]; }
    else { returns[i] = data.rewards[i]; tail[i] = gamma; }
  }
  // Folds of whole runs by a seeded Fisher–Yates shuffle (Knuth, TAOCP Vol. 2, §3.4.2).
  const rng = createRandom(input.seed), order = Int32Array.from({ length: e }, (_, i) => i);
  for (let i = e - 1; i > 0; i--) {
    const j = rng.integer(i + 1), t = order[i];
    order[i] = order[j];
    order[j] = t;
  }
  const fold = new Int32Array(e);
  order.forEach((run, position) => { fold[run] = position % DEGREE_CHOICE_FOLDS; });

  // LSTD sums per fold at the top degree, one pass (degreeChoiceSums.ts).
  const spec = fitStateActionStandardiser(data).spec;
  const features = createFeatureMap(polynomialFeatureSpec(spec, top)), d = features.dim;
  const { a, b, counts } = foldLstdSums(data, features, gamma, continues, fold, DEGREE_CHOICE_FOLDS);
  const input0 = new Float64Array(p), phi = new Float64Array(d);
  // Each degree's weights per fold, fitted on the other folds' runs.
  const weights: Float64Array[][] = [];
  for (const degree of degrees) {
    const dk = monomialCount(p, degree), perFold: Float64Array[] = [];
    for (let f = 0; f < DEGREE_CHOICE_FOLDS; f++) {
      let rows = 0;
      const system = new Float64Array(dk * dk), rhs = new Float64Array(dk);
      for (let g = 0; g < DEGREE_CHOICE_FOLDS; g++) {
        if (g === f) continue;
        rows += counts[g];
        for (let r = 0; r < dk; r++) {
          for (let c = 0; c < dk; c++) system[r * dk + c] += a[g][r * d + c];
          rhs[r] += b[g][r];
        }
      }
      if (rows === 0) return keep('a fold of runs has no rows to fit on');
      for (let k = 0; k < dk * dk; k++) system[k] /= rows;
      for (let r = 0; r < dk; r++) rhs[r] /= rows;
      for (let r = 1; r < dk; r++) system[r * dk + r] += RIDGE.default;
      try {
        const w = luSolve(luFactor(system, dk), rhs);
        if (!w.every(Number.isFinite)) return keep(`the degree-${degree} fit of the present controller’s value is too badly conditioned to solve`);
        perFold.push(w);
      } catch (error) {
        if (!(error instanceof SingularMatrixError)) throw error;
        return keep(`the degree-${degree} fit of the present controller’s value is singular on these runs`);
      }
    }
    weights.push(perFold);
  }
  // Score each run on its fold's fits: γ^t-weighted squared error of the observed return.
  const q = degrees.length, runScore = Array.from({ length: q }, () => new Float64Array(e)), runWeight = new Float64Array(e);
  const firstReturn = new Float64Array(e), hasFirst = new Uint8Array(e);
  let rowsScored = 0, runStart = 0, discountFromStart = 1, absoluteReturns = 0;
  for (let i = 0; i < n; i++) {
    const run = data.episode[i];
    if (i === 0 || data.episode[i - 1] !== run) { runStart = i; discountFromStart = 1; }
    else discountFromStart *= gamma;
    if (tail[i] > TAIL_WEIGHT) continue;
    loggedStateAction(data, i, input0);
    features.evaluate(input0, 0, phi, 0);
    const f = fold[run];
    for (let k = 0; k < q; k++) {
      const w = weights[k][f];
      let prediction = 0;
      for (let c = 0; c < w.length; c++) prediction += w[c] * phi[c];
      runScore[k][run] += discountFromStart * (returns[i] - prediction) ** 2;
    }
    runWeight[run] += discountFromStart;
    absoluteReturns += Math.abs(returns[i]);
    if (i === runStart) { firstReturn[run] = returns[i]; hasFirst[run] = 1; }
    rowsScored++;
  }
  const scored: number[] = [];
  for (let run = 0; run < e; run++) if (runWeight[run] > 0) scored.push(run);
  if (scored.length < MIN_SCORED_RUNS) {
    return keep(`only ${scored.length} run${scored.length === 1 ? '' : 's'} hold rows whose return is observed to within ${shareText(TAIL_WEIGHT)} of its horizon; at least ${MIN_SCORED_RUNS} are needed`);
  }
  const perRun = (k: number) => scored.map((run) => runScore[k][run] / runWeight[run]);
  const meanSquaredError = degrees.map((_, k) => average(perRun(k)));
  const starts = scored.filter((run) => hasFirst[run]).map((run) => Math.abs(firstReturn[run]));
  const scaleOfReturn = starts.length > 0 ? average(starts) : absoluteReturns / rowsScored;
  const relativeError = meanSquaredError.map((mse) => Math.sqrt(mse) / Math.max(scaleOfReturn, Number.MIN_VALUE));
  // The paired rule between the default (first) and the best other degree.
  const baseRuns = perRun(0);
  let chosen = base, difference: number | null = null, standardError: number | null = null, bestGain = 0;
  for (let k = 1; k < q; k++) {
    const d = perRun(k).map((x, j) => x - baseRuns[j]), mean = average(d);
    const sd = Math.sqrt(d.reduce((s, x) => s + (x - mean) ** 2, 0) / Math.max(1, d.length - 1)), se = sd / Math.sqrt(d.length);
    if (difference === null || mean < difference) { difference = mean; standardError = se; }
    if (mean < -CHOICE_STANDARD_ERRORS * se && mean < bestGain) { chosen = degrees[k]; bestGain = mean; }
  }
  const other = degrees.find((x) => x !== base) ?? base, rows = `${scored.length} runs, each scored on fits over the other runs`;
  // The two errors are compared in one sentence: one precision (core/shareText.ts sharesText).
  // The degree set against the default: the one chosen, or else the other one compared.
  const [comparedError, baseError] = sharesText([relativeError[degrees.indexOf(chosen !== base ? chosen : other)], relativeError[0]]);
  const sentence = chosen !== base
    ? `Polynomial part of degree ${chosen}: it predicted the present controller’s held-out returns better than degree ${base} (root mean squared error ${comparedError} against ${baseError} of the return, by more than ${CHOICE_STANDARD_ERRORS} standard errors; ${rows}).`
    : `Polynomial part of degree ${base}: degree ${other} did not predict the present controller’s held-out returns better by more than ${CHOICE_STANDARD_ERRORS} standard errors (root mean squared error ${comparedError} against ${baseError} of the return; ${rows}).`;
  return { degrees, chosen, meanSquaredError, relativeError, difference, standardError, runsScored: scored.length, rowsScored, notCompared: null, overFeatureLimit: false, sentence };
}

function notCompared(degrees: readonly number[], base: number, why: string): DegreeChoice {
  return {
    degrees, chosen: base, meanSquaredError: [], relativeError: [], difference: null, standardError: null, runsScored: 0, rowsScored: 0, notCompared: why, overFeatureLimit: false,
    sentence: `Polynomial part of degree ${base}, the default: the degrees were not compared because ${why}.`,
  };
}

function average(xs: readonly number[]): number {
  return xs.reduce((s, x) => s + x, 0) / Math.max(1, xs.length);
}
