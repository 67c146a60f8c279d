import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { type BusLoad, type CircuitResult, type ConverterParams, chargeConverter } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { sumParts, traceAt } from "./circuitResultProbes.js";
import { inputErrorMessage } from "./inputErrorMessage.js";

const cond = { sourceVoltageV: 400, initialVoltageV: 0, completion: { fraction: 0.95, timeoutS: 2 } };

// Efficiency η: input = output/η, loss = output·(1/η − 1) (Erickson & Maksimović, Fundamentals of
// Power Electronics, 2nd ed. (2001), §1.1, from memory). Output energy into C from V0 to V1 with no
// load is C·(V1² − V0²)/2, so the switch takes (1/η − 1)·C·(V1² − V0²)/2 in either mode.
describe("chargeConverter", () => {
  test("constant current: ramp V0 + I·t/C, switch loss (1/η − 1)·V·I", () => {
    const r = chargeConverter({ capacitanceF: 1e-3, mode: "constant-current", currentA: 2, efficiency: 0.9 }, { ...cond, initialVoltageV: 40 });
    expectClose(r.durationS, (1e-3 * 340) / 2, { rel: 1e-13 });
    expectClose(r.energy.partsJ.switch!, (1 / 0.9 - 1) * 0.5e-3 * (380 * 380 - 40 * 40), { rel: 1e-12 });
    expectClose(traceAt(r, "switch", 0.05), (1 / 0.9 - 1) * (40 + 100) * 2, { rel: 1e-13 });
  });

  test("the current limit caps a constant current", () => {
    const r = chargeConverter({ capacitanceF: 1e-3, mode: "constant-current", currentA: 2, currentLimitA: 1.25, efficiency: 0.9 }, cond);
    expectClose(r.durationS, (1e-3 * 380) / 1.25, { rel: 1e-13 });
  });

  // Constant power P into C: C·V·dV/dt = P, so V² = Vk² + 2·P·t/C (separable ODE; Hayt,
  // Kemmerly & Durbin, 8th ed. (2012), §7.1, capacitor energy C·V²/2 grows at P; section from
  // memory). Below Vk = P/Ilim the
  // current limit gives a ramp lasting C·Vk/Ilim.
  test("constant power with a current limit: ramp to P/Ilim, then V² = Vk² + 2·P·t/C (odex path, 2e-11)", () => {
    const p = 500;
    const ilim = 5;
    const vk = p / ilim;
    const r = chargeConverter({ capacitanceF: 1e-3, mode: "constant-power", powerW: p, currentLimitA: ilim, efficiency: 0.92 }, { ...cond, wantSamples: true });
    const expected = (1e-3 * vk) / ilim + (1e-3 * (380 * 380 - vk * vk)) / (2 * p);
    // odex at 1e-11 on a unit-size problem, crossing located by bisection. Measured when the
    // tolerances were set: 4.0e-12 relative on the duration, 4.3e-12 on the loss, 2.1e-12 at worst
    // on the samples; 2e-11 is about 5x the largest.
    expectClose(r.durationS, expected, { rel: 2e-11 });
    expectClose(r.energy.partsJ.switch!, (1 / 0.92 - 1) * 0.5e-3 * 380 * 380, { rel: 2e-11 });
    // in constant-power mode the loss is exactly the constant P·(1/η − 1): one merged segment
    expect(r.traces.switch!.length).toBe(2);
    expectClose(traceAt(r, "switch", 0.1), p * (1 / 0.92 - 1), { rel: 1e-14 });
    for (const s of r.samples!.filter((x) => x.timeS > (1e-3 * vk) / ilim)) {
      expectClose(s.voltageV, Math.sqrt(vk * vk + (2 * p * (s.timeS - (1e-3 * vk) / ilim)) / 1e-3), { rel: 2e-11 });
    }
  });

  test("a dwell past the source voltage: the converter holds the bus at Vs and feeds the load", () => {
    const r = chargeConverter(
      { capacitanceF: 1e-3, mode: "constant-current", currentA: 2, efficiency: 0.8, load: { kind: "resistive", resistanceOhm: 1000 } },
      { ...cond, completion: { dwellS: 2, timeoutS: 3 } },
    );
    expect(r.outcome).toBe("completed");
    expectClose(r.endVoltageV, 400, { rel: 1e-15 });
    // at Vs the load takes Vs²/RL = 160 W, the switch 160·(1/0.8 − 1) = 40 W
    expectClose(traceAt(r, "switch", 1.9), 40, { rel: 1e-12 });
  });

  test("a load larger than the converter's current stalls the bus at 0 V", () => {
    const r = chargeConverter({ capacitanceF: 1e-3, mode: "constant-current", currentA: 2, efficiency: 0.9, load: { kind: "constant-current", currentA: 3 } }, cond);
    expect(r.outcome).toBe("timed-out");
    expect(r.busStalled).toBe(true);
  });

  // Conservation of energy (Tellegen's theorem; Desoer & Kuh (1969), §9.5, from memory). Measured
  // over these 150 runs when the tolerances were set, as a fraction of the energies' scale: 8.0e-14
  // in linear regimes, 1.5e-9 with a constant-power load or converter (odex at 1e-11 per stretch,
  // over many stretches), 1.0e-14 on the switch loss; the bounds are 5x, 65x and 5x those.
  test("source = stored + parts + load (property)", () => {
    const loadArb: fc.Arbitrary<BusLoad> = fc.oneof(
      fc.constant<BusLoad>({ kind: "none" }),
      fc.constant<BusLoad>({ kind: "short" }),
      fc.double({ min: 10, max: 1e5, noNaN: true }).map((r): BusLoad => ({ kind: "resistive", resistanceOhm: r })),
      fc.double({ min: 0.01, max: 5, noNaN: true }).map((i): BusLoad => ({ kind: "constant-current", currentA: i })),
      fc.tuple(fc.double({ min: 1, max: 800, noNaN: true }), fc.double({ min: 50, max: 380, noNaN: true }), fc.double({ min: 0.3, max: 0.95, noNaN: true })).map(
        ([p, en, dis]): BusLoad => ({ kind: "constant-power", powerW: p, enableV: en, disableV: en * dis }),
      ),
    );
    fc.assert(
      fc.property(
        loadArb,
        fc.boolean(),
        fc.double({ min: 0.2, max: 10, noNaN: true }),
        fc.double({ min: 10, max: 2000, noNaN: true }),
        fc.double({ min: 0.5, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1.05, noNaN: true }),
        fc.boolean(),
        (load, cc, i, p, eta, v0f, dwell) => {
          const params: ConverterParams = cc
            ? { capacitanceF: 1e-3, mode: "constant-current", currentA: i, efficiency: eta, load }
            : { capacitanceF: 1e-3, mode: "constant-power", powerW: p, currentLimitA: i, efficiency: eta, load };
          const r = chargeConverter(params, { ...cond, initialVoltageV: 400 * v0f, completion: dwell ? { dwellS: 0.5, timeoutS: 1 } : { fraction: 0.95, timeoutS: 1 } });
          const e = r.energy;
          const scale = Math.abs(e.sourceJ) + Math.abs(e.storedJ) + Math.abs(e.loadJ) + sumParts(r);
          const nonlinear = !cc || load.kind === "constant-power";
          expectClose(e.sourceJ, e.storedJ + sumParts(r) + e.loadJ, { abs: (nonlinear ? 1e-7 : 4e-13) * scale });
          // switch loss is (1/η − 1) of the output: source = output/η
          expectClose(e.partsJ.switch!, e.sourceJ * (1 - eta), { abs: 5e-14 * scale });
        },
      ),
      { numRuns: 150, seed: 20261202 },
    );
  });

  test.each([
    [{ capacitanceF: 1e-3, mode: "constant-current", currentA: 2, efficiency: 0 }, "efficiency: expected an efficiency above 0 and at most 1, found 0"],
    [{ capacitanceF: 1e-3, mode: "constant-current", currentA: 2, efficiency: 1.2 }, "efficiency: expected an efficiency above 0 and at most 1, found 1.2"],
    [{ capacitanceF: 1e-3, mode: "constant-current", efficiency: 0.9 }, "currentA: expected an output current > 0 A, found nothing"],
    [{ capacitanceF: 1e-3, mode: "constant-power", powerW: 100, efficiency: 0.9 }, "currentLimitA: expected a current limit > 0 A (a constant-power charge from 0 V needs one), found nothing"],
    [{ capacitanceF: 1e-3, mode: "boost", efficiency: 0.9 }, 'mode: expected one of "constant-current", "constant-power", found "boost"'],
    [{ capacitanceF: -1, mode: "constant-current", currentA: 2, efficiency: 0.9 }, "capacitanceF: expected a capacitance > 0 F, found -1"],
  ])("%j → %s", (params, message) => {
    expect(inputErrorMessage(() => chargeConverter(params as ConverterParams, cond))).toBe(message);
  });
});
