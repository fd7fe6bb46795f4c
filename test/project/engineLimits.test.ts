/**
 * Every limit a project sets and the engine also checks at its entry (src/core/limits.ts): at each end
 * of each range the project schema and the engine accept the same values and refuse the same values,
 * and a refusal names the same field (issue 11: a value the schema accepts must not reach the engine
 * as an internal error, exit 70; README, exit status). The network's own ranges (NETWORK_LIMITS) are
 * walked the same way in networkDefaults.test.ts.
 *
 * Engine side: the linear and network fits' entry checks (core/fqe/linearFqeInput.ts checkFqeInput,
 * networkFqeInput.ts checkNetworkFqeInput), which read core/fqe/solveSettingChecks.ts. Schema side:
 * the project document (src/project/schema.ts, approximatorSchema.ts). Quadrature nodes with
 * actuator limits: the schema takes up to MAX_GAUSS_HERMITE_NODES and the plan words the rest by the
 * engine's own quadratureProblem (planPolicies.ts); both are held to it here.
 */
import { describe, expect, it } from 'vitest';
import { simulateTankLevels, tankTrimmedPolicy } from '../../sample-projects/tank-levels/simulate';
import { createFeatureMap } from '../../src/core/features/featureMap';
import { polynomialFeatureSpec } from '../../src/core/features/polynomialFeatures';
import { fitStateActionStandardiser } from '../../src/core/features/standardiser';
import { FqeOptionsError } from '../../src/core/fqe/fqeErrors';
import { checkFqeInput, type LinearFqeInput } from '../../src/core/fqe/linearFqeInput';
import { checkNetworkFqeInput } from '../../src/core/fqe/networkFqeInput';
import type { NetworkFqeInput } from '../../src/core/fqe/networkFqe';
import { defaultNetworkSettings } from '../../src/core/fqe/networkSettings';
import { quadratureProblem } from '../../src/core/fqe/solveSettingChecks';
import {
  DISCOUNT_RANGE, MAX_BOUNDED_NORMAL_NODES, MAX_GAUSS_HERMITE_NODES, MAX_ITERATIONS, MAX_QUADRATURE_POINTS, MIN_QUADRATURE_NODES, RIDGE, SEED, TOLERANCE,
} from '../../src/core/limits';
import { createGaussianPolicy, type GaussianPolicy } from '../../src/core/policy';
import { approximatorSchema } from '../../src/project/approximatorSchema';
import { projectSchema } from '../../src/project/schema';
import { tankLogTransitions } from '../core/fqe/simulatedTransitions';

const log = simulateTankLevels({ runs: 4, stepsPerRun: 30, seed: 5 });
const data = tankLogTransitions(log.rows, log.rowCount);
const free = createGaussianPolicy(tankTrimmedPolicy, 2);
const clipped = createGaussianPolicy({ ...tankTrimmedPolicy, bounds: { lo: [0], hi: [100], mode: 'clip' } }, 2);
const features = createFeatureMap(polynomialFeatureSpec(fitStateActionStandardiser(data).spec, 2));
const linear = (change: Partial<LinearFqeInput>): LinearFqeInput => ({
  data, policy: free, features, discount: 0.95, ridge: RIDGE.default, quadratureNodes: 10, tolerance: TOLERANCE.default, maxIterations: MAX_ITERATIONS.default, ...change,
});
const network = (change: Partial<NetworkFqeInput>): NetworkFqeInput => ({ data, policy: free, discount: 0.95, quadratureNodes: 10, seed: 1, settings: { ...defaultNetworkSettings }, ...change });

/** The engine's verdict: null where it accepts, else the field its message starts with. */
function engineField(check: () => void): string | null {
  try {
    check();
    return null;
  } catch (error) {
    if (!(error instanceof FqeOptionsError)) throw error; // anything else would reach the command line as an internal error
    return /^(\w+):/.exec(error.message)?.[1] ?? error.message;
  }
}

/** The schema's verdict on a project field: null where it accepts, else the field its first problem names. */
function schemaField(field: 'discount' | 'quadratureNodes' | 'seed', value: number): string | null {
  const r = projectSchema.shape[field].safeParse(value);
  return r.success ? null : field;
}

function approximatorField(field: 'ridge' | 'tolerance' | 'maxIterations', value: number): string | null {
  const r = approximatorSchema.safeParse({ kind: 'linear', features: { kind: 'polynomial', degree: 2 }, [field]: value });
  return r.success ? null : String(r.error.issues[0].path[0]);
}

const below = (x: number) => x - Math.max(Math.abs(x) * 1e-9, Number.MIN_VALUE);
const above = (x: number) => x + Math.max(Math.abs(x) * 1e-9, Number.MIN_VALUE);

describe('the schema and the engine hold every project limit at the same ends', () => {
  // [field, value, accepted]: each range's ends, just inside and just outside (ours: the limits in src/core/limits.ts).
  const project: ['discount' | 'quadratureNodes' | 'seed', number, boolean][] = [
    ['discount', DISCOUNT_RANGE.above, false], ['discount', above(DISCOUNT_RANGE.above), true],
    ['discount', below(DISCOUNT_RANGE.below), true], ['discount', DISCOUNT_RANGE.below, false],
    ['quadratureNodes', MIN_QUADRATURE_NODES - 1, false], ['quadratureNodes', MIN_QUADRATURE_NODES, true], ['quadratureNodes', MAX_GAUSS_HERMITE_NODES, true], ['quadratureNodes', MAX_GAUSS_HERMITE_NODES + 1, false],
    ['quadratureNodes', 2.5, false],
  ];
  it.each(project)('%s = %d (accepted: %s), linear and network fits alike', (field, value, ok) => {
    expect(schemaField(field, value)).toBe(ok ? null : field);
    expect(engineField(() => checkFqeInput(linear({ [field]: value })))).toBe(ok ? null : field);
    expect(engineField(() => checkNetworkFqeInput(network({ [field]: value })))).toBe(ok ? null : field);
  });

  it.each([[SEED.min - 1, false], [SEED.min, true], [SEED.max, true], [SEED.max + 1, false]] as [number, boolean][])('seed = %d (accepted: %s)', (value, ok) => {
    expect(schemaField('seed', value)).toBe(ok ? null : 'seed');
    expect(engineField(() => checkNetworkFqeInput(network({ seed: value })))).toBe(ok ? null : 'seed');
  });

  const approximator: ['ridge' | 'tolerance' | 'maxIterations', number, boolean][] = [
    ['ridge', -1e-12, false], ['ridge', 0, true], ['ridge', RIDGE.max, true], ['ridge', above(RIDGE.max), false],
    ['tolerance', below(TOLERANCE.min), false], ['tolerance', TOLERANCE.min, true], ['tolerance', TOLERANCE.max, true], ['tolerance', above(TOLERANCE.max), false],
    ['maxIterations', MAX_ITERATIONS.min - 1, false], ['maxIterations', MAX_ITERATIONS.min, true], ['maxIterations', MAX_ITERATIONS.max, true],
    ['maxIterations', MAX_ITERATIONS.max + 1, false], ['maxIterations', 10.5, false],
  ];
  it.each(approximator)('approximator.%s = %d (accepted: %s)', (field, value, ok) => {
    expect(approximatorField(field, value)).toBe(ok ? null : field);
    expect(engineField(() => checkFqeInput(linear({ [field]: value })))).toBe(ok ? null : field);
  });

  it('quadrature nodes with actuator limits: the plan’s words and the engine refuse the same counts, naming quadratureNodes', () => {
    const plan = (policy: GaussianPolicy, n: number) => quadratureProblem(policy, n);
    for (const [policy, n, ok] of [[clipped, MAX_BOUNDED_NORMAL_NODES, true], [clipped, MAX_BOUNDED_NORMAL_NODES + 1, false], [free, MAX_BOUNDED_NORMAL_NODES + 1, true]] as [GaussianPolicy, number, boolean][]) {
      expect(plan(policy, n) === null).toBe(ok);
      expect(engineField(() => checkFqeInput(linear({ policy, quadratureNodes: n })))).toBe(ok ? null : 'quadratureNodes');
      expect(engineField(() => checkNetworkFqeInput(network({ policy, quadratureNodes: n })))).toBe(ok ? null : 'quadratureNodes');
    }
    // The points-per-state budget binds only with several actions: one action reaches MAX_GAUSS_HERMITE_NODES first.
    expect(MAX_GAUSS_HERMITE_NODES).toBeLessThan(MAX_QUADRATURE_POINTS);
  });
});
