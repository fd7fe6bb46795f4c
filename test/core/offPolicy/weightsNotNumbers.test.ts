/**
 * A run whose importance weight is not a number, worded for what it is. A candidate truncated at
 * limits its mean lies far outside (here 39 dithers) gives its band a probability that underflows
 * to 0 in a double (Φ(−39) ≈ φ(39)/39 ≈ 5e−333, below the smallest double 4.9e−324; the tail's
 * asymptotic form, Abramowitz & Stegun 26.2.12, section number from memory), so the log ratio is +∞ for an action inside the band and −∞ for one outside, and a
 * run with both has a NaN weight. Kish's size is then 0 (a NaN among the weights), which the words
 * said as "every logged run takes an action the candidate would never take": not what happened.
 * The numbers are invented; the limits and the dither are what a project file can declare.
 */
import { describe, expect, it } from 'vitest';
import { createGaussianPolicy } from '../../../src/core/policy';
import { logImportanceRatio } from '../../../src/core/offPolicy/importanceRatio';
import { effectiveSampleSizeFromLogs } from '../../../src/core/diagnostics/effectiveSampleSize';
import { crossCheckVerdict } from '../../../src/core/offPolicy/crossCheckVerdict';
import { effectiveShareFinding } from '../../../src/core/diagnostics/severity';
import { effectiveRunsText, weightsNotNumbers, WHY_NO_WEIGHT, WHY_NOT_A_NUMBER } from '../../../src/core/offPolicy/effectiveRunsText';

describe('importance weights that are not numbers', () => {
  // The present controller's model: clipped at the logged extremes −3 and 3 (every logged action inside).
  const behaviour = createGaussianPolicy({ offset: [0], gain: [[0]], std: [1], bounds: { lo: [-3], hi: [3], mode: 'clip' } }, 1);
  // A candidate truncated to [−1, 1] with its mean at 40, 39 dithers above the band.
  const candidate = createGaussianPolicy({ offset: [40], gain: [[0]], std: [1], bounds: { lo: [-1], hi: [1], mode: 'truncate' } }, 1);
  const logRatio = (a: number) => logImportanceRatio(candidate, behaviour, new Float64Array([0]), new Float64Array([a]));

  it('are reached by a truncated candidate whose mean lies far outside its limits', () => {
    expect(logRatio(0.5)).toBe(Infinity); // inside the band: density / 0
    expect(logRatio(2)).toBe(-Infinity); // outside it: 0
    const runs = [logRatio(0.5) + logRatio(2), 0.1, -0.3]; // one run has both: NaN
    expect(Number.isNaN(runs[0])).toBe(true);
    expect(effectiveSampleSizeFromLogs(runs)).toBe(0); // Kish's size reads 0 over the two good runs as well
    expect(weightsNotNumbers(runs)).toBe(1);
    expect(weightsNotNumbers([Infinity, -Infinity, 0])).toBe(1); // +∞ is not usable either; −∞ is a weight of 0
  });

  it('are said for what they are in the finding, the cross-check note and the words', () => {
    expect(effectiveRunsText(0, 1)).toContain(`no usable weight (the importance weight of 1 run is not a number: ${WHY_NOT_A_NUMBER})`);
    expect(effectiveRunsText(0, 1)).not.toContain(WHY_NO_WEIGHT);
    const finding = effectiveShareFinding(Number.NaN, 40, 20, 3)!;
    expect(finding.severity).toBe('serious'); // as a size of 0 is
    expect(finding.message).toContain('the importance weights of 3 runs are not a number');
    expect(finding.message).not.toContain(WHY_NO_WEIGHT);
    const note = crossCheckVerdict({
      label: 'Doubly robust', difference: 0, differenceStandardError: 0.5, fqe: -100,
      weights: { effectiveEpisodes: Number.NaN, episodesReaching: 40, horizonSteps: 20, tailWeight: 0.05, notNumbers: 3 },
    });
    expect(note.agreement).not.toBe('agrees'); // a size that is not a number never passes the rule
    expect(note.note).toContain('not a number');
    // With every weight a true zero, the old words stay: they are right there.
    expect(effectiveRunsText(0)).toContain(WHY_NO_WEIGHT);
  });
});
