import { expect } from "vitest";

/**
 * The one closeness check for physical quantities: passes when
 * |actual − expected| ≤ max(abs, rel·|expected|). Give the reason for the tolerance beside the call.
 */
export function expectClose(actual: number, expected: number, tolerance: { rel?: number; abs?: number }): void {
  const bound = Math.max(tolerance.abs ?? 0, (tolerance.rel ?? 0) * Math.abs(expected));
  const error = Math.abs(actual - expected);
  if (!(error <= bound)) {
    expect.fail(`expected ${actual} to be within ${bound} of ${expected} (error ${error})`);
  }
}
