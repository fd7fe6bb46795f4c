/**
 * The nested-class sentence in the class verdict's reason (the one text the command line, the app's
 * findings and the report read): a linear project of degree 2 whose degrees 3 and 4 agree, paired, and
 * both differ from it gets the sentence; the range and the verdict stay as they were. Hand-made
 * replicates from fixed ramps (as in test/core/diagnostics/nestedClassPointer.test.ts); the rule it
 * applies was adopted on the measured table in test/battery/README.md.
 */
import { describe, expect, it } from 'vitest';
import { functionClassVerdict } from '../../src/core/diagnostics/functionClassRange';
import { classAssessment, notSettledMessage } from '../../src/pipeline/assessClassRange';
import type { CandidateReplicates } from '../../src/pipeline/assessResamples';
import type { CandidateWork } from '../../src/pipeline/assessCandidate';

const N = 200;
const ramp = (step: number) => Array.from({ length: N }, (_, k) => (((k * step) % N) - (N - 1) / 2) / ((N - 1) / 2));
const shared = ramp(1), second = ramp(7), third = ramp(13);

/** Classes in the order the assessment lists them (the project's own first), with replicates about their values. */
function work(labels: string[], values: number[], linear = true): { w: CandidateWork; r: CandidateReplicates } {
  const reps = [
    shared.map((s) => values[0] + 3 * s),
    shared.map((s, k) => values[1] + 3 * s + 0.5 * second[k]),
    shared.map((s, k) => values[2] + 3 * s + 0.5 * second[k] + 0.5 * third[k]),
  ];
  const classes = labels.map((label, i) => ({ label, model: { fit: { policyValue: values[i] } } }));
  const w = { replicate: linear ? {} : null, unconvergedClasses: [], model: { fit: { policyValue: values[0] } }, classes } as unknown as CandidateWork;
  return { w, r: { fqe: [], classes: reps } as unknown as CandidateReplicates };
}

const own2 = ['polynomial, degree 2', 'polynomial, degree 3', 'polynomial, degree 4'];

describe('the nested-class sentence in the class verdict', () => {
  it('is said where degree 2 is 10 % off and degrees 3 and 4 agree; the range and the verdict are unchanged', () => {
    const { w, r } = work(own2, [90, 100, 100.5]);
    const a = classAssessment(w, r, 0.9, 1)!;
    expect(a.settled).toBe(false);
    // The widest gap opens the reason as before (shares are written with a no-break space before "%": \s).
    expect(a.reason).toMatch(/^Not settled: polynomial, degree 2 and polynomial, degree 4 differ by 10.4\s% of J \(23.5 paired standard errors\), beyond 2 standard errors and 2\s% of J, so at least one class cannot represent the value of this policy; the range spans them all\. /);
    expect(a.reason).toMatch(/ The two richer classes \(polynomial, degree 3; polynomial, degree 4\), each holding the one below it, agree with each other by the same rule \(0.498\s% of J apart, 1.3 paired standard errors; they could have seen a gap of 10\s%\), and both differ from polynomial, degree 2: the gap most likely lies in that class, too simple for the value of this policy\.$/);
    // The range is the hull of the three classes' intervals, as without the sentence.
    const verdict = functionClassVerdict(a.classes.map((c, k) => ({ label: c.label, value: c.value, standardError: c.standardError!, interval: c.interval!, replicates: r.classes[k] as number[] })));
    expect(a.range).toEqual(verdict.range);
    // The serious finding the command line, the app and the report show carries the same words.
    expect(notSettledMessage(a)).toContain('each holding the one below it, agree with each other by the same rule');
  });

  it('is the same in a cost project (values flipped): shares and standard errors do not depend on the sign', () => {
    const { w, r } = work(own2, [90, 100, 100.5]);
    expect(classAssessment(w, r, 0.9, -1)!.reason).toBe(classAssessment(w, r, 0.9, 1)!.reason);
  });

  it('is not said where degree 2 is not the project\'s own class', () => {
    const { w, r } = work(['polynomial, degree 3', 'polynomial, degree 2', 'polynomial, degree 4'], [100, 90, 100.5]);
    const a = classAssessment(w, r, 0.9, 1)!;
    expect(a.settled).toBe(false);
    expect(a.reason).not.toContain('The two richer classes');
  });

  it('is not said on a network project, whose own value has no replicates here and whose linear classes are checked among themselves', () => {
    // Degrees 2, 3 and 4 as above (3 and 4 agree, 2 stands apart), beside a network's own class: degree 2 is not the project's class.
    const { w, r } = work(own2, [90, 100, 100.5]);
    const network = { ...w, replicate: null, classes: [{ label: 'network, one hidden layer of 8 units', model: { fit: { policyValue: 95 } } }, ...w.classes] } as unknown as CandidateWork;
    const a = classAssessment(network, { ...r, classes: [new Array(N).fill(null), ...r.classes] } as unknown as CandidateReplicates, 0.9, 1)!;
    expect(a.classes.map((c) => c.label)).toEqual(own2); // the three linear classes were compared …
    expect(a.settled).toBe(false); // … and disagree, as in the first case …
    expect(a.reason).not.toContain('The two richer classes'); // … but the sentence is for a project whose own class is degree 2
  });

  it('is not said where degrees 3 and 4 disagree', () => {
    const { w, r } = work(own2, [90, 100, 110]);
    expect(classAssessment(w, r, 0.9, 1)!.reason).not.toContain('The two richer classes');
  });
});
