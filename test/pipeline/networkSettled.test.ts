/**
 * A network project's verdict across function classes (src/pipeline/assessAssembly.ts
 * withUnresampledOwn). The network has no resamples of its own, so the linear classes are compared
 * among themselves for disagreement only, and the network's own value is checked by the agreement
 * rule (src/core/fqe/approximatorAgreement.ts). The rule's own statements (ours): "settled" needs
 * the network checked, so an agreement that cannot tell ("inconclusive", the difference's interval
 * wider than 5 % of J) is not settled, as a linear project's own class is not settled where no class
 * could have seen a gap of 10 % of J. Invented numbers.
 */
import { describe, expect, it } from 'vitest';
import { approximatorAgreement } from '../../src/core/fqe/approximatorAgreement';
import { classAssessment, networkDisagreement, withUnresampledOwn } from '../../src/pipeline/assessClassRange';
import type { CandidateReplicates } from '../../src/pipeline/assessResamples';
import type { CandidateWork } from '../../src/pipeline/assessCandidate';
import type { FunctionClassAssessment } from '../../src/pipeline/assessment';

const linearClasses = (): FunctionClassAssessment => ({
  classes: [
    { label: 'polynomial, degree 2', value: 30.2, interval: [19.3, 41.1], standardError: 6.6 },
    { label: 'polynomial, degree 3', value: 19, interval: [-50, 88], standardError: 42 },
  ],
  settled: true, range: [-50, 88], coverage: '', reason: 'Settled: the function classes agree (widest gap …).', pairs: [],
});

const network = (value: number, difference: [number, number]) => {
  const iv = { lower: value - 2, upper: value + 2, level: 0.9 };
  const estimate = { value, interval: iv }, linear = { value: 30, interval: { lower: 19.3, upper: 41.1, level: 0.9 } };
  const d = { value: value - 30, interval: { lower: difference[0], upper: difference[1], level: 0.9 } };
  return {
    replicate: null, classes: [{ label: 'network, two hidden layers of 16 units each' }],
    model: { fit: { policyValue: value, interval: { ...iv, standardError: 1.2 }, linearComparison: { agreement: approximatorAgreement({ network: estimate, linear, difference: d }) } } },
  } as unknown as CandidateWork;
};

describe('a network project is settled only where the linear estimate checks the network', () => {
  it('is not settled where the network and the linear estimate cannot be told apart', () => {
    // Difference 1 with a paired interval [−9, 11]: reaches 11/31 = 35 % of J, beyond 5 %: "inconclusive".
    const w = network(31, [-9, 11]);
    expect(w.model.fit.linearComparison!.agreement.verdict).toBe('inconclusive');
    const v = withUnresampledOwn(linearClasses(), w, 1)!;
    expect(v.settled).toBe(false);
    expect(v.reason).toContain('too little data to tell whether they agree');
  });

  it('says a disagreement once: the class verdict carries it, so no second serious warning repeats the sentence', () => {
    // Difference −8 with a paired interval [−10, −6]: beyond the intervals, "disagree". Before, the user read the same
    // paragraph twice among the serious warnings (topics functionClass and approximatorAgreement).
    const w = network(22, [-10, -6]);
    const agreement = w.model.fit.linearComparison!.agreement;
    expect(agreement.verdict).toBe('disagree');
    const v = withUnresampledOwn(linearClasses(), w, 1)!;
    expect(v.settled).toBe(false);
    expect(v.reason).toBe(`Not settled: ${agreement.message}`);
    expect(networkDisagreement(w, v)).toEqual([]);
    // Without a class verdict to carry it, the disagreement is its own serious warning.
    expect(networkDisagreement(w, null)).toEqual([{ severity: 'serious', topic: 'approximatorAgreement', message: agreement.message }]);
  });

  it('stays settled where they agree closely, and the range spans the network too', () => {
    // Difference 0.2 with a paired interval [−0.5, 0.9]: within 5 % of J: "agree".
    const w = network(30.2, [-0.5, 0.9]);
    expect(w.model.fit.linearComparison!.agreement.verdict).toBe('agree');
    const v = withUnresampledOwn(linearClasses(), w, 1)!;
    expect(v.settled).toBe(true);
    expect(v.classes[0].label).toBe('network, two hidden layers of 16 units each');
    expect(v.range).toEqual([-50, 88]);
  });

  it('says the range covers every class it lists, the network included', () => {
    const linear = { ...linearClasses(), coverage: 'Covers the sampling of runs and the spread across the 2 function classes fitted (polynomial, degree 2; polynomial, degree 3); a bias they all share would not show.' };
    const v = withUnresampledOwn(linear, network(30.2, [-0.5, 0.9]), 1)!;
    expect(v.classes).toHaveLength(3);
    expect(v.coverage).toBe('Covers the sampling of runs and the spread across the 3 function classes fitted (network, two hidden layers of 16 units each; polynomial, degree 2; polynomial, degree 3); a bias they all share would not show.');
  });
});

describe('a network project with one linear class fitted beside it (the others too large for the data)', () => {
  // The network's own class has no replicates in the assessment (classes[0]); one linear class does.
  const oneClass = (value: number, difference: [number, number]) => {
    const w = network(value, difference) as unknown as { model: unknown };
    const own = { label: 'network, two hidden layers of 16 units each', model: w.model }, degree2 = { label: 'polynomial, degree 2', model: { fit: { policyValue: 30 } } };
    return { ...w, classes: [own, degree2], unconvergedClasses: [] } as unknown as CandidateWork;
  };
  // Invented replicates of the degree-2 class around 30, spread about ±1.6 (a 90 % interval near [28.4, 31.6]).
  const replicates = { fqe: [], classes: [[], Array.from({ length: 41 }, (_, b) => 30 + 0.08 * (b - 20))] } as unknown as CandidateReplicates;

  it('has a verdict, and it is not settled where the agreement rule cannot tell', () => {
    const w = oneClass(31, [-9, 11]);
    const v = withUnresampledOwn(classAssessment(w, replicates, 0.9, 1), w, 1);
    expect(v).not.toBeNull();
    expect(v!.settled).toBe(false);
    expect(v!.reason).toContain('too little data to tell whether they agree');
  });

  it('is settled where they agree, and says so by the agreement rule, not as “one function class only”', () => {
    const w = oneClass(30.2, [-0.5, 0.9]);
    const v = withUnresampledOwn(classAssessment(w, replicates, 0.9, 1), w, 1)!;
    expect(v.settled).toBe(true);
    expect(v.classes.map((c) => c.label)).toEqual(['network, two hidden layers of 16 units each', 'polynomial, degree 2']);
    expect(v.reason).toMatch(/^Settled: The network and the .* agree/);
    expect(v.reason + v.coverage).not.toMatch(/one function class only|no other function class/i);
  });
});

describe('a linear fit without resamples of its own (it did not converge) and one other class', () => {
  it('has no verdict, as before: one class beside it checks nothing and no agreement rule reads it', () => {
    const w = {
      replicate: null, unconvergedClasses: [], model: { fit: { policyValue: 30 } },
      classes: [{ label: 'polynomial, degree 2', model: { fit: { policyValue: 30 } } }, { label: 'polynomial, degree 3', model: { fit: { policyValue: 30 } } }],
    } as unknown as CandidateWork;
    const replicates = { fqe: [], classes: [[], Array.from({ length: 41 }, (_, b) => 30 + 0.08 * (b - 20))] } as unknown as CandidateReplicates;
    expect(classAssessment(w, replicates, 0.9, 1)).toBeNull();
  });
});
