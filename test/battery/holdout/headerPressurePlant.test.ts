/**
 * The hold-out gas header (headerPressurePlant.ts) is what its doc comment says: at the setpoint, the
 * nominal load and the speed matching it the pressure stays put (mass balance) and only energy is
 * paid; the pressure's disturbance grows with the load (sample variances against (0.02 + 0.1·L)²);
 * the load is the slow AR(1) state (stationary standard deviation σ/√(1 − φ²), lag-one correlation φ:
 * common practice); the hinge cost's mean over a normal next pressure equals its closed form, the
 * second partial moment of a normal law E[(Z − c)₊²] = (s² + (μ − c)²)·Φ(−k) + (μ − c)·s·φ(k), k = (c − μ)/s
 * (e.g. Winkler, Roodman & Britney, Management Science 1972, on partial moments; from memory); and
 * the logged pressure sits near the relief limit, crossing it on a small share of the rows.
 */
import { describe, expect, it } from 'vitest';
import { createRandom, type RandomSource } from '../../../src/core/random';
import { NOMINAL_LOAD, RELIEF_LIMIT_BAR, headerPressureDynamics, headerPressurePlant, pressureNoise } from './headerPressurePlant';

const quiet: RandomSource = { normal: () => 0, uniform: () => 0.5, integer: () => 0 };

/** Standard normal density and distribution function (Abramowitz & Stegun 26.2.17, error below 7.5·10⁻⁸). */
function phi(z: number): number {
  return Math.exp(-z * z / 2) / Math.sqrt(2 * Math.PI);
}
function bigPhi(z: number): number {
  const t = 1 / (1 + 0.2316419 * Math.abs(z));
  const tail = phi(z) * t * (0.31938153 + t * (-0.356563782 + t * (1.781477937 + t * (-1.821255978 + t * 1.330274429))));
  return z >= 0 ? 1 - tail : tail;
}

/** Sample mean and variance of f over n draws. */
function moments(n: number, f: () => number): { mean: number; variance: number } {
  let s = 0, q = 0;
  for (let i = 0; i < n; i++) {
    const v = f();
    s += v;
    q += v * v;
  }
  return { mean: s / n, variance: (q - s * s / n) / (n - 1) };
}

describe('hold-out gas header with load-dependent noise and a relief-limit hinge', () => {
  it('holds the setpoint at the nominal load with the speed matching it, paying only energy', () => {
    const next = new Float64Array(2);
    const cost = headerPressureDynamics.step(Float64Array.of(0, NOMINAL_LOAD), Float64Array.of(NOMINAL_LOAD), quiet, next);
    expect(next[0]).toBeCloseTo(0, 15);
    expect(next[1]).toBeCloseTo(NOMINAL_LOAD, 15);
    expect(cost).toBeCloseTo(0.2 * NOMINAL_LOAD, 15);
  });

  it('draws the pressure disturbance with a spread that grows with the load', () => {
    const rng = createRandom(3), next = new Float64Array(2), n = 100_000;
    for (const load of [0.2, 0.8]) {
      const { variance } = moments(n, () => (headerPressureDynamics.step(Float64Array.of(0, load), Float64Array.of(load), rng, next), next[0]));
      const exact = pressureNoise(load) ** 2;
      expect(Math.abs(variance - exact)).toBeLessThan(4 * exact * Math.sqrt(2 / n)); // SE of a normal sample variance
    }
    expect(pressureNoise(0.8) / pressureNoise(0.2)).toBeCloseTo(2.5, 12);
  });

  it('pays the hinge as its closed form says for a normal next pressure', () => {
    const rng = createRandom(4), next = new Float64Array(2), load = NOMINAL_LOAD, n = 400_000;
    const p = 0.25, u = load - 0.3; // next mean 0.8·0.25 + 0.5·(−0.3) = 0.05
    const mu = 0.05, s = pressureNoise(load), c = RELIEF_LIMIT_BAR, k = (c - mu) / s;
    const exact = 50 * ((s * s + (mu - c) ** 2) * bigPhi(-k) + (mu - c) * s * phi(k));
    const hinge = moments(n, () => (headerPressureDynamics.step(Float64Array.of(p, load), Float64Array.of(u), rng, next), 50 * Math.max(0, next[0] - c) ** 2));
    expect(Math.abs(hinge.mean - exact)).toBeLessThan(4 * Math.sqrt(hinge.variance / n));
  });

  it('logs a slow load (AR(1) spread and lag-one correlation) and a pressure that crosses the relief limit on a small share of rows', () => {
    const plant = headerPressurePlant(), data = plant.simulate({ transitions: 100_000, seed: 2 });
    let sum = 0, squares = 0, lagged = 0, above = 0;
    for (let i = 0; i < data.count; i++) {
      const load = data.states[i * 2 + 1] - NOMINAL_LOAD;
      sum += load;
      squares += load * load;
      lagged += load * (data.nextStates[i * 2 + 1] - NOMINAL_LOAD);
      if (data.states[i * 2] > RELIEF_LIMIT_BAR) above++;
    }
    const sd = Math.sqrt(squares / data.count - (sum / data.count) ** 2);
    expect(sd).toBeGreaterThan(0.6 * 0.01 / Math.sqrt(1 - 0.99 ** 2)); // 0.0709; a few hundred independent stretches of the slow load only
    expect(sd).toBeLessThan(1.4 * 0.01 / Math.sqrt(1 - 0.99 ** 2));
    expect(lagged / squares).toBeGreaterThan(0.98);
    expect(above / data.count).toBeGreaterThan(0.02);
    expect(above / data.count).toBeLessThan(0.15);
    expect(plant.simulate({ transitions: 100_000, seed: 2 }).states).toEqual(data.states);
  });
});
