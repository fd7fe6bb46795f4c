/**
 * Coverage diagnostics of one candidate and the warnings they raise. Thresholds, as stated in the
 * report (which are rules of thumb is said beside each):
 *   - distribution shift νᵀΣ⁻¹ν (Duan, Jia & Wang 2020): caution above 4, serious above 25 — the
 *     error bound scales with its square root, so these are 2× and 5× the on-policy level (ours);
 *   - importance weights: Kish effective size at the effective horizon below 10 % of the episodes
 *     reaching it is a caution, below 1 % serious (a common rule of thumb in importance sampling);
 *   - action support: a mean outside-probability above 10 % is a caution, above 25 % serious (ours;
 *     the logged controller's own level is shown beside it for scale).
 */
import { createActionQuadrature } from '../core/actionQuadrature';
import { meanStartFeatures, policyFeatureMean } from '../core/features/policyFeatures';
import { distributionShift, nextStateFeatureMean } from '../core/diagnostics/distributionShift';
import { probabilityOutsideLoggedActions, type LoggedActionRanges } from '../core/diagnostics/actionSupport';
import { effectiveSampleSizeFromLogs } from '../core/diagnostics/effectiveSampleSize';
import { ridgeGram, ridgeGramFactor } from '../core/fqe/ridgeSystem';
import type { ImportanceWeightTable } from '../core/offPolicy/importanceWeights';
import type { GaussianPolicy } from '../core/policy';
import type { ActionSupportDiagnostics, AssessmentWarning, CoverageDiagnostics, ImportanceWeightDiagnostics } from './assessment';
import type { AssessmentContext, CandidateWork } from './assessCandidate';
import type { LinearMaterial } from './model/candidateModel';

export const COVERAGE_THRESHOLDS = {
  distributionShift: { caution: 4, serious: 25 },
  effectiveShare: { caution: 0.1, serious: 0.01 },
  outside: { caution: 0.1, serious: 0.25 },
} as const;

export interface BehaviourReference {
  policy: GaussianPolicy | null;
  /** Mean share of its action probability outside the logged range near each state. */
  meanOutside: number | null;
}

export function coverageDiagnostics(work: CandidateWork, context: AssessmentContext, ranges: LoggedActionRanges, behaviour: BehaviourReference): CoverageDiagnostics {
  const { model } = work, linear = model.linear;
  const settings = context.plan.approximator;
  const shift = linear && settings.kind === 'linear' ? linearShift(linear, settings.ridge, context, behaviour.policy) : null;
  return {
    distributionShiftStart: shift?.start ?? null,
    distributionShiftNext: shift?.next ?? null,
    behaviourShiftStart: shift?.behaviourStart ?? null,
    behaviourShiftNext: shift?.behaviourNext ?? null,
    importanceWeights: 'perDecision' in work.offPolicy ? weightDiagnostics(work.offPolicy.table, context.plan.discount) : null,
    actionSupport: actionSupport(model.policy, ranges, behaviour.meanOutside),
  };
}

/** νᵀΣ⁻¹ν of the candidate and of the fitted behaviour (ν by its own action quadrature), with the same features and Σ. */
function linearShift(linear: LinearMaterial, ridge: number, context: AssessmentContext, behaviour: GaussianPolicy | null) {
  const { features, statistics: stats } = linear, { data, starts } = context.plan, d = features.dim;
  const factor = ridgeGramFactor(ridgeGram(stats, ridge, features.constantIndex), d, ridge);
  const next = nextStateFeatureMean(stats, features.constantIndex);
  let behaviourStart: number | null = null, behaviourNext: number | null = null;
  if (behaviour) {
    const quadrature = createActionQuadrature(behaviour, context.plan.quadratureNodes);
    behaviourStart = distributionShift(policyFeatureMean(features, quadrature, starts.states, data.stateDim), factor, d);
    behaviourNext = distributionShift(policyFeatureMean(features, quadrature, data.nextStates, data.stateDim, data.terminal), factor, d);
  }
  return {
    start: distributionShift(meanStartFeatures(linear.startFeatures, d), factor, d), next: next && distributionShift(next, factor, d), behaviourStart, behaviourNext,
  };
}

function weightDiagnostics(table: ImportanceWeightTable, discount: number): ImportanceWeightDiagnostics {
  const oneStep = effectiveSampleSizeFromLogs(table.logRatio);
  const horizonSteps = Math.max(1, Math.min(table.horizon, Math.round(1 / (1 - discount))));
  const atHorizon: number[] = [];
  for (let p = 0; p < table.step.length; p++) if (table.step[p] === horizonSteps - 1) atHorizon.push(table.logWeight[p]);
  return {
    oneStepEffectiveSize: oneStep, oneStepShare: oneStep / table.step.length,
    horizonSteps, horizonEffectiveEpisodes: effectiveSampleSizeFromLogs(atHorizon), horizonEpisodes: atHorizon.length,
  };
}

export function meanOutside(policy: GaussianPolicy, ranges: LoggedActionRanges): number {
  const outside = probabilityOutsideLoggedActions(policy, ranges);
  return outside.reduce((a, b) => a + b, 0) / outside.length;
}

function actionSupport(policy: GaussianPolicy, ranges: LoggedActionRanges, behaviourMeanOutside: number | null): ActionSupportDiagnostics {
  const outside = Float64Array.from(probabilityOutsideLoggedActions(policy, ranges)).sort();
  const q = outside.length;
  return {
    neighbours: ranges.neighbours, queryStates: q,
    meanOutside: outside.reduce((a, b) => a + b, 0) / q, p90Outside: outside[Math.min(q - 1, Math.floor(0.9 * q))], maxOutside: outside[q - 1],
    behaviourMeanOutside,
  };
}

export function coverageWarnings(d: CoverageDiagnostics): AssessmentWarning[] {
  const t = COVERAGE_THRESHOLDS, out: AssessmentWarning[] = [];
  out.push(...shiftWarnings(d));
  const w = d.importanceWeights;
  if (w && w.horizonEpisodes > 0 && w.horizonEffectiveEpisodes < t.effectiveShare.caution * w.horizonEpisodes) {
    out.push({
      severity: w.horizonEffectiveEpisodes < t.effectiveShare.serious * w.horizonEpisodes ? 'serious' : 'caution', topic: 'importanceWeights',
      message: `Importance weights at step ${w.horizonSteps}: effective size ${w.horizonEffectiveEpisodes.toFixed(1)} of ${w.horizonEpisodes} episodes ` +
        `(below ${100 * t.effectiveShare.caution} %, a common rule of thumb): the importance-sampling cross-checks rest on a few episodes.`,
    });
  }
  const a = d.actionSupport;
  if (a.meanOutside > t.outside.caution) {
    const reference = a.behaviourMeanOutside === null ? '' : ` (the logged controller itself: ${(100 * a.behaviourMeanOutside).toFixed(1)} %)`;
    out.push({
      severity: a.meanOutside > t.outside.serious ? 'serious' : 'caution', topic: 'actionSupport',
      message: `On average ${(100 * a.meanOutside).toFixed(1)} % of the candidate’s action probability lies outside the actions logged at the ${a.neighbours} nearest logged states${reference}: ` +
        'there Q is extrapolated to actions the logs do not hold.',
    });
  }
  return out;
}

/**
 * The next-state shift is the candidate's own (same states, its actions); the start-state shift
 * also says how unusual the start states are in the logs, so it is read beside the behaviour's.
 */
function shiftWarnings(d: CoverageDiagnostics): AssessmentWarning[] {
  const t = COVERAGE_THRESHOLDS.distributionShift, out: AssessmentWarning[] = [];
  const bound = (v: number) => `the error bound of linear FQE grows with its square root, here ${Math.sqrt(v).toFixed(1)}× the on-policy level`;
  const next = d.distributionShiftNext;
  if (next !== null && next > t.caution) {
    out.push({
      severity: next > t.serious ? 'serious' : 'caution', topic: 'distributionShift',
      message: `Distribution shift over the logged next states νᵀΣ⁻¹ν = ${next.toPrecision(3)} (1 means none): ${bound(next)}. The candidate asks for actions in combinations the logs rarely contain.`,
    });
  }
  const start = d.distributionShiftStart, reference = d.behaviourShiftStart;
  if (start !== null && start > t.caution) {
    const own = reference === null ? '' : ` (the logged controller itself: ${reference.toPrecision(3)})`;
    const ratherStarts = reference !== null && start < 2 * reference;
    out.push({
      severity: start > t.serious && !ratherStarts ? 'serious' : 'caution', topic: 'distributionShift',
      message: `Distribution shift over the start states νᵀΣ⁻¹ν = ${start.toPrecision(3)}${own}: ${bound(start)}. ` +
        (ratherStarts ? 'The start states themselves lie where the logs are thin, so J leans on extrapolated values there.' : 'The candidate’s actions at the start states lie where the logs are thin.'),
    });
  }
  return out;
}
