/**
 * The assessment's numbers in a reviewer's words: intervals as text, the verdict of a cross-check,
 * the coverage diagnostics as sentences with the level the logged controller itself reaches, and
 * the progress line while the assessment runs.
 */
import type { Agreement, CoverageDiagnostics, IntervalEstimate } from '../../../../pipeline/assessment';
import type { AssessRunProgress } from '../../../../shared/workerMessages';
import { OCCUPANCY_SHIFT_LIMITS, UPPER_PERCENTILE } from '../../../../core/diagnostics/severity';
import { intervalAtPrecision, valueWithError } from '../../../../figures/parts/uncertainNumber';
import { effectiveRunsNumber, effectiveRunsText } from '../../../../core/offPolicy/effectiveRunsText';
import { shareText, sharesText } from '../../../../core/shareText';
import { shiftText } from '../../../../core/diagnostics/shiftText';
import { unvisitedSentence } from '../../../../pipeline/unvisitedWords';

/** "90 %" from 0.9: a confidence level is written by the one share writer, as the report writes it. */
export function levelText(level: number): string {
  return shareText(level);
}

/** A share as a percentage: the one writer every host uses (core/shareText.ts). */
export { shareText, sharesText };

/** The basic interval and the replicate count, for the tooltip of an interval cell. */
export function intervalDetail(estimate: IntervalEstimate, level: number): string {
  const failed = estimate.failedReplicates > 0 ? `, ${estimate.failedReplicates} gave no value` : '';
  return `${levelText(level)} basic interval ${intervalAtPrecision(estimate.basic)}; bootstrap s.e. ${valueWithError(estimate.value, estimate.standardError, estimate.percentile).error}; ${estimate.replicates} resamples${failed}`;
}

/** A cross-check's note without its leading verdict word, which the verdict column already says. */
export function noteWithoutVerdict(note: string): string {
  // The column's verdict ends in a full stop, so what follows opens a sentence ("Not applicable here. It has actuator limits").
  return sentenceCase(note.replace(/^((agrees|disagrees|uninformative|not applicable)( to this candidate)?\s*[:.—-]\s*)+/i, ''));
}

/** The first letter in capitals: a phrase shown after a full stop. */
export function sentenceCase(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** The pipeline's messages typeset for the screen: the true minus and powers of ten (core/typesetText.ts, shared with the report). */
export { typesetText as typesetMinus } from '../../../../core/typesetText';

export const VERDICT: Record<Agreement, string> = {
  agrees: 'Agrees with fitted Q-evaluation',
  disagrees: 'Disagrees with fitted Q-evaluation — look into it before trusting J',
  uninformative: 'Too uncertain to confirm or contradict',
  notApplicable: 'Not applicable here',
};

/** The coverage diagnostics as sentences, each with the logged controller's own level where known. */
export function coverageSentences(d: CoverageDiagnostics): string[] {
  const sentences: string[] = [];
  if (d.occupancyShift !== null) {
    const own = d.presentControllerShift === null ? '' : ` (the present controller itself: ${shiftText(d.presentControllerShift)})`;
    const upper = d.occupancyShiftUpper === null ? '' : `, ${shiftText(d.occupancyShiftUpper)} at the ${UPPER_PERCENTILE}th percentile over resamples`;
    sentences.push(`Occupancy shift: ${shiftText(d.occupancyShift)}${upper}${own}, measured in ${d.shiftFeatures}. `
      + `1 means the candidate would visit states and actions like the logged ones; the error of its estimate grows with the shift’s square root, `
      + `caution above ${OCCUPANCY_SHIFT_LIMITS.caution} times the present controller’s own level (at least 1), serious above ${OCCUPANCY_SHIFT_LIMITS.serious} times.`);
  }
  const w = d.importanceWeights;
  if (w) {
    sentences.push(`Importance weights: the one-step weights are worth ${Math.round(w.oneStepEffectiveSize).toLocaleString('en-US')} transitions (${shareText(w.oneStepShare)} of them); `
      + `after ${w.horizonSteps} steps the cumulative weights ${w.horizonEffectiveEpisodes >= 1 && !w.horizonNotNumbers ? `are worth ${effectiveRunsNumber(w.horizonEffectiveEpisodes)} of ${w.horizonEpisodes} runs` : `carry ${effectiveRunsText(w.horizonEffectiveEpisodes, w.horizonNotNumbers)} from ${w.horizonEpisodes} runs`}. `
      + 'Few effective samples make the importance-sampling cross-checks noisy.');
  }
  const a = d.actionSupport;
  // Four shares compared in one sentence: one precision (core/shareText.ts sharesText).
  const [mean, p90, max, logged] = sharesText([a.meanOutside, a.p90Outside, a.maxOutside, a.behaviourMeanOutside]);
  const own = a.behaviourMeanOutside === null ? '' : ` (the present controller itself: ${logged})`;
  sentences.push(`Action probability outside the logged range: on average ${mean} of the candidate’s action probability falls outside the actions logged near the same state `
    + `(${a.neighbours} nearest logged states), ${p90} at the ${UPPER_PERCENTILE}th percentile of ${a.queryStates} states and ${max} at worst${own}. Q is extrapolated there.`);
  return sentences;
}

/**
 * The coverage figures on one line, the sentences (coverageSentences) behind it, the present
 * controller's own levels in brackets: "Occupancy shift 4.50, action probability outside the logs
 * 26.9 % (present controller 4.40, 2.8 %) · weights worth 2.43 % of transitions" (the one-step
 * weights' effective share; the sentence behind says so). Short enough for one line at 1280 × 800.
 */
export function coverageLine(d: CoverageDiagnostics): string {
  const a = d.actionSupport, [mean, logged] = sharesText([a.meanOutside, a.behaviourMeanOutside]);
  const ownShare = a.behaviourMeanOutside === null ? null : logged;
  let figures = `Action probability outside the logs ${mean}${ownShare === null ? '' : ` (present controller ${ownShare})`}`;
  if (d.occupancyShift !== null) {
    // Both figures, and the present controller's two in the same order ("—" for one it lacks).
    const ownShift = d.presentControllerShift === null ? null : shiftText(d.presentControllerShift);
    const own = ownShift === null && ownShare === null ? '' : ` (present controller ${ownShift ?? '—'}, ${ownShare ?? '—'})`;
    figures = `Occupancy shift ${shiftText(d.occupancyShift)}, action probability outside the logs ${mean}${own}`;
  }
  const weights = d.importanceWeights ? ` · weights worth ${shareText(d.importanceWeights.oneStepShare)} of transitions` : '';
  return `${figures}${weights}`;
}

/** The unvisited share in words, said once (pipeline/unvisitedWords.ts): the app and the report share it. */
export { unvisitedSentence };

const STAGE: Record<AssessRunProgress['stage'], string> = {
  preparing: 'Preparing each candidate',
  resampling: 'Resampling runs',
  sensitivity: 'Sweeping the discount and the features',
};

export function progressLine(progress: AssessRunProgress | null): string {
  if (!progress) return 'Starting the assessment…';
  const count = progress.stage === 'sensitivity' ? '' : ` (${progress.done.toLocaleString('en-US')} of ${progress.total.toLocaleString('en-US')})`;
  return `${STAGE[progress.stage]}${count}…`;
}

export function assessmentFraction(progress: AssessRunProgress | null): number {
  if (!progress) return 0;
  if (progress.stage === 'preparing') return 0.1 * (progress.done / Math.max(1, progress.total));
  if (progress.stage === 'resampling') return 0.1 + 0.7 * (progress.done / Math.max(1, progress.total));
  return 0.85;
}
