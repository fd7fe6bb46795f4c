/**
 * The network nested-class sentence in a network project's class reason (withUnresampledOwn in
 * src/pipeline/assessAssembly.ts; the one text the command line, the app's findings and the report
 * read). Where the network's fit converged and the network, degree 3 and degree 4 agree by the class rule (the network's pairs
 * unpaired: √(se_net² + se_k²)) and all differ from degree 2, the not-settled reason ends with the
 * sentence; the range and the verdict stay as they were. Invented numbers, arithmetic by hand:
 * network 100 ± 1, degree 3 at 100.5 ± 1: 0.5 / √2 = 0.35 standard errors, the smallest gap the pair
 * could see 2 · 1.414 / 100.5 = 2.8 % of J; degree 2 at 90 is 10 / √2 = 7.1 standard errors away.
 */
import { describe, expect, it } from 'vitest';
import { approximatorAgreement } from '../../src/core/fqe/approximatorAgreement';
import { unpairedGap } from '../../src/core/diagnostics/functionClassRange';
import { notSettledMessage, withUnresampledOwn } from '../../src/pipeline/assessClassRange';
import type { CandidateWork } from '../../src/pipeline/assessCandidate';
import type { FunctionClassAssessment } from '../../src/pipeline/assessment';

const NET = 'network, two hidden layers of 32 units each';

function linearClasses(d2: number, d3: number, d4: number): FunctionClassAssessment {
  const k = (label: string, value: number) => ({ label, value, interval: [value - 1.645, value + 1.645] as [number, number], standardError: 1 });
  const classes = [k('polynomial, degree 2', d2), k('polynomial, degree 3', d3), k('polynomial, degree 4', d4)];
  const s = (c: (typeof classes)[number]) => ({ label: c.label, value: c.value, standardError: 1 });
  const pairs = [unpairedGap(s(classes[0]), s(classes[1])), unpairedGap(s(classes[0]), s(classes[2])), unpairedGap(s(classes[1]), s(classes[2]))];
  return {
    classes, settled: false, pairs,
    range: [Math.min(d2, d3, d4) - 1.645, Math.max(d2, d3, d4) + 1.645], coverage: '',
    reason: 'Not settled: polynomial, degree 2 and polynomial, degree 3 differ by 10 % of J.',
  };
}

/** A network at 100 ± 1 (90 % interval ± 1.645), disagreeing with the linear estimate of degree 2 at 90. */
function network(value = 100, status = 'converged'): CandidateWork {
  const iv = { lower: value - 1.645, upper: value + 1.645, level: 0.9 };
  const linear = { value: 90, interval: { lower: 88.355, upper: 91.645, level: 0.9 } };
  const d = { value: value - 90, interval: { lower: value - 92, upper: value - 88, level: 0.9 } };
  return {
    replicate: null, classes: [{ label: NET }],
    model: { fit: { status, policyValue: value, interval: { ...iv, standardError: 1 }, linearComparison: { agreement: approximatorAgreement({ network: { value, interval: iv }, linear, difference: d }) } } },
  } as unknown as CandidateWork;
}

describe('the network nested-class sentence in a network project\'s class reason', () => {
  it('is said where the network, degrees 3 and 4 agree and degree 2 stands apart; range and verdict unchanged', () => {
    const w = network();
    const v = withUnresampledOwn(linearClasses(90, 100.5, 99.8), w, 1)!;
    expect(v.settled).toBe(false);
    expect(v.reason.startsWith(`Not settled: ${w.model.fit.linearComparison!.agreement.message} `)).toBe(true);
    expect(v.reason).toMatch(/ The network and the two richer polynomial classes \(polynomial, degree 3; polynomial, degree 4\) agree with each other by the class rule \(at most 0.697\s% of J apart; each pair could have seen a gap of 10\s%\), and all three differ from polynomial, degree 2: the gap most likely lies in that class, too simple for the value of this policy\.$/);
    expect(v.range).toEqual([90 - 1.645, 100.5 + 1.645]);
    // The serious finding the command line, the app and the report show carries the same words.
    expect(notSettledMessage(v)).toContain('the gap most likely lies in that class');
  });

  it('is the same in a cost project (values flipped)', () => {
    const flip = (a: FunctionClassAssessment): FunctionClassAssessment => ({
      ...a, classes: a.classes.map((c) => ({ ...c, value: -c.value, interval: [-c.interval![1], -c.interval![0]] as [number, number] })),
      pairs: a.pairs!.map((g) => ({ ...g, difference: -g.difference })), range: [-a.range[1], -a.range[0]],
    });
    const reward = withUnresampledOwn(linearClasses(90, 100.5, 99.8), network(), 1)!.reason;
    expect(withUnresampledOwn(flip(linearClasses(90, 100.5, 99.8)), network(), -1)!.reason).toBe(reward);
  });

  it('is not said where the network disagrees with degree 3 (3 apart: 2.1 standard errors, 2.9 % of J)', () => {
    const v = withUnresampledOwn(linearClasses(90, 103, 101.5), network(), 1)!;
    expect(v.settled).toBe(false);
    expect(v.reason).not.toContain('two richer polynomial classes');
  });

  it('is not said where the network\'s fit did not converge (stopped at its iteration limit)', () => {
    const v = withUnresampledOwn(linearClasses(90, 100.5, 99.8), network(100, 'maxIterations'), 1)!;
    expect(v.settled).toBe(false);
    expect(v.reason).not.toContain('two richer polynomial classes');
  });

  it('is not said, and nothing fails, where the verdict has no pairs (results saved before they were kept)', () => {
    // Before pairs was optional the network's pointer spread `a.pairs` and threw "a.pairs is not iterable" here.
    const { pairs: _dropped, ...old } = linearClasses(90, 100.5, 99.8);
    const saved: FunctionClassAssessment = old;
    const v = withUnresampledOwn(saved, network(), 1)!;
    expect(v.settled).toBe(false);
    expect(v.reason).not.toContain('most likely lies');
  });

  it('is not said where degree 4 was not fitted', () => {
    const two = linearClasses(90, 100.5, 99.8);
    const v = withUnresampledOwn({ ...two, classes: two.classes.slice(0, 2), pairs: two.pairs!.slice(0, 1) }, network(), 1)!;
    expect(v.reason).not.toContain('two richer polynomial classes');
  });
});
