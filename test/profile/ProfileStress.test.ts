import { describe, expect, test } from "vitest";
import { LINEAR_MOSFET_CAUTION, ProfileStress, chargeLinearMosfet, defaultCircuitModels, loadProfile, mosfetOperatingPoints, simulateProfile } from "../../src/internal.js";
import type { OperatingPoint } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// The stress glue fed by a real simulation of an invented linear-MOSFET pre-charge: 400 V bus,
// 1.5 mF, gate 4.6 V, threshold 3.5 V, source resistor 2.2 ohm, so the MOSFET is a current source
// I = (4.6 − 3.5)/2.2 = 0.5 A (source degeneration: Sedra & Smith, Microelectronic Circuits, 7th
// ed., §5.2, from memory, the model's own statement). With no load the capacitor charges at
// dVc/dt = I/C (Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §7.1,
// section from memory), so at a
// time s into the charge Vds = Vs − Vc − I·Rs = 400 − (0.5/1.5e-3)·s − 1.1 V. The bus reaches
// 390 V (completion "within 10 V") after 390·1.5e-3/0.5 = 1.17 s, before the MOSFET runs out of
// headroom at 400 − 0.5·(2.2 + 0.12) = 398.84 V. SOA tables here are invented for the test.
const PROFILE = (stressKeys: string, ambient = "25 degC") => `name: linear MOSFET pre-charge
ambient: ${ambient}
parts:
  - id: q1
    role: mosfet
    network: { form: foster, stages: [{ r: 0.5 K/W, tau: 20 ms }, { r: 1.5 K/W, tau: 2 s }] }
    limits: { maxTemperature: 175 degC }
${stressKeys}
  - id: rs
    role: source-resistor
    network: { form: foster, stages: [{ r: 5 K/W, tau: 1 s }] }
    limits: { maxTemperature: 155 degC }
circuit:
  topology: linear-mosfet
  busVoltage: 400 V
  capacitance: 1.5 mF
  mosfet: { gateVoltage: 4.6 V, thresholdVoltage: 3.5 V, sourceResistor: 2.2 ohm, rdsOn: 0.12 ohm }
  completion: { within: 10 V, timeout: 3 s }
  discharge: { kind: bleeder, resistance: 10 kohm }
events:
  - power-up: {}
  - run: 10 s
  - power-down: { off: 5 min }
  - power-up: {}
`;

/** A flat SOA boundary (same current at every voltage up to 500 V, every duration): DC only. */
const FLAT_SOA = (amps: string, derating = "") =>
  `    ratings:\n      soa: [{ duration: dc, points: [{ vds: 10 V, id: ${amps} }, { vds: 500 V, id: ${amps} }] }]\n${derating}`;

function run(stressKeys: string, ambient?: string) {
  const profile = loadProfile(PROFILE(stressKeys, ambient), "q.yaml");
  const stress = new ProfileStress(profile, { keepCycles: true });
  const points: OperatingPoint[][] = [];
  const result = simulateProfile(profile, {
    models: defaultCircuitModels,
    wantSamples: stress.wantsSamples,
    onEvent: (event) => {
      stress.addEvent(event);
      if (event.samples !== undefined) points.push(event.samples.map((s) => ({ timeS: s.timeS - event.startS, vdsV: 0, idA: s.currentA })));
    },
    onPoint: (timeS, temperatureC, kind, eventIndex) => stress.addPoint(timeS, temperatureC, kind, eventIndex),
  });
  return { profile, result, stress: stress.finish(result.endTimeS), samples: points, wantsSamples: stress.wantsSamples };
}

describe("ProfileStress on a linear-MOSFET pre-charge", () => {
  test("asks for circuit samples only when a MOSFET has an SOA table", () => {
    expect(run("").wantsSamples).toBe(false);
    expect(run(FLAT_SOA("1 A")).wantsSamples).toBe(true);
  });

  // The operating points come from the circuit's samples (Id) and the MOSFET's power (Vds = P/Id);
  // against the closed form above they agree to rounding: 1e-9 relative.
  test("operating points follow Vds = Vs − I·t/C − I·Rs at Id = 0.5 A", () => {
    const { stress, samples } = run(FLAT_SOA("1 A"));
    const q1 = stress.parts[0]!.report;
    expect(q1.events.map((e) => e.index)).toEqual([0, 3]);
    const soa = q1.events[0]!.soa!;
    expect(soa.status).toBe("pass");
    expect(soa.pointsChecked).toBe(samples[0]!.length);
    // the worst point (highest current use) is the first: Id = 0.5 A at Vds = 400 − 1.1 = 398.9 V
    expectClose(soa.worst!.idA, 0.5, { rel: 1e-12 });
    expectClose(soa.worst!.vdsV, 398.9, { rel: 1e-9 });
    // the pulse lasts the whole charge, 1.17 s
    expectClose(soa.durationS, 1.17, { rel: 1e-9 });
    for (const s of samples[0]!) expectClose(s.idA, 0.5, { rel: 1e-12 });
  });

  // SOA check: every point is held to the boundary (DC here). 0.505 A allowed passes 0.5 A (99 %),
  // 0.495 A fails it (101 %): one percent either side of the operating current.
  test.each([
    ["0.505 A", "pass", 0.5 / 0.505],
    ["0.495 A", "fail", 0.5 / 0.495],
  ])("a flat SOA boundary at %s: %s", (amps, status, use) => {
    const { stress } = run(FLAT_SOA(amps));
    expect(stress.ratingStatus).toBe(status);
    const check = stress.parts[0]!.report.events[0]!.soa!;
    expect(check.status).toBe(status);
    expectClose(check.worst!.utilisation, use, { rel: 1e-9 });
  });

  // Linear derating of the SOA between a reference and the maximum junction temperature at the
  // part's temperature at the event start (common practice): the first charge starts at the 40 °C
  // ambient, so the factor is (175 − 40)/(175 − 25) = 0.9 exactly (1e-12 relative). The second
  // starts after about 311 s of cooling, 155 times the longest time constant (2 s): the MOSFET is
  // back at ambient to within e^−155 of its rise, so its factor is 0.9 too, to rounding.
  test("SOA derating reads the part's temperature at each event start", () => {
    const { stress } = run(FLAT_SOA("1 A", "      soaDerating: { reference: 25 degC, maxJunction: 175 degC }\n"), "40 degC");
    const events = stress.parts[0]!.report.events;
    expectClose(events[0]!.soa!.deratingFactor, 0.9, { rel: 1e-12 });
    expectClose(events[1]!.soa!.deratingFactor, 0.9, { rel: 1e-9 });
  });

  test("the MOSFET's report carries the linear-mode caution; the resistor's does not", () => {
    const { stress } = run("");
    expect(stress.parts[0]!.report.cautions).toContain(LINEAR_MOSFET_CAUTION);
    expect(stress.parts[1]!.report.cautions).not.toContain(LINEAR_MOSFET_CAUTION);
    expect(stress.parts[1]!.report.damage).toBeUndefined();
    expect(stress.parts[1]!.report.notes.join(" ")).toContain("No cycling model for this resistor");
  });

  // Two charges, each one heating-cooling cycle of the MOSFET (the run and the off time let it
  // settle), closed on itself as one repetition (ASTM E1049-85 (2017) §5.4.5): full cycles only.
  test("the temperature history is counted closed on itself: full cycles only", () => {
    const { stress } = run("");
    const c = stress.parts[0]!.report.cycleSummary;
    expect(c.mode).toBe("repeating");
    expect(c.halfCycles).toBe(0);
    expect(c.fullCycles).toBeGreaterThanOrEqual(2);
    expect(stress.parts[0]!.report.cycles.length).toBe(c.fullCycles);
  });

  test("an SOA table on a part that is not the MOSFET is reported as not checked", () => {
    const text = PROFILE("").replace("    limits: { maxTemperature: 155 degC }", `    limits: { maxTemperature: 155 degC }\n${FLAT_SOA("1 A")}`);
    const profile = loadProfile(text, "q.yaml");
    const stress = new ProfileStress(profile);
    const result = simulateProfile(profile, { models: defaultCircuitModels, onEvent: (e) => stress.addEvent(e), onPoint: (t, c, k, i) => stress.addPoint(t, c, k, i) });
    const rs = stress.finish(result.endTimeS).parts[1]!.report;
    expect(rs.events).toEqual([]);
    expect(rs.notes.join(" ")).toContain("not the circuit's linear-mode MOSFET");
  });
});

describe("mosfetOperatingPoints", () => {
  // Every sample of the real linear-MOSFET model against the closed form of the header: Id = 0.5 A,
  // Vds = 400 − (0.5/1.5e-3)·t − 1.1 V, while the MOSFET is a current source (the whole charge to
  // 390 V). Vds comes from P/Id, so it carries the rounding of the power terms: 1e-9 relative.
  test("Vds = P/Id agrees with Vs − I·t/C − I·Rs at every sample of a charge", () => {
    const result = chargeLinearMosfet(
      { capacitanceF: 1.5e-3, gateVoltageV: 4.6, thresholdVoltageV: 3.5, sourceResistorOhm: 2.2, rdsOnOhm: 0.12 },
      { sourceVoltageV: 400, initialVoltageV: 0, completion: { withinV: 10, timeoutS: 3 }, wantSamples: true },
    );
    const points = mosfetOperatingPoints(result.samples!, result.traces["mosfet"]!, 400);
    expect(points.length).toBe(result.samples!.length);
    expect(points.length).toBeGreaterThan(10);
    for (const p of points) {
      expectClose(p.idA, 0.5, { rel: 1e-12 });
      expectClose(p.vdsV, 400 - (0.5 / 1.5e-3) * p.timeS - 1.1, { rel: 1e-9 });
    }
  });

  // With no current nothing drops across the source resistor: Vds = Vs − Vc (Kirchhoff's voltage
  // law around the loop; Hayt et al., §3.3, section from memory). Exact arithmetic.
  test("at zero current Vds is the whole gap Vs − Vc", () => {
    const points = mosfetOperatingPoints([{ timeS: 0.5, voltageV: 120, currentA: 0 }], [], 400);
    expect(points).toEqual([{ timeS: 0.5, vdsV: 280, idA: 0 }]);
  });
});
