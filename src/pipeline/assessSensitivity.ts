/**
 * Sensitivity of the conclusions to the estimator's settings, as data for a small plot: J of every
 * candidate (and the logged behaviour's return) over a range of discount factors, and over the
 * size of the approximator — polynomial degree or radial-basis centres per input for the linear
 * fit, hidden-layer width for a network. A conclusion that holds across the range does not hinge
 * on the setting; each curve says whether the ranking is the same at every setting.
 *
 * Linear: the discount sweep reuses each candidate's one-pass statistics, which do not depend on γ
 * (linearFqe.ts), so each point is one solve. The discounts are γ^(1/f) for f = ½, ¾, 1, 1½, 2: the
 * project's discount with its time constant scaled by f (γ = e^(−Δt/τ) per step of Δt, so τ → f·τ
 * gives γ^(1/f)); for γ near 1 this scales the effective horizon 1/(1 − γ) by about f, and it stays
 * inside (0, 1) for every γ there by construction. The feature sweep takes the project's centres and
 * one either side, or three polynomial degrees around the project's from 2 up (sweptDegrees), each
 * from the class check's fit of that degree or its own data pass, solved as the resamples are.
 * Network: every point is a new network fit, so only the width is swept (½× and 2× the units of
 * every hidden layer, beside the project's own fit; sweptWidths) and the discount sweep is left out.
 */
import { meanStartFeatures, startStateFeatures } from '../core/features/policyFeatures';
import { POLYNOMIAL_DEGREE_RANGE, RADIAL_CENTRES_RANGE } from '../core/limits';
import { reachedSolve, replicateSystem } from '../core/bootstrap/linearFqeReplicate';
import { bellmanStatisticsSteps } from '../core/fqe/bellmanStatistics';
import { createPacer, PACE_INTERVAL_MS, runStepsPaced, throwIfCancelled } from '../core/fqe/cancellation';
import { loggedDiscountedReturns } from '../core/loggedReturn';
import { rewardTermScale } from '../core/rankingTie';
import type { ApproximatorSettings } from '../project/approximatorSchema';
import type { AssessmentWarning, Sensitivity, SensitivityCurve, SensitivitySeries } from './assessment';
import { checkDiscountSweep, type SweepCheckSettings } from './assessSweepCheck';
import { linearSolveSettings, type AssessmentContext, type CandidateWork } from './assessCandidate';
import { BEHAVIOUR_NAME } from './assessAssembly';
import { COMPARED_DEGREES, MAX_CLASS_FEATURES } from './assessClasses';
import { polynomialClassLabel } from './plan/approximatorLabel';
import { sweepRanking } from './sweepRanking';
import { isEngineError } from './engineErrors';
import { fitNetworkCandidate } from './fitNetworkCandidate';
import { NETWORK_LIMITS } from '../core/fqe/networkSettings';
import { wholePassStatistics } from './model/linearModel';
import { networkRequest } from './model/networkModel';
import { featureMapFor } from './plan/featureMapFor';

type LinearSettings = Extract<ApproximatorSettings, { kind: 'linear' }>;
type NetworkSettings = Extract<ApproximatorSettings, { kind: 'network' }>;

const HORIZON_FACTORS = [0.5, 0.75, 1, 1.5, 2];
const WIDTH_FACTORS = [0.5, 1, 2];

/** The sweeps, and per candidate (works' order) the warnings the discount sweep's check raised (assessSweepCheck.ts). */
export async function sensitivity(context: AssessmentContext, works: CandidateWork[], sign: number, check: SweepCheckSettings): Promise<{ sensitivity: Sensitivity; warnings: AssessmentWarning[][] }> {
  const a = context.plan.approximator;
  if (a.kind === 'network') {
    return { sensitivity: { curves: [await widthCurve(context, works, a, sign)], notes: ['With the network approximator every setting is a new network fit, so the discount is not swept.'] }, warnings: works.map(() => []) };
  }
  const discount = discountCurve(context, works, sign, check), curves = [discount.curve];
  const features = await featureCurve(context, works, a, sign);
  if (features) curves.push(features);
  const notes = [...(discount.note ? [discount.note] : []), 'Network sizes are swept when the project uses the network approximator; this project’s sweep covers the linear features.'];
  return { sensitivity: { curves, notes }, warnings: discount.warnings };
}

/** γ^(1/f): the discount with its time constant scaled by f, inside (0, 1) for every γ there. */
export function sweptDiscount(discount: number, factor: number): number {
  return discount ** (1 / factor);
}

/** The discount curve with its check against what the rewards allow (assessSweepCheck.ts): marked points, the settings the ranking leaves out, warnings. */
function discountCurve(context: AssessmentContext, works: CandidateWork[], sign: number, check: SweepCheckSettings): { curve: SensitivityCurve; warnings: AssessmentWarning[][]; note: string | null } {
  const { plan } = context, settings = HORIZON_FACTORS.map((f) => sweptDiscount(plan.discount, f)), projectIndex = HORIZON_FACTORS.indexOf(1);
  const fitted = works.map((w) => {
    const setup = linearSolveSettings(plan, w.model), { statistics, startFeatures, features } = w.model.linear!;
    const xiBar = meanStartFeatures(startFeatures, features.dim), system = replicateSystem(setup, statistics); // G + λD and its factor: the same at every γ
    // The project's own point carries its fit's status, as in the feature sweep (ownPoint): where that fit diverged its weights
    // are the fixed point, from which the iteration at the same discount stops at once and would read as converged.
    return settings.map((g, k) => (k === projectIndex && w.model.fit.status !== 'converged'
      ? { policyValue: w.model.fit.policyValue, weights: null, status: w.model.fit.status }
      : reachedSolve({ ...setup, discount: g }, statistics, xiBar, system)));
  });
  const swept = checkDiscountSweep(context, works, settings, projectIndex, fitted, check);
  const series: SensitivitySeries[] = works.map((w, c) => ({
    name: w.model.name, values: fitted[c].map((f) => (f.policyValue === null ? null : sign * f.policyValue)), status: fitted[c].map((f) => f.status),
    ...(swept.marks[c].some(Boolean) ? { beyondPossible: swept.marks[c] } : {}),
  }));
  series.push({ name: BEHAVIOUR_NAME, values: loggedDiscountedReturns(plan.data, settings).map((r) => sign * r.value), status: settings.map(() => 'logged'), reference: true });
  const scales = settings.map((g) => rewardTermScale(plan.data.rewards, g));
  return { curve: finish('discount', 'discount factor γ', settings, projectIndex, series, sign, scales), warnings: swept.warnings, note: swept.note };
}

async function featureCurve(context: AssessmentContext, works: CandidateWork[], a: LinearSettings, sign: number): Promise<SensitivityCurve | null> {
  const polynomial = a.features.kind === 'polynomial';
  const own = a.features.kind === 'polynomial' ? a.features.degree : a.features.centresPerInput;
  const range = polynomial ? POLYNOMIAL_DEGREE_RANGE : RADIAL_CENTRES_RANGE;
  const sizes = polynomial ? sweptDegrees(own, range.max) : [own - 1, own, own + 1].filter((v) => v >= range.min && v <= range.max);
  const variants = sizes
    .map((v) => ({ value: v, settings: { ...a, features: polynomial ? { kind: 'polynomial' as const, degree: v } : { ...a.features, centresPerInput: v } } }))
    .filter((v) => v.value === own || sizeOf(context, v.settings) <= MAX_CLASS_FEATURES);
  const series: SensitivitySeries[] = [];
  for (const w of works) {
    const fits = [];
    for (const v of variants) fits.push(v.value === own ? ownPoint(w) : await refitLinear(context, w, v.settings));
    series.push({ name: w.model.name, values: fits.map((f) => (f.value === null ? null : sign * f.value)), status: fits.map((f) => f.status) });
  }
  series.push(flatBehaviour(context, variants.length, sign));
  const parameter = polynomial ? 'polynomialDegree' : 'centresPerInput';
  const label = polynomial ? 'polynomial degree of the features' : 'radial-basis centres per input';
  return finish(parameter, label, variants.map((v) => v.value), variants.findIndex((v) => v.value === own), series, sign, projectScales(context, variants.length));
}

/**
 * The polynomial degrees swept: three neighbours of the project's own, one either side where both
 * exist, the window moved up (or down at the schema's highest) to keep three, and never below the
 * lowest degree the function-class check compares (2) unless the project's own is lower. A degree-1
 * Q cannot represent the value of a quadratic cost (assessClasses.ts), so a ranking that turned
 * there would say nothing about the candidates; degrees 2–4 are the class check's own fits, reused.
 */
export function sweptDegrees(own: number, highest: number): number[] {
  const lowest = Math.min(own, COMPARED_DEGREES[0]);
  const start = Math.max(lowest, Math.min(own - 1, highest - 2));
  return [start, start + 1, start + 2].filter((v) => v >= lowest && v <= highest);
}

/**
 * The swept networks: every hidden layer scaled by each of WIDTH_FACTORS and held to NETWORK_LIMITS.units,
 * the project's own (factor 1) kept as it is. A scaled network whose first layer — the figure's setting — comes
 * out as the project's (one unit halved, or 1,024 doubled at the limit) is left out: its point would stand at the
 * project's setting under the project's label while being another fit.
 */
export function sweptWidths(hiddenLayers: readonly number[]): { factor: number; hiddenLayers: number[] }[] {
  const { min, max } = NETWORK_LIMITS.units;
  return WIDTH_FACTORS
    .map((factor) => ({ factor, hiddenLayers: hiddenLayers.map((u) => (factor === 1 ? u : Math.min(max, Math.max(min, Math.round(u * factor))))) }))
    .filter((w) => w.factor === 1 || w.hiddenLayers[0] !== hiddenLayers[0]);
}

async function widthCurve(context: AssessmentContext, works: CandidateWork[], a: NetworkSettings, sign: number): Promise<SensitivityCurve> {
  const widths = sweptWidths(a.hiddenLayers);
  const series: SensitivitySeries[] = [];
  for (const w of works) {
    const fits = [];
    for (const { factor, hiddenLayers } of widths) fits.push(factor === 1 ? ownPoint(w) : await refitNetwork(context, w, { ...a, hiddenLayers }));
    series.push({ name: w.model.name, values: fits.map((f) => (f.value === null ? null : sign * f.value)), status: fits.map((f) => f.status) });
  }
  series.push(flatBehaviour(context, widths.length, sign));
  const projectIndex = widths.findIndex((w) => w.factor === 1);
  return finish('networkWidth', `units in the first hidden layer (all layers scaled alike; project ${a.hiddenLayers.join('×')})`, widths.map((w) => w.hiddenLayers[0]), projectIndex, series, sign, projectScales(context, widths.length));
}

/** The project's own fit as a sweep's point: "project setting" where it converged, else its own status, which the figure's sentence names. */
function ownPoint(w: CandidateWork): { value: number | null; status: string } {
  return { value: w.model.fit.policyValue, status: w.model.fit.status === 'converged' ? 'project setting' : w.model.fit.status };
}

function flatBehaviour(context: AssessmentContext, count: number, sign: number): SensitivitySeries {
  const value = sign * context.plan.loggedReturn.value;
  return { name: BEHAVIOUR_NAME, values: new Array<number>(count).fill(value), status: new Array<string>(count).fill('logged'), reference: true };
}

function sizeOf(context: AssessmentContext, settings: LinearSettings): number {
  try {
    return featureMapFor(settings, context.plan.data).dim;
  } catch (error) {
    if (isEngineError(error)) return Infinity;
    throw error;
  }
}

/**
 * The candidate solved with other features. Its statistics and start features are those of the same
 * class in the class comparison when that class was fitted (the same feature map, quadrature and
 * ridge, so the same sums, up to their order of summation), else read off a compared class's whole
 * pass where that is this pass to the last bit (wholePassStatistics), else one more data pass — paced like the
 * model's own (cancellation.ts), so a stop request is heard during it.
 * Its status is the class check's where that class did not converge (no value, the same words), else
 * that of the fitted Q-evaluation iteration from zero weights, the rule the project's own fit is judged
 * by: solved directly at its fixed point, as the resamples of a converged fit are, a class whose
 * iteration diverges would still give a number and be called converged.
 */
async function refitLinear(context: AssessmentContext, w: CandidateWork, settings: LinearSettings): Promise<{ value: number | null; status: string }> {
  const { plan, cancel } = context, { quadrature } = w.model;
  throwIfCancelled(cancel);
  const label = settings.features.kind === 'polynomial' ? polynomialClassLabel(settings.features.degree) : null;
  const unconverged = w.unconvergedClasses.find((c) => c.label === label);
  if (unconverged) return { value: null, status: unconverged.why };
  try {
    const fitted = w.classes.find((c) => c.label === label)?.model.linear;
    const features = fitted?.features ?? featureMapFor(settings, plan.data), d = features.dim;
    const stats = fitted?.statistics ?? wholePassStatistics(plan, features, quadrature, w.classes.map((c) => c.model))
      ?? await runStepsPaced(bellmanStatisticsSteps(plan.data, features, quadrature, { cancel }), context.pace ?? createPacer(PACE_INTERVAL_MS));
    const xiBar = meanStartFeatures(fitted?.startFeatures ?? startStateFeatures(features, quadrature, plan.starts.states, plan.data.stateDim), d);
    const solve = { ...linearSolveSettings(plan, w.model), solver: 'iteration' as const, ridge: settings.ridge, tolerance: settings.tolerance, maxIterations: settings.maxIterations };
    // Judged as the project's own fit is (reachedSolve: the tolerance met, or a stop at the limit with a proved contraction).
    const fit = reachedSolve({ ...solve, constantIndex: features.constantIndex, initialWeights: new Float64Array(d) }, stats, xiBar);
    return { value: fit.status === 'converged' ? fit.policyValue : null, status: fit.status };
  } catch (error) {
    if (isEngineError(error)) return { value: null, status: (error as Error).message };
    throw error;
  }
}

async function refitNetwork(context: AssessmentContext, w: CandidateWork, settings: NetworkSettings): Promise<{ value: number | null; status: string }> {
  throwIfCancelled(context.cancel);
  try {
    const fit = await fitNetworkCandidate(networkRequest(context.plan, w.model, { cancel: context.cancel, wasmPath: context.wasmPath }, settings));
    fit.dispose();
    return { value: fit.policyValue, status: fit.status };
  } catch (error) {
    if (isEngineError(error)) return { value: null, status: (error as Error).message };
    throw error;
  }
}

/** The tie rule's term scale at the project's discount, the same at each of `count` settings (core/rankingTie.ts). */
function projectScales(context: AssessmentContext, count: number): number[] {
  return new Array<number>(count).fill(rewardTermScale(context.plan.data.rewards, context.plan.discount));
}

/** termScales: per setting, the size of the terms its J sum, for the ranking's tie rule (core/rankingTie.ts). */
function finish(
  parameter: SensitivityCurve['parameter'], label: string, settings: number[], projectIndex: number, series: SensitivitySeries[], sign: number, termScales: number[],
): SensitivityCurve {
  return { parameter, label, settings, projectIndex, series, ...sweepRanking(settings, series, sign, projectIndex, termScales) };
}
