import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { Matrix, inverse } from 'ml-matrix';
import {
  TANK_LEVELS_COLUMNS, simulateTankLevels, tankBehaviourPolicy, tankLevelsCsv, tankOperatingPoint, tankPlant,
  tankTrimmedPolicy, tankTunedPolicy,
} from '../../sample-projects/tank-levels/simulate';
import {
  heatDelivered, heatingBehaviourPolicy, heatingLoopCsv, heatingPlantParameters, simulateHeatingLoop,
} from '../../sample-projects/heating-loop/simulate';
import { deviationFeedback } from '../../src/core/lq';
import { createGaussianPolicy, type GaussianPolicySpec } from '../../src/core/policy';
import { multiply, solve, transpose } from '../../src/core/linalg/dense';
import { solveDiscreteLyapunov } from '../../src/core/linalg/lyapunov';

const COLS = 6;
const runs = 200, stepsPerRun = 501; // 200 × 500 = 100,000 transitions

/**
 * Stationary mean stage cost of the tank loop under an affine Gaussian policy, in closed form:
 * x̄ = (I − F)⁻¹ B d and Σ = FΣFᵀ + BSBᵀ + W with F = A − BK (the stationary covariance of a
 * stable linear system driven by white noise; Kailath, "Linear Systems", 1980); then
 * E[xᵀQx] = tr(QΣ) + x̄ᵀQx̄ and E[vᵀRv] = tr(R(KΣKᵀ + S)) + v̄ᵀRv̄ with v̄ = d − K x̄.
 */
function stationaryMeanCost(spec: GaussianPolicySpec): number {
  const { dynamics: a, inputGain: b, processNoiseCovariance: w, stateWeight: q, actionWeight: r } = tankPlant;
  const { feedbackGain: k, bias: d, noiseCovariance: s } = deviationFeedback(createGaussianPolicy(spec, 2), tankOperatingPoint);
  const f = a.map((v, i) => v - multiply(b, k, 2, 1, 2)[i]);
  const drive = multiply(b, multiply(s, transpose(b, 2, 1), 1, 1, 2), 2, 1, 2).map((v, i) => v + w[i]);
  const sigma = solveDiscreteLyapunov(transpose(f, 2, 2), drive, 2, 1);
  const mean = solve(Float64Array.from([1 - f[0], -f[1], -f[2], 1 - f[3]]), 2, multiply(b, d, 2, 1, 1));
  const vMean = d[0] - (k[0] * mean[0] + k[1] * mean[1]);
  const kSigmaK = k[0] * (sigma[0] * k[0] + sigma[1] * k[1]) + k[1] * (sigma[2] * k[0] + sigma[3] * k[1]);
  const stateTerm = q[0] * (sigma[0] + mean[0] ** 2) + q[3] * (sigma[3] + mean[1] ** 2); // Q is diagonal
  return stateTerm + r[0] * (kSigmaK + s[0] + vMean ** 2);
}

/** Per-run mean cost after a burn-in; the SE comes from the spread of the independent run means. */
function runMeanCost(rows: Float64Array, burnIn: number): { mean: number; standardError: number } {
  const means = new Float64Array(runs);
  for (let run = 0; run < runs; run++) {
    let total = 0;
    for (let t = burnIn; t < stepsPerRun; t++) total += rows[(run * stepsPerRun + t) * COLS + 5];
    means[run] = total / (stepsPerRun - burnIn);
  }
  const mean = means.reduce((x, y) => x + y, 0) / runs;
  const variance = means.reduce((acc, m) => acc + (m - mean) ** 2, 0) / (runs - 1);
  return { mean, standardError: Math.sqrt(variance / runs) };
}

describe('tank-levels simulator', () => {
  // Slowest closed-loop pole 0.904: after 100 steps the start transient in Σ is 0.904^200 ≈ 2e-9.
  for (const [name, spec] of [['behaviour', tankBehaviourPolicy], ['tuned', tankTunedPolicy], ['trimmed', tankTrimmedPolicy]] as const) {
    it(`empirical mean cost under the ${name} policy matches the stationary closed form within 4 SE`, () => {
      const log = simulateTankLevels({ runs, stepsPerRun, seed: 5, policy: spec });
      const { mean, standardError } = runMeanCost(log.rows, 100);
      expect(Math.abs(mean - stationaryMeanCost(spec))).toBeLessThan(4 * standardError);
    });
  }

  it('least squares on the logged transitions recovers the exported A and B within 4 SE (ml-matrix)', () => {
    const log = simulateTankLevels({ runs, stepsPerRun, seed: 6 });
    const x: number[][] = [], y: number[][] = [];
    for (let run = 0; run < runs; run++) {
      for (let t = 0; t + 1 < stepsPerRun; t++) {
        const o = (run * stepsPerRun + t) * COLS, o2 = o + COLS;
        x.push([log.rows[o + 2] - 1.2, log.rows[o + 3] - 0.8, log.rows[o + 4] - 45]);
        y.push([log.rows[o2 + 2] - 1.2, log.rows[o2 + 3] - 0.8]);
      }
    }
    expect(x.length).toBe(100_000);
    // Ordinary least squares β = (XᵀX)⁻¹XᵀY, SE_j = σ·√[(XᵀX)⁻¹]_jj (common practice).
    const X = new Matrix(x), Y = new Matrix(y), xtxInv = inverse(X.transpose().mmul(X));
    const beta = xtxInv.mmul(X.transpose()).mmul(Y);
    const truth = [[0.92, 0.06], [0, 0.95], [0.004, 0]]; // rows: regressor; columns: next upper, next lower
    for (let out = 0; out < 2; out++) {
      const sigma = Math.sqrt(tankPlant.processNoiseCovariance[out * 3]);
      for (let j = 0; j < 3; j++) {
        const se = sigma * Math.sqrt(xtxInv.get(j, j));
        expect(Math.abs(beta.get(j, out) - truth[j][out])).toBeLessThan(4 * se);
      }
    }
  });

  it('the committed CSV is exactly what the default seed produces', () => {
    const committed = readFileSync(new URL('../../sample-projects/tank-levels/tank-levels.csv', import.meta.url), 'utf8');
    expect(committed.split('\n', 1)[0]).toBe(TANK_LEVELS_COLUMNS.join(','));
    expect(committed).toBe(tankLevelsCsv(simulateTankLevels()));
  });
});

describe('heating-loop simulator', () => {
  const log = simulateHeatingLoop({ runs, stepsPerRun, seed: 9 });
  const p = heatingPlantParameters;

  it('logs the applied (saturated) opening and a cost that follows from the row', () => {
    let saturated = 0, outOfRange = 0, worstCostError = 0;
    for (let i = 0; i < log.rowCount; i++) {
      const o = i * COLS, valve = log.rows[o + 4];
      if (!(valve >= 0 && valve <= 100)) outOfRange++;
      if (valve === 100 || valve === 0) saturated++;
      const cost = (log.rows[o + 2] - p.zoneSetpointC) ** 2 + p.energyWeight * heatDelivered(valve);
      worstCostError = Math.max(worstCostError, Math.abs(log.rows[o + 5] - cost));
    }
    expect(outOfRange).toBe(0);
    expect(worstCostError).toBeLessThan(1e-12);
    expect(saturated / log.rowCount).toBeGreaterThan(0.01);
  });

  it('one-step residuals have the exported noise standard deviations (within 4 SE of the variance)', () => {
    let sumZone = 0, sumOut = 0, n = 0;
    for (let run = 0; run < runs; run++) {
      for (let t = 0; t + 1 < stepsPerRun; t++) {
        const o = (run * stepsPerRun + t) * COLS, o2 = o + COLS;
        const [zone, outdoor, valve] = [log.rows[o + 2], log.rows[o + 3], log.rows[o + 4]];
        const zoneNext = zone + p.envelopeLossPerStep * (outdoor - zone) + p.fullHeatRiseKPerStep * heatDelivered(valve);
        const outNext = outdoor + p.outdoorReversionPerStep * (p.outdoorMeanC - outdoor);
        sumZone += (log.rows[o2 + 2] - zoneNext) ** 2;
        sumOut += (log.rows[o2 + 3] - outNext) ** 2;
        n++;
      }
    }
    // Var of a mean of n squared N(0, σ²) residuals is 2σ⁴/n (chi-square, common practice).
    for (const [sum, std] of [[sumZone, p.zoneNoiseStdK], [sumOut, p.outdoorNoiseStdK]] as const) {
      expect(Math.abs(sum / n - std ** 2)).toBeLessThan(4 * std ** 2 * Math.sqrt(2 / n));
    }
  });

  it('is deterministic for a seed and the CSV has the documented header', () => {
    const again = simulateHeatingLoop({ runs: 2, stepsPerRun: 10, seed: 9, policy: heatingBehaviourPolicy });
    expect(Array.from(again.rows.subarray(0, 10 * COLS))).toEqual(Array.from(log.rows.subarray(0, 10 * COLS)));
    expect(heatingLoopCsv(again).split('\n', 1)[0]).toBe('run,time_s,zone_temp_c,outdoor_temp_c,heating_valve_pct,cost');
  });

  it('the committed CSV is exactly what the default seed produces', () => {
    const committed = readFileSync(new URL('../../sample-projects/heating-loop/heating-loop.csv', import.meta.url), 'utf8');
    expect(committed).toBe(heatingLoopCsv(simulateHeatingLoop()));
  });
});
