/**
 * Network FQE on the invented tank-levels plant against the closed-form linear-quadratic answer
 * (src/core/lq.ts: discrete Lyapunov equation for P, then the linear and constant parts;
 * Bertsekas, "Dynamic Programming and Optimal Control" Vol. I, §4.1), at 100,000 transitions.
 *
 * Settings (affordableSettings) for cost: γ = 0.95 needs about 100 outer iterations before the truncation error
 * γ^k·|Q_0 − Q| is negligible (≈ 0.3 % of J here), so each iteration is kept cheap — a 32-32
 * network, 60 Adam steps of 1024 transitions at learning rate 3·10⁻³, and 3 Gauss–Hermite nodes
 * (exact for the quadratic true Q in the action, common practice) — and the last 20 networks are
 * averaged to damp the step noise. Measured during development with these settings (wasm): the
 * relative error of J for the tuned candidate over fit seeds 1–6 was +0.02, +1.2, +0.04, +1.7,
 * +1.9, +0.02 %, and for the trimmed candidate over seeds 1–2 +2.0 and +1.7 %; without averaging
 * the spread was about ±3 %. The brief's 3 % is therefore about 2 spreads above the typical
 * error: it catches a broken fit, not seed noise. About 25–45 s per fit on one core.
 */
import { describe, expect, it } from 'vitest';
import { createActionQuadrature } from '../../../src/core/actionQuadrature';
import { fitNetworkFqe } from '../../../src/core/fqe/networkFqe';
import { closedFormPolicyCost, lqClosedForm, rewardFromCost } from '../../../src/core/lq';
import { createGaussianPolicy, type GaussianPolicySpec } from '../../../src/core/policy';
import { policyValue } from '../../../src/core/value';
import {
  simulateTankLevels, tankDiscount, tankOperatingPoint, tankPlant, tankTrimmedPolicy, tankTunedPolicy,
} from '../../../sample-projects/tank-levels/simulate';
import { tankLogTransitions } from './simulatedTransitions';
import { affordableSettings, wasmDirectory } from './networkTestEnvironment';

describe('network FQE on the linear-quadratic tank plant', () => {
  // 200 runs × 501 logged steps under the tank's logging controller = 100,000 transitions (fixed seed).
  const log = simulateTankLevels({ runs: 200, stepsPerRun: 501, seed: 20_417 });
  const data = tankLogTransitions(log.rows, log.rowCount);

  it.each([
    ['tuned (centred) candidate', tankTunedPolicy],
    ['trimmed (off-centre) candidate', tankTrimmedPolicy],
  ] as [string, GaussianPolicySpec][])('estimates J of the %s within 3% of the closed form', async (_, spec) => {
    expect(data.count).toBe(100_000);
    const policy = createGaussianPolicy(spec, 2);
    const fit = await fitNetworkFqe({ data, policy, discount: tankDiscount, quadratureNodes: 3, seed: 1, settings: affordableSettings, wasmPath: wasmDirectory });
    expect(fit.status).toBe('maxIterations');
    const estimate = policyValue(fit.actionValue, policy, data.startStates, createActionQuadrature(policy, 3)).value;
    fit.dispose();
    // J over the same logged start states; reward = −cost.
    const exact = rewardFromCost(closedFormPolicyCost(lqClosedForm(tankPlant, tankOperatingPoint, policy, tankDiscount), data.startStates, data.episodeCount));
    expect(Math.abs(estimate - exact) / Math.abs(exact)).toBeLessThan(0.03);
  }, 240_000);
});
