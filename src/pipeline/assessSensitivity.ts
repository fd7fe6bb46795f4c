/**
 * Sensitivity of the conclusions to two settings, as data for a small plot: J of every candidate
 * (and the logged behaviour's return) over a range of discount factors, and over feature sizes
 * (polynomial degree, or radial-basis centres per input). A conclusion that holds across the range
 * does not hinge on the setting; the ranking's stability is reported per curve.
 *
 * The discount sweep reuses each candidate's one-pass statistics, which do not depend on γ
 * (linearFqe.ts), so each point is one solve. Discounts are spread over the effective horizon
 * 1/(1 − γ) at ½, ¾, 1, 1½ and 2 times the project's. The feature sweep takes the project's
 * degree (or centres per input) and one either side, each with its own data pass, solved as the
 * resamples are (assessCandidate.ts: the fixed point when the full-data iteration converged).
 */
import { meanStartFeatures } from '../core/bootstrap/startFeatures';
import { solveReplicate } from '../core/bootstrap/linearFqeReplicate';
import { accumulateBellmanStatistics } from '../core/fqe/bellmanStatistics';
import { startStateFeatures } from '../core/bootstrap/startFeatures';
import { throwIfCancelled } from '../core/fqe/cancellation';
import { loggedDiscountedReturn } from '../core/loggedReturn';
import type { ApproximatorSettings } from '../project/schema';
import type { Sensitivity, SensitivityCurve, SensitivitySeries } from './assessment';
import type { CandidateWork, SharedInputs } from './assessCandidate';
import { isEngineError } from './engineErrors';
import { featureMapFor } from './featureMapFor';

const HORIZON_FACTORS = [0.5, 0.75, 1, 1.5, 2];
const MAX_DEGREE = 6; // the project schema's limit
const MAX_CENTRES = 12;
/** Feature maps larger than this are left out of the sweep (each costs a data pass of O(n·K·d²)). */
const MAX_SWEEP_FEATURES = 300;
const BEHAVIOUR = 'logged behaviour (today)';

export function sensitivity(shared: SharedInputs, works: CandidateWork[], sign: number): Sensitivity {
  const curves = [discountCurve(shared, works, sign)];
  const features = featureCurve(shared, works, sign);
  if (features) curves.push(features);
  return { curves, notes: ['Sensitivity to network size is not computed: the sweep covers the linear approximator’s features only.'] };
}

function discountCurve(shared: SharedInputs, works: CandidateWork[], sign: number): SensitivityCurve {
  const gamma = shared.project.discount;
  const settings = HORIZON_FACTORS.map((f) => 1 - (1 - gamma) / f);
  const series: SensitivitySeries[] = works.map((w) => {
    const xiBar = meanStartFeatures(w.setup.startFeatures, w.setup.sums.dim);
    const fits = settings.map((g) => solveReplicate({ ...w.setup, discount: g }, w.fullStatistics, xiBar));
    return { name: w.name, values: fits.map((f) => (f.policyValue === null ? null : sign * f.policyValue)), status: fits.map((f) => f.status) };
  });
  series.push({ name: BEHAVIOUR, values: settings.map((g) => sign * loggedDiscountedReturn(shared.data, g).value), status: settings.map(() => 'logged') });
  return finish('discount', 'discount factor γ', settings, HORIZON_FACTORS.indexOf(1), series, sign);
}

function featureCurve(shared: SharedInputs, works: CandidateWork[], sign: number): SensitivityCurve | null {
  const a = shared.project.approximator;
  if (a.kind !== 'linear') return null;
  const polynomial = a.features.kind === 'polynomial';
  const own = a.features.kind === 'polynomial' ? a.features.degree : a.features.centresPerInput;
  const lowest = polynomial ? 1 : 2, highest = polynomial ? MAX_DEGREE : MAX_CENTRES;
  const candidates = [own - 1, own, own + 1].filter((v) => v >= lowest && v <= highest);
  const variants = candidates
    .map((v) => ({ value: v, settings: { ...a, features: polynomial ? { kind: 'polynomial' as const, degree: v } : { ...a.features, centresPerInput: v } } }))
    .filter((v) => v.value === own || sizeOf(shared, v.settings) <= MAX_SWEEP_FEATURES);
  const series: SensitivitySeries[] = works.map((w) => {
    const fits = variants.map((v) => refit(shared, w, v.settings));
    return { name: w.name, values: fits.map((f) => (f.value === null ? null : sign * f.value)), status: fits.map((f) => f.status) };
  });
  const behaviour = sign * loggedDiscountedReturn(shared.data, shared.project.discount).value;
  series.push({ name: BEHAVIOUR, values: variants.map(() => behaviour), status: variants.map(() => 'logged') });
  const parameter = polynomial ? 'polynomialDegree' : 'centresPerInput';
  const label = polynomial ? 'polynomial degree of the features' : 'radial-basis centres per input';
  return finish(parameter, label, variants.map((v) => v.value), variants.findIndex((v) => v.value === own), series, sign);
}

function sizeOf(shared: SharedInputs, settings: Extract<ApproximatorSettings, { kind: 'linear' }>): number {
  try {
    return featureMapFor(settings, shared.data).dim;
  } catch (error) {
    if (isEngineError(error)) return Infinity;
    throw error;
  }
}

function refit(shared: SharedInputs, w: CandidateWork, settings: Extract<ApproximatorSettings, { kind: 'linear' }>): { value: number | null; status: string } {
  throwIfCancelled(shared.cancel);
  try {
    const features = featureMapFor(settings, shared.data), d = features.dim;
    const stats = accumulateBellmanStatistics(shared.data, features, w.quadrature, { cancel: shared.cancel });
    const xiBar = meanStartFeatures(startStateFeatures(features, w.quadrature, shared.startStates, shared.data.stateDim), d);
    const fit = solveReplicate({ ...w.setup, ridge: settings.ridge, constantIndex: features.constantIndex, initialWeights: new Float64Array(d) }, stats, xiBar);
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
