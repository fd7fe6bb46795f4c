/**
 * Does the logged state carry the plant's memory? Every estimator here assumes the next state
 * depends on the present state and action only (the Markov property). A dead time between a valve
 * and the measurement, or a lag nobody logged, breaks that: the next state then also depends on
 * earlier rows. The check is residual analysis of a one-step model (L. Ljung, "System
 * Identification: Theory for the User", 2nd ed., 1999, §16.6: residuals of a correct model are
 * uncorrelated with past inputs and outputs), done as a nested least-squares regression:
 *
 *   base:  s'_j − s_j  on  φ_k(s_t, a_t)                       (monomials of the standardised (s, a);
 *                                                                the degree is the host's, pipeline/plantMemoryCheck.ts)
 *   full:  the same  +  s_{t−l}, a_{t−l},  l = 1..L             (earlier rows of the same run)
 *
 * with residual sums of squares RSS₀ ≥ RSS₁. Reported per next-state component j: the share of the
 * base residual the earlier rows explain, the partial R² = (RSS₀ − RSS₁)/RSS₀; its F statistic
 * F = ((RSS₀ − RSS₁)/q) / (RSS₁/(N − p − q)) on (q, N − p − q) degrees of freedom (the F-test for
 * nested linear models; any regression textbook, e.g. Seber & Lee, "Linear Regression Analysis",
 * 2nd ed., 2003, §4.3; from memory); and the one earlier signal and lag that alone explains most,
 * its partial R² given the base. The effect size decides, not the F (at 10⁵ rows anything is
 * significant); the threshold (plantMemoryFinding.ts) was chosen on the battery.
 *
 * Route: one Gram matrix of [φ(s, a) | earlier rows | targets] over the rows used, then one
 * Cholesky factorisation in that order. The squared entries of a target's row of the factor are its
 * sequential sums of squares (Seber & Lee, §3.9, from memory): those in the base columns are what
 * the base explains, those in the earlier-row columns what the earlier rows add. A column whose pivot
 * falls to rounding level (it is a combination of earlier columns — a controller without dither makes
 * a_{t−l} a function of s_{t−l}) is left out and not counted in q. Earlier-row values are standardised
 * like the features and, with the targets, centred on the rows used, which leaves every sum of
 * squares unchanged (the constant is a base column) and keeps the Gram well scaled.
 *
 * Rows used: a row whose L earlier rows are in its run and chained (each row's s' is the next row's
 * s, so no row was left out between), that is not a transition into an end state; at most maxRows
 * of them at an even stride. Shapes: ds states, m actions, p monomials, q = L·(ds + m).
 */
import { PIVOT_FLOOR } from '../limits';
import type { FeatureMap } from '../features/featureMap';
import type { StandardiserSpec } from '../features/standardiser';
import type { TransitionSet } from '../transitions';

export type MemoryData = Pick<TransitionSet, 'count' | 'stateDim' | 'actionDim' | 'states' | 'actions' | 'nextStates' | 'terminal' | 'episode'>;

export interface PlantMemoryOptions {
  /** The base regression's monomials of the standardised (s, a), constant first. */
  readonly features: FeatureMap;
  readonly standardiser: StandardiserSpec;
  readonly lags: number; // L ≥ 1
  readonly maxRows: number;
}

/** The earlier signal that explains most of a component's base residual on its own. */
export interface EarlierSignal {
  readonly kind: 'state' | 'action';
  readonly index: number; // of the state or action
  readonly lag: number; // rows back, 1..L
  readonly partialRSquared: number;
}

export interface ComponentMemory {
  readonly component: number; // next-state index j
  readonly partialRSquared: number;
  readonly fStatistic: number;
  readonly numeratorDf: number; // q kept
  readonly denominatorDf: number; // N − p − q
  readonly strongest: EarlierSignal | null;
}

export type PlantMemoryResult =
  | { readonly rows: number; readonly usableRows: number; readonly lags: number; readonly components: ComponentMemory[] }
  | { readonly reason: string };

/** Relative gap at which a row's s' and the next row's s still count as one value (ours: six printed digits). */
const CHAIN_TOLERANCE = 1e-6;
/** A base residual below this share of the target's centred sum of squares is rounding, not plant (ours). */
const RESIDUAL_FLOOR = 1e-12;

export function plantMemory(data: MemoryData, options: PlantMemoryOptions): PlantMemoryResult {
  const { lags } = options, ds = data.stateDim, m = data.actionDim;
  const usable = usableRows(data, lags);
  const stride = Math.max(1, Math.ceil(usable.length / options.maxRows));
  const rows = usable.filter((_, k) => k % stride === 0);
  const p = options.features.dim, q = lags * (ds + m), width = p + q + ds;
  if (rows.length <= 2 * (p + q)) {
    const why = usable.length === 0 && data.count > 2 * lags ? ' (no row’s next state is the next row’s state, or every run is shorter)' : '';
    return { reason: `it needs more than ${2 * (p + q)} rows with ${lags} earlier rows of their own run before them, and the log has ${usable.length}${why}` };
  }
  const table = regressionTable(data, rows, options);
  const gram = new Float64Array(width * width);
  for (let r = 0; r < rows.length; r++) addOuter(gram, table, r * width, width);
  const factor = sequentialFactor(gram, width, p + q);
  const components: ComponentMemory[] = [];
  for (let j = 0; j < ds; j++) components.push(componentMemory(factor, gram, { p, q, ds, m, lags, row: p + q + j, n: rows.length }, j));
  return { rows: rows.length, usableRows: usable.length, lags, components };
}

/** Rows with `lags` chained earlier rows of the same run before them, not into an end state. */
export function usableRows(data: MemoryData, lags: number): number[] {
  const ds = data.stateDim, out: number[] = [];
  let chain = 0; // chained earlier rows before row i
  for (let i = 0; i < data.count; i++) {
    chain = i > 0 && data.episode[i] === data.episode[i - 1] && !data.terminal[i - 1] && chained(data, i, ds) ? chain + 1 : 0;
    if (chain >= lags && !data.terminal[i]) out.push(i);
  }
  return out;
}

/** Row i − 1's s' is row i's s, to CHAIN_TOLERANCE (a log whose next-state columns are printed to fewer digits still chains). */
function chained(data: MemoryData, i: number, ds: number): boolean {
  for (let c = 0; c < ds; c++) {
    const a = data.nextStates[(i - 1) * ds + c], b = data.states[i * ds + c];
    if (!(Math.abs(a - b) <= CHAIN_TOLERANCE * (Math.abs(a) + Math.abs(b)))) return false;
  }
  return true;
}

/** rows × [φ(s_t, a_t) | (z_{t−1}, …, z_{t−L}) | s' − s], z = standardised (s, a); the last two blocks centred. */
function regressionTable(data: MemoryData, rows: number[], options: PlantMemoryOptions): Float64Array {
  const ds = data.stateDim, m = data.actionDim, { lags, features, standardiser } = options;
  const p = features.dim, q = lags * (ds + m), width = p + q + ds, n = rows.length;
  const table = new Float64Array(n * width), input = new Float64Array(ds + m);
  const z = (i: number, c: number) => ((c < ds ? data.states[i * ds + c] : data.actions[i * m + c - ds]) - standardiser.mean[c]) / standardiser.scale[c];
  rows.forEach((i, r) => {
    const at = r * width;
    for (let c = 0; c < ds + m; c++) input[c] = c < ds ? data.states[i * ds + c] : data.actions[i * m + c - ds];
    features.evaluate(input, 0, table, at);
    for (let l = 1; l <= lags; l++) for (let c = 0; c < ds + m; c++) table[at + p + (l - 1) * (ds + m) + c] = z(i - l, c);
    for (let j = 0; j < ds; j++) table[at + p + q + j] = data.nextStates[i * ds + j] - data.states[i * ds + j];
  });
  for (let c = p; c < width; c++) {
    let mean = 0;
    for (let r = 0; r < n; r++) mean += table[r * width + c];
    mean /= n;
    for (let r = 0; r < n; r++) table[r * width + c] -= mean;
  }
  return table;
}

/** Upper triangle of G += x xᵀ for the row at `at`. */
function addOuter(gram: Float64Array, table: Float64Array, at: number, width: number): void {
  for (let a = 0; a < width; a++) {
    const xa = table[at + a];
    if (xa === 0) continue;
    const base = a * width;
    for (let b = a; b < width; b++) gram[base + b] += xa * table[at + b];
  }
}

/**
 * L (width × width, lower, row-major) with LLᵀ = G over the first `columns` columns, the remaining
 * rows (the targets) filled in those columns only; a column at rounding level is left zero.
 */
function sequentialFactor(gram: Float64Array, width: number, columns: number): Float64Array {
  const l = new Float64Array(width * width);
  const g = (a: number, b: number) => (a <= b ? gram[a * width + b] : gram[b * width + a]);
  for (let c = 0; c < columns; c++) {
    let pivot = g(c, c);
    for (let k = 0; k < c; k++) pivot -= l[c * width + k] ** 2;
    if (!(pivot > PIVOT_FLOOR * g(c, c))) continue;
    const root = Math.sqrt(pivot);
    for (let i = c; i < width; i++) {
      let v = g(i, c);
      for (let k = 0; k < c; k++) v -= l[i * width + k] * l[c * width + k];
      l[i * width + c] = i === c ? root : v / root;
    }
  }
  return l;
}

interface Layout { p: number; q: number; ds: number; m: number; lags: number; row: number; n: number }

function componentMemory(l: Float64Array, gram: Float64Array, at: Layout, j: number): ComponentMemory {
  const width = at.p + at.q + at.ds, y = at.row;
  let base = 0, added = 0, keptBase = 0, keptLags = 0;
  for (let c = 0; c < at.p; c++) if (l[c * width + c] > 0) { base += l[y * width + c] ** 2; keptBase++; }
  for (let c = at.p; c < at.p + at.q; c++) if (l[c * width + c] > 0) { added += l[y * width + c] ** 2; keptLags++; }
  const rss0 = Math.max(0, gram[y * width + y] - base), rss1 = Math.max(0, rss0 - added);
  const denominatorDf = at.n - keptBase - keptLags;
  // A component the base explains to rounding (an angle integrated from its rate) has no residual to read.
  if (!(rss0 > RESIDUAL_FLOOR * gram[y * width + y])) return { component: j, partialRSquared: 0, fStatistic: 0, numeratorDf: keptLags, denominatorDf, strongest: null };
  const partialRSquared = rss0 > 0 ? Math.min(1, added / rss0) : 0;
  const fStatistic = keptLags > 0 && rss1 > 0 ? (added / keptLags) / (rss1 / denominatorDf) : keptLags > 0 && added > 0 ? Infinity : 0;
  return { component: j, partialRSquared, fStatistic, numeratorDf: keptLags, denominatorDf, strongest: strongestSignal(l, gram, at, rss0) };
}

/** For each earlier column z alone beside the base: (S_zy)² / (S_zz · RSS₀), S the sums of squares left by the base. */
function strongestSignal(l: Float64Array, gram: Float64Array, at: Layout, rss0: number): EarlierSignal | null {
  const width = at.p + at.q + at.ds, y = at.row, w = at.ds + at.m;
  let best: EarlierSignal | null = null;
  for (let c = at.p; c < at.p + at.q; c++) {
    let szz = gram[c * width + c], szy = gram[c * width + y];
    for (let k = 0; k < at.p; k++) {
      szz -= l[c * width + k] ** 2;
      szy -= l[c * width + k] * l[y * width + k];
    }
    if (!(szz > PIVOT_FLOOR * gram[c * width + c]) || !(rss0 > 0)) continue;
    const share = (szy * szy) / (szz * rss0), k = c - at.p, slot = k % w;
    if (!best || share > best.partialRSquared) {
      best = { kind: slot < at.ds ? 'state' : 'action', index: slot < at.ds ? slot : slot - at.ds, lag: 1 + Math.floor(k / w), partialRSquared: share };
    }
  }
  return best;
}
