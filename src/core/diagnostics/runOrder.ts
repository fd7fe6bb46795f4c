/**
 * Is the log one plant under one controller from its first run to its last? Every estimate here
 * assumes so: the present controller's law is fitted to all logged actions as one law, and every
 * J is over one plant. A plant that wears over the months, or a controller retuned halfway through
 * the log, breaks that, and nothing else in the product looks at the order of the runs.
 *
 * Per run, in the order the runs appear in the data (the episode index, file order), ordinary least
 * squares of
 *   (a) the present controller's law: each action on [1, states] (the inputs of the product's
 *       baseline law, core/behaviourModel.ts: a = c + G·s + e; where the log shows an actuator limit
 *       and the run reaches it, by the baseline's censored fit — censoredLaw);
 *   (b) the one-step plant model: each next state on [1, states, actions], rows that end a run left out.
 * The regressors are centred and scaled by the whole log's means and spreads (the same for every
 * run), so an intercept is the fitted value at the log's mean state (and action), and ranks across
 * runs are those of the coefficients themselves. A run with too few rows for its block, or whose
 * normal equations are singular (a pivot at rounding level: an action without dither is a function
 * of the state), is skipped for that block and counted.
 *
 * For each coefficient, its trend against run order: Spearman's rank correlation ρ between the run's
 * position and the run's estimate (average ranks for ties), z = ρ·√(n − 1) (the large-sample normal
 * approximation; Kendall & Gibbons, "Rank Correlation Methods", 5th ed., 1990 — from memory), two-sided
 * p = 2·Φ(−|z|). One estimate per run makes the runs the independent units; ranks keep a few wild
 * per-run fits (a short run, a run that never left the setpoint) from deciding. The Bonferroni
 * correction over the coefficients tested lives with the rule (runOrderFinding.ts).
 *
 * Shapes: ds states, m actions; law coefficients m × (1 + ds), model coefficients ds × (1 + ds + m).
 */
import { CensoredRegressionError, fitCensoredRegression } from '../censoredRegression';
import { changeShape, type ChangeKind } from './changeShape';
import { cholesky, choleskySolve, SingularMatrixError } from '../linalg/dense';
import { PIVOT_FLOOR } from '../limits';
import { normalSurvival } from '../normalDistribution';

export interface RunOrderData {
  readonly count: number;
  readonly stateDim: number;
  readonly actionDim: number;
  readonly states: Float64Array;
  readonly actions: Float64Array;
  readonly nextStates: Float64Array;
  readonly episode: Int32Array;
  /** 1 where the row ends its run (its next state is a copy, core/transitions.ts): left out of the plant model, as the dynamics model leaves it out. */
  readonly terminal?: Uint8Array;
  /**
   * The actuator limits the baseline reads from the whole log (core/loggedActionLimits.ts; ±Infinity or
   * absent where none): a run's law is then fitted as the baseline's is, by censored maximum likelihood.
   */
  readonly actionLimits?: { readonly lo: ArrayLike<number>; readonly hi: ArrayLike<number> };
}

/** One coefficient's trend over the runs. `input` is -1 for the intercept, else the regressor's index in [states, actions]. */
export interface CoefficientTrend {
  readonly block: 'law' | 'model';
  /** The action (law) or next state (model) regressed. */
  readonly output: number;
  readonly input: number;
  readonly runs: number;
  readonly rho: number;
  readonly z: number;
  /** Two-sided p of z under the normal approximation (not yet corrected for the number tested). */
  readonly p: number;
  /** The estimate's medians over the first and the last fifth of the runs, in the log's units (an intercept: the value at the log's mean state and action), to say which way it went. */
  readonly early: number;
  readonly late: number;
  /**
   * The series' shape (changeShape.ts, on the ranks ρ reads): a step, with the run position (0-based among
   * all the log's runs) of the first fitted run after it, or a drift (`run` then the best step's, unused by the words).
   */
  readonly change: { readonly kind: ChangeKind; readonly run: number; readonly clear: boolean } | null;
}

export type RunOrderResult =
  | {
    readonly runs: number; readonly lawSkipped: number; readonly modelSkipped: number; readonly trends: CoefficientTrend[];
    /** The first row of each run, by run position: where a host reads a run's label. */
    readonly firstRows: readonly number[];
  }
  | {
    readonly reason: string;
    /** Inputs ([states, actions] indices) that never vary within a run (a setpoint or grade column): each run's fit is singular through them. */
    readonly constantInRuns?: readonly number[];
  };

/** Spearman's ρ of two equal-length samples, average ranks for ties; NaN when either is constant. */
export function spearmanRho(x: ArrayLike<number>, y: ArrayLike<number>): number {
  return rankCorrelation(averageRanks(x), averageRanks(y));
}

/** Pearson's r of two rankings of 1..n (average ranks for ties): Spearman's ρ once the ranks are known; NaN when either is constant. */
function rankCorrelation(rx: Float64Array, ry: Float64Array): number {
  const n = rx.length;
  if (n < 2) return NaN;
  const mean = (n + 1) / 2;
  let sxy = 0, sxx = 0, syy = 0;
  for (let i = 0; i < n; i++) {
    const a = rx[i] - mean, b = ry[i] - mean;
    sxy += a * b;
    sxx += a * a;
    syy += b * b;
  }
  return sxx > 0 && syy > 0 ? sxy / Math.sqrt(sxx * syy) : NaN;
}

/** 1-based ranks, ties given the average of the ranks they span. */
export function averageRanks(x: ArrayLike<number>): Float64Array {
  const n = x.length, order = Array.from({ length: n }, (_, i) => i).sort((a, b) => x[a] - x[b]), ranks = new Float64Array(n);
  for (let i = 0; i < n;) {
    let j = i;
    while (j + 1 < n && x[order[j + 1]] === x[order[i]]) j++;
    for (let k = i; k <= j; k++) ranks[order[k]] = (i + j) / 2 + 1;
    i = j + 1;
  }
  return ranks;
}

/** z = ρ·√(n − 1) and its two-sided normal p (Kendall & Gibbons, from memory). */
export function spearmanTrend(rho: number, n: number): { z: number; p: number } {
  if (!Number.isFinite(rho) || n < 2) return { z: 0, p: 1 };
  const z = rho * Math.sqrt(n - 1);
  return { z, p: Math.min(1, 2 * normalSurvival(Math.abs(z))) };
}

export function runOrderTrends(data: RunOrderData, minimumRuns: number): RunOrderResult {
  const ds = data.stateDim, m = data.actionDim, w = ds + m;
  const spans = runSpans(data);
  if (spans.length < minimumRuns) return { reason: `it needs at least ${minimumRuns} runs, and the log has ${spans.length}` };
  const { mean, scale } = columnScales(data);
  const law: number[][] = [], model: number[][] = []; // per run: coefficients, or skipped
  const lawRuns: number[] = [], modelRuns: number[] = [];
  spans.forEach(([from, to], r) => {
    const lawFit = fitRun(data, from, to, { inputs: ds, mean, scale, outputs: m, target: 'action' });
    if (lawFit) { law.push(lawFit); lawRuns.push(r); }
    const modelFit = fitRun(data, from, to, { inputs: w, mean, scale, outputs: ds, target: 'next' });
    if (modelFit) { model.push(modelFit); modelRuns.push(r); }
  });
  const trends: CoefficientTrend[] = [];
  const add = (block: 'law' | 'model', fits: number[][], runs: number[], outputs: number, inputs: number) => {
    if (runs.length < minimumRuns) return;
    const runRanks = averageRanks(runs); // the same for every coefficient of the block
    for (let o = 0; o < outputs; o++) for (let c = 0; c <= inputs; c++) {
      const unit = c === 0 ? 1 : scale[c - 1], series = fits.map((f) => f[o * (inputs + 1) + c] / unit);
      // One ranking of the series for ρ and for its shape (changeShape reads the ranks ρ reads).
      const ranks = averageRanks(series), rho = rankCorrelation(runRanks, ranks), { z, p } = spearmanTrend(rho, runs.length);
      const fifth = Math.max(1, Math.floor(series.length / 5)), shape = changeShape(runs, ranks);
      trends.push({
        block, output: o, input: c - 1, runs: runs.length, rho: Number.isFinite(rho) ? rho : 0, z, p, early: median(series.slice(0, fifth)), late: median(series.slice(-fifth)),
        change: shape && { kind: shape.kind, run: runs[shape.after], clear: shape.clear },
      });
    }
  };
  add('law', law, lawRuns, m, ds);
  add('model', model, modelRuns, ds, w);
  if (trends.length === 0) {
    const constant = constantInEveryRun(data, spans);
    return { reason: `fewer than ${minimumRuns} runs could be fitted (each needs more rows than twice its coefficients, and some spread in its states and actions)`, ...(constant.length ? { constantInRuns: constant } : {}) };
  }
  return { runs: spans.length, lawSkipped: spans.length - lawRuns.length, modelSkipped: spans.length - modelRuns.length, trends, firstRows: spans.map(([from]) => from) };
}

/** [first row, one past the last] of each run, in the order the runs appear (rows of one episode index in a row). */
function runSpans(data: RunOrderData): [number, number][] {
  const spans: [number, number][] = [];
  for (let i = 0; i < data.count;) {
    let j = i + 1;
    while (j < data.count && data.episode[j] === data.episode[i]) j++;
    spans.push([i, j]);
    i = j;
  }
  return spans;
}

/** The inputs ([states, actions]) whose value never changes within any run: no per-run fit can tell their effect from the run's offset. */
function constantInEveryRun(data: RunOrderData, spans: [number, number][]): number[] {
  const w = data.stateDim + data.actionDim, out: number[] = [];
  for (let c = 0; c < w; c++) {
    if (spans.every(([from, to]) => { for (let i = from + 1; i < to; i++) if (input(data, i, c) !== input(data, from, c)) return false; return true; })) out.push(c);
  }
  return out;
}

/** The whole log's mean and spread of each of [states, actions] (spread 1 where a column is constant). */
function columnScales(data: RunOrderData): { mean: Float64Array; scale: Float64Array } {
  const ds = data.stateDim, m = data.actionDim, w = ds + m, n = data.count;
  const mean = new Float64Array(w), scale = new Float64Array(w);
  for (let i = 0; i < n; i++) for (let c = 0; c < w; c++) mean[c] += input(data, i, c) / n;
  for (let i = 0; i < n; i++) for (let c = 0; c < w; c++) scale[c] += (input(data, i, c) - mean[c]) ** 2 / n;
  for (let c = 0; c < w; c++) scale[c] = scale[c] > 0 ? Math.sqrt(scale[c]) : 1;
  return { mean, scale };
}

function input(data: RunOrderData, i: number, c: number): number {
  return c < data.stateDim ? data.states[i * data.stateDim + c] : data.actions[i * data.actionDim + c - data.stateDim];
}

interface Block { inputs: number; outputs: number; mean: Float64Array; scale: Float64Array; target: 'action' | 'next' }

/** Least squares of each output on [1, scaled inputs] over rows [from, to); null when too short or singular. Row-major outputs × (1 + inputs). */
function fitRun(data: RunOrderData, from: number, to: number, b: Block): number[] | null {
  const p = b.inputs + 1, n = to - from;
  if (n <= 2 * p) return null;
  const gram = new Float64Array(p * p), rhs = new Float64Array(p * b.outputs), x = new Float64Array(p);
  for (let i = from; i < to; i++) {
    if (b.target === 'next' && data.terminal?.[i]) continue;
    scaledRow(data, i, b, x);
    for (let a = 0; a < p; a++) for (let c = a; c < p; c++) gram[a * p + c] += x[a] * x[c];
    for (let o = 0; o < b.outputs; o++) {
      const y = b.target === 'action' ? data.actions[i * data.actionDim + o] : data.nextStates[i * data.stateDim + o];
      for (let a = 0; a < p; a++) rhs[o * p + a] += x[a] * y;
    }
  }
  const l = factor(gram, p);
  if (!l) return null;
  const out: number[] = [];
  for (let o = 0; o < b.outputs; o++) out.push(...choleskySolve(l, p, rhs.subarray(o * p, o * p + p)));
  return b.target === 'action' ? censoredLaw(data, from, to, b, out) : out;
}

/**
 * Where the log shows an action's limits and this run reaches one, least squares on the clipped values
 * is biased toward zero slope by how often the run sits at the limit — which moves with the operating
 * point from run to run (a cold season's heater at full output), not with the law. That action's law
 * is then the censored-normal maximum-likelihood fit (Tobit, J. Tobin, Econometrica 26, 1958), the
 * baseline's own estimator (core/behaviourModel.ts), started from least squares; a run wholly at a
 * limit, or whose fit fails, is skipped. A run that never reaches a limit keeps least squares, which
 * is then the same maximum-likelihood fit.
 */
function censoredLaw(data: RunOrderData, from: number, to: number, b: Block, ols: number[]): number[] | null {
  const limits = data.actionLimits, p = b.inputs + 1, n = to - from, m = data.actionDim;
  if (!limits) return ols;
  const out = [...ols];
  let x: Float64Array | null = null;
  for (let o = 0; o < b.outputs; o++) {
    const lo = limits.lo[o] ?? -Infinity, hi = limits.hi[o] ?? Infinity, y = new Float64Array(n);
    let atLimit = 0;
    for (let i = 0; i < n; i++) {
      y[i] = data.actions[(from + i) * m + o];
      if (y[i] <= lo || y[i] >= hi) atLimit++;
    }
    if (atLimit === 0) continue;
    if (atLimit === n) return null;
    x ??= runInputs(data, from, to, b);
    const start = ols.slice(o * p, o * p + p), sigma = residualSpread(x, y, start);
    if (!(sigma > 0)) return null;
    try {
      out.splice(o * p, p, ...fitCensoredRegression(x, y, n, p, lo, hi, { coefficients: start, sigma }).coefficients);
    } catch (error) {
      if (error instanceof CensoredRegressionError) return null;
      throw error;
    }
  }
  return out;
}

/** The run's rows of [1, scaled inputs], n × (1 + inputs) row-major. */
function runInputs(data: RunOrderData, from: number, to: number, b: Block): Float64Array {
  const p = b.inputs + 1, x = new Float64Array((to - from) * p);
  for (let i = from; i < to; i++) scaledRow(data, i, b, x.subarray((i - from) * p, (i - from + 1) * p));
  return x;
}

/** Row i as [1, inputs centred and scaled by the whole log], written into `out` (1 + inputs). */
function scaledRow(data: RunOrderData, i: number, b: Block, out: Float64Array): void {
  out[0] = 1;
  for (let c = 0; c < b.inputs; c++) out[c + 1] = (input(data, i, c) - b.mean[c]) / b.scale[c];
}

/** √(Σ (y − xβ)² / (n − p)): least squares' residual spread, the censored fit's starting σ. */
function residualSpread(x: Float64Array, y: Float64Array, beta: number[]): number {
  const p = beta.length, n = y.length;
  let ss = 0;
  for (let i = 0; i < n; i++) {
    let fitted = 0;
    for (let c = 0; c < p; c++) fitted += x[i * p + c] * beta[c];
    ss += (y[i] - fitted) ** 2;
  }
  return Math.sqrt(ss / Math.max(1, n - p));
}

/** Lower Cholesky factor of the gram (upper triangle filled here, mirrored); null when a pivot is at rounding level. */
function factor(gram: Float64Array, p: number): Float64Array | null {
  for (let a = 0; a < p; a++) for (let c = a + 1; c < p; c++) gram[c * p + a] = gram[a * p + c];
  let l: Float64Array;
  try {
    l = cholesky(gram, p);
  } catch (error) {
    if (error instanceof SingularMatrixError) return null;
    throw error;
  }
  for (let j = 0; j < p; j++) if (!(l[j * p + j] ** 2 > PIVOT_FLOOR * gram[j * p + j])) return null;
  return l;
}

function median(v: number[]): number {
  const s = [...v].sort((a, b) => a - b), h = Math.floor(s.length / 2);
  return s.length % 2 ? s[h] : (s[h - 1] + s[h]) / 2;
}
