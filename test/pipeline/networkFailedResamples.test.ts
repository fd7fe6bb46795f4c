/**
 * A network J's interval on the assessment's resamples (networkRunResamples.ts) counts its resamples
 * as a linear fit's interval does (intervalEstimate: replicates used, failed), so a share of
 * resamples whose last layer had no solution above the assessment's limit raises the same caution
 * ("… may be too narrow", assessAssembly.ts failedWarning). Before, the counts stayed those of the
 * empty linear replicates (0 of 0), and a network interval built from a few solved resamples said
 * nothing. Invented numbers.
 */
import { describe, expect, it } from 'vitest';
import { withNetworkInterval } from '../../src/pipeline/assessClassRange';
import { intervalEstimate } from '../../src/pipeline/assessIntervals';
import type { CandidateWork } from '../../src/pipeline/assessCandidate';
import type { NetworkRunResamples } from '../../src/pipeline/networkRunResamples';

const work = { model: { fit: { policyValue: 10, interval: { level: 0.9, lower: 9, upper: 11, standardError: 0.6 } } } } as unknown as CandidateWork;
const net: NetworkRunResamples = {
  interval: { level: 0.9, lower: 8.5, upper: 11.5, standardError: 0.9 }, covers: 'the network’s own',
  replicates: [...Array.from({ length: 30 }, (_, b) => 10 + 0.05 * (b - 15)), ...Array.from({ length: 10 }, () => null)], allowance: 0.2,
};

describe('a network J’s interval on the assessment’s resamples', () => {
  it('counts the resamples it came from, solved and failed', () => {
    const e = withNetworkInterval(intervalEstimate(10, [], 0.9, 1), work, 1, net);
    expect(e.percentile).toEqual([8.5, 11.5]);
    expect(e.replicates).toBe(30);
    expect(e.failedReplicates).toBe(10);
  });
});
