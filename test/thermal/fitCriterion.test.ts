import { describe, expect, test } from "vitest";
import { fitCriterion } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

describe("fitCriterion", () => {
  // Hand-worked values of the least-squares forms, Burnham & Anderson, Model Selection and
  // Multimodel Inference, 2nd ed. (2002), §2.2 and §2.4, and Schwarz (1978):
  //   N = 40, k = 8, S = 0.004: N·ln(S/N) = 40·ln(1e-4) = −368.413615
  //   BIC  = −368.413615 + 8·ln 40 (= 29.511035)              = −338.902580
  //   AICc = −368.413615 + 16 + 2·8·9/(40 − 8 − 1) (= 4.645161) = −347.768454
  // 1e-8 relative: the hand values are rounded to 9 significant digits (rounding error ≤ 2e-9).
  test.each([
    ["bic", -338.90258],
    ["aicc", -347.768454],
  ] as const)("fitCriterion(%s, 40 points, 8 parameters, S = 0.004) matches the hand-worked value", (criterion, expected) => {
    expectClose(fitCriterion(criterion, 40, 8, 0.004, 1e-4), expected, { rel: 1e-8 });
  });

  test("fitCriterion floors S at N·resolution², so a smaller residual below the resolution wins nothing", () => {
    expect(fitCriterion("bic", 40, 8, 1e-20, 1e-4)).toBe(fitCriterion("bic", 40, 8, 40 * 1e-8, 1e-4));
    expect(fitCriterion("bic", 40, 10, 1e-22, 1e-4)).toBeGreaterThan(fitCriterion("bic", 40, 8, 1e-20, 1e-4));
  });

  test("fitCriterion AICc is infinite when there are not more points than parameters plus one", () => {
    expect(fitCriterion("aicc", 9, 8, 0.01, 1e-4)).toBe(Number.POSITIVE_INFINITY);
  });
});
