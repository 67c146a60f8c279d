import { describe, expect, test } from "vitest";
import {
  MATERIALS,
  ProfileStress,
  adiabaticMass,
  adiabaticMassEstimates,
  allowedContinuousPowerW,
  checkAdiabatic,
  defaultCircuitModels,
  formatProfileStress,
  loadProfile,
  maxWindowEnergyJ,
  peakVoltageAcrossV,
  simulateProfile,
  spreadingTimeS,
  stressReportJson,
} from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// The limits a resistor is judged against beside its temperature: voltage across it, continuous
// power against ambient, the adiabatic limit of its element, and the quick adiabatic mass.

/** An invented 400 V pre-charge through 100 ohm into 1 mF whose second attempt meets a hard short. */
const PROFILE = (ratings: string) => `name: hard short at 400 V
ambient: 25 degC
parts:
  - id: r1
    role: resistor
    network: { form: foster, stages: [{ r: 0.1 K/W, tau: 0.5 s }, { r: 1 K/W, tau: 60 s }] }
    limits: { maxTemperature: 350 degC }
    ratings:
${ratings}
circuit:
  topology: series-resistor
  busVoltage: 400 V
  capacitance: 1 mF
  resistance: 100 ohm
  completion: { fraction: 0.95, timeout: 100 ms }
  discharge: { kind: bleeder, resistance: 100 kohm }
events:
  - power-up: {}
  - run: 10 s
  - power-down: { off: 1 min }
  - retry: { attempts: 1, interval: 1 s, fault: { type: shorted-output }, lockout: 1 min }
`;

function simulate(ratings: string) {
  const profile = loadProfile(PROFILE(ratings), "short.yaml");
  const stress = new ProfileStress(profile);
  const result = simulateProfile(profile, {
    models: defaultCircuitModels,
    onEvent: (event) => stress.addEvent(event),
    onPoint: (timeS, temperatureC, kind, eventIndex) => stress.addPoint(timeS, temperatureC, kind, eventIndex),
  });
  const found = stress.finish(result.endTimeS);
  return { profile, found, endTimeS: result.endTimeS, text: formatProfileStress(profile, found), json: stressReportJson(found.parts[0]!.report) };
}

describe("voltage across the part", () => {
  test("a hard short at 400 V across a part rated 300 V fails, naming the voltage", () => {
    // in a hard short the capacitor stays at 0 V and the whole bus voltage stands across the
    // resistor: P = V²/R = 400²/100 = 1600 W, V = √(P·R) = 400 V (Joule heating p = v²/R, Hayt,
    // Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §2.4)
    const { found, text, json } = simulate("      voltage: { limitingElement: 300 V }");
    expect(found.ratingStatus).toBe("fail");
    // the verdict line and its wrapped continuation, as one line
    const line = text.replace(/\n {6}/g, " ").split("\n").find((l) => l.includes("limit, voltage across the part"))!;
    expect(line).toMatch(/^ {2}limit, voltage across the part: FAIL: 400 V in event \d+ at [\d.]+ s, allowed 300 V; margin -100 V \(-33\.3 %\)$/);
    const entry = json.limits.find((l) => l.limit === "voltage")!;
    expect(entry.status).toBe("fail");
    expectClose(entry.found, 400, { rel: 1e-9 });
    expect(entry.allowed).toBe(300);
    expectClose(entry.margin!, -100, { rel: 1e-9 });
    expect(entry.basis).toMatch(/limiting-element voltage \(IEC 60115-1\)/);
    // the healthy charge also starts at the full bus voltage across the resistor (the capacitor is
    // empty), so both events cross it
    expect(entry.crossed).toBe(2);
    expect(text.split("\n").every((l) => l.length <= 100)).toBe(true);
  });

  test("a pulse voltage above the limiting-element voltage holds for the pulses", () => {
    const { json } = simulate("      voltage: { limitingElement: 300 V, pulse: 500 V }");
    const entry = json.limits.find((l) => l.limit === "voltage")!;
    expect(entry.status).toBe("pass");
    expectClose(entry.margin!, 100, { rel: 1e-9 });
  });

  test("V = √(P·R)", () => {
    // 1600 W in 100 ohm: √160000 = 400 V
    expect(peakVoltageAcrossV(1600, 100)).toBe(400);
  });
});

describe("continuous power and its derating against ambient (common practice: two-point linear)", () => {
  const curve = { ratedPowerW: 10, fullPowerUpToC: 70, zeroPowerAtC: 155 };
  test("by hand at three ambients", () => {
    // 25 °C is below the knee: the full 10 W
    expect(allowedContinuousPowerW(curve, 25)).toBe(10);
    // 112.5 °C: 10·(155 − 112.5)/(155 − 70) = 10·42.5/85 = 5 W
    expectClose(allowedContinuousPowerW(curve, 112.5), 5, { rel: 1e-12 });
    // 140 °C: 10·15/85 = 1.7647 W
    expectClose(allowedContinuousPowerW(curve, 140), 1.764706, { rel: 1e-6 });
    // at and above 155 °C nothing
    expect(allowedContinuousPowerW(curve, 160)).toBe(0);
  });

  test("the run's mean power is judged at the part's ambient", () => {
    const { json, endTimeS } = simulate("      continuousPower: { rated: 10 W, fullPowerUpTo: 70 degC, zeroPowerAt: 155 degC }");
    const entry = json.limits.find((l) => l.limit === "continuous-power")!;
    // the healthy charge times out after one time constant RC = 100 ohm · 1 mF = 100 ms, at
    // f = 1 − e^(−1) = 0.63212 of the bus (driven RC circuit, Hayt, Kemmerly & Durbin, 8th ed.
    // (2012), §8.8, section from memory); the resistor's energy charging C from 0 to f·V is
    // ∫(V − v)²/R dt = C·∫(V − v)dv = C·V²·(f − f²/2) = 160·(0.63212 − 0.19979) = 69.17 J
    // (capacitor i = C·dv/dt, same book §7.1), plus the short 400²/100 W · 0.1 s = 160 J:
    // 229.17 J over the run; at 25 °C, below the knee, the full 10 W is allowed
    const f = 1 - Math.exp(-1);
    expect(entry.allowed).toBe(10);
    expectClose(entry.found, (160 * (f - (f * f) / 2) + 160) / endTimeS, { rel: 1e-6 });
    expect(entry.status).toBe("pass");
  });
});

describe("adiabatic element limit", () => {
  test("spreading time d²/α of nichrome (Incropera et al., 7th ed. (2011), §5.2: Fo = α·t/L²)", () => {
    // α = k/(ρ·c) = 12/(8400·420) = 3.4014e-6 m²/s; d = 0.5 mm: 0.25e-6/3.4014e-6 = 0.0735 s
    const nichrome = MATERIALS.find((m) => m.id === "nichrome")!;
    expectClose(spreadingTimeS(0.5e-3, nichrome.conductivityWPerMK / (nichrome.densityKgPerM3 * nichrome.specificHeatJPerKgK)), 0.0735, { rel: 1e-12 });
  });

  test("energy within the window of a decaying pulse, exact integral", () => {
    // P = 1600·e^(−t/0.05 s): within 0.02 s, 1600·0.05·(1 − e^(−0.4)) = 80·0.32968 = 26.374 J
    const trace = [{ startS: 3, durationS: 1, terms: [{ a: 1600, b: 0, lambda: 20 }] }];
    expectClose(maxWindowEnergyJ(trace, 0.02), 26.3744, { rel: 1e-5 });
  });

  test("the rise E/C_el against the headroom from the start temperature (Incropera et al., 7th ed. (2011), §1.3.1)", () => {
    // 160 J within the window on 0.8 J/K: 200 K; from 200 °C to 350 °C only 150 K are left
    const check = checkAdiabatic({ spreadingTimeS: 0.1, heatCapacityJPerK: 0.8, basis: "" }, 160, 200, 350);
    expect(check.riseK).toBe(200);
    expect(check.allowedRiseK).toBe(150);
    expect(check.status).toBe("fail");
  });

  test("in a profile: the hard short's first 50 ms count against the element alone", () => {
    const { json } = simulate("      adiabatic: { heatCapacity: 0.4 J/K, spreadingTime: 50 ms }");
    const entry = json.limits.find((l) => l.limit === "adiabatic")!;
    // the short puts 1600 W · 0.05 s = 80 J into 0.4 J/K within the spreading time: 200 K, from
    // a start near 25 °C with 325 K allowed
    expectClose(entry.found, 200, { rel: 1e-6 });
    expect(entry.status).toBe("pass");
  });
});

describe("the quick adiabatic mass m = E/(c·ΔT)", () => {
  test("70 V on 3 mF is about 7.35 J and needs about 0.147 g at c = 1000 J/(kg K) and 50 K (common practice)", () => {
    // E = C·V²/2 = 3e-3·4900/2 = 7.35 J (Hayt, Kemmerly & Durbin, 8th ed. (2012), §7.1)
    const energyJ = (3e-3 * 70 ** 2) / 2;
    expectClose(energyJ, 7.35, { rel: 1e-12 });
    // m = 7.35/(1000·50) = 1.47e-4 kg = 0.147 g (Q = m·c·ΔT, Incropera et al., 7th ed. (2011), §1.3.1)
    expectClose(adiabaticMass(energyJ, 1000, 50), 1.47e-4, { rel: 1e-12 });
  });

  test("per common element and body material, each mass E/(c·ΔT) with its preset's specific heat", () => {
    // 7.35 J, 50 K: ceramic 850 → 0.1729 g, alumina 765 → 0.1922 g, nichrome 420 → 0.35 g,
    // steatite 900 → 0.1633 g (specific heats from memory: Incropera et al., 7th ed. (2011),
    // Tables A.1, A.2 for alumina and nichrome; typical values for ceramic and steatite)
    const estimates = adiabaticMassEstimates(7.35, 50);
    expect(estimates.map((e) => e.materialId)).toEqual(["ceramic", "alumina", "nichrome", "steatite"]);
    [1.7294e-4, 1.9216e-4, 3.5e-4, 1.6333e-4].forEach((m, i) => expectClose(estimates[i]!.massKg, m, { rel: 1e-4 }));
  });
});
