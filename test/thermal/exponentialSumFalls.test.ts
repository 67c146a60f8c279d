import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { exponentialSumFalls } from "../../src/thermal/exponentialSumFalls.js";

// Closed form (algebra): with u = e^(−x), the sum ab·e^(−x) − (a + b)·e^(−2x) + e^(−3x) is the
// cubic u·(u − a)·(u − b). For 1 > a > b > 0 it is positive at x = 0 (u = 1), falls through zero
// at u = a (x = −ln a) and rises again at u = b (x = −ln b): two sign changes in its coefficients,
// two zeros, one of them a fall.
describe("exponentialSumFalls against the closed-form cubic in e^(−x)", () => {
  const [a, b] = [0.6, 0.3];
  const rates = [1, 2, 3];
  const cubic = [a * b, -(a + b), 1];
  const negated = cubic.map((k) => -k);
  test("the fall at x = −ln a = 0.511 is found when the step reaches it, and not before", () => {
    expect(exponentialSumFalls(cubic, rates, 3, 0.5)).toBe(false);
    expect(exponentialSumFalls(cubic, rates, 3, 0.52)).toBe(true);
    expect(exponentialSumFalls(cubic, rates, 3, 5)).toBe(true);
  });
  test("the negated cubic rises at x = −ln a and falls at x = −ln b = 1.204", () => {
    expect(exponentialSumFalls(negated, rates, 3, 1.19)).toBe(false);
    expect(exponentialSumFalls(negated, rates, 3, 1.22)).toBe(true);
  });
  test("a value exactly at zero at the step start is not told from rounding: true", () => {
    // u·(u − 1)·(u − 0.5): zero at x = 0
    expect(exponentialSumFalls([0.5, -1.5, 1], rates, 3, 2)).toBe(true);
  });
});

// Outside reference: dense sampling of the sum with Math.exp (2·10^4 points), where a fall shows
// as a positive sample followed by one at or below zero. A fall between two samples that rises
// again before the next one is invisible to the sampler, so only the sampler's "fall" is held
// against the exact answer: the exact test must never miss a fall the sampler sees (a missed
// fall would be a missed peak; a needless "true" only sends the step to the grid search).
describe("exponentialSumFalls against dense sampling (property)", () => {
  test("random sums of up to six terms with several sign changes", () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: 2, maxLength: 6 }),
        fc.array(fc.double({ min: 0.01, max: 200, noNaN: true }), { minLength: 6, maxLength: 6 }),
        fc.double({ min: 1e-3, max: 5, noNaN: true }),
        (coefficients, rawRates, h) => {
          const n = coefficients.length;
          const rates = [0, ...rawRates].slice(0, n).sort((x, y) => x - y);
          const at = (x: number) => coefficients.reduce((s, k, i) => s + k * Math.exp(-rates[i]! * x), 0);
          const size = (x: number) => coefficients.reduce((s, k, i) => s + Math.abs(k) * Math.exp(-rates[i]! * x), 0);
          let sampledFall = false;
          let previous = at(0);
          const points = 20_000;
          for (let j = 1; j <= points && !sampledFall; j++) {
            const x = (h * j) / points;
            const value = at(x);
            // a sign change within rounding of zero proves nothing either way
            if (previous > 1e-9 * size(x) && value <= -1e-9 * size(x)) sampledFall = true;
            previous = value;
          }
          if (sampledFall) expect(exponentialSumFalls(coefficients, rates, n, h)).toBe(true);
        },
      ),
      { numRuns: 400, seed: 20261202 },
    );
  });

  test("a sum that stays positive over the step never falls", () => {
    // coefficients of both signs, but the positive constant outweighs the rest: S > 0 everywhere
    // (settled by the bounds; the cubic above with h = 0.5 is settled by the isolation)
    expect(exponentialSumFalls([5, -1, 2, -1.5, 1], [0, 1, 10, 50, 100], 5, 3)).toBe(false);
  });
});
