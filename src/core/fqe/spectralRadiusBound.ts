/**
 * An upper bound on the spectral radius ρ(T) of a square matrix from Gelfand's formula
 * ρ(T) = lim ‖T^k‖^(1/k), with ρ(T) ≤ ‖T^k‖^(1/k) for every k and any consistent norm (Horn &
 * Johnson, "Matrix Analysis", 2nd ed., Cor. 5.6.14). T^k is formed by repeated squaring,
 * k = 2^p, renormalising each square so nothing overflows; the bound tightens as p grows
 * (the excess is a factor c^(1/k) for a constant c set by T's eigenvectors).
 *
 * Why a bound and not eigenvalues: the FQE iteration matrix is non-symmetric with possibly
 * complex eigenvalues, and the question asked of it is one-sided — once the bound is below 1 the
 * iteration provably contracts, so squaring can stop there.
 */

/** Squarings at most: k = 2^30 leaves an excess factor c^(1/k) ≈ 1 + 1e-9·ln c. */
const MAX_SQUARINGS = 30;

/** t: n×n row-major. Returns a bound ≥ ρ(t); 0 for a nilpotent matrix. */
export function spectralRadiusBound(t: Float64Array, n: number, stopBelow = 1 - 1e-3): number {
  return countedSpectralRadiusBound(t, n, stopBelow).bound;
}

/** spectralRadiusBound with the squarings it ran (each an n×n product, n³ multiply-adds), for a budget that counts what runs. */
export function countedSpectralRadiusBound(t: Float64Array, n: number, stopBelow = 1 - 1e-3): { bound: number; squarings: number } {
  let power = Float64Array.from(t), square = new Float64Array(n * n);
  let logNorm = normalise(power); // log ‖T^k‖_F with power = T^k/‖T^k‖_F
  if (logNorm === -Infinity) return { bound: 0, squarings: 0 };
  let k = 1, bound = Math.exp(logNorm), p = 0;
  while (p < MAX_SQUARINGS) {
    multiplyInto(power, power, square, n);
    p++;
    const logScale = normalise(square);
    if (logScale === -Infinity) return { bound: 0, squarings: p }; // T^(2k) = 0 to working precision
    [power, square] = [square, power];
    logNorm = 2 * logNorm + logScale;
    k *= 2;
    const next = Math.exp(logNorm / k);
    const settled = Math.abs(next - bound) <= 1e-10 * bound; // the excess roughly halves per squaring
    bound = next;
    if (bound < stopBelow || settled) break;
  }
  return { bound, squarings: p };
}

/** Divide a by its Frobenius norm in place; returns log of that norm (−∞ for a zero matrix). */
function normalise(a: Float64Array): number {
  let max = 0;
  for (let i = 0; i < a.length; i++) max = Math.max(max, Math.abs(a[i]));
  if (max === 0) return -Infinity;
  let s = 0;
  for (let i = 0; i < a.length; i++) s += (a[i] / max) ** 2;
  const norm = max * Math.sqrt(s); // scaled first so the sum of squares cannot overflow
  for (let i = 0; i < a.length; i++) a[i] /= norm;
  return Math.log(norm);
}

function multiplyInto(a: Float64Array, b: Float64Array, out: Float64Array, n: number): void {
  out.fill(0);
  for (let i = 0; i < n; i++) {
    for (let p = 0; p < n; p++) {
      const aip = a[i * n + p];
      if (aip === 0) continue;
      for (let j = 0; j < n; j++) out[i * n + j] += aip * b[p * n + j];
    }
  }
}
