/**
 * Gaussian radial basis features over the standardised inputs z = (x − mean)/scale:
 * φ(x) = [1, (z if linear terms), exp(−‖z − c_j‖² / (2 w²)) for each centre c_j],
 * with centres c_j and width w both in standardised units (Bishop, "Pattern Recognition and
 * Machine Learning", 2006, §3.1, eq. 3.4).
 *
 * When the centres form a full tensor grid (as radialBasisGridSpec makes them), the Gaussian
 * factorises over the inputs, exp(−Σ_v (z_v − c_v)²/(2w²)) = Π_v exp(−(z_v − c_v)²/(2w²)), so the
 * p^n features are products of n·p one-dimensional factors: n·p exponentials per evaluation
 * instead of p^n (the same values up to rounding in the last place).
 */
import type { FeatureMap, RadialBasisFeatureSpec } from './featureTypes';
import { FeatureSpecError } from './featureSpecError';
import { MAX_FEATURES } from '../limits';
import { expandProducts, gridNodeAverage } from './gridNodeAverage';
import { readStandardiser, type StandardiserSpec } from './standardiser';

export interface RadialBasisGridOptions {
  /** Centres per input dimension (≥ 1); the grid has pointsPerDimension^n centres. */
  pointsPerDimension: number;
  /** The grid spans [−halfRange, halfRange] standard deviations in every input; default 2. */
  halfRange?: number;
  /** Width w in standard deviations; default: the grid spacing (neighbouring bumps overlap at e^(−1/2)). */
  width?: number;
  linearTerms?: boolean;
}

/** Centres on a regular grid in standardised coordinates. */
export function radialBasisGridSpec(standardiser: StandardiserSpec, options: RadialBasisGridOptions): RadialBasisFeatureSpec {
  const n = standardiser.mean.length, p = options.pointsPerDimension, half = options.halfRange ?? 2;
  if (!Number.isInteger(p) || p < 1) throw new FeatureSpecError(`pointsPerDimension: expected a whole number ≥ 1, got ${p}`);
  if (!(half > 0) || !Number.isFinite(half)) throw new FeatureSpecError(`halfRange: expected a positive number, got ${half}`);
  if (p ** n > MAX_FEATURES) throw new FeatureSpecError(`a grid of ${p} centres in each of ${n} inputs has ${p ** n} centres; at most ${MAX_FEATURES} are supported`);
  const axis = Array.from({ length: p }, (_, i) => (p === 1 ? 0 : -half + (2 * half * i) / (p - 1)));
  const centres: number[][] = [];
  const index = new Array<number>(n).fill(0);
  for (let c = 0; c < p ** n; c++) {
    centres.push(index.map((i) => axis[i]));
    for (let v = n - 1; v >= 0 && ++index[v] === p; v--) index[v] = 0; // odometer
  }
  const spacing = p === 1 ? half : (2 * half) / (p - 1);
  return {
    kind: 'radialBasis',
    centres,
    width: options.width ?? spacing,
    linearTerms: options.linearTerms ?? false,
    standardiser: { mean: [...standardiser.mean], scale: [...standardiser.scale] },
  };
}

export function createRadialBasisFeatures(spec: RadialBasisFeatureSpec): FeatureMap {
  const { mean, scale } = readStandardiser(spec.standardiser);
  const n = mean.length, centres = readCentres(spec.centres, n), c = spec.centres.length;
  const width = spec.width;
  if (typeof width !== 'number' || !(width > 0) || !Number.isFinite(width)) {
    throw new FeatureSpecError(`radial basis width: expected a positive number of standard deviations, got ${width}`);
  }
  if (typeof spec.linearTerms !== 'boolean') throw new FeatureSpecError('radial basis linearTerms: expected true or false');
  const linear = spec.linearTerms, first = linear ? 1 + n : 1, d = first + c;
  if (d > MAX_FEATURES) throw new FeatureSpecError(`radial basis features: ${d} features; at most ${MAX_FEATURES} are supported`);
  const inverseTwoWidthSq = 1 / (2 * width * width);
  const z = new Float64Array(n); // scratch; evaluate is synchronous, so one buffer per map suffices
  const frozen: RadialBasisFeatureSpec = structuredClone(spec);
  const grid = tensorGridAxes(centres, c, n);
  const bumps = grid ? createGridBumps(grid, inverseTwoWidthSq) : null;
  return {
    dim: d,
    inputDim: n,
    constantIndex: 0,
    evaluate(input, inputOffset, out, outOffset) {
      out[outOffset] = 1;
      for (let v = 0; v < n; v++) z[v] = (input[inputOffset + v] - mean[v]) / scale[v];
      if (linear) for (let v = 0; v < n; v++) out[outOffset + 1 + v] = z[v];
      if (bumps) {
        bumps(z, out, outOffset + first);
        return;
      }
      for (let j = 0; j < c; j++) {
        let r2 = 0;
        for (let v = 0; v < n; v++) {
          const t = z[v] - centres[j * n + v];
          r2 += t * t;
        }
        out[outOffset + first + j] = Math.exp(-r2 * inverseTwoWidthSq);
      }
    },
    nodeAverage: grid ? (ds) => gridNodeAverage({ mean, scale, axes: grid, inverseTwoWidthSq, linear }, ds) : undefined,
    toSpec: () => structuredClone(frozen),
  };
}

/**
 * The per-input axes when the c centres (c×n, row-major) are the full grid axes[0] × … × axes[n−1]
 * in odometer order (the last input fastest, as radialBasisGridSpec writes them); else null.
 */
function tensorGridAxes(centres: Float64Array, c: number, n: number): Float64Array[] | null {
  const axes: Float64Array[] = [];
  for (let v = 0; v < n; v++) {
    const values: number[] = []; // distinct values in order of first appearance
    for (let j = 0; j < c; j++) if (!values.includes(centres[j * n + v])) values.push(centres[j * n + v]);
    axes.push(Float64Array.from(values));
  }
  if (axes.reduce((k, a) => k * a.length, 1) !== c) return null;
  const index = new Array<number>(n).fill(0);
  for (let j = 0; j < c; j++) {
    for (let v = 0; v < n; v++) if (centres[j * n + v] !== axes[v][index[v]]) return null;
    for (let v = n - 1; v >= 0 && ++index[v] === axes[v].length; v--) index[v] = 0;
  }
  return axes;
}

/** Fills the p_0·…·p_(n−1) grid bumps at z as products of one-dimensional factors, odometer order. */
function createGridBumps(axes: Float64Array[], inverseTwoWidthSq: number): (z: Float64Array, out: Float64Array, offset: number) => void {
  const factors = axes.map((a) => new Float64Array(a.length));
  const total = axes.reduce((k, a) => k * a.length, 1), scratch = new Float64Array(total);
  return (z, out, offset) => {
    axes.forEach((axis, v) => {
      for (let i = 0; i < axis.length; i++) factors[v][i] = Math.exp(-((z[v] - axis[i]) ** 2) * inverseTwoWidthSq);
    });
    expandProducts(factors, scratch); // input by input, the last input fastest
    for (let j = 0; j < total; j++) out[offset + j] = scratch[j];
  };
}

function readCentres(centres: number[][], n: number): Float64Array {
  if (!Array.isArray(centres) || centres.length === 0) throw new FeatureSpecError('radial basis centres: expected at least one centre');
  const flat = new Float64Array(centres.length * n);
  centres.forEach((centre, j) => {
    if (!Array.isArray(centre) || centre.length !== n) {
      throw new FeatureSpecError(`radial basis centre ${j + 1}: expected ${n} coordinates (one per input)`);
    }
    centre.forEach((v, i) => {
      if (typeof v !== 'number' || !Number.isFinite(v)) throw new FeatureSpecError(`radial basis centre ${j + 1}, coordinate ${i + 1}: not a finite number`);
      flat[j * n + i] = v;
    });
  });
  return flat;
}
