/**
 * Replicates and full-data estimates → the parts of an Assessment: per candidate its interval,
 * cross-checks, diagnostics, slices and warnings; the comparison of all policies; the share of the
 * surface the logs never visit; and the warnings that concern the whole assessment.
 */
import type { LoggedActionRanges } from '../core/diagnostics/actionSupport';
import { modelPolicyValue } from '../core/offPolicy/modelBasedValue';
import { ImportanceSamplingError, perDecisionEstimates } from '../core/offPolicy/perDecisionEstimators';
import { uncoveredShare } from '../core/diagnostics/unvisitedRegion';
import type { AssessmentWarning, CandidateAssessment, Comparison, IntervalEstimate, PairedDifference } from './assessment';
import type { AssessmentContext, CandidateWork } from './assessCandidate';
import { crossChecks } from './assessCrossChecks';
import { coverageDiagnostics, coverageWarnings } from './assessDiagnostics';
import { intervalEstimate, pairedDifference, ranking, type Estimator } from './assessIntervals';
import { isModelValueFailure, type ModelCheck } from './assessModelCheck';
import type { ReplicateSet } from './assessResamples';
import type { AssessmentSettings } from './assessSettings';
import { actionSlices } from './assessSlices';
import type { EvaluationPlan } from './plan/evaluationPlan';
import { surfaceVisits } from './plan/surfaceGrid';

export const BEHAVIOUR_NAME = 'logged behaviour (today)';
/** More failed resamples than this share raise a caution (our rule). */
const FAILED_SHARE = 0.05;

export interface AssemblyInputs {
  context: AssessmentContext;
  works: CandidateWork[];
  replicates: ReplicateSet;
  modelCheck: ModelCheck;
  modelReasons: (string | null)[];
  ranges: LoggedActionRanges;
  behaviourOutside: number | null;
  settings: AssessmentSettings;
  sign: number;
}

export function assembleCandidates(inputs: AssemblyInputs): CandidateAssessment[] {
  const { context, works, replicates, settings, sign } = inputs;
  return works.map((work, j) => {
    const diagnostics = coverageDiagnostics(work, context, inputs.ranges, { policy: context.presentController, meanOutside: inputs.behaviourOutside });
    const points = fullDataCrossChecks(inputs, work, j);
    const checks = crossChecks({
      work, replicates: replicates.candidates[j], points: points.values, weights: diagnostics.importanceWeights,
      offPolicyReason: points.offPolicyReason, modelReason: points.modelReason, level: settings.level, sign,
    });
    const policyValue = intervalEstimate(work.model.fit.policyValue, replicates.candidates[j].fqe, settings.level, sign);
    const warnings = [
      ...coverageWarnings(diagnostics),
      ...checks.filter((c) => c.agreement === 'disagrees').map((c): AssessmentWarning => ({ severity: 'serious', topic: 'crossCheck', message: `${c.label}: ${c.note}` })),
      ...failedWarning(policyValue),
    ];
    return { name: work.model.name, policyValue, crossChecks: checks, diagnostics, slices: actionSlices(work.model, context.plan.data, sign), warnings };
  });
}

function fullDataCrossChecks(inputs: AssemblyInputs, work: CandidateWork, j: number) {
  const { plan } = inputs.context, discount = plan.discount;
  const values = { importanceSampling: null as number | null, doublyRobust: null as number | null, model: null as number | null };
  let offPolicyReason: string | null = 'perDecision' in work.offPolicy ? null : work.offPolicy.reason;
  if ('perDecision' in work.offPolicy) {
    try {
      const estimates = perDecisionEstimates(work.offPolicy.perDecision, discount);
      values.importanceSampling = estimates.importanceSampling;
      values.doublyRobust = estimates.doublyRobust;
    } catch (error) {
      if (!(error instanceof ImportanceSamplingError)) throw error;
      offPolicyReason = error.message;
    }
  }
  let modelReason = inputs.modelReasons[j];
  if (modelReason === null && inputs.modelCheck.fit) {
    try {
      values.model = modelPolicyValue(inputs.modelCheck.fit, work.model.policy, discount, plan.starts.states);
    } catch (error) {
      if (!isModelValueFailure(error)) throw error;
      modelReason = (error as Error).message;
    }
  }
  return { values, offPolicyReason, modelReason };
}

function failedWarning(estimate: IntervalEstimate): AssessmentWarning[] {
  const total = estimate.replicates + estimate.failedReplicates;
  if (total === 0 || estimate.failedReplicates <= FAILED_SHARE * total) return [];
  return [{
    severity: 'caution', topic: 'bootstrap',
    message: `${estimate.failedReplicates} of ${total} resamples gave no solution of the fit; the interval uses the other ${estimate.replicates} and may be too narrow.`,
  }];
}

export function comparison(loggedValue: number, replicates: ReplicateSet, works: CandidateWork[], level: number, sign: number): Comparison {
  const behaviour: Estimator = { name: BEHAVIOUR_NAME, point: loggedValue, replicates: replicates.loggedReturn };
  // A fit that did not converge has no value to compare: it is left out of the differences and the ranking.
  const candidates: Estimator[] = works.flatMap((w, j) => (w.model.fit.status !== 'converged' ? []
    : [{ name: w.model.name, point: w.model.fit.policyValue, replicates: replicates.candidates[j].fqe }]));
  const differences: PairedDifference[] = candidates.map((c) => pairedDifference(c, behaviour, level, sign));
  for (let i = 0; i < candidates.length; i++) {
    for (let j = i + 1; j < candidates.length; j++) differences.push(pairedDifference(candidates[i], candidates[j], level, sign));
  }
  return { differences, ranking: ranking([...candidates, behaviour]) };
}

export function unvisitedShare(plan: EvaluationPlan): number | null {
  const grid = plan.surface;
  if (!grid) return null;
  return uncoveredShare(surfaceVisits(plan.data, grid), grid.resolution[0], grid.resolution[1]);
}

export function globalWarnings(context: AssessmentContext, truncationWeight: number, candidates: CandidateAssessment[], unvisited: number | null): AssessmentWarning[] {
  const out: AssessmentWarning[] = [];
  const { plan } = context;
  if (plan.approximator.kind === 'network') {
    out.push({
      severity: 'caution', topic: 'bootstrap',
      message: 'The candidates’ J by the network approximator has no interval (each resample would refit the network); compare it with the cross-checks and the sensitivity to the network width.',
    });
  }
  if (!plan.starts.followEpisodes) {
    out.push({
      severity: 'caution', topic: 'startStates',
      message: `The candidates’ J is taken at the ${plan.starts.count} start states given in the project, the logged behaviour’s return at its episodes’ own starts: the comparison with today mixes two start distributions.`,
    });
  }
  if (!context.presentController) out.push({ severity: 'caution', topic: 'behaviourModel', message: `Importance-sampling cross-checks are not available: ${context.presentControllerReason}.` });
  context.presentControllerShareAtLimit.forEach((share, j) => {
    if (share > FAILED_SHARE) {
      out.push({
        severity: 'caution', topic: 'behaviourModel',
        message: `${(100 * share).toFixed(1)} % of the logged ${plan.data.actionNames[j]} values sit at an actuator limit; the behaviour model is a least-squares fit on all rows, so the importance weights are approximate.`,
      });
    }
  });
  if (truncationWeight > 1e-3) {
    out.push({ severity: 'caution', topic: 'loggedReturn', message: `Logged episodes are short for this discount: up to ${(100 * truncationWeight).toFixed(1)} % of the return’s weight lies beyond their end, so the logged baseline and the importance-sampling estimates are biased toward zero.` });
  }
  if (unvisited !== null && unvisited > 0.5) {
    out.push({ severity: 'caution', topic: 'unvisited', message: `${(100 * unvisited).toFixed(0)} % of the value-surface grid has no logged state within one grid step: the surfaces are extrapolated there.` });
  }
  for (const c of candidates) {
    const { percentile: p, basic: b } = c.policyValue;
    if (p && b && Math.abs((p[0] + p[1]) / 2 - (b[0] + b[1]) / 2) > 0.25 * (p[1] - p[0])) {
      out.push({ severity: 'caution', topic: 'bootstrap', message: `${c.name}: the percentile and basic intervals differ markedly, a sign of a skewed or biased estimator; read both.` });
    }
  }
  return out;
}
