/**
 * A candidate fitted in other function classes, for the function-class check (issue of approximation
 * error: a bootstrap over runs measures sampling error only, not the bias of a class too poor for
 * V^π). Polynomial features of degrees 2 to 4 are fitted beside the project's own class, each by one
 * pass over the data with per-episode sums, so every class is resampled on the same resamples and the
 * classes can be compared pair by pair (src/core/diagnostics/functionClassRange.ts).
 *
 * Degree 1 is left out (our choice): a linear Q cannot represent the value of a quadratic cost, so it
 * would make every verdict "not settled" without saying anything about the classes that can. Classes
 * above MAX_CLASS_FEATURES features are left out for their cost (a data pass is O(n·d²)). A class
 * whose fit does not converge has no value to compare; it is listed as such, and the verdict reads it
 * (src/core/diagnostics/functionClassRange.ts).
 */
import type { UnconvergedClass } from '../core/diagnostics/functionClassRange';
import { FIT_STATUS_WORDS } from '../core/fqe/fitStatus';
import { MAX_ITERATIONS, RIDGE, TOLERANCE } from '../core/limits';
import { throwIfCancelled } from '../core/fqe/cancellation';
import { TRANSITIONS_PER_FEATURE } from '../data/datasetChecks';
import { replicator, type AssessmentContext, type ClassWork } from './assessCandidate';
import { isEngineError } from './engineErrors';
import type { CandidateModel, LinearFitSpec } from './model/candidateModel';
import { buildLinearModelsPaced } from './model/linearModel';
import { featureMapFor } from './plan/featureMapFor';
import { polynomialClassLabel } from './plan/approximatorLabel';

export const COMPARED_DEGREES = [2, 3, 4] as const;
/** Largest feature count of a compared class (the sensitivity sweep's limit as well; ours). */
export const MAX_CLASS_FEATURES = 300;

/** The candidate's other function classes: those fitted to convergence, and those whose fit did not converge. */
export interface OtherClasses {
  readonly fitted: ClassWork[];
  readonly unconverged: UnconvergedClass[];
}

/**
 * What the class fits of several policies on one run share (one per assessment, classFits): each
 * degree's fit spec made once, so every policy's fit of a degree has the very same feature map, and
 * the class models fitted so far, which lend a later policy's pass of the same map its policy-free
 * sums (ΦᵀΦ, Φᵀr, rᵀr: the same numbers to the last bit, ../core/fqe/nextFeatureSums.ts). The
 * present controller's classes, fitted after the candidates', so form only the policy's own part.
 */
export interface ClassFits {
  readonly specs: Map<number, LinearFitSpec | null>;
  readonly models: CandidateModel[];
}

export function classFits(): ClassFits {
  return { specs: new Map(), models: [] };
}

export async function classWorks(context: AssessmentContext, model: CandidateModel, shared: ClassFits = classFits()): Promise<OtherClasses> {
  const { plan } = context, a = plan.approximator;
  const own = a.kind === 'linear' && a.features.kind === 'polynomial' ? a.features.degree : null;
  const out: ClassWork[] = [], unconverged: UnconvergedClass[] = [];
  // Highest degree first: a higher degree's data pass (the project's own included) serves the lower
  // degrees, whose monomials lead its own (linearModel.ts nestedStatistics), and their influence
  // passes are one (buildLinearModelsPaced).
  const classes = [...COMPARED_DEGREES].reverse().flatMap((degree) => {
    if (!shared.specs.has(degree)) shared.specs.set(degree, degree === own ? null : classSpec(context, degree));
    const spec = shared.specs.get(degree);
    return spec ? [{ degree, spec }] : [];
  });
  throwIfCancelled(context.cancel);
  const outcomes = await buildLinearModelsPaced(plan, model, { cancel: context.cancel }, classes.map((c) => c.spec), [model], shared.models);
  outcomes.forEach((outcome) => {
    if ('model' in outcome) shared.models.push(outcome.model);
  });
  outcomes.forEach((outcome, i) => {
    const label = polynomialClassLabel(classes[i].degree);
    if ('error' in outcome) {
      if (!isEngineError(outcome.error)) throw outcome.error; // a class that cannot be fitted is simply not compared
      return;
    }
    const fitted = outcome.model;
    if (fitted.fit.status === 'converged') out.unshift({ label, model: fitted, replicate: replicator(plan, fitted) });
    else unconverged.unshift({ label, why: FIT_STATUS_WORDS[fitted.fit.status] });
  });
  return { fitted: out, unconverged };
}



/** The fit of polynomial degree k with the project's ridge and tolerance (defaults beside a network); null when too large for the data or the budget. */
function classSpec(context: AssessmentContext, degree: number): LinearFitSpec | null {
  const { plan } = context, a = plan.approximator;
  const settings = a.kind === 'linear'
    ? { ridge: a.ridge, tolerance: a.tolerance, maxIterations: a.maxIterations }
    : { ridge: RIDGE.default, tolerance: TOLERANCE.default, maxIterations: MAX_ITERATIONS.default };
  const features = featureMapFor({ kind: 'linear', features: { kind: 'polynomial', degree }, ...settings }, plan.data);
  if (features.dim > MAX_CLASS_FEATURES || plan.data.count < TRANSITIONS_PER_FEATURE * features.dim) return null;
  return { features, ...settings };
}
