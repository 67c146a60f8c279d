/**
 * The one zero inside a bracket [lo, hi], searched from x, of an exponential sum
 *   S(x) = Σ_{from ≤ i < to} coefficients[offset + i]·e^(−rates[i]·x),
 * which changes sign there once (S(lo) > 0 ≥ S(hi) when `falling`, the other way round when not),
 * by Newton's method kept inside the bracket: a step that leaves it is replaced by bisection, and
 * the bracket shrinks at every evaluation. Stops when the bracket or the step is below 1e-12·h.
 * Source: Newton with bracketing, Press et al., Numerical Recipes, 3rd ed. (2007), §9.4.
 * Cost O(to − from) per iteration (at most 200), no allocation.
 */
export function exponentialSumZero(
  coefficients: ArrayLike<number>,
  offset: number,
  rates: ArrayLike<number>,
  from: number,
  to: number,
  lo: number,
  hi: number,
  x: number,
  falling: boolean,
  h: number,
): number {
  for (let iteration = 0; iteration < 200; iteration++) {
    let f = 0;
    let df = 0;
    for (let i = from; i < to; i++) {
      const term = coefficients[offset + i]! * Math.exp(-rates[i]! * x);
      f += term;
      df -= term * rates[i]!;
    }
    if (f === 0) return x;
    if (f > 0 === falling) lo = x;
    else hi = x;
    if (hi - lo <= 1e-12 * h) break;
    let next = x - f / df;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - x) <= 1e-12 * h) return next;
    x = next;
  }
  return 0.5 * (lo + hi);
}
