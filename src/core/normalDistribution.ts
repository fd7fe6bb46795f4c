/**
 * The standard normal density φ, distribution function Φ and its complement.
 *
 * Φ is computed from the complementary error function by W. J. Cody's rational Chebyshev
 * approximations ("Rational Chebyshev approximations for the error function", Math. Comp. 23,
 * 1969), accurate to about 1e-15 relative over the whole line, including far tails, which the
 * bounded-action expectations need (mass beyond an actuator bound 8 standard deviations away).
 */
const SQRT_2PI = Math.sqrt(2 * Math.PI);

export function normalDensity(z: number): number {
  return Math.exp(-0.5 * z * z) / SQRT_2PI;
}

export function logNormalDensity(z: number): number {
  return -0.5 * z * z - Math.log(SQRT_2PI);
}

/** Φ(z) = P(Z ≤ z) for Z ~ N(0, 1). */
export function normalCdf(z: number): number {
  return 0.5 * erfc(-z / Math.SQRT2);
}

/** 1 − Φ(z), computed without cancellation for large z. */
export function normalSurvival(z: number): number {
  return 0.5 * erfc(z / Math.SQRT2);
}

/** Φ(b) − Φ(a) for a ≤ b, using whichever tail avoids cancellation. */
export function normalIntervalProbability(a: number, b: number): number {
  if (a >= 0) return normalSurvival(a) - normalSurvival(b);
  if (b <= 0) return normalCdf(b) - normalCdf(a);
  return 1 - normalCdf(a) - normalSurvival(b);
}

const ERF_A = [3.1611237438705656, 113.864154151050156, 377.485237685302021, 3209.37758913846947, 0.185777706184603153];
const ERF_B = [23.6012909523441209, 244.024637934444173, 1282.61652607737228, 2844.23683343917062];
const ERFC_C = [
  0.564188496988670089, 8.88314979438837594, 66.1191906371416295, 298.635138197400131, 881.95222124176909,
  1712.04761263407058, 2051.07837782607147, 1230.33935479799725, 2.15311535474403846e-8,
];
const ERFC_D = [15.7449261107098347, 117.693950891312499, 537.181101862009858, 1621.38957456669019, 3290.79923573345963, 4362.61909014324716, 3439.36767414372164, 1230.33935480374942];
const ERFC_P = [0.305326634961232344, 0.360344899949804439, 0.125781726111229246, 0.0160837851487422766, 6.58749161529837803e-4, 0.0163153871373020978];
const ERFC_Q = [2.56852019228982242, 1.87295284992346725, 0.527905102951428412, 0.0605183413124413191, 0.00233520497626869185];
const INV_SQRT_PI = 0.564189583547756287;

/** Complementary error function erfc(x) = 1 − erf(x) (Cody 1969, the three-interval form). */
export function erfc(x: number): number {
  if (Number.isNaN(x)) return NaN;
  const y = Math.abs(x);
  let result: number;
  if (y <= 0.46875) {
    const ysq = y > 1.11e-16 ? y * y : 0;
    let num = ERF_A[4] * ysq, den = ysq;
    for (let i = 0; i < 3; i++) {
      num = (num + ERF_A[i]) * ysq;
      den = (den + ERF_B[i]) * ysq;
    }
    const erfValue = (x * (num + ERF_A[3])) / (den + ERF_B[3]);
    return 1 - erfValue;
  } else if (y <= 4) {
    let num = ERFC_C[8] * y, den = y;
    for (let i = 0; i < 7; i++) {
      num = (num + ERFC_C[i]) * y;
      den = (den + ERFC_D[i]) * y;
    }
    result = (num + ERFC_C[7]) / (den + ERFC_D[7]);
    result *= expSquaredSplit(y);
  } else if (y >= 26.55) {
    result = 0;
  } else {
    const ysq = 1 / (y * y);
    let num = ERFC_P[5] * ysq, den = ysq;
    for (let i = 0; i < 4; i++) {
      num = (num + ERFC_P[i]) * ysq;
      den = (den + ERFC_Q[i]) * ysq;
    }
    result = (ysq * (num + ERFC_P[4])) / (den + ERFC_Q[4]);
    result = (INV_SQRT_PI - result) / y;
    result *= expSquaredSplit(y);
  }
  return x < 0 ? 2 - result : result;
}

/** exp(−y²) with y split into a 1/16 grid point and a remainder, as Cody does, to keep relative accuracy. */
function expSquaredSplit(y: number): number {
  const ysq = Math.trunc(y * 16) / 16;
  const del = (y - ysq) * (y + ysq);
  return Math.exp(-ysq * ysq) * Math.exp(-del);
}
