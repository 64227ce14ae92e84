/**
 * The standard normal distribution: density φ, distribution function Φ, upper tail 1 − Φ and the
 * inverse Φ⁻¹. Pure functions of one number; no tables.
 */

const SQRT_2PI = Math.sqrt(2 * Math.PI);

/** Below this |x| the Taylor series is used, at or above it the continued fraction (tuned by trial). */
const SERIES_LIMIT = 2.5;

/** Largest number of continued-fraction terms tried before giving up (never reached for |x| ≥ 2.5). */
const MAX_FRACTION_TERMS = 500;

/** φ(x) = exp(−x²/2)/√(2π). */
export function normalDensity(x: number): number {
  return Math.exp(-0.5 * x * x) / SQRT_2PI;
}

/**
 * Σ_k x^(2k+1)/(1·3·5···(2k+1)), so that Φ(x) = ½ + φ(x)·S(x) (Marsaglia, "Evaluating the normal
 * distribution", J. Statist. Software 11(4), 2004). All terms have the sign of x, so the sum itself
 * loses nothing; cost grows like x².
 */
function marsagliaSeries(x: number): number {
  const x2 = x * x;
  let term = x;
  let sum = x;
  for (let k = 1; k < 200; k++) {
    term *= x2 / (2 * k + 1);
    const next = sum + term;
    if (next === sum) break;
    sum = next;
  }
  return sum;
}

/**
 * Upper tail Q(x) = 1 − Φ(x) for x ≥ SERIES_LIMIT by Laplace's continued fraction
 * Q(x) = φ(x) / (x + 1/(x + 2/(x + 3/(x + …)))) (Abramowitz & Stegun 26.2.14, from memory),
 * evaluated with the modified Lentz method (Lentz 1976; Thompson & Barnett 1986, from memory).
 * Relative accuracy is kept deep into the tail, where 1 − Φ(x) in double would be 0.
 */
function upperTailFraction(x: number): number {
  const tiny = 1e-300;
  let f = x;
  let c = x;
  let d = 0;
  for (let k = 1; k <= MAX_FRACTION_TERMS; k++) {
    d = x + k * d;
    if (d === 0) d = tiny;
    c = x + k / c;
    if (c === 0) c = tiny;
    d = 1 / d;
    const delta = c * d;
    f *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return normalDensity(x) / f;
}

/**
 * Φ(x) = P(Z ≤ x) for Z ~ N(0, 1).
 * Method: Marsaglia's series for |x| < 2.5, Laplace's continued fraction for the tails, so the
 * lower tail keeps its relative accuracy down to the underflow of φ (x ≈ −38).
 * Cost: at most a few hundred flops.
 */
export function normalCdf(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x === Infinity) return 1;
  if (x === -Infinity) return 0;
  if (Math.abs(x) < SERIES_LIMIT) return 0.5 + normalDensity(x) * marsagliaSeries(x);
  return x < 0 ? upperTailFraction(-x) : 1 - upperTailFraction(x);
}

/** 1 − Φ(x), computed without cancellation for large x (see normalCdf). */
export function normalUpperTail(x: number): number {
  return normalCdf(-x);
}

// Rational approximations of P. J. Acklam, "An algorithm for computing the inverse normal
// cumulative distribution function" (2003, web note; coefficients from memory, checked in the
// tests against Φ to the approximation's stated relative error 1.15e-9).
const A = [
  -3.969683028665376e1, 2.209460984245205e2, -2.759285104469687e2, 1.38357751867269e2,
  -3.066479806614716e1, 2.506628277459239,
] as const;
const B = [
  -5.447609879822406e1, 1.615858368580409e2, -1.556989798598866e2, 6.680131188771972e1,
  -1.328068155288572e1,
] as const;
const C = [
  -7.784894002430293e-3, -3.223964580411365e-1, -2.400758277161838, -2.549732539343734,
  4.374664141464968, 2.938163982698783,
] as const;
const D = [
  7.784695709041462e-3, 3.224671290700398e-1, 2.445134137142996, 3.754408661907416,
] as const;
const P_LOW = 0.02425;

/** Acklam's approximation of Φ⁻¹(p) for 0 < p ≤ ½ (relative error below 1.15e-9). */
export function acklamLowerHalf(p: number): number {
  if (p < P_LOW) {
    const q = Math.sqrt(-2 * Math.log(p));
    return (
      (((((C[0] * q + C[1]) * q + C[2]) * q + C[3]) * q + C[4]) * q + C[5]) /
      ((((D[0] * q + D[1]) * q + D[2]) * q + D[3]) * q + 1)
    );
  }
  const q = p - 0.5;
  const r = q * q;
  return (
    ((((((A[0] * r + A[1]) * r + A[2]) * r + A[3]) * r + A[4]) * r + A[5]) * q) /
    (((((B[0] * r + B[1]) * r + B[2]) * r + B[3]) * r + B[4]) * r + 1)
  );
}

/**
 * Φ⁻¹(p): the x with Φ(x) = p, for 0 ≤ p ≤ 1 (−∞ at 0, +∞ at 1).
 * Method: Acklam's rational approximation on the lower half, then one Halley step against the
 * accurate normalCdf (as Acklam suggests), which brings it to near full double precision; the upper
 * half by symmetry Φ⁻¹(p) = −Φ⁻¹(1 − p).
 * Throws RangeError when p is outside [0, 1] or NaN.
 */
export function normalInverseCdf(p: number): number {
  if (!(p >= 0 && p <= 1)) throw new RangeError(`p must lie in [0, 1], got ${p}`);
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  if (p > 0.5) return -normalInverseCdf(1 - p);
  const x = acklamLowerHalf(p);
  // Halley's step for Φ(x) − p = 0: u = (Φ(x) − p)/φ(x), x ← x − u/(1 + x·u/2).
  const u = (normalCdf(x) - p) / normalDensity(x);
  return x - u / (1 + (x * u) / 2);
}
