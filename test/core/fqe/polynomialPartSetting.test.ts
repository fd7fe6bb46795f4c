/**
 * The network fit reads the polynomial part's degree from its settings (src/core/fqe/polynomialPartSetting.ts,
 * the project's approximator.polynomialDegree), and a method given by a bench or a test overrides it.
 * On the invented quartic-cost log (quarticCostLog.ts: its present controller's Q is exactly quartic)
 * the guarded choice takes 4 over the run starts (degreeChoiceStartGuard.test.ts); a fixed 2 must fit 2
 * — six quadratic terms in (s, a), C(2 + 2, 2) — with no choice made and the same numbers as the
 * method's degree 2, to the bit.
 */
import { describe, expect, it } from 'vitest';
import { fitNetworkFqe, type NetworkFqeInput } from '../../../src/core/fqe/networkFqe';
import { defaultNetworkSettings, type NetworkFqeSettings } from '../../../src/core/fqe/networkSettings';
import { linearPartDegreeOf } from '../../../src/core/fqe/polynomialPartSetting';
import { createGaussianPolicy } from '../../../src/core/policy';
import { wasmDirectory } from './networkTestEnvironment';
import { quarticCostLog } from './quarticCostLog';

const tiny: NetworkFqeSettings = { ...defaultNetworkSettings, hiddenLayers: [8], batchSize: 64, stepsPerIteration: 10, outerIterations: 2, heldOutFraction: 0, patience: 0, averageLast: 1 };

describe('the polynomial part from the network settings', () => {
  const log = quarticCostLog(200, 100, 7), policy = createGaussianPolicy({ offset: [0], gain: [[-0.3]], std: [0.3] }, 1);
  const input = (settings: Partial<NetworkFqeSettings>, method: NetworkFqeInput['method'] = { members: 1, intervalResamples: 20 }): NetworkFqeInput => ({
    data: log, policy, discount: 0.9, quadratureNodes: 3, seed: 1, settings: { ...tiny, ...settings }, wasmPath: wasmDirectory, method,
  });

  it('maps "chosen" to the guarded choice and a number to itself', () => {
    expect(linearPartDegreeOf('chosen')).toBe('choose');
    expect(linearPartDegreeOf(4)).toBe(4);
  });

  it('chooses by default, fits a fixed degree as set, and lets a method override the setting', async () => {
    const chosen = await fitNetworkFqe(input({}));
    expect(chosen).toMatchObject({ linearPartDegree: 4, degreeChoice: { chosen: 4 } });
    chosen.dispose();
    const fixed = await fitNetworkFqe(input({ polynomialDegree: 2 }));
    expect(fixed.linearPartDegree).toBe(2);
    expect(fixed.degreeChoice).toBeUndefined();
    expect(fixed.linearStart.features.dim).toBe(6);
    const byMethod = await fitNetworkFqe(input({ polynomialDegree: 4 }, { members: 1, intervalResamples: 20, linearPartDegree: 2 }));
    expect(byMethod.linearPartDegree).toBe(2);
    expect(byMethod.estimate(log.startStates).value).toBe(fixed.estimate(log.startStates).value);
    fixed.dispose();
    byMethod.dispose();
  }, 120_000);
});
