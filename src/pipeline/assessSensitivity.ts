/**
 * Sensitivity of the conclusions to the estimator's settings, as data for a small plot: J of every
 * candidate (and the logged behaviour's return) over a range of discount factors, and over the
 * size of the approximator — polynomial degree or radial-basis centres per input for the linear
 * fit, hidden-layer width for a network. A conclusion that holds across the range does not hinge
 * on the setting; each curve says whether the ranking is the same at every setting.
 *
 * Linear: the discount sweep reuses each candidate's one-pass statistics, which do not depend on γ
 * (linearFqe.ts), so each point is one solve; discounts spread the effective horizon 1/(1 − γ) over
 * ½, ¾, 1, 1½ and 2 times the project's. The feature sweep takes the project's degree (or centres)
 * and one either side, each with its own data pass, solved as the resamples are.
 * Network: every point is a new network fit, so only the width is swept (½× and 2× the units of
 * every hidden layer, beside the project's own fit) and the discount sweep is left out.
 */
import { meanStartFeatures, startStateFeatures } from '../core/bootstrap/startFeatures';
import { solveReplicate } from '../core/bootstrap/linearFqeReplicate';
import { accumulateBellmanStatistics } from '../core/fqe/bellmanStatistics';
import { throwIfCancelled } from '../core/fqe/cancellation';
import { loggedDiscountedReturn } from '../core/loggedReturn';
import type { ApproximatorSettings } from '../project/schema';
import type { Sensitivity, SensitivityCurve, SensitivitySeries } from './assessment';
import type { CandidateWork, LinearWork, SharedInputs } from './assessCandidate';
import { isEngineError } from './engineErrors';
import { featureMapFor } from './featureMapFor';
import { fitCandidate } from './fitCandidate';

type LinearSettings = Extract<ApproximatorSettings, { kind: 'linear' }>;
type NetworkSettings = Extract<ApproximatorSettings, { kind: 'network' }>;

const HORIZON_FACTORS = [0.5, 0.75, 1, 1.5, 2];
const MAX_DEGREE = 6; // the project schema's limits
const MAX_CENTRES = 12;
const MAX_UNITS = 1024;
const WIDTH_FACTORS = [0.5, 1, 2];
/** Feature maps larger than this are left out of the sweep (each costs a data pass of O(n·K·d²)). */
const MAX_SWEEP_FEATURES = 300;
const BEHAVIOUR = 'logged behaviour (today)';

export async function sensitivity(shared: SharedInputs, works: CandidateWork[], sign: number): Promise<Sensitivity> {
  const a = shared.project.approximator;
  if (a.kind === 'network') {
    return { curves: [await widthCurve(shared, works, a, sign)], notes: ['With the network approximator every setting is a new network fit, so the discount is not swept.'] };
  }
  const linear = works.map((w) => w.linear!);
  const curves = [discountCurve(shared, works, linear, sign)];
  const features = featureCurve(shared, works, a, sign);
  if (features) curves.push(features);
  return { curves, notes: ['Network sizes are swept when the project uses the network approximator; this project’s sweep covers the linear features.'] };
}

function discountCurve(shared: SharedInputs, works: CandidateWork[], linear: LinearWork[], sign: number): SensitivityCurve {
  const settings = HORIZON_FACTORS.map((f) => 1 - (1 - shared.project.discount) / f);
  const series: SensitivitySeries[] = works.map((w, j) => {
    const { setup, fullStatistics } = linear[j], xiBar = meanStartFeatures(setup.startFeatures, setup.sums.dim);
    const fits = settings.map((g) => solveReplicate({ ...setup, discount: g }, fullStatistics, xiBar));
    return { name: w.name, values: fits.map((f) => (f.policyValue === null ? null : sign * f.policyValue)), status: fits.map((f) => f.status) };
  });
  series.push({ name: BEHAVIOUR, values: settings.map((g) => sign * loggedDiscountedReturn(shared.data, g).value), status: settings.map(() => 'logged') });
  return finish('discount', 'discount factor γ', settings, HORIZON_FACTORS.indexOf(1), series, sign);
}

function featureCurve(shared: SharedInputs, works: CandidateWork[], a: LinearSettings, sign: number): SensitivityCurve | null {
  const polynomial = a.features.kind === 'polynomial';
  const own = a.features.kind === 'polynomial' ? a.features.degree : a.features.centresPerInput;
  const lowest = polynomial ? 1 : 2, highest = polynomial ? MAX_DEGREE : MAX_CENTRES;
  const variants = [own - 1, own, own + 1].filter((v) => v >= lowest && v <= highest)
    .map((v) => ({ value: v, settings: { ...a, features: polynomial ? { kind: 'polynomial' as const, degree: v } : { ...a.features, centresPerInput: v } } }))
    .filter((v) => v.value === own || sizeOf(shared, v.settings) <= MAX_SWEEP_FEATURES);
  const series: SensitivitySeries[] = works.map((w) => {
    const fits = variants.map((v) => (v.value === own ? { value: w.policyValue, status: 'project setting' } : refitLinear(shared, w, v.settings)));
    return { name: w.name, values: fits.map((f) => (f.value === null ? null : sign * f.value)), status: fits.map((f) => f.status) };
  });
  series.push(flatBehaviour(shared, variants.length, sign));
  const parameter = polynomial ? 'polynomialDegree' : 'centresPerInput';
  const label = polynomial ? 'polynomial degree of the features' : 'radial-basis centres per input';
  return finish(parameter, label, variants.map((v) => v.value), variants.findIndex((v) => v.value === own), series, sign);
}

async function widthCurve(shared: SharedInputs, works: CandidateWork[], a: NetworkSettings, sign: number): Promise<SensitivityCurve> {
  const widths = WIDTH_FACTORS.map((f) => a.hiddenLayers.map((u) => Math.min(MAX_UNITS, Math.max(1, Math.round(u * f)))));
  const series: SensitivitySeries[] = [];
  for (const w of works) {
    const fits = [];
    for (const [i, hiddenLayers] of widths.entries()) fits.push(WIDTH_FACTORS[i] === 1 ? { value: w.policyValue, status: 'project setting' } : await refitNetwork(shared, w, { ...a, hiddenLayers }));
    series.push({ name: w.name, values: fits.map((f) => (f.value === null ? null : sign * f.value)), status: fits.map((f) => f.status) });
  }
  series.push(flatBehaviour(shared, widths.length, sign));
  return finish('networkWidth', `units in the first hidden layer (all layers scaled alike; project ${a.hiddenLayers.join('×')})`, widths.map((h) => h[0]), WIDTH_FACTORS.indexOf(1), series, sign);
}

function flatBehaviour(shared: SharedInputs, count: number, sign: number): SensitivitySeries {
  const value = sign * loggedDiscountedReturn(shared.data, shared.project.discount).value;
  return { name: BEHAVIOUR, values: new Array<number>(count).fill(value), status: new Array<string>(count).fill('logged') };
}

function sizeOf(shared: SharedInputs, settings: LinearSettings): number {
  try {
    return featureMapFor(settings, shared.data).dim;
  } catch (error) {
    if (isEngineError(error)) return Infinity;
    throw error;
  }
}

function refitLinear(shared: SharedInputs, w: CandidateWork, settings: LinearSettings): { value: number | null; status: string } {
  throwIfCancelled(shared.cancel);
  try {
    const features = featureMapFor(settings, shared.data), d = features.dim;
    const stats = accumulateBellmanStatistics(shared.data, features, w.quadrature, { cancel: shared.cancel });
    const xiBar = meanStartFeatures(startStateFeatures(features, w.quadrature, shared.startStates, shared.data.stateDim), d);
    const fit = solveReplicate({ ...w.linear!.setup, ridge: settings.ridge, constantIndex: features.constantIndex, initialWeights: new Float64Array(d) }, stats, xiBar);
    return { value: fit.policyValue, status: fit.status };
  } catch (error) {
    if (isEngineError(error)) return { value: null, status: (error as Error).message };
    throw error;
  }
}

async function refitNetwork(shared: SharedInputs, w: CandidateWork, settings: NetworkSettings): Promise<{ value: number | null; status: string }> {
  throwIfCancelled(shared.cancel);
  try {
    const fit = await fitCandidate({
      data: shared.data, policy: w.policy, approximator: settings, discount: shared.project.discount, quadratureNodes: shared.project.quadratureNodes,
      seed: shared.project.seed, startStates: shared.startStates, cancel: shared.cancel, wasmPath: shared.wasmPath,
    });
    fit.dispose();
    return { value: fit.policyValue, status: fit.status };
  } catch (error) {
    if (isEngineError(error)) return { value: null, status: (error as Error).message };
    throw error;
  }
}

function finish(
  parameter: SensitivityCurve['parameter'], label: string, settings: number[], projectIndex: number, series: SensitivitySeries[], sign: number,
): SensitivityCurve {
  const orderAt = (i: number) => series.filter((s) => s.values[i] !== null).sort((x, y) => sign * ((y.values[i] as number) - (x.values[i] as number))).map((s) => s.name).join('>');
  const reference = orderAt(projectIndex);
  return { parameter, label, settings, projectIndex, series, rankingStable: settings.every((_, i) => orderAt(i) === reference) };
}
