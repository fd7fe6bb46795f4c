/**
 * tank-levels — an invented two-tank rig with a linear-quadratic answer known in closed form.
 *
 * Two stacked tanks: an inflow valve feeds the upper tank, which drains by gravity into the lower
 * tank, which drains to a downstream process. Around the setpoints the level deviations
 * x = (upper, lower) − setpoint [m] and the valve move v = valve − 45 % follow, per 5 s step,
 *   x⁺ = A x + B v + w,  w ~ N(0, W),   cost = xᵀQx + vᵀRv,
 * the zero-order-hold form of linearised tank balances (common practice). Runs start after a
 * disturbance, x0 ~ N(0, Σ0). See README.md for the story and all parameters.
 *
 * simulateTankLevels is pure (seeded); running this file writes tank-levels.csv beside it.
 */
import { pathToFileURL } from 'node:url';
import { createRandom, type RandomSource } from '../../src/core/random';
import { createGaussianPolicy, sampleAction, type GaussianPolicySpec } from '../../src/core/policy';
import type { LinearQuadraticPlant, OperatingPoint } from '../../src/core/lq';

export const TANK_LEVELS_COLUMNS = ['run', 'time_s', 'level_upper_m', 'level_lower_m', 'inflow_valve_pct', 'cost'] as const;
export const tankSamplePeriodSeconds = 5;
/** Per-step discount; 0.95^500 ≈ 7e-12, so a 500-step run is effectively infinite-horizon. */
export const tankDiscount = 0.95;
export const TANK_LEVELS_SEED = 20_417;

/** Setpoints in absolute units: upper 1.20 m, lower 0.80 m, valve 45 %. */
export const tankOperatingPoint: OperatingPoint = {
  state: Float64Array.from([1.2, 0.8]),
  action: Float64Array.from([45]),
};

/** The true plant in deviation coordinates (metres and valve per cent). */
export const tankPlant: LinearQuadraticPlant = {
  stateDim: 2,
  actionDim: 1,
  // Upper tank: 60 s drain time constant (1 − 5/60 ≈ 0.92); lower: receives 0.06 of the upper
  // deviation per step and drains with a 100 s time constant (0.95).
  dynamics: Float64Array.from([0.92, 0, 0.06, 0.95]),
  inputGain: Float64Array.from([0.004, 0]), // m of upper level per % valve per step
  processNoiseCovariance: Float64Array.from([0.003 ** 2, 0, 0, 0.002 ** 2]), // m²
  stateWeight: Float64Array.from([100, 0, 0, 400]), // per m²: the lower tank feeds the process
  actionWeight: Float64Array.from([0.01]), // per %²: valve wear
};

/** Start of each run in absolute units: levels after an upstream disturbance. */
export const tankStartMean = Float64Array.from([1.2, 0.8]);
export const tankStartCovariance = Float64Array.from([0.08 ** 2, 0, 0, 0.06 ** 2]);

/**
 * The logging controller: valve = 45 − 30·(upper − 1.2) − 20·(lower − 0.8) + N(0, 4²), written in
 * the engine's affine form offset + G·s with offset = 45 + 30·1.2 + 20·0.8 = 97 (centred).
 */
export const tankBehaviourPolicy: GaussianPolicySpec = { offset: [97], gain: [[-30, -20]], std: [4] };

/** Candidate: tighter on the lower tank, K = (60, 90) %/m, less dither; centred (45 + 72 + 72). */
export const tankTunedPolicy: GaussianPolicySpec = { offset: [189], gain: [[-60, -90]], std: [1.5] };

/** Candidate: the tuned gains with a 1.5 % trim error, so levels settle off their setpoints. */
export const tankTrimmedPolicy: GaussianPolicySpec = { offset: [190.5], gain: [[-60, -90]], std: [1.5] };

export interface TankLevelsOptions {
  runs?: number; // default 40
  stepsPerRun?: number; // default 500
  seed?: number; // default TANK_LEVELS_SEED
  policy?: GaussianPolicySpec; // default tankBehaviourPolicy
}

/** Logged rows, one per step: the state at the step, the action taken, the cost incurred. */
export interface TankLevelsLog {
  readonly columns: typeof TANK_LEVELS_COLUMNS;
  readonly rowCount: number;
  readonly rows: Float64Array; // rowCount×6 row-major, in column order
}

export function simulateTankLevels(options: TankLevelsOptions = {}): TankLevelsLog {
  const { runs = 40, stepsPerRun = 500, seed = TANK_LEVELS_SEED, policy = tankBehaviourPolicy } = options;
  if (!Number.isInteger(runs) || runs < 1) throw new RangeError(`runs: expected a positive integer, got ${runs}`);
  if (!Number.isInteger(stepsPerRun) || stepsPerRun < 1) throw new RangeError(`stepsPerRun: expected a positive integer, got ${stepsPerRun}`);
  const pi = createGaussianPolicy(policy, 2);
  const rng = createRandom(seed);
  const cols = TANK_LEVELS_COLUMNS.length;
  const rows = new Float64Array(runs * stepsPerRun * cols);
  const state = new Float64Array(2), action = new Float64Array(1);
  let r = 0;
  for (let run = 0; run < runs; run++) {
    drawStart(rng, state);
    for (let step = 0; step < stepsPerRun; step++, r++) {
      sampleAction(pi, state, rng, action);
      const o = r * cols;
      rows[o] = run + 1;
      rows[o + 1] = step * tankSamplePeriodSeconds;
      rows[o + 2] = state[0];
      rows[o + 3] = state[1];
      rows[o + 4] = action[0];
      rows[o + 5] = advance(state, action[0], rng);
    }
  }
  return { columns: TANK_LEVELS_COLUMNS, rowCount: r, rows };
}

function drawStart(rng: RandomSource, out: Float64Array): void {
  out[0] = tankStartMean[0] + Math.sqrt(tankStartCovariance[0]) * rng.normal();
  out[1] = tankStartMean[1] + Math.sqrt(tankStartCovariance[3]) * rng.normal();
}

/** Stage cost of (state, valve), then step the absolute state in place. */
function advance(state: Float64Array, valvePct: number, rng: RandomSource): number {
  const { dynamics: a, inputGain: b, processNoiseCovariance: w, stateWeight: q, actionWeight: rw } = tankPlant;
  const x0 = state[0] - tankOperatingPoint.state[0], x1 = state[1] - tankOperatingPoint.state[1];
  const v = valvePct - tankOperatingPoint.action[0];
  const cost = q[0] * x0 * x0 + q[3] * x1 * x1 + rw[0] * v * v; // Q and W are diagonal here
  const next0 = a[0] * x0 + a[1] * x1 + b[0] * v + Math.sqrt(w[0]) * rng.normal();
  const next1 = a[2] * x0 + a[3] * x1 + b[1] * v + Math.sqrt(w[3]) * rng.normal();
  state[0] = tankOperatingPoint.state[0] + next0;
  state[1] = tankOperatingPoint.state[1] + next1;
  return cost;
}

/** CSV text with a header line; levels to the micrometre, valve to 1e-4 %, cost to 1e-8. */
export function tankLevelsCsv(log: TankLevelsLog): string {
  const cols = log.columns.length;
  const lines = [log.columns.join(',')];
  for (let i = 0; i < log.rowCount; i++) {
    const v = log.rows.subarray(i * cols, (i + 1) * cols);
    lines.push(`${v[0]},${v[1]},${v[2].toFixed(6)},${v[3].toFixed(6)},${v[4].toFixed(4)},${v[5].toFixed(8)}`);
  }
  return lines.join('\n') + '\n';
}

async function main(): Promise<void> {
  const { writeFileSync } = await import('node:fs');
  const target = new URL('./tank-levels.csv', import.meta.url);
  const log = simulateTankLevels();
  writeFileSync(target, tankLevelsCsv(log));
  console.log(`wrote ${log.rowCount} rows to ${target.pathname}`);
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) void main();
