/**
 * The cross-checks of one candidate by other methods, each with the assumption it rests on and a
 * verdict against fitted Q-evaluation from the paired bootstrap over the same resamples.
 *
 * Verdict (our thresholds, stated in the report): "disagrees" when the difference exceeds 3
 * standard errors of the paired difference and 2 % of |J|; "uninformative" for the weighted
 * estimators when the importance weights at the effective horizon have a Kish effective size
 * below max(10, 10 % of the episodes) — the weights then rest on a handful of episodes (and the
 * doubly robust estimate falls back on the same fitted Q, so agreement would prove little).
 */
import type { Agreement, CrossCheck, CrossCheckMethod, ImportanceWeightDiagnostics } from './assessment';
import type { CandidateWork } from './assessCandidate';
import { intervalEstimate, pairedReplicates } from './assessIntervals';
import type { CandidateReplicates, Replicates } from './assessResamples';

export const AGREEMENT_THRESHOLDS = { standardErrors: 3, relative: 0.02, minEffectiveEpisodes: 10, minEffectiveShare: 0.1 } as const;

const ASSUMPTIONS: Record<CrossCheckMethod, { label: string; assumption: string }> = {
  weightedImportanceSampling: {
    label: 'Weighted per-decision importance sampling',
    assumption: 'The logged actions were drawn from the fitted behaviour model (linear-Gaussian in the state, clipped at limits seen in the logs), ' +
      'the candidate only takes actions the logged controller could also have taken, and episodes are independent. Uses the logged rewards only, ' +
      'no model of Q; self-normalised per step, so slightly biased in small samples but consistent.',
  },
  weightedDoublyRobust: {
    label: 'Weighted doubly robust',
    assumption: 'Consistent when either the fitted Q or the behaviour model is right. It shares the fitted Q with the main estimate: when the ' +
      'importance weights are concentrated it falls back on that Q and cannot confirm it. The Q part is held at the full-data fit across resamples.',
  },
  linearQuadraticModel: {
    label: 'Linear-quadratic model (closed form)',
    assumption: 'The plant is linear with Gaussian noise and the reward is quadratic in states and actions, as fitted to the logs by least squares, ' +
      'and the candidate’s actions are never limited. Does not depend on the features of the main fit.',
  },
};

export interface CrossCheckInputs {
  work: CandidateWork;
  replicates: CandidateReplicates;
  points: { importanceSampling: number | null; doublyRobust: number | null; model: number | null };
  weights: ImportanceWeightDiagnostics | null;
  offPolicyReason: string | null;
  modelReason: string | null;
  level: number;
  sign: number;
}

export function crossChecks(inputs: CrossCheckInputs): CrossCheck[] {
  const { replicates: r, points } = inputs;
  return [
    crossCheck('weightedImportanceSampling', points.importanceSampling, r.importanceSampling, inputs.offPolicyReason, inputs),
    crossCheck('weightedDoublyRobust', points.doublyRobust, r.doublyRobust, inputs.offPolicyReason, inputs),
    crossCheck('linearQuadraticModel', points.model, r.model, inputs.modelReason, inputs),
  ];
}

function crossCheck(method: CrossCheckMethod, point: number | null, replicates: Replicates | null, reason: string | null, inputs: CrossCheckInputs): CrossCheck {
  const { label, assumption } = ASSUMPTIONS[method];
  if (point === null || replicates === null) {
    return { method, label, assumption, estimate: null, difference: null, agreement: 'notApplicable', note: `Not applicable: ${reason ?? 'no estimate on the full data'}.` };
  }
  const fqe = inputs.work.model.fit.policyValue;
  const estimate = intervalEstimate(point, replicates, inputs.level, inputs.sign);
  const difference = intervalEstimate(point - fqe, pairedReplicates(replicates, inputs.replicates.fqe), inputs.level, inputs.sign);
  // Without replicates of the main estimate (a network) the check's own standard error stands in for the paired one.
  const standardError = difference.standardError ?? estimate.standardError;
  const { agreement, note } = verdict(method, point - fqe, standardError, fqe, inputs.weights, difference.standardError !== null);
  return { method, label, assumption, estimate, difference, agreement, note };
}

function verdict(
  method: CrossCheckMethod, delta: number, standardError: number | null, fqe: number, weights: ImportanceWeightDiagnostics | null, paired: boolean,
): { agreement: Agreement; note: string } {
  const t = AGREEMENT_THRESHOLDS;
  const relative = Math.abs(delta) / Math.max(Math.abs(fqe), Number.MIN_VALUE);
  const z = standardError && standardError > 0 ? Math.abs(delta) / standardError : Infinity;
  const of = paired ? 'of the paired difference' : 'of this check (the main estimate has no resamples)';
  const gap = `differs from fitted Q-evaluation by ${(100 * relative).toFixed(1)} % of J (${Number.isFinite(z) ? z.toFixed(1) : '∞'} standard errors ${of})`;
  if (method !== 'linearQuadraticModel' && weights) {
    const needed = Math.max(t.minEffectiveEpisodes, t.minEffectiveShare * weights.horizonEpisodes);
    if (weights.horizonEffectiveEpisodes < needed) {
      return { agreement: 'uninformative', note: `Uninformative: at step ${weights.horizonSteps} the importance weights have an effective size of ${weights.horizonEffectiveEpisodes.toFixed(1)} episodes (below ${needed.toFixed(0)}); it ${gap}.` };
    }
  }
  if (z > t.standardErrors && relative > t.relative) return { agreement: 'disagrees', note: `Disagrees: it ${gap}.` };
  return { agreement: 'agrees', note: `Agrees: it ${gap}.` };
}
