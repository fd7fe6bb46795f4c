/**
 * Student's t distribution with ν degrees of freedom: its distribution function and quantile, for an
 * interval whose scale is estimated from ν residual degrees of freedom (drift/weightedTrendForecast.ts).
 *
 * The distribution function through the regularised incomplete beta function,
 *   F(t) = 1 − ½·I_x(ν/2, ½) for t ≥ 0, x = ν/(ν + t²)          (Abramowitz & Stegun 26.7.1 with 26.5.27),
 * I_x(a, b) by its continued fraction evaluated with the modified Lentz method (Press et al., "Numerical
 * Recipes", 3rd ed., §6.4; Lentz 1976), on the side where it converges fast (x < (a + 1)/(a + b + 2), else
 * by the symmetry I_x(a, b) = 1 − I_{1−x}(b, a)). ln Γ by the Lanczos approximation (Numerical Recipes §6.1,
 * g = 5, six terms; relative error below 2·10⁻¹⁰). The quantile by bisection on F, which is monotone: 200
 * halvings of a bracket that F's tails guarantee, so the answer is as exact as F itself.
 * Checked against Abramowitz & Stegun, Table 26.10, and scipy.stats.t (test/core/studentDistribution.test.ts).
 */

const LANCZOS = [76.18009172947146, -86.50532032941677, 24.01409824083091, -1.231739572450155, 0.1208650973866179e-2, -0.5395239384953e-5];

/** ln Γ(x) for x > 0 (Lanczos; Numerical Recipes §6.1). */
export function logGamma(x: number): number {
  let y = x, sum = 1.000000000190015;
  const t = x + 5.5 - (x + 0.5) * Math.log(x + 5.5);
  for (const c of LANCZOS) sum += c / ++y;
  return -t + Math.log((2.5066282746310005 * sum) / x);
}

const TINY = 1e-300, EPS = 1e-15, MAX_TERMS = 1000;

/** The continued fraction of I_x(a, b) (Numerical Recipes §6.4, betacf), modified Lentz. */
function betaContinuedFraction(a: number, b: number, x: number): number {
  const qab = a + b, qap = a + 1, qam = a - 1;
  let c = 1, d = 1 - (qab * x) / qap;
  d = 1 / (Math.abs(d) < TINY ? TINY : d);
  let h = d;
  for (let m = 1; m <= MAX_TERMS; m++) {
    const m2 = 2 * m;
    for (const coefficient of [(m * (b - m) * x) / ((qam + m2) * (a + m2)), (-(a + m) * (qab + m) * x) / ((a + m2) * (qap + m2))]) {
      d = 1 + coefficient * d;
      d = 1 / (Math.abs(d) < TINY ? TINY : d);
      c = 1 + coefficient / c;
      if (Math.abs(c) < TINY) c = TINY;
      h *= d * c;
    }
    if (Math.abs(d * c - 1) < EPS) break;
  }
  return h;
}

/** The regularised incomplete beta function I_x(a, b), a, b > 0, 0 ≤ x ≤ 1. */
export function regularisedIncompleteBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const front = Math.exp(logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log(1 - x));
  return x < (a + 1) / (a + b + 2) ? (front * betaContinuedFraction(a, b, x)) / a : 1 - (front * betaContinuedFraction(b, a, 1 - x)) / b;
}

/** P(T ≤ t) for T ~ Student t with `degrees` (> 0) degrees of freedom. */
export function studentCdf(t: number, degrees: number): number {
  const tail = 0.5 * regularisedIncompleteBeta(degrees / (degrees + t * t), degrees / 2, 0.5);
  return t >= 0 ? 1 - tail : tail;
}

/** The p-quantile of Student's t with `degrees` degrees of freedom, 0 < p < 1. */
export function studentQuantile(p: number, degrees: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`studentQuantile: p must lie strictly between 0 and 1, got ${p}`);
  if (!(degrees > 0)) throw new RangeError(`studentQuantile: degrees of freedom must be positive, got ${degrees}`);
  if (p === 0.5) return 0;
  if (p < 0.5) return -studentQuantile(1 - p, degrees);
  let lo = 0, hi = 1;
  while (studentCdf(hi, degrees) < p) hi *= 2; // the tail is at most ~ t^−ν: the bracket is found in a few doublings
  for (let k = 0; k < 200 && hi - lo > 1e-14 * hi; k++) {
    const mid = 0.5 * (lo + hi);
    if (studentCdf(mid, degrees) < p) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}
