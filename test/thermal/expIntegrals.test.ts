import { create, all } from "mathjs";
import { describe, test } from "vitest";
import { expIntegral0, expIntegral1 } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// Outside reference: mathjs (registry library) BigNumber arithmetic at 80 significant digits,
// evaluating the plain closed forms φ0(x) = (1 − e^(−x))/x and φ1(x) = (1 − e^(−x)(1 + x))/x²,
// whose cancellation is harmless at that precision (x ≥ 1e-12 loses at most 24 of 80 digits).
// φ0(0) = 1 and φ1(0) = 1/2 are the limits (A&S 4.2.1 series).
// Tolerance 4e-16 relative (two ulps): the double implementation should be correctly rounded or
// nearly so at every x; a cancellation bug would show as 1e-4 or worse.
const big = create(all!, { number: "BigNumber", precision: 80 });

function reference(x: number): [number, number] {
  if (x === 0) return [1, 0.5];
  const X = big.bignumber(x);
  const e = X.neg().exp();
  const phi0 = big.bignumber(1).minus(e).div(X);
  const phi1 = big.bignumber(1).minus(e.times(X.plus(1))).div(X.times(X));
  return [phi0.toNumber(), phi1.toNumber()];
}

describe.each([0, 1e-12, 1e-6, 1, 50, 700])("expIntegrals at x = mu·h = %d", (x) => {
  const [phi0, phi1] = reference(x);
  test("φ0 matches 80-digit arithmetic", () => expectClose(expIntegral0(x), phi0, { rel: 4e-16 }));
  test("φ1 matches 80-digit arithmetic", () => expectClose(expIntegral1(x), phi1, { rel: 4e-16 }));
});

describe.each([0.3, 0.49, 0.5, 0.51, 5, -0.4, -3])("expIntegrals at the series switch and negative x = %d", (x) => {
  const [phi0, phi1] = reference(x);
  test("φ0 and φ1 match 80-digit arithmetic", () => {
    // measured worst 2.2e-16 relative (one ulp) at every x here; 4e-16 as above
    expectClose(expIntegral0(x), phi0, { rel: 4e-16 });
    expectClose(expIntegral1(x), phi1, { rel: 4e-16 });
  });
});
