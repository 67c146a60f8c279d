import { describe, expect, test } from "vitest";
import { type ProfileCircuit, defaultCircuitModels, sizeChargingElement } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// The slowest charging element that still completes a healthy power-up from 0 V within the timeout,
// against closed forms of textbook capacitor charging. The solver bisects the circuit model's
// completion on ln(value) to a relative width of 1e-7 (SIZE_DEFAULTS.circuitRelativeWidth), and the
// linear models are exact, so 1e-6 relative is an honest bound (ten times the bracket width).
const common = { load: { kind: "none" as const }, discharge: { kind: "none" as const } };

describe("sizeChargingElement: series resistor", () => {
  // RC charging from V0 through Rt = R + Rsrc (Hayt, Kemmerly & Durbin, Engineering Circuit Analysis,
  // 8th ed. (2012), §8.8, section from memory): V(t) = Vs − (Vs − V0)·e^(−t/τ), τ = Rt·C.
  // Setting V = k·Vs:
  //   (1 − k)·Vs = (Vs − V0)·e^(−t/τ)  ⇒  t = τ·ln((Vs − V0)/((1 − k)·Vs)).
  // Completion within the timeout T needs t ≤ T, so the largest total resistance is
  //   Rt_max = T / (C·ln((Vs − V0)/((1 − k)·Vs))),  R_max = Rt_max − Rsrc   (here V0 = 0).
  test.each([
    { vs: 51.2, c: 3.3e-3, fraction: 0.92, timeout: 0.6, rSrc: 0.06 },
    { vs: 400, c: 1e-3, fraction: 0.95, timeout: 0.5, rSrc: 0 },
    { vs: 800, c: 0.2e-3, fraction: 0.9, timeout: 2, rSrc: 1.5 },
    { vs: 12, c: 47e-3, fraction: 0.98, timeout: 10, rSrc: 0.01 },
  ])("Vs $vs V, C $c F, k $fraction, timeout $timeout s, Rsrc $rSrc Ω: R_max closed form", ({ vs, c, fraction, timeout, rSrc }) => {
    const circuit: ProfileCircuit = { ...common, topology: "series-resistor", busVoltageV: vs, capacitanceF: c, resistanceOhm: 10, sourceResistanceOhm: rSrc, completion: { fraction, timeoutS: timeout } };
    const answer = sizeChargingElement(circuit, defaultCircuitModels);
    const expected = timeout / (c * Math.log(vs / ((1 - fraction) * vs))) - rSrc;
    expect(answer.status).toBe("sized");
    expect(answer.knob?.direction).toBe("largest");
    expectClose(answer.value!, expected, { rel: 1e-6 });
    expect(answer.chargeS!).toBeLessThanOrEqual(timeout);
  });

  test("completion within a voltage: k = 1 − withinV/Vs in the same closed form", () => {
    // within 2 V of 48 V: k = 46/48; Rt_max = T / (C·ln(48/2))
    const circuit: ProfileCircuit = { ...common, topology: "series-resistor", busVoltageV: 48, capacitanceF: 2e-3, resistanceOhm: 5, completion: { withinV: 2, timeoutS: 1 } };
    expectClose(sizeChargingElement(circuit, defaultCircuitModels).value!, 1 / (2e-3 * Math.log(48 / 2)), { rel: 1e-6 });
  });

  test("a profile value that does not complete is searched downward to the same answer", () => {
    const circuit: ProfileCircuit = { ...common, topology: "series-resistor", busVoltageV: 100, capacitanceF: 1e-3, resistanceOhm: 5000, completion: { fraction: 0.9, timeoutS: 1 } };
    const answer = sizeChargingElement(circuit, defaultCircuitModels);
    expect(answer.presentChargeS).toBe(Infinity);
    expectClose(answer.value!, 1 / (1e-3 * Math.log(10)), { rel: 1e-6 });
  });

  test("a dwell-only completion rule: the question does not apply, and the report says why", () => {
    const circuit: ProfileCircuit = { ...common, topology: "series-resistor", busVoltageV: 100, capacitanceF: 1e-3, resistanceOhm: 10, completion: { dwellS: 0.2, timeoutS: 1 } };
    const answer = sizeChargingElement(circuit, defaultCircuitModels);
    expect(answer.status).toBe("not-applicable");
    expect(answer.reason).toContain("fixed dwell");
  });
});

describe("sizeChargingElement: converter and linear MOSFET", () => {
  test("constant-current converter: I_min = C·k·Vs / T", () => {
    // C·dV/dt = I (Hayt et al., §7.1, capacitor charged by a constant current): V = I·t/C, so
    // reaching k·Vs by T needs I ≥ C·k·Vs/T = 2e-3 · 0.95 · 400 / 0.8 = 0.95 A.
    const circuit: ProfileCircuit = { ...common, topology: "converter", busVoltageV: 400, capacitanceF: 2e-3, mode: "constant-current", currentA: 3, efficiency: 0.9, completion: { fraction: 0.95, timeoutS: 0.8 } };
    const answer = sizeChargingElement(circuit, defaultCircuitModels);
    expect(answer.knob?.direction).toBe("smallest");
    expectClose(answer.value!, 0.95, { rel: 1e-6 });
  });

  test("constant-power converter with a current limit: the smaller root of the charge-time quadratic", () => {
    // Below V1 = P/Ilim the converter gives Ilim: t1 = C·V1/Ilim = C·P/Ilim². Above, C·V·dV/dt = P:
    // t2 = C·(Vk² − V1²)/(2P) (energy balance, Erickson & Maksimović §1.1 with η on the input side).
    // t1 + t2 = C·Vk²/(2P) + C·P/(2·Ilim²) = T  ⇒  (C/(2·Ilim²))·P² − T·P + C·Vk²/2 = 0,
    //   P_min = (T − sqrt(T² − C²·Vk²/Ilim²)) · Ilim² / C   (the root with P ≤ Ilim·Vk).
    const c = 1e-3;
    const vk = 0.9 * 400;
    const ilim = 2;
    const t = 0.5;
    const expected = ((t - Math.sqrt(t * t - (c * c * vk * vk) / (ilim * ilim))) * ilim * ilim) / c;
    const circuit: ProfileCircuit = { ...common, topology: "converter", busVoltageV: 400, capacitanceF: c, mode: "constant-power", powerW: 500, currentLimitA: ilim, efficiency: 0.92, completion: { fraction: 0.9, timeoutS: t } };
    // the nonlinear stretch is integrated by odex (relative tolerance about 1e-5 to 1e-6), so 1e-4
    expectClose(sizeChargingElement(circuit, defaultCircuitModels).value!, expected, { rel: 1e-4 });
  });

  test("linear MOSFET with a source resistor: Rs_max = (Vgate − Vth)·T / (C·k·Vs) while headroom lasts", () => {
    // I = (Vgate − Vth)/Rs is constant while the MOSFET has headroom (the linear-mode model of src/circuits/chargeLinearMosfet.ts), so V = I·t/C as for
    // a current source; at k = 0.5 the MOSFET keeps Vds ≥ 200 V ≫ I·(Rs + RdsOn) until completion.
    // Rs_max = 1.1 V · 2 s / (1.5e-3 F · 200 V) = 7.3333 Ω.
    const circuit: ProfileCircuit = {
      ...common,
      topology: "linear-mosfet",
      busVoltageV: 400,
      capacitanceF: 1.5e-3,
      gateVoltageV: 4.6,
      thresholdVoltageV: 3.5,
      sourceResistorOhm: 2.2,
      rdsOnOhm: 0.12,
      completion: { fraction: 0.5, timeoutS: 2 },
    };
    const answer = sizeChargingElement(circuit, defaultCircuitModels);
    expect(answer.knob?.field).toBe("circuit.mosfet.sourceResistor");
    expectClose(answer.value!, (1.1 * 2) / (1.5e-3 * 200), { rel: 1e-6 });
    expectClose(answer.currentA!, 1.1 / answer.value!, { rel: 1e-12 });
  });
});
