/**
 * The two integrals every exact segment update reduces to, evaluated without overflow or
 * cancellation for every x ≥ 0 (and correctly for moderate negative x):
 *
 *   φ0(x) = ∫0^1 e^(−x·u) du   = (1 − e^(−x))/x            (φ0(0) = 1)
 *   φ1(x) = ∫0^1 u·e^(−x·u) du = (1 − e^(−x)·(1 + x))/x²    (φ1(0) = 1/2)
 *
 * φ0 uses expm1, which is accurate to rounding for tiny x. φ1 loses every digit to cancellation
 * near 0 in its closed form, so for |x| < 0.5 it uses the Taylor series
 * φ1(x) = Σ_k (−x)^k / (k!·(k + 2)), whose terms fall below 2^-53 of the sum after 20 terms.
 *
 * Source: Abramowitz & Stegun, Handbook of Mathematical Functions (1964), 4.2.1 (exponential
 * series); the "phi-functions" of exponential integrators, Hochbruck & Ostermann, Acta Numerica
 * 19 (2010), eq. (2.10).
 * Cost: O(1).
 */
export function expIntegral0(x: number): number {
  if (x === 0) return 1;
  return -Math.expm1(-x) / x;
}

/** φ1(x) = ∫0^1 u·e^(−x·u) du; see {@link expIntegral0}. Cost O(1). */
export function expIntegral1(x: number): number {
  if (Math.abs(x) < 0.5) {
    let term = 1;
    let sum = 0.5;
    for (let k = 1; k < 24; k++) {
      term *= -x / k;
      sum += term / (k + 2);
    }
    return sum;
  }
  return (-Math.expm1(-x) - x * Math.exp(-x)) / (x * x);
}
