/**
 * The cross-checks of one model by other methods, each with the assumption it rests on and a
 * verdict against fitted Q-evaluation from the paired bootstrap (src/core/offPolicy/
 * crossCheckVerdict.ts states the rule: informative only when it could see an error of 10 % of J,
 * with enough effective weight and little extrapolation; disagrees beyond 3 paired standard errors
 * and 2 % of J). The verdicts together give the headline: confirmed, contradicted or unconfirmed.
 */
import { LOGGED_LIMITS_NAMED } from '../core/loggedActionLimits';
import { confirmationOf, crossCheckVerdict, type CrossCheckEvidence } from '../core/offPolicy/crossCheckVerdict';
import { unpairedStandardError } from '../core/offPolicy/unpairedDifference';
import type { CrossCheck, CrossCheckMethod, ImportanceWeightDiagnostics } from './assessment';
import type { CandidateWork } from './assessCandidate';
import { intervalEstimate, pairedReplicates } from './assessIntervals';
import type { CandidateReplicates, Replicates } from './assessResamples';
import { ROLLOUT_STARTS, type RolloutOutcome } from './assessRollouts';

const ASSUMPTIONS: Record<CrossCheckMethod, { label: string; assumption: string }> = {
  weightedImportanceSampling: {
    label: 'Weighted per-decision importance sampling',
    assumption: `The logged actions were drawn from the present controller’s fitted model (linear-Gaussian in the state, clipped at ${LOGGED_LIMITS_NAMED}), ` +
      'the candidate only takes actions the present controller could also have taken, and runs are independent. Uses the logged rewards; past a run that ends on a time limit ' +
      'it adds the fitted value there, discounted; a run that ends in an end state stays in every later step’s weighting, paying nothing (in proportion to the runs not cut by a time limit there, so time limits must not depend on how the plant behaves). Self-normalised per step, so slightly biased in small samples but consistent.',
  },
  weightedDoublyRobust: {
    label: 'Weighted doubly robust',
    assumption: 'Consistent when either the fitted Q or the present controller’s model is right. It shares the fitted Q with the main estimate: when the ' +
      'importance weights are concentrated it falls back on that Q and cannot confirm it. The Q part is held at the full-data fit across resamples.',
  },
  modelRollouts: {
    label: 'Rollouts of a fitted plant model',
    assumption: 'The plant’s next state and the reward are polynomials of the state and action with Gaussian noise, as fitted to the logs by least squares ' +
      '(and, where runs end in an end state, the chance of that end a logistic function of the same terms); ' +
      `the candidate is simulated on that model from up to ${ROLLOUT_STARTS} start states. Shares no fit with Q, so it can see an error in it; it extrapolates ` +
      'where the simulated states leave the logged range, and says how often they do and how much of its value comes from there.',
  },
  linearQuadraticModel: {
    label: 'Linear-quadratic model (closed form)',
    assumption: 'The plant is linear with Gaussian noise and the reward is quadratic in states and actions, as fitted to the logs by least squares, ' +
      'and the candidate’s actions are never limited. Does not depend on the features of the main fit.',
  },
};

/** The checks that rest on a plant model fitted to the logs rather than on the logged actions and rewards (crossCheckVerdict.ts, confirmationOf). */
const PLANT_MODEL_CHECKS: readonly CrossCheckMethod[] = ['modelRollouts', 'linearQuadraticModel'];

export interface CrossCheckInputs {
  work: CandidateWork;
  replicates: CandidateReplicates;
  points: { importanceSampling: number | null; doublyRobust: number | null; model: number | null };
  rollout: RolloutOutcome;
  weights: ImportanceWeightDiagnostics | null;
  /** Mean over runs of γ^T past a time-limited end: the share of the discount weight the logs do not hold. */
  tailWeight: number;
  offPolicyReason: string | null;
  modelReason: string | null;
  level: number;
  sign: number;
  /** The function-class verdict of this model (false: not settled; null: none). */
  settled: boolean | null;
  /**
   * The fit's own standard error of J where it has no resamples to pair a check with (a network's,
   * from its own interval); null where it has them, or has no standard error at all.
   */
  fitStandardError: number | null;
}

export function crossChecks(inputs: CrossCheckInputs): { checks: CrossCheck[]; confirmation: { status: 'confirmed' | 'contradicted' | 'unconfirmed'; text: string } } {
  const { replicates: r, points, weights } = inputs;
  const importance = weights ? { effectiveEpisodes: weights.horizonEffectiveEpisodes, episodesReaching: weights.horizonEpisodes, horizonSteps: weights.horizonSteps, tailWeight: inputs.tailWeight, notNumbers: weights.horizonNotNumbers } : undefined;
  const checks = [
    crossCheck('weightedImportanceSampling', points.importanceSampling, r.importanceSampling, inputs.offPolicyReason, inputs, { weights: importance }),
    crossCheck('weightedDoublyRobust', points.doublyRobust, r.doublyRobust, inputs.offPolicyReason, inputs, { weights: importance }),
    rolloutCrossCheck(inputs),
    crossCheck('linearQuadraticModel', points.model, r.model, inputs.modelReason, inputs, {}),
  ];
  const verdicts = checks.filter((c) => c.agreement !== 'notApplicable').map((c) => ({
    label: c.label, agreement: c.agreement as 'agrees' | 'disagrees' | 'uninformative', note: c.note, fromPlantModel: PLANT_MODEL_CHECKS.includes(c.method),
  }));
  return { checks, confirmation: confirmationOf(verdicts, inputs.settled) };
}

function crossCheck(
  method: CrossCheckMethod, point: number | null, replicates: Replicates | null, reason: string | null, inputs: CrossCheckInputs,
  evidence: Pick<CrossCheckEvidence, 'weights' | 'shareOutsideLogs'>,
): CrossCheck {
  const { label, assumption } = ASSUMPTIONS[method];
  if (point === null || replicates === null) return notApplicable(method, reason);
  const fqe = inputs.work.model.fit.policyValue;
  const estimate = intervalEstimate(point, replicates, inputs.level, inputs.sign, 'sampling of the logged runs');
  const difference = intervalEstimate(point - fqe, pairedReplicates(replicates, inputs.replicates.fqe), inputs.level, inputs.sign, 'sampling of the logged runs, paired');
  // Without replicates of the main estimate (a network) the difference cannot be paired: the unpaired bound, the check's and the fit's own added.
  const paired = difference.standardError !== null || inputs.fitStandardError === null;
  const standardError = paired ? difference.standardError ?? estimate.standardError ?? Infinity : unpairedStandardError(estimate.standardError, inputs.fitStandardError!);
  const verdict = crossCheckVerdict({ label, difference: point - fqe, differenceStandardError: standardError, fqe, paired, ...evidence });
  return { method, label, assumption, estimate, difference, agreement: verdict.agreement, note: verdict.note };
}

function rolloutCrossCheck(inputs: CrossCheckInputs): CrossCheck {
  const method: CrossCheckMethod = 'modelRollouts', { label, assumption } = ASSUMPTIONS[method], r = inputs.rollout;
  if ('reason' in r) return notApplicable(method, r.reason);
  const fqe = inputs.work.model.fit.policyValue, covers = `sampling of the logged runs (${r.differenceReplicates.length} resamples), paired`;
  const difference = intervalEstimate(r.difference, r.differenceReplicates, inputs.level, inputs.sign, covers);
  const estimate = { ...intervalEstimate(r.value, [], inputs.level, inputs.sign, `the model’s value over ${r.starts} start states`) };
  // The resamples reuse the rollouts' random numbers, so the Monte Carlo error of the full-data value is added on top of their spread.
  const ownError = Math.hypot(difference.standardError ?? Infinity, r.monteCarloError);
  // A fit without resamples is held at its full-data value in those replicates (assessRollouts.ts), so they hold the model's spread only: unpaired.
  const paired = inputs.fitStandardError === null;
  const standardError = paired ? ownError : unpairedStandardError(ownError, inputs.fitStandardError!);
  const verdict = crossCheckVerdict({ label, difference: r.difference, differenceStandardError: standardError, fqe, paired, shareOutsideLogs: r.shareOutsideLogs, rewardShareAtEdge: r.rewardShareAtEdge });
  return { method, label, assumption, estimate, difference, agreement: verdict.agreement, note: verdict.note,
    edge: { stepShare: r.shareOutsideLogs, rewardShare: r.rewardShareAtEdge } };
}

function notApplicable(method: CrossCheckMethod, reason: string | null): CrossCheck {
  const { label, assumption } = ASSUMPTIONS[method];
  return { method, label, assumption, estimate: null, difference: null, agreement: 'notApplicable', note: `Not applicable: ${reason ?? 'no estimate on the full data'}.` };
}
