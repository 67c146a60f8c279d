import { describe, expect, test } from "vitest";
import { defaultCircuitModels, loadProfile, materialPreset, simulateProfile, sizeHeatCapacity, sizeProfile } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";
import { inputErrorMessage } from "../helpers/inputErrorMessage.js";

// Invented test profiles: one part heated by rectangular power pulses (power-trace events), or a
// series-resistor pre-charge. Networks are written as text so the re-simulation at a scaled
// capacity below is an independent path (hand-scaled network, loader, simulator), not the solver's.
interface Stage {
  readonly r: number;
  readonly tau: number;
}
function pulseProfileText(stages: readonly Stage[], pulse: { powerW: number; durationS: number; count: number; periodS: number }, limitC: number, marginK = 0): string {
  const trace = `power-trace: { part: p, points: [[0, ${pulse.powerW}], [${pulse.durationS} s, ${pulse.powerW}]] }`;
  return `name: sizing test
ambient: 25 degC
parts:
  - id: p
    network: { form: foster, stages: [ ${stages.map((s) => `{ r: ${s.r} K/W, tau: ${s.tau} s }`).join(", ")} ] }
    limits: { maxTemperature: ${limitC} degC, margin: ${marginK} K }
events:
  - repeat:
      count: ${pulse.count}
      period: ${pulse.periodS} s
      events:
        - ${trace}
`;
}
const peakOf = (text: string): number => simulateProfile(loadProfile(text, "t.yaml"), { models: defaultCircuitModels }).parts[0]!.peakTemperatureC;
const models = defaultCircuitModels;

describe("sizeHeatCapacity: inversion of the whole profile", () => {
  test("one rectangular pulse on one stage: the closed-form scale lies inside the returned bracket", () => {
    // Lumped capacitance with constant heating from rest (Incropera et al., Fundamentals of Heat and
    // Mass Transfer, 7th ed. (2011), §5.1 and §5.3, the general lumped solution):
    // rise(t) = P·R·(1 − e^(−t/(k·tau))), highest at the pulse end t_p. Setting it to ΔT:
    //   k = t_p / (tau·ln(1/(1 − ΔT/(P·R)))) = 0.5 / ln(1/0.375) = 0.509770...
    // (P = 100 W, R = 2 K/W, tau = 1 s, t_p = 0.5 s, ΔT = 150 − 25 = 125 K.)
    const profile = loadProfile(pulseProfileText([{ r: 2, tau: 1 }], { powerW: 100, durationS: 0.5, count: 1, periodS: 10 }, 150), "t.yaml");
    const answer = sizeHeatCapacity(profile, 0, { models });
    const expected = 0.5 / Math.log(1 / (1 - 125 / 200));
    expect(answer.inversion.status).toBe("sized");
    expect(answer.inversion.crossingScale!).toBeLessThanOrEqual(expected);
    expect(answer.inversion.scale).toBeGreaterThanOrEqual(expected);
    // the bracket is at most 1e-3 wide (SIZE_DEFAULTS.capacityRelativeWidth), so 1e-3 relative
    expectClose(answer.inversion.scale, expected, { rel: 1e-3 });
    // first capacity of one Foster stage: tau/R = 0.5 J/K, scaled by k
    expectClose(answer.inversion.capacityJPerK, answer.inversion.scale * 0.5, { rel: 1e-12 });
  });

  test("a train of pulses on one stage: the closed-form geometric sum agrees", () => {
    // N pulses of P for t_p every T: the peak is at the end of the last pulse,
    //   rise = P·R·(1 − e^(−t_p/a))·(1 − e^(−N·T/a))/(1 − e^(−T/a)),  a = k·tau
    // (the §5.1/§5.3 lumped response, superposed). Solved here for a by plain bisection
    // on ln a (the rise falls as a grows), independently of the library.
    const [p, r, tau, tp, n, period, rise] = [100, 1.5, 20, 0.2, 12, 3, 100];
    const riseAt = (a: number): number => p * r * (1 - Math.exp(-tp / a)) * (1 - Math.exp((-n * period) / a)) / (1 - Math.exp(-period / a));
    let lo = 1e-3;
    let hi = 1e4;
    for (let i = 0; i < 200; i++) {
      const mid = Math.sqrt(lo * hi);
      if (riseAt(mid) > rise) lo = mid;
      else hi = mid;
    }
    const expected = hi / tau;
    const profile = loadProfile(pulseProfileText([{ r, tau }], { powerW: p, durationS: tp, count: n, periodS: period }, 25 + rise), "t.yaml");
    const answer = sizeHeatCapacity(profile, 0, { models });
    expect(answer.inversion.crossingScale!).toBeLessThanOrEqual(expected * (1 + 1e-12));
    expect(answer.inversion.scale).toBeGreaterThanOrEqual(expected * (1 - 1e-12));
  });

  test.each([
    { name: "two Foster stages, pulse train", stages: [{ r: 0.4, tau: 0.05 }, { r: 2.5, tau: 30 }], pulse: { powerW: 300, durationS: 0.1, count: 20, periodS: 2 }, limitC: 160, marginK: 10 },
    { name: "three Foster stages, one long pulse", stages: [{ r: 0.2, tau: 0.01 }, { r: 1, tau: 2 }, { r: 3, tau: 200 }], pulse: { powerW: 50, durationS: 5, count: 1, periodS: 10 }, limitC: 90, marginK: 0 },
  ])("$name: the returned capacity keeps the peak within 0.1 K under the target, 1 % less crosses it", ({ stages, pulse, limitC, marginK }) => {
    // Closed loop: the peaks are re-simulated from a network file whose time
    // constants are multiplied by hand (capacity × k at fixed R is tau × k, sizeScaledProfile).
    const answer = sizeHeatCapacity(loadProfile(pulseProfileText(stages, pulse, limitC, marginK), "t.yaml"), 0, { models });
    const target = limitC - marginK;
    const k = answer.inversion.scale;
    const scaled = (f: number) => stages.map((s) => ({ r: s.r, tau: s.tau * f }));
    const peak = peakOf(pulseProfileText(scaled(k), pulse, limitC, marginK));
    expect(peak).toBeLessThanOrEqual(target);
    expect(peak).toBeGreaterThan(target - 0.1);
    expect(peakOf(pulseProfileText(scaled(0.99 * k), pulse, limitC, marginK))).toBeGreaterThan(target);
  });

  test("a part whose resistance alone keeps it cool: any capacity works", () => {
    // P·R = 10 W · 2 K/W = 20 K < 125 K: even with no capacity the rise is at most P·R
    const answer = sizeHeatCapacity(loadProfile(pulseProfileText([{ r: 2, tau: 1 }], { powerW: 10, durationS: 0.5, count: 1, periodS: 10 }, 150), "t.yaml"), 0, { models });
    expect(answer.inversion.status).toBe("any");
    expect(answer.feasible).toBe(true);
    expect(answer.inversion.peakTemperatureC).toBeLessThanOrEqual(25 + 20 + 1e-9);
  });

  test("a target not above ambient: no size, and the reason says so", () => {
    const answer = sizeHeatCapacity(loadProfile(pulseProfileText([{ r: 2, tau: 1 }], { powerW: 100, durationS: 0.5, count: 1, periodS: 10 }, 60, 40), "t.yaml"), 0, { models });
    expect(answer.feasible).toBe(false);
    expect(answer.reason).toBe("the target 20 °C (limit 60 °C less 40 K margin) is not above the ambient 25 °C, so no heat capacity keeps the part under it");
  });
});

describe("sizeHeatCapacity: element only (--scale element)", () => {
  // Invented: an element (C1, R1) on a body (C2, R2 = 10 K/W to ambient); 5 pulses of P for t_p every 20 s.
  const ladderText = (c1: number, c2: number, p: number, tp: number, r1: number): string => `name: element test
ambient: 25 degC
parts:
  - id: p
    network: { form: cauer, stages: [ { r: ${r1} K/W, c: ${c1} J/K }, { r: 10 K/W, c: ${c2} J/K } ] }
    limits: { maxTemperature: 150 degC, margin: 0 K }
events:
  - repeat:
      count: 5
      period: 20 s
      events:
        - power-trace: { part: p, points: [[0, ${p}], [${tp} s, ${p}]] }
`;
  /** one pulse of 100 W for 0.5 s into a Cauer ladder of [R K/W, C J/K] stages, limit 150 °C, no margin */
  const onePulseOnLadder = (stages: readonly (readonly [number, number])[]): string => `name: one pulse
ambient: 25 degC
parts:
  - id: p
    network: { form: cauer, stages: [ ${stages.map(([r, c]) => `{ r: ${r} K/W, c: ${c} J/K }`).join(", ")} ] }
    limits: { maxTemperature: 150 degC, margin: 0 K }
events:
  - power-trace: { part: p, points: [[0, 100], [0.5 s, 100]] }
`;

  test("regression: the whole-body answer's C1 on the original body runs past the target; the element answer holds", () => {
    // The defect: the report gave k·C1 of a body whose every capacity is k times larger (here k ≈ 12)
    // as if it were the element's capacity. Put that C1 on the original 2 J/K body and the part
    // overheats; the element answer, re-simulated from a network file written by hand, holds.
    const profile = loadProfile(ladderText(0.05, 2, 200, 0.5, 1), "t.yaml");
    const whole = sizeHeatCapacity(profile, 0, { models, scope: "whole" });
    const element = sizeHeatCapacity(profile, 0, { models, scope: "element" });
    expect(whole.inversion.scale).toBeGreaterThan(1);
    expect(peakOf(ladderText(whole.inversion.capacityJPerK, 2, 200, 0.5, 1))).toBeGreaterThan(150 + 10);
    const c1 = element.inversion.capacityJPerK;
    expectClose(c1, element.inversion.scale * 0.05, { rel: 1e-12 });
    expect(c1).toBeGreaterThan(whole.inversion.capacityJPerK);
    // SIZE_DEFAULTS.temperatureToleranceK: the sized peak lies at most 0.01 K under the target
    const peak = peakOf(ladderText(c1, 2, 200, 0.5, 1));
    expect(peak).toBeLessThanOrEqual(150);
    expect(peak).toBeGreaterThan(150 - 0.01);
    expect(peakOf(ladderText(0.98 * c1, 2, 200, 0.5, 1))).toBeGreaterThan(150);
    expect(element.inversion.sizedNetwork).toEqual({ kind: "cauer", stages: [{ rKPerW: 1, cJPerK: c1 }, { rKPerW: 10, cJPerK: 2 }] });
    expect(element.reason).toBe(`an element capacity C1 = ${Number(c1.toPrecision(4))} J/K (${Number(element.inversion.scale.toPrecision(4))} × the present 0.05 J/K, the rest of the network as it is) keeps the peak at ${element.inversion.peakTemperatureC.toFixed(2)} °C, at or under the 150 °C target`);
  });

  test("an element on a very large body: the one-lump closed form", () => {
    // With C2 = 1e6 J/K the body does not warm (50 J raise it by 5e-5 K), so the element is one lump
    // R1, k·C1 from ambient (Incropera et al., 7th ed., §5.2): rise = P·R1·(1 − e^(−t_p/(k·R1·C1)))
    // at the pulse end; one pulse of 100 W for 0.5 s, R1 = 2 K/W, C1 = 0.25 J/K, ΔT = 125 K:
    //   k = t_p / (R1·C1·ln(1/(1 − ΔT/(P·R1)))) = 0.5 / (0.5·ln(1/0.375)) = 1.01955...
    const answer = sizeHeatCapacity(loadProfile(onePulseOnLadder([[2, 0.25], [1, 1e6]]), "t.yaml"), 0, { models, scope: "element" });
    // the bracket is 1e-3 wide (SIZE_DEFAULTS.capacityRelativeWidth); the body's 5e-5 K moves k by under 1e-6
    expectClose(answer.inversion.scale, 0.5 / (0.5 * Math.log(1 / 0.375)), { rel: 1e-3 });
    expect(answer.inversion.sizedNetwork).toEqual({ kind: "cauer", stages: [{ rKPerW: 2, cJPerK: answer.inversion.capacityJPerK }, { rKPerW: 1, cJPerK: 1e6 }] });
  });

  test("an element whose capacity does not matter: any, and the reason says the rest of the network sets the peak", () => {
    // 100 W for 0.5 s through R1 = 0.2 K/W into a 10 J/K body: with no element capacity at all the
    // element is at most P·R1 = 20 K above the body, and the body rises at most E/C2 = 50 J / 10 J/K
    // = 5 K (no heat leaving, Q = m·c·ΔT): at most 25 K, far under the 125 K allowed
    const answer = sizeHeatCapacity(loadProfile(onePulseOnLadder([[0.2, 0.1], [5, 10]]), "t.yaml"), 0, { models, scope: "element" });
    expect(answer.inversion.status).toBe("any");
    expect(answer.reason).toMatch(/^even [\d.e+-]+ × the element capacity C1 keeps the peak at [\d.]+ °C, under the 150 °C target: the rest of the network, not the element's capacity, sets this part's peak$/);
  });

});

describe("sizeHeatCapacity: adiabatic bound", () => {
  test("one power-up through a series resistor: C = E/ΔT, m = E/(c·ΔT), and the inversion agrees for a slow part", () => {
    // Energy in the resistor while C charges from 0 to V1 = f·Vs (Hayt et al., §8.8 RC charging;
    // energy by the capacitor's charge balance): E = ∫(Vs − V)·i dt = ∫C·(Vs − V) dV = C·(Vs·V1 − V1²/2)
    //   = 1e-3 F · (100 V)² · (0.95 − 0.95²/2) = 4.9875 J.
    // Adiabatic bound, Q = m·c·ΔT (Incropera et al., 7th ed. (2011), §1.3.1): ΔT = 75 − 25 = 50 K,
    //   C = 4.9875/50 = 0.09975 J/K; copper c = 385 J/(kg·K) (Incropera Table A.1, from memory):
    //   m = 4.9875 / (385 · 50) = 2.5909e-4 kg = 0.259 g.
    const text = `name: adiabatic test
ambient: 25 degC
parts:
  - id: r
    role: resistor
    network: { form: foster, stages: [ { r: 200 K/W, tau: 100 s } ] }
    limits: { maxTemperature: 75 degC, margin: 0 K }
circuit:
  topology: series-resistor
  busVoltage: 100 V
  capacitance: 1 mF
  resistance: 1 ohm
  completion: { fraction: 0.95, timeout: 1 s }
  discharge: { kind: none }
events:
  - power-up: {}
`;
    // one stage has one capacity: element and whole-body scaling are the same thing; only the
    // element answer is given as a mass (a whole body is of several materials)
    const answer = sizeHeatCapacity(loadProfile(text, "t.yaml"), 0, { models, material: materialPreset("copper"), scope: "element" });
    const whole = sizeHeatCapacity(loadProfile(text, "t.yaml"), 0, { models, material: materialPreset("copper"), scope: "whole" });
    expect(whole.inversion.massKg).toBeUndefined();
    expectClose(whole.inversion.capacityJPerK, answer.inversion.capacityJPerK, { rel: 1e-3 }); // two bisections, each bracket 1e-3 wide
    // the charge model's energy is exact for a linear circuit: 1e-12 relative covers rounding
    expectClose(answer.worstEvent!.energyJ, 4.9875, { rel: 1e-12 });
    expectClose(answer.adiabatic!.capacityJPerK, 0.09975, { rel: 1e-12 });
    expectClose(answer.adiabatic!.massKg!, 2.5909e-4, { rel: 1e-4 }); // the comment's value has 5 digits
    // The charge lasts about 3 ms and the sized part's time constant is about 20 s, so under 1e-3 of
    // the heat leaves during the pulse: the inversion sits just under the adiabatic bound (its own
    // bracket adds at most 1e-3).
    expect(answer.inversion.capacityJPerK).toBeLessThanOrEqual(0.09975 * (1 + 1e-3));
    expect(answer.inversion.capacityJPerK).toBeGreaterThan(0.09975 * (1 - 2e-3));
    expectClose(answer.inversion.massKg!, answer.inversion.capacityJPerK / 385, { rel: 1e-12 });
  });
});

describe("sizing: bad input", () => {
  const profile = loadProfile(pulseProfileText([{ r: 2, tau: 1 }], { powerW: 100, durationS: 0.5, count: 1, periodS: 10 }, 150), "t.yaml");
  test.each([
    { name: "negative margin", run: () => sizeHeatCapacity(profile, 0, { models, marginK: -1 }), expected: "--margin: expected a margin ≥ 0 K, found -1" },
    { name: "unknown part", run: () => sizeProfile(profile, { models, partIds: ["q"] }), expected: '--part: expected one of the profile\'s parts (p), found "q"' },
    {
      name: "element scaling of a part built from a modal model alone",
      run: () => sizeHeatCapacity({ ...profile, parts: profile.parts.map(({ network: _dropped, ...modalOnly }) => modalOnly) }, 0, { models, scope: "element" }),
      expected: "--scale: expected whole for part p (element scaling needs its network as written: Foster, Cauer or graph), found element on a modal model alone",
    },
  ])("$name", ({ run, expected }) => {
    expect(inputErrorMessage(run)).toBe(expected);
  });
});
