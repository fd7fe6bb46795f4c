/**
 * Input standardisation z = (x − mean) / scale per input column, fitted from data.
 *
 * Why: polynomial and radial-basis features of raw plant units (levels in metres next to flows
 * in m³/h) give Gram matrices whose condition number grows like scale^(2·degree); centring and
 * scaling each column first is common practice (Hastie, Tibshirani & Friedman, "The Elements of
 * Statistical Learning", 2nd ed., §3.4.1).
 */
import type { TransitionSet } from '../transitions';
import { FeatureSpecError } from './featureSpecError';

/** Plain-JSON numbers of a fitted standardiser; both arrays have one entry per input column. */
export interface StandardiserSpec {
  mean: number[];
  scale: number[];
}

export interface StandardiserFit {
  readonly spec: StandardiserSpec;
  /** 0-based input columns with (numerically) no spread; they get scale 1 and so standardise to 0. */
  readonly constantColumns: number[];
}

/**
 * Fit mean and population standard deviation of each column of rows (count×width row-major).
 * Two passes (mean, then squared deviations) avoid the cancellation of the one-pass formula
 * (Chan, Golub & LeVeque, "Algorithms for computing the sample variance", 1983).
 */
export function fitStandardiser(rows: ArrayLike<number>, count: number, width: number): StandardiserFit {
  if (!(count >= 1)) throw new FeatureSpecError(`standardiser: need at least one row of data, got ${count}`);
  if (rows.length < count * width) throw new FeatureSpecError(`standardiser: expected ${count}×${width} values, got ${rows.length}`);
  return fitColumns(count, width, (i, c) => rows[i * width + c]);
}

/** Fit the standardiser of the feature inputs z = [s, a] of a transition set (columns: states, then actions). */
export function fitStateActionStandardiser(data: Pick<TransitionSet, 'count' | 'stateDim' | 'actionDim' | 'states' | 'actions'>): StandardiserFit {
  const { count, stateDim: ds, actionDim: m, states, actions } = data;
  if (!(count >= 1)) throw new FeatureSpecError('standardiser: the transition set is empty');
  return fitColumns(count, ds + m, (i, c) => (c < ds ? states[i * ds + c] : actions[i * m + c - ds]));
}

function fitColumns(count: number, width: number, value: (row: number, column: number) => number): StandardiserFit {
  const mean: number[] = [], scale: number[] = [], constantColumns: number[] = [];
  for (let c = 0; c < width; c++) {
    let sum = 0;
    for (let i = 0; i < count; i++) sum += value(i, c);
    const mu = sum / count;
    let squares = 0;
    for (let i = 0; i < count; i++) squares += (value(i, c) - mu) ** 2;
    const sd = Math.sqrt(squares / count);
    if (!Number.isFinite(mu) || !Number.isFinite(sd)) {
      throw new FeatureSpecError(`standardiser: input column ${c + 1} contains a non-finite value`);
    }
    // Spread at round-off level of the mean is no spread: such a column carries no information.
    const constant = sd === 0 || sd <= 1e-12 * Math.abs(mu);
    if (constant) constantColumns.push(c);
    mean.push(mu);
    scale.push(constant ? 1 : sd);
  }
  return { spec: { mean, scale }, constantColumns };
}

/** Validate a standardiser read from JSON; returns typed copies. */
export function readStandardiser(spec: StandardiserSpec): { mean: Float64Array; scale: Float64Array } {
  if (!spec || !Array.isArray(spec.mean) || !Array.isArray(spec.scale)) {
    throw new FeatureSpecError('standardiser: expected {"mean": [...], "scale": [...]}');
  }
  if (spec.mean.length === 0) throw new FeatureSpecError('standardiser.mean: needs at least one input column');
  if (spec.mean.length !== spec.scale.length) {
    throw new FeatureSpecError(`standardiser: mean has ${spec.mean.length} entries but scale has ${spec.scale.length}`);
  }
  spec.mean.forEach((v, i) => {
    if (typeof v !== 'number' || !Number.isFinite(v)) throw new FeatureSpecError(`standardiser.mean[${i}]: expected a finite number, got ${v}`);
  });
  spec.scale.forEach((v, i) => {
    if (typeof v !== 'number' || !(v > 0) || !Number.isFinite(v)) {
      throw new FeatureSpecError(`standardiser.scale[${i}]: expected a positive finite number, got ${v}`);
    }
  });
  return { mean: Float64Array.from(spec.mean), scale: Float64Array.from(spec.scale) };
}
