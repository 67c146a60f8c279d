import { describe, test } from "vitest";
import { constantPowerSegment, fosterToModal, runThermalHistory, traceSteps, zth } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// One RC stage driven by a power step: rise(t) = P·R·(1 − e^(−t/τ)); cooling from θ0:
// θ0·e^(−t/τ). Source: Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011),
// §5.1 (lumped capacitance method, eq. 5.6) and §5.3 (the heated form).
describe("single RC stage (lumped capacitance)", () => {
  const R = 2.5;
  const tau = 0.8;
  const P = 12;
  const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: R, tauS: tau }] });

  test.each([1e-6, 0.01, 0.8, 3, 40])("zth(%d s) equals R·(1 − e^(−t/τ))", (t) => {
    // exact closed form; 1e-14 relative covers rounding of expm1.
    expectClose(zth(model, t), R * -Math.expm1(-t / tau), { rel: 1e-14 });
  });

  test("a rectangular pulse heats to P·R·(1 − e^(−tp/τ)) and then cools exponentially", () => {
    const tp = 0.5;
    const end = 2.5;
    const run = runThermalHistory(model, traceSteps([[constantPowerSegment(0, tp, P)]], 0, end));
    const peak = P * R * -Math.expm1(-tp / tau);
    // closed forms evaluated in double precision: 1e-13 relative is rounding only.
    expectClose(run.peakRiseK[0]!, peak, { rel: 1e-13 });
    expectClose(run.peakTimeS[0]!, tp, { rel: 1e-15 });
    expectClose(run.endRiseK[0]!, peak * Math.exp(-(end - tp) / tau), { rel: 1e-13 });
  });
});
