import { mkdtempSync, rmSync } from "node:fs";
import { createRequire } from "node:module";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, test } from "vitest";
import {
  type ChargeThermalContext,
  type ResistanceCurve,
  chargeSeriesResistor,
  curveResistance,
  defaultCircuitModels,
  loadProfile,
  resistanceAt,
  runThermalHistory,
  simulateProfile,
  traceSteps,
} from "../../src/internal.js";
import { runNgspiceBatch } from "../helpers/electroThermalReferences.js";

const work = mkdtempSync(join(tmpdir(), "heatledger-rt-"));
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe("resistance curves", () => {
  test("NTC by its B value: 10 ohm at 25 °C, B = 3000 K, at 150 °C (hand calculation)", () => {
    // R = R25·exp(B·(1/T − 1/T25)), T in kelvin (the B-value definition of IEC 60539-1, from memory):
    // 1/423.15 K = 0.00236323, 1/298.15 K = 0.00335402, difference −0.00099079 1/K,
    // × 3000 K = −2.97236, exp(−2.97236) = 0.051182, so R = 0.51182 ohm ("about 0.5 ohm").
    const curve: ResistanceCurve = { kind: "ntc-beta", betaK: 3000, referenceC: 25 };
    expect(resistanceAt(curve, 10, 150)).toBeCloseTo(0.51182, 4);
    expect(resistanceAt(curve, 10, 25)).toBe(10);
  });

  test("linear TCR: copper's 3900 ppm/K (from memory) gives 1.39 × R25 at 125 °C", () => {
    expect(resistanceAt({ kind: "linear", coefficientPerK: 3900e-6, referenceC: 25 }, 2, 125)).toBeCloseTo(2.78, 12);
  });

  test("Steinhart-Hart: Cardano's root satisfies 1/T = a + b·ln R + c·(ln R)³; the usual 10 kohm set gives about 10 kohm at 25 °C", () => {
    // coefficients often quoted for a 10 kohm NTC (from memory): a = 1.009249522e-3,
    // b = 2.378405444e-4, c = 2.019202697e-7
    const curve = { kind: "steinhart-hart", a: 1.009249522e-3, b: 2.378405444e-4, c: 2.019202697e-7 } as const;
    for (const t of [-20, 0, 25, 60, 100, 150]) {
      const x = Math.log(curveResistance(curve, t));
      expect(curve.a + curve.b * x + curve.c * x ** 3).toBeCloseTo(1 / (t + 273.15), 15);
    }
    expect(Math.abs(curveResistance(curve, 25) - 10_000) / 10_000).toBeLessThan(0.02);
    // scaled to the circuit's resistance at 25 °C
    expect(resistanceAt(curve, 10, 25)).toBeCloseTo(10, 12);
  });

  test("a table is interpolated in ln R and held at its ends", () => {
    const curve: ResistanceCurve = { kind: "table", temperatureC: [25, 120, 140], resistanceOhm: [10, 100, 10_000] };
    expect(curveResistance(curve, 130)).toBeCloseTo(1000, 9); // the geometric mean of 100 and 10,000
    expect(curveResistance(curve, 0)).toBe(10);
    expect(curveResistance(curve, 200)).toBe(10_000);
  });
});

// Outside reference: odex (npm), integrating C·dT/dt = P(T) − (T − Ta)/Rth with the table written
// out here (no project thermal or circuit code).
const { Solver } = createRequire(import.meta.url)("odex") as {
  Solver: new (n: number) => {
    relativeTolerance: number;
    absoluteTolerance: number;
    maxSteps: number;
    solve(f: (x: number, y: number[]) => number[], x0: number, y0: number[], xEnd: number): { y: number[] };
  };
};

describe("a PTC resistor limits itself into a short", () => {
  // invented PTC: 10 ohm cold, switching near 120 °C; 48 V source with 0.5 ohm of wiring; one RC
  // (40 K/W, 20 s) at 25 °C ambient; the bus is shorted for 60 s
  const ts = [25, 100, 120, 140];
  const rs = [10, 12, 100, 10_000];
  const ptc = (t: number): number => {
    if (t <= ts[0]!) return rs[0]!;
    if (t >= ts.at(-1)!) return rs.at(-1)!;
    const k = ts.findIndex((x) => x > t) - 1;
    return Math.exp(Math.log(rs[k]!) + ((t - ts[k]!) / (ts[k + 1]! - ts[k]!)) * Math.log(rs[k + 1]! / rs[k]!));
  };
  const [vs, rSrc, rth, tau, ambient, seconds] = [48, 0.5, 40, 20, 25, 60];
  const power = (t: number) => (vs * vs * ptc(t)) / (ptc(t) + rSrc) ** 2;

  test("temperature, end current and energy match odex within 1e-4", () => {
    const thermal: ChargeThermalContext = { roles: ["resistor"], ambientC: [ambient], tauS: [tau], gainKPerW: [[[rth]]], startRiseK: [[0]] };
    const r = chargeSeriesResistor(
      { resistanceOhm: 10, sourceResistanceOhm: rSrc, capacitanceF: 1e-3, load: { kind: "short" }, temperatureCurve: { kind: "table", temperatureC: ts, resistanceOhm: rs } },
      { sourceVoltageV: vs, initialVoltageV: 0, completion: { fraction: 0.9, timeoutS: seconds }, thermal, wantSamples: true },
    );
    const solver = new Solver(2);
    solver.relativeTolerance = 1e-12;
    solver.absoluteTolerance = 1e-12;
    solver.maxSteps = 1e6;
    const [rise, energy] = solver.solve((_t, y) => [(power(ambient + y[0]!) * rth - y[0]!) / tau, power(ambient + y[0]!)], 0, [0, 0], seconds).y as [number, number];
    const model = { tauS: [tau], sources: ["r"], observed: ["r"], gainKPerW: [[[rth]]] };
    const history = runThermalHistory(model, traceSteps([r.traces.resistor]));
    expect(Math.abs(history.endRiseK[0]! - rise) / rise).toBeLessThan(1e-4);
    expect(Math.abs(r.energy.partsJ.resistor! - energy) / energy).toBeLessThan(1e-4);
    const endCurrent = r.samples!.at(-1)!.currentA;
    const expected = vs / (ptc(ambient + rise) + rSrc);
    expect(Math.abs(endCurrent - expected) / expected).toBeLessThan(1e-3);
    // it limited itself: the current fell by far more than 10× from the cold 4.6 A
    expect(r.peakCurrentA).toBeCloseTo(vs / (10 + rSrc), 9);
    expect(endCurrent).toBeLessThan(0.1);
  });
});

// Outside reference: ngspice (Debian package `ngspice`), with behavioural sources: the NTC is a
// B-source current V/R(T) whose R reads the thermal node's voltage (the rise over ambient), and
// its power I·V drives that node's RC; a third B-source integrates the power into a 1 F capacitor
// (its voltage is the energy). A hot restart: the NTC starts 60 K above a 35 °C ambient.
// Measured when written: the event's own heating and the energy both +1.1e-4 relative; the
// tolerance is 0.5 %.
describe("NTC hot restart against ngspice", () => {
  test("peak temperature rise of the event and NTC energy within 0.5 %", () => {
    const [r25, beta, c, vs, rth, tau, ambient, start] = [10, 3000, 1e-3, 325, 20, 40, 35, 60];
    const thermal: ChargeThermalContext = { roles: ["resistor"], ambientC: [ambient], tauS: [tau], gainKPerW: [[[rth]]], startRiseK: [[start]] };
    const r = chargeSeriesResistor(
      { resistanceOhm: r25, capacitanceF: c, temperatureCurve: { kind: "ntc-beta", betaK: beta, referenceC: 25 } },
      { sourceVoltageV: vs, initialVoltageV: 0, completion: { fraction: 0.95, timeoutS: 1 }, thermal },
    );
    const model = { tauS: [tau], sources: ["r"], observed: ["r"], gainKPerW: [[[rth]]] };
    const ours = runThermalHistory(model, traceSteps([r.traces.resistor]), { initialState: Float64Array.of(start / rth) });
    const tstop = r.durationS;
    const ntc = `(${r25}*exp(${beta}*(1/(v(th)+${ambient + 273.15})-1/298.15)))`;
    const netlist = `* NTC charging a capacitor, thermal node th = rise over ambient
v1 src 0 dc ${vs}
b1 src bus i=v(src,bus)/${ntc}
c1 bus 0 ${c} ic=0
b2 0 th i=v(src,bus)*v(src,bus)/${ntc}
rth th 0 ${rth}
cth th 0 ${tau / rth} ic=${start}
b3 0 en i=v(src,bus)*v(src,bus)/${ntc}
cen en 0 1 ic=0
.options reltol=1e-6 abstol=1e-12 vntol=1e-9
.tran 1e-7 ${tstop} 0 2e-6 uic
.control
set filetype=ascii
set wr_singlescale
set wr_vecnames
run
wrdata ntc.dat v(th) v(en)
.endc
.end
`;
    const cols = runNgspiceBatch(work, "ntc", netlist);
    const at = (name: string) => cols[name]!;
    expect(at("time").at(-1)).toBeCloseTo(tstop, 9);
    const spicePeakRise = Math.max(...at("v(th)"));
    const spiceEnergy = at("v(en)").at(-1)!;
    // the event's own heating (peak rise less the start rise), the stricter comparison
    expect(Math.abs(ours.peakRiseK[0]! - spicePeakRise) / (spicePeakRise - start)).toBeLessThan(5e-3);
    expect(Math.abs(r.energy.partsJ.resistor! - spiceEnergy) / spiceEnergy).toBeLessThan(5e-3);
  });
});

describe("resistorTemperature in a profile: bad input, exact messages", () => {
  const profileWith = (curve: string) => `name: t
ambient: 25 degC
parts:
  - id: ntc
    role: resistor
    network: { form: foster, stages: [{ r: 20 K/W, tau: 40 s }] }
    limits: { maxTemperature: 200 degC }
circuit:
  topology: series-resistor
  busVoltage: 325 V
  capacitance: 1 mF
  resistance: 10 ohm
  resistorTemperature: ${curve}
  completion: { fraction: 0.95, timeout: 1 s }
  discharge: { kind: none }
events:
  - power-up: {}
`;
  const messageOf = (curve: string): string => {
    try {
      loadProfile(profileWith(curve), "p.yaml");
    } catch (error) {
      return (error as Error).message;
    }
    return "loaded";
  };
  test("a key the kind needs is missing, a key it does not take is there", () => {
    expect(messageOf("{ kind: ntc-beta, ppmPerK: 3900 }")).toBe(
      'p.yaml:13: circuit.resistorTemperature.ppmPerK: expected no "ppmPerK" for a ntc-beta curve (keys: beta, reference), found a value\n' +
        "p.yaml:13: circuit.resistorTemperature.beta: expected this value (required for a ntc-beta curve), found nothing",
    );
  });
  test("a table whose resistance at 25 °C is not the circuit's resistance", () => {
    expect(messageOf("{ kind: table, points: [[25 degC, 12 ohm], [130 degC, 1 kohm]] }")).toBe(
      "p.yaml:13: circuit.resistorTemperature.kind: expected a curve whose resistance at 25 °C is within 1 % of circuit.resistance (10 ohm), found 12 ohm at 25 °C",
    );
  });
  test("the profile loads with a valid curve, and simulates", () => {
    const profile = loadProfile(profileWith("{ kind: ntc-beta, beta: 3000 K }"), "p.yaml");
    expect(simulateProfile(profile, { models: defaultCircuitModels }).parts[0]!.peakTemperatureC).toBeGreaterThan(25);
  });
});
