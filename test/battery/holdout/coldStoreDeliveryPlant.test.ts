/**
 * The cold store whose present controller feeds forward a delivery load the log may leave out
 * (coldStoreDeliveryPlant.ts) is what its doc comment says: it rests at −20 °C with the compressor at half and no
 * load (the heat balance 0.02·45 = 1.8·0.5); the delivery load is an AR(1) whose variance is σ²/(1 − ρ²) and whose
 * lag-1 correlation is ρ (common practice); least squares (ml-matrix, an independent library) of the logged action
 * on (T + 20, q, w) recovers today's law — 0.3 per K, 0 on q, 0.25 on w, dither 0.05 — and without w the slope on
 * T + 20 stays 0.3 while the residual spread becomes √(0.05² + 0.25²·0.4²) (ordinary least squares is unbiased when
 * the omitted part is independent of the regressors: w is, on the white log); and the plant as the unlogged log
 * shows it answers the compressor at −1.8 + 0.5·Cov(w, u | T, q)/Var(u | T, q) = −0.2 per unit, not −1.8 (the
 * omitted-variable bias of least squares, common practice), while with w in the regression it is −1.8.
 */
import { describe, expect, it } from 'vitest';
import { Matrix, solve } from 'ml-matrix';
import type { RandomSource } from '../../../src/core/random';
import type { TransitionSet } from '../../../src/core/transitions';
import { DELIVERY_FEEDFORWARD, DELIVERY_HEAT, DELIVERY_SD, coldStoreDeliveryPlant, deliveryDynamics } from './coldStoreDeliveryPlant';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };

/** Least squares of y on [1, columns…] over the rows (ml-matrix's solve, QR for a tall system): coefficients and residual sd. */
function leastSquares(rows: number, columns: (i: number) => number[], y: (i: number) => number) {
  const x = new Matrix(Array.from({ length: rows }, (_, i) => [1, ...columns(i)])), target = Matrix.columnVector(Array.from({ length: rows }, (_, i) => y(i)));
  const beta = solve(x, target), residual = target.sub(x.mmul(beta));
  return { beta: beta.to1DArray(), sd: Math.sqrt(residual.to1DArray().reduce((s, r) => s + r * r, 0) / rows) };
}

const T = (d: TransitionSet, i: number) => d.states[d.stateDim * i] + 20;

describe('hold-out cold store whose present controller feeds forward a delivery load', () => {
  it('rests at −20 °C with the compressor at half and no load, paying only for the compressor', () => {
    const next = new Float64Array(3), cost = deliveryDynamics(0.9).step(Float64Array.of(-20, 0, 0), Float64Array.of(0.5), quiet, next);
    expect([...next].map((v) => Math.abs(v))).toEqual([20, 0, 0]);
    expect(cost).toBeCloseTo(0.75, 14);
  });

  it('the delivery load is an AR(1) with variance σ²/(1 − ρ²) = 0.4² and lag-1 correlation ρ; the store holds −20 °C on average', () => {
    for (const [memory, rho] of [['white', 0], ['slow', 0.9]] as const) {
      const d = coldStoreDeliveryPlant(memory, true).simulate({ transitions: 100_000, seed: 7 });
      let n = 0, sw = 0, sww = 0, lag = 0, st = 0;
      for (let i = 0; i < d.count; i++) {
        const w = d.states[3 * i + 2];
        n++; sw += w; sww += w * w; st += T(d, i);
        lag += w * d.nextStates[3 * i + 2];
      }
      const variance = sww / n - (sw / n) ** 2, correlation = (lag / n - (sw / n) ** 2) / variance;
      // Sample variance of an AR(1): its relative SE ≈ √(2(1 + ρ²)/(n(1 − ρ²))) — 0.45 % white, 1.9 % slow; 4 SE.
      expect(Math.abs(variance / DELIVERY_SD ** 2 - 1)).toBeLessThan(4 * Math.sqrt((2 * (1 + rho * rho)) / (n * (1 - rho * rho))));
      expect(Math.abs(correlation - rho)).toBeLessThan(0.02);
      expect(Math.abs(st / n)).toBeLessThan(0.02);
    }
  });

  it('least squares with w recovers today’s law (0.3, 0, 0.25, dither 0.05); without w the slope on T stays 0.3 and the spread widens', () => {
    const logged = coldStoreDeliveryPlant('white', true).simulate({ transitions: 100_000, seed: 3 });
    const unlogged = coldStoreDeliveryPlant('white', false).simulate({ transitions: 100_000, seed: 3 });
    const full = leastSquares(logged.count, (i) => [T(logged, i), logged.states[3 * i + 1], logged.states[3 * i + 2]], (i) => logged.actions[i]);
    expect(full.beta[0] - 0.5).toBeCloseTo(0, 2);
    expect(full.beta[1]).toBeCloseTo(0.3, 2);
    expect(full.beta[2]).toBeCloseTo(0, 2);
    expect(full.beta[3]).toBeCloseTo(DELIVERY_FEEDFORWARD, 2);
    expect(Math.abs(full.sd - 0.05)).toBeLessThan(0.001);
    const part = leastSquares(unlogged.count, (i) => [T(unlogged, i), unlogged.states[2 * i + 1]], (i) => unlogged.actions[i]);
    expect(part.beta[1]).toBeCloseTo(0.3, 2);
    expect(Math.abs(part.sd - Math.hypot(0.05, DELIVERY_FEEDFORWARD * DELIVERY_SD))).toBeLessThan(0.002);
  });

  it('the unlogged white log shows a compressor worth −0.2 per unit (omitted-variable bias); with w in the regression −1.8', () => {
    const logged = coldStoreDeliveryPlant('white', true).simulate({ transitions: 100_000, seed: 5 });
    const unlogged = coldStoreDeliveryPlant('white', false).simulate({ transitions: 100_000, seed: 5 });
    const feedforwardVariance = (DELIVERY_FEEDFORWARD * DELIVERY_SD) ** 2, ditherVariance = 0.05 ** 2;
    const biased = -1.8 + (DELIVERY_HEAT * DELIVERY_FEEDFORWARD * DELIVERY_SD ** 2) / (feedforwardVariance + ditherVariance);
    expect(biased).toBeCloseTo(-0.2, 12);
    const shown = leastSquares(unlogged.count, (i) => [unlogged.states[2 * i], unlogged.states[2 * i + 1], unlogged.actions[i]], (i) => unlogged.nextStates[2 * i]);
    // Its SE: √(residual variance / (n · Var(u | T, q))) = √(0.018 / (10⁵ · 0.0125)) ≈ 0.004; 5 SE.
    expect(Math.abs(shown.beta[3] - biased)).toBeLessThan(0.02);
    const whole = leastSquares(logged.count, (i) => [logged.states[3 * i], logged.states[3 * i + 1], logged.states[3 * i + 2], logged.actions[i]], (i) => logged.nextStates[3 * i]);
    expect(Math.abs(whole.beta[4] + 1.8)).toBeLessThan(0.02);
    expect(Math.abs(whole.beta[3] - DELIVERY_HEAT)).toBeLessThan(0.01);
  });

  it('the unlogged log is the logged one without its third column, with the same true run starts (w included)', () => {
    const logged = coldStoreDeliveryPlant('slow', true).simulate({ transitions: 4_000, seed: 2 });
    const unlogged = coldStoreDeliveryPlant('slow', false).simulate({ transitions: 4_000, seed: 2 });
    expect(unlogged.stateDim).toBe(2);
    expect(unlogged.stateNames).toEqual(['store_temperature_c', 'heat_load']);
    for (let i = 0; i < logged.count; i++) for (let j = 0; j < 2; j++) {
      expect(unlogged.states[2 * i + j]).toBe(logged.states[3 * i + j]);
      expect(unlogged.nextStates[2 * i + j]).toBe(logged.nextStates[3 * i + j]);
    }
    expect(unlogged.actions).toEqual(logged.actions);
    expect(unlogged.startStates).toEqual(logged.startStates);
    expect(unlogged.startStates.length).toBe(3 * unlogged.episodeCount);
  });
});
