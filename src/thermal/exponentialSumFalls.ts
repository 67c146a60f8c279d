import { exponentialSumZero } from "./exponentialSumZero.js";

/**
 * Whether an exponential sum S(x) = Σ_{i<n} k_i·e^(−r_i·x) (rates ascending, r_0 ≥ 0) goes from
 * positive to zero or below somewhere in (0, h]: for the slope of a rise, whether the step holds
 * a maximum. The answer is exact, not sampled, however many sign changes the coefficients have.
 *
 * Method (the proof of the rule of signs for exponential sums, run as an algorithm): e^(r_0·x)·S(x)
 * has the zeros and the sign of S, and its derivative is e^(r_0·x)·S_1(x) with
 *   S_1(x) = Σ_{i≥1} k_i·(r_0 − r_i)·e^(−r_i·x),
 * one term fewer. Between two consecutive zeros of S_1 (or the interval ends) e^(r_0·x)·S is
 * monotone, so S changes sign there at most once, and it does exactly when its signs at the two
 * ends differ (Rolle's theorem). Applied again to S_1, S_2, ... down to a level whose coefficients
 * change sign at most once (at most one zero, told by the signs at 0 and h), this isolates every
 * zero of S in [0, h]: each level's zeros are the next level's breakpoints, found by safeguarded
 * Newton inside their brackets. S falls to zero or below exactly when, over the breakpoints of S
 * itself, a positive value is followed by one at or below zero. Before all this, bounds from the
 * terms' values at 0 and h settle most steps in O(n): S above zero, or never above it.
 * Source: the generalised rule of signs for exponential sums (Laguerre) and its proof by this
 * differentiation, as in Pólya & Szegő, Problems and Theorems in Analysis II, Part V (from
 * memory); Rolle's theorem; Newton with bracketing, Press et al., Numerical Recipes, 3rd ed.
 * (2007), §9.4.
 * Validity: a value within `UNSURE` of zero, relative to the sum of the terms' sizes there (a
 * tangency, or a turn exactly at a breakpoint), cannot be told apart from rounding: the answer
 * is then true, so a caller that searches on "true" loses nothing.
 * Cost O(n) when the bounds settle it, else O(n² × Newton iterations); no allocation once the
 * scratch has grown to n.
 */
export function exponentialSumFalls(coefficients: ArrayLike<number>, rates: ArrayLike<number>, n: number, h: number): boolean {
  // first the bounds: each term lies between its values at 0 and h, so S is positive over the
  // whole step when the sum of the terms' lower ends is, and never positive when the sum of their
  // upper ends is not (the answer for almost every step: a fall is rare)
  let low = 0;
  let high = 0;
  let size = 0;
  for (let i = 0; i < n; i++) {
    const k = coefficients[i]!;
    const end = k * Math.exp(-rates[i]! * h);
    low += Math.min(k, end);
    high += Math.max(k, end);
    size += Math.abs(k);
  }
  if (low > UNSURE * size || high < -UNSURE * size) return false;
  reserve(n);
  // level j holds the coefficients of S_j at j·n + i for i ≥ j (its terms are j..n−1)
  for (let i = 0; i < n; i++) levelCoefficients[i] = coefficients[i]!;
  let deepest = 0;
  while (deepest < n - 1 && signChanges(deepest, n) > 1) {
    const from = deepest * n;
    const to = from + n;
    const r0 = rates[deepest]!;
    for (let i = deepest + 1; i < n; i++) levelCoefficients[to + i] = levelCoefficients[from + i]! * (r0 - rates[i]!);
    deepest++;
  }
  // the deepest level has at most one zero: bracketed by [0, h]
  let count = 2;
  breakpoints[0] = 0;
  breakpoints[1] = h;
  for (let level = deepest; level >= 0; level--) {
    // values of S_level at the breakpoints, each checked against rounding
    for (let k = 0; k < count; k++) {
      const x = breakpoints[k]!;
      const value = levelValue(level, n, rates, x);
      if (!(Math.abs(value) > UNSURE * levelSize(level, n, rates, x))) return true;
      values[k] = value;
    }
    if (level === 0) {
      for (let k = 0; k + 1 < count; k++) if (values[k]! > 0 && values[k + 1]! <= 0) return true;
      return false;
    }
    // the zeros of S_level, in order, become the breakpoints of S_(level−1)
    let next = 1;
    nextBreakpoints[0] = 0;
    for (let k = 0; k + 1 < count; k++)
      if (values[k]! > 0 !== values[k + 1]! > 0) nextBreakpoints[next++] = exponentialSumZero(levelCoefficients, level * n, rates, level, n, breakpoints[k]!, breakpoints[k + 1]!, 0.5 * (breakpoints[k]! + breakpoints[k + 1]!), values[k]! > 0, h);
    nextBreakpoints[next++] = h;
    const swap = breakpoints;
    breakpoints = nextBreakpoints;
    nextBreakpoints = swap;
    count = next;
  }
  return true;
}

/** Relative size below which a value is taken as possibly zero (see exponentialSumFalls, Validity). */
const UNSURE = 1e-10;

/** Scratch of exponentialSumFalls: coefficients by level (n × n), breakpoints and values (n + 1). Grown on demand. */
let levelCoefficients = new Float64Array(64);
let breakpoints = new Float64Array(9);
let nextBreakpoints = new Float64Array(9);
let values = new Float64Array(9);

function reserve(n: number): void {
  if (levelCoefficients.length < n * n) levelCoefficients = new Float64Array(2 * n * n);
  if (breakpoints.length < n + 2) {
    breakpoints = new Float64Array(2 * n + 2);
    nextBreakpoints = new Float64Array(2 * n + 2);
    values = new Float64Array(2 * n + 2);
  }
}

/** Sign changes among the coefficients of level j, zeros skipped. */
function signChanges(j: number, n: number): number {
  let changes = 0;
  let last = 0;
  for (let i = j; i < n; i++) {
    const c = levelCoefficients[j * n + i]!;
    const sign = c > 0 ? 1 : c < 0 ? -1 : 0;
    if (sign === 0) continue;
    if (last !== 0 && sign !== last) changes++;
    last = sign;
  }
  return changes;
}

/** S_j(x). */
function levelValue(j: number, n: number, rates: ArrayLike<number>, x: number): number {
  let sum = 0;
  for (let i = j; i < n; i++) sum += levelCoefficients[j * n + i]! * Math.exp(-rates[i]! * x);
  return sum;
}

/** Σ |terms of S_j| at x: the scale its rounding error is measured against. */
function levelSize(j: number, n: number, rates: ArrayLike<number>, x: number): number {
  let sum = 0;
  for (let i = j; i < n; i++) sum += Math.abs(levelCoefficients[j * n + i]!) * Math.exp(-rates[i]! * x);
  return sum;
}
