import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { abortChecks, constantPowerSegment, healthyBus, healthyCorners, riseChecks, traceEnergyUntil } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { MODELS, oneStageProfile } from "./superviseFixtures.js";

// Invariants of the check thresholds over random corner sets of a series resistor with no load.
// Reference for every corner's bus voltage: Vc(t) = Vs − (Vs − V0)·e^(−t/RC) (Hayt, Kemmerly &
// Durbin, Engineering Circuit Analysis, 8th ed. (2012), §8.8, driven RC circuit, section from memory).
describe("abortChecks / riseChecks invariants", () => {
  test("no healthy corner trips an early-abort or a rise-too-fast threshold, whatever the corner set", () => {
    fc.assert(
      fc.property(
        fc.record({
          cLow: fc.double({ min: 1e-4, max: 1e-2, noNaN: true }),
          cSpan: fc.double({ min: 1, max: 3, noNaN: true }),
          vLow: fc.double({ min: 12, max: 400, noNaN: true }),
          vSpan: fc.double({ min: 1, max: 1.4, noNaN: true }),
          r: fc.double({ min: 1, max: 200, noNaN: true }),
          margin: fc.double({ min: 0, max: 0.5, noNaN: true }),
          fractionOfTau: fc.double({ min: 0.01, max: 3, noNaN: true }),
        }),
        (g) => {
          const profile = oneStageProfile({
            rThKPerW: 1,
            tauS: 1,
            resistanceOhm: g.r,
            busV: [g.vLow, g.vLow * g.vSpan],
            capacitanceF: [g.cLow, g.cLow * g.cSpan],
            fraction: [0.9, 0.95],
            ambientC: 25,
            limitC: 150,
            marginK: 0,
            timeoutS: 1e6,
          });
          const corners = healthyCorners(profile.supervision!, profile.circuit!);
          const buses = corners.map((c) => healthyBus(MODELS, profile.circuit!, c, 0, 1e6));
          const t = g.fractionOfTau * g.r * g.cLow;
          const [abort] = abortChecks(buses, [t], g.margin, 0, [], 1);
          const [rise] = riseChecks(buses, [t], g.margin, 0, g.vLow);
          for (const c of corners) {
            const v = c.busVoltageV * (1 - Math.exp(-t / (g.r * c.capacitanceF)));
            // 1e-9 relative: the model is closed form too, only rounding differs
            expect(v).toBeGreaterThanOrEqual(abort!.thresholdV * (1 - 1e-9));
            expect(v).toBeLessThanOrEqual(rise!.thresholdV * (1 + 1e-9));
          }
        },
      ),
      { numRuns: 25 },
    );
  });

  test.each([
    [0.5, 0.25, 25],
    [0.5, 0.5, 50],
    [0.5, 2, 50],
  ])("traceEnergyUntil: 100 W for %d s, read at %d s = %d J (rectangle)", (durationS, atS, energyJ) => {
    expectClose(traceEnergyUntil([constantPowerSegment(0, durationS, 100)], atS), energyJ, { rel: 1e-12 });
  });
});
