import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { type BusLoad, type CircuitResult, type LinearMosfetParams, chargeLinearMosfet, segmentEnergy } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { sumParts, traceAt } from "./circuitResultProbes.js";
import { inputErrorMessage } from "./inputErrorMessage.js";

// Scenario (invented): 400 V bus, 1 mF link, gate at 12 V, threshold 4 V, Rs = 4 Ω → I = 2 A.
const base: LinearMosfetParams = { capacitanceF: 1e-3, gateVoltageV: 12, thresholdVoltageV: 4, sourceResistorOhm: 4, rdsOnOhm: 50 };
const cond = { sourceVoltageV: 400, initialVoltageV: 0, completion: { fraction: 0.95, timeoutS: 2 } };

describe("chargeLinearMosfet", () => {
  // Constant current into C: V = V0 + I·t/C (Hayt, Kemmerly & Durbin, Engineering Circuit
  // Analysis, 8th ed. (2012), §7.1, capacitor v = (1/C)∫i dt, section from memory). With
  // I·dt = C·dV the MOSFET takes
  // ∫(Vs − V − I·Rs)·I dt = C·[(Vs − I·Rs)·(V1 − V0) − (V1² − V0²)/2] and Rs takes I²·Rs·t.
  test("current-source stretch: linear ramp, MOSFET energy C·[(Vs − I·Rs)·ΔV − Δ(V²)/2]", () => {
    // Rds(on) small: the knee 400 − 2·4.1 = 391.8 V lies above the 380 V threshold
    const r = chargeLinearMosfet({ ...base, rdsOnOhm: 0.1 }, { ...cond, initialVoltageV: 50 });
    expect(r.outcome).toBe("completed");
    const t = (1e-3 * (380 - 50)) / 2;
    // closed forms: rounding only
    expectClose(r.durationS, t, { rel: 1e-13 });
    expectClose(r.energy.partsJ.mosfet!, 1e-3 * ((400 - 8) * 330 - (380 * 380 - 50 * 50) / 2), { rel: 1e-12 });
    expectClose(r.energy.partsJ.sourceResistor!, 4 * 4 * t, { rel: 1e-13 });
    // power at the start (Vs − V0 − I·Rs)·I and halfway
    expectClose(traceAt(r, "mosfet", 0), (400 - 50 - 8) * 2, { rel: 1e-14 });
    expectClose(traceAt(r, "mosfet", t / 2), (400 - (50 + 165) - 8) * 2, { rel: 1e-13 });
  });

  test("out of headroom at Vs − I·(Rs + Rds(on)) it continues as the resistance Rs + Rds(on)", () => {
    const r = chargeLinearMosfet(base, cond);
    const knee = 400 - 2 * 54; // 292 V
    const tKnee = (1e-3 * knee) / 2;
    const tau = 54 * 1e-3;
    // after the knee: V = 400 − 108·e^(−s/τ) reaches 380 V at τ·ln(108/20) (driven RC, ch. 8)
    expectClose(r.durationS, tKnee + tau * Math.log(108 / 20), { rel: 1e-13 });
    // at the knee the current is continuous: 2 A in both modes, so the MOSFET power is I²·Rds(on)
    expectClose(traceAt(r, "mosfet", tKnee * (1 + 1e-12)), 2 * 2 * 50, { rel: 1e-9 });
    expectClose(traceAt(r, "mosfet", tKnee * (1 - 1e-12)), 2 * 2 * 50, { rel: 1e-9 });
    expect(r.traces.mosfet!.length).toBe(2);
  });

  test("threshold drift from the part's temperature at the event start changes the current", () => {
    // −5 mV/K at 125 °C: Vth = 4 − 0.5 = 3.5 V, I = (12 − 3.5)/4 = 2.125 A
    const r = chargeLinearMosfet({ ...base, rdsOnOhm: 0.1, thresholdTempcoVPerK: -5e-3 }, { ...cond, partTemperatureC: { mosfet: 125 } });
    expectClose(r.durationS, (1e-3 * 380) / 2.125, { rel: 1e-13 });
  });

  test("saturation current instead of a source resistor: a gate-driven switch, nothing in Rs", () => {
    const r = chargeLinearMosfet({ capacitanceF: 1e-3, gateVoltageV: 10, thresholdVoltageV: 3, saturationCurrentA: 5, rdsOnOhm: 0.05 }, cond);
    expectClose(r.durationS, (1e-3 * 380) / 5, { rel: 1e-13 });
    expect(r.energy.partsJ.sourceResistor).toBe(0);
    expect(r.traces.sourceResistor).toEqual([]);
    // with both, the smaller current wins: min(8/4, 1.5) = 1.5 A
    const capped = chargeLinearMosfet({ ...base, rdsOnOhm: 0.1, saturationCurrentA: 1.5 }, cond);
    expectClose(capped.durationS, (1e-3 * 380) / 1.5, { rel: 1e-13 });
  });

  test("a shorted bus: the MOSFET holds (Vs − I·Rs) at I until the timeout", () => {
    const r = chargeLinearMosfet({ ...base, load: { kind: "short" } }, cond);
    expect(r.outcome).toBe("timed-out");
    expect(r.busStalled).toBe(true);
    expectClose(r.energy.partsJ.mosfet!, (400 - 8) * 2 * 2, { rel: 1e-14 });
  });

  test("a constant-current load above the set current holds the bus at 0 V", () => {
    const r = chargeLinearMosfet({ ...base, load: { kind: "constant-current", currentA: 3 } }, cond);
    expect(r.outcome).toBe("timed-out");
    expect(r.busStalled).toBe(true);
    expect(r.endVoltageV).toBe(0);
  });

  // Conservation of energy (Tellegen's theorem; Desoer & Kuh, Basic Circuit Theory (1969), §9.5,
  // from memory). Measured over these 150 runs when the tolerances were set, as a fraction of the
  // energies' scale: 1.6e-14 in linear regimes (a resistive load), 7.4e-12 with a constant-power
  // load (odex at 1e-11 per stretch); the bounds are about 6x and 4x those.
  test("source = stored + parts + load for every load (property)", () => {
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
      fc.property(loadArb, fc.double({ min: 0.5, max: 20, noNaN: true }), fc.double({ min: 0.01, max: 100, noNaN: true }), fc.double({ min: 0, max: 1.05, noNaN: true }), fc.double({ min: 0.05, max: 3, noNaN: true }), (load, rs, rds, v0f, timeoutS) => {
        const r = chargeLinearMosfet({ ...base, sourceResistorOhm: rs, rdsOnOhm: rds, load }, { ...cond, initialVoltageV: 400 * v0f, completion: { fraction: 0.95, timeoutS } });
        const e = r.energy;
        const scale = Math.abs(e.sourceJ) + Math.abs(e.storedJ) + Math.abs(e.loadJ) + sumParts(r);
        expectClose(e.sourceJ, e.storedJ + sumParts(r) + e.loadJ, { abs: (load.kind === "constant-power" ? 3e-11 : 1e-13) * scale });
        for (const seg of r.traces.mosfet!) expect(segmentEnergy(seg.terms, seg.durationS)).toBeGreaterThanOrEqual(-1e-9 * scale);
      }),
      { numRuns: 150, seed: 20261202 },
    );
  });

  test.each([
    [{ ...base, gateVoltageV: 3 }, {}, "gateVoltageV: expected a gate voltage above the threshold (4 V at 25 °C), found 3"],
    [{ ...base, gateVoltageV: 3.6, thresholdTempcoVPerK: -5e-3 }, { partTemperatureC: { mosfet: 25 } }, "gateVoltageV: expected a gate voltage above the threshold (4 V at 25 °C), found 3.6"],
    [{ ...base, sourceResistorOhm: undefined }, {}, "sourceResistorOhm: expected a source resistor > 0 Ω, a saturationCurrentA or a transconductanceAPerV2, found none of them"],
    [{ ...base, sourceResistorOhm: 0 }, {}, "sourceResistorOhm: expected a source resistor > 0 Ω, found 0"],
    [{ ...base, rdsOnOhm: -1 }, {}, "rdsOnOhm: expected an on-resistance > 0 Ω, found -1"],
    [{ ...base, capacitanceF: 0 }, {}, "capacitanceF: expected a capacitance > 0 F, found 0"],
    [base, { completion: { fraction: 1.5, timeoutS: 1 } }, "completion.fraction: expected a fraction of the source voltage between 0 and 1 (exclusive), found 1.5"],
    [base, { completion: { fraction: 0.9, timeoutS: -0.1 } }, "completion.timeoutS: expected a timeout ≥ 0 s, found -0.1"],
  ])("%j %j → %s", (params, over, message) => {
    expect(inputErrorMessage(() => chargeLinearMosfet(params as LinearMosfetParams, { ...cond, ...over }))).toBe(message);
  });
});
