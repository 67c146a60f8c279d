import { describe, expect, test } from "vitest";
import { InputError, defaultCircuitModels, loadProfile, materialPreset, simulateProfile, sizeHeatCapacity, sizeProfile } from "../../src/index.js";
import { expectClose } from "../helpers/expectClose.js";

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
    const answer = sizeHeatCapacity(loadProfile(text, "t.yaml"), 0, { models, material: materialPreset("copper") });
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
  const message = (run: () => unknown): string => {
    try {
      run();
    } catch (error) {
      if (error instanceof InputError) return error.problems.map((p) => `${p.field}: expected ${p.expected}, found ${p.found}`).join("; ");
      throw error;
    }
    throw new Error("no InputError");
  };
  test.each([
    { name: "negative margin", run: () => sizeHeatCapacity(profile, 0, { models, marginK: -1 }), expected: "--margin: expected a margin ≥ 0 K, found -1" },
    { name: "unknown part", run: () => sizeProfile(profile, { models, partIds: ["q"] }), expected: '--part: expected one of the profile\'s parts (p), found "q"' },
  ])("$name", ({ run, expected }) => {
    expect(message(run)).toBe(expected);
  });
});
