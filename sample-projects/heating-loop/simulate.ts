/**
 * heating-loop — an invented hot-water zone heating loop: nonlinear, with a saturating valve.
 *
 * States: zone temperature T [°C] and outdoor temperature T_out [°C]; action: heating valve
 * opening u [%], physically limited to 0–100 %. Per 60 s step:
 *   T⁺     = T + α·(T_out − T) + β·h(u_clipped) + w_T,        w_T ~ N(0, σ_T²)
 *   T_out⁺ = T_out + ρ·(μ_out − T_out) + w_out,                w_out ~ N(0, σ_out²)
 *   h(u)   = (R^{u/100} − 1) / (R − 1)                         (heat delivered, 0 … 1)
 *   cost   = (T − 21)² + λ·h(u_clipped)
 * h is an equal-percentage valve characteristic shifted to close tight at 0 % (equal-percentage
 * trim is common practice for heat-exchanger valves); the outdoor temperature is a slow AR(1)
 * drift. No closed form exists: this plant exercises the estimators where the LQ answer fails.
 * See README.md for the story and all parameters.
 *
 * simulateHeatingLoop is pure (seeded); running this file writes heating-loop.csv beside it.
 */
import { pathToFileURL } from 'node:url';
import { createRandom, type RandomSource } from '../../src/core/random';
import { createGaussianPolicy, sampleAction, type GaussianPolicy, type GaussianPolicySpec } from '../../src/core/policy';

export const HEATING_LOOP_COLUMNS = ['run', 'time_s', 'zone_temp_c', 'outdoor_temp_c', 'heating_valve_pct', 'cost'] as const;
export const heatingSamplePeriodSeconds = 60;
/** Per-step discount; 0.95^500 ≈ 7e-12. */
export const heatingDiscount = 0.95;
export const HEATING_LOOP_SEED = 31_029;

export const heatingPlantParameters = {
  zoneSetpointC: 21,
  /** Fraction of the indoor–outdoor difference lost per step (envelope time constant 50 min). */
  envelopeLossPerStep: 0.02,
  /** Zone temperature rise per step at full heat, K. */
  fullHeatRiseKPerStep: 0.8,
  /** Valve rangeability R of the equal-percentage characteristic. */
  valveRangeability: 20,
  zoneNoiseStdK: 0.05,
  outdoorMeanC: -2,
  outdoorReversionPerStep: 0.002,
  outdoorNoiseStdK: 0.18,
  /** Weight of delivered heat (0 … 1 per step) in the cost, in K² per unit heat. */
  energyWeight: 0.1,
  valveMinPct: 0,
  valveMaxPct: 100,
} as const;

/** Start of each run: zone after a night setback, outdoor around its mean. */
export const heatingStartMean = Float64Array.from([19.5, -2]);
export const heatingStartStd = Float64Array.from([1.0, 3.0]);

const clip = { lo: [0], hi: [100], mode: 'clip' as const };

/**
 * The logging controller: u = 395 − 15·T − 1.3·T_out + N(0, 10²), clipped to 0–100 %; at T = 21 °C,
 * T_out = −2 °C its mean is 82.6 %, the opening that holds 21 °C there (h⁻¹(23·α/β)).
 */
export const heatingBehaviourPolicy: GaussianPolicySpec = { offset: [395], gain: [[-15, -1.3]], std: [10], bounds: clip };

/** Candidate: stronger feedback (−25 %/K), same operating opening, less dither. */
export const heatingTighterPolicy: GaussianPolicySpec = { offset: [605], gain: [[-25, -1.3]], std: [3], bounds: clip };

/** Candidate: the tighter loop trimmed to hold about 0.5 K below setpoint to save heat. */
export const heatingEconomyPolicy: GaussianPolicySpec = { offset: [592.5], gain: [[-25, -1.3]], std: [3], bounds: clip };

/** Heat delivered by the valve at opening u (clipped to 0–100 %), 0 … 1. */
export function heatDelivered(valvePct: number): number {
  const { valveRangeability: r, valveMinPct, valveMaxPct } = heatingPlantParameters;
  const u = Math.min(valveMaxPct, Math.max(valveMinPct, valvePct));
  return (r ** (u / 100) - 1) / (r - 1);
}

export interface HeatingLoopOptions {
  runs?: number; // default 40
  stepsPerRun?: number; // default 500
  seed?: number; // default HEATING_LOOP_SEED
  policy?: GaussianPolicySpec; // default heatingBehaviourPolicy
}

/** Logged rows, one per step: state at the step, the valve opening applied, the cost incurred. */
export interface HeatingLoopLog {
  readonly columns: typeof HEATING_LOOP_COLUMNS;
  readonly rowCount: number;
  readonly rows: Float64Array; // rowCount×6 row-major, in column order
}

export function simulateHeatingLoop(options: HeatingLoopOptions = {}): HeatingLoopLog {
  const { runs = 40, stepsPerRun = 500, seed = HEATING_LOOP_SEED, policy = heatingBehaviourPolicy } = options;
  if (!Number.isInteger(runs) || runs < 1) throw new RangeError(`runs: expected a positive integer, got ${runs}`);
  if (!Number.isInteger(stepsPerRun) || stepsPerRun < 1) throw new RangeError(`stepsPerRun: expected a positive integer, got ${stepsPerRun}`);
  const pi = createGaussianPolicy(policy, 2);
  const rng = createRandom(seed);
  const cols = HEATING_LOOP_COLUMNS.length;
  const rows = new Float64Array(runs * stepsPerRun * cols);
  const state = new Float64Array(2), action = new Float64Array(1);
  const { valveMinPct, valveMaxPct } = heatingPlantParameters;
  let r = 0;
  for (let run = 0; run < runs; run++) {
    state[0] = heatingStartMean[0] + heatingStartStd[0] * rng.normal();
    state[1] = heatingStartMean[1] + heatingStartStd[1] * rng.normal();
    for (let step = 0; step < stepsPerRun; step++, r++) {
      sampleAction(pi, state, rng, action);
      // The valve saturates whatever the controller asks: log what was applied.
      const applied = Math.min(valveMaxPct, Math.max(valveMinPct, action[0]));
      const o = r * cols;
      rows[o] = run + 1;
      rows[o + 1] = step * heatingSamplePeriodSeconds;
      rows[o + 2] = state[0];
      rows[o + 3] = state[1];
      rows[o + 4] = applied;
      rows[o + 5] = advance(state, applied, rng);
    }
  }
  return { columns: HEATING_LOOP_COLUMNS, rowCount: r, rows };
}

/** Stage cost of (state, opening), then step the state in place. */
function advance(state: Float64Array, valvePct: number, rng: RandomSource): number {
  const p = heatingPlantParameters;
  const [zone, outdoor] = state;
  const heat = heatDelivered(valvePct);
  const cost = (zone - p.zoneSetpointC) ** 2 + p.energyWeight * heat;
  state[0] = zone + p.envelopeLossPerStep * (outdoor - zone) + p.fullHeatRiseKPerStep * heat + p.zoneNoiseStdK * rng.normal();
  state[1] = outdoor + p.outdoorReversionPerStep * (p.outdoorMeanC - outdoor) + p.outdoorNoiseStdK * rng.normal();
  return cost;
}

/**
 * The value of a candidate that reads the sample project's four states — zone temperature,
 * outdoor temperature, the zone error integral Σ (21 − T)·60 s (K·s) and the previous valve
 * opening (%), as the project derives them on import — by seeded rollouts of this plant from
 * given start states (count×4). Returns the mean over starts of each start's mean discounted cost
 * over `horizon` steps (0.95^400 ≈ 1e−9) at `discount` (the project's 0.95 unless given) and its standard error given the starts,
 * √(Σ_i s_i²/R)/count. Costs, as the project reports them.
 */
export function heatingCandidateCost(
  policy: GaussianPolicy, starts: Float64Array, rolloutsPerStart: number, seed: number, horizon = 400, discount = heatingDiscount,
): { cost: number; standardError: number } {
  if (policy.stateDim !== 4 || policy.actionDim !== 1) throw new RangeError('policy: expected the four states of the sample project and one action');
  const rng = createRandom(seed), count = starts.length / 4, r = rolloutsPerStart, p = heatingPlantParameters;
  const state = new Float64Array(4), plant = new Float64Array(2), action = new Float64Array(1);
  let total = 0, variance = 0;
  for (let i = 0; i < count; i++) {
    let sum = 0, sumSq = 0;
    for (let k = 0; k < r; k++) {
      state.set(starts.subarray(4 * i, 4 * i + 4));
      let ret = 0, weight = 1;
      for (let t = 0; t < horizon; t++, weight *= discount) {
        sampleAction(policy, state, rng, action);
        const applied = Math.min(p.valveMaxPct, Math.max(p.valveMinPct, action[0]));
        plant[0] = state[0];
        plant[1] = state[1];
        ret += weight * advance(plant, applied, rng);
        state[2] += (p.zoneSetpointC - state[0]) * heatingSamplePeriodSeconds;
        state[0] = plant[0];
        state[1] = plant[1];
        state[3] = applied;
      }
      sum += ret;
      sumSq += ret * ret;
    }
    const mean = sum / r;
    total += mean;
    variance += (sumSq - r * mean * mean) / (r - 1) / r;
  }
  return { cost: total / count, standardError: Math.sqrt(variance) / count };
}

/** CSV text with a header line; temperatures to 1e-4 K, opening to 1e-4 %, cost to 1e-8. */
export function heatingLoopCsv(log: HeatingLoopLog): string {
  const cols = log.columns.length;
  const lines = [log.columns.join(',')];
  for (let i = 0; i < log.rowCount; i++) {
    const v = log.rows.subarray(i * cols, (i + 1) * cols);
    lines.push(`${v[0]},${v[1]},${v[2].toFixed(4)},${v[3].toFixed(4)},${v[4].toFixed(4)},${v[5].toFixed(8)}`);
  }
  return lines.join('\n') + '\n';
}

async function main(): Promise<void> {
  const { writeFileSync } = await import('node:fs');
  const target = new URL('./heating-loop.csv', import.meta.url);
  const log = simulateHeatingLoop();
  writeFileSync(target, heatingLoopCsv(log));
  console.log(`wrote ${log.rowCount} rows to ${target.pathname}`);
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) void main();
