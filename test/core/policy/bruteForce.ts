/**
 * A brute-force reference for expectations under a limited Gaussian action, built from the
 * definitions alone (no code of the engine): a = clip(μ + σz, L, U) with z ~ N(0, 1), density
 * φ(z) = exp(−z²/2)/√(2π), so E f(a) = ∫ f(clip(μ + σz, L, U)) φ(z) dz. The integral over
 * z ∈ [−12, 12] (tails below 1e−32) is split at the clip points, where the integrand has kinks,
 * and each smooth piece gets composite Simpson with `panels` panels (error O(h⁴); Abramowitz &
 * Stegun 25.4.6). For truncation the same integral over [L, U] only, divided by its mass.
 */
export function bruteForceExpectation(
  f: (a: number) => number, mean: number, std: number, lo: number, hi: number, mode: 'clip' | 'truncate' | 'none', panels = 4000,
): number {
  const zLo = Math.max(-12, (lo - mean) / std), zHi = Math.min(12, (hi - mean) / std);
  const density = (z: number) => Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI);
  const action = (z: number) => Math.min(hi, Math.max(lo, mean + std * z));
  const g = (z: number) => f(action(z)) * density(z);
  if (mode === 'none') return simpson(g, -12, 12, panels);
  if (lo === hi) return f(lo);
  const inside = zLo < zHi ? simpson(g, zLo, zHi, panels) : 0;
  if (mode === 'truncate') return inside / simpson(density, zLo, zHi, panels);
  const below = zLo > -12 ? simpson(g, -12, zLo, panels) : 0;
  const above = zHi < 12 ? simpson(g, zHi, 12, panels) : 0;
  return below + inside + above;
}

function simpson(g: (z: number) => number, a: number, b: number, panels: number): number {
  if (!(b > a)) return 0;
  const h = (b - a) / panels;
  let sum = g(a) + g(b);
  for (let i = 1; i < panels; i++) sum += (i % 2 === 1 ? 4 : 2) * g(a + i * h);
  return (sum * h) / 3;
}
