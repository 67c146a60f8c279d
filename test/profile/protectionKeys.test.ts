import { describe, expect, test } from "vitest";
import { InputError, defaultCircuitModels, loadProfile, simulateProfile } from "../../src/internal.js";

const base = (circuitExtra: string, events = "  - fault: { type: shorted-output }\n  - power-up: {}\n") => `name: protection keys
ambient: 40 degC
parts:
  - id: r
    role: resistor
    network: { form: foster, stages: [{ r: 2 K/W, tau: 1 s }] }
    limits: { maxTemperature: 200 degC }
circuit:
  topology: series-resistor
  busVoltage: 84 V
  capacitance: 3.3 mF
  resistance: 47 ohm
  completion: { fraction: 0.92, timeout: 700 ms }
  discharge: { kind: bleeder, resistance: 10 kohm }
${circuitExtra}events:
${events}`;

const load = (text: string) => loadProfile(text, "p.yaml", () => "");

describe("circuit.protection and circuit.contactor keys", () => {
  test("every protection key resolves into SI on the completion rule", () => {
    const p = load(
      base(`  protection:
    busChecks: [{ at: 50 ms, below: 11.3 V }, { at: 5 ms, above: 6.6 V }]
    riseChecks: [{ from: 10 ms, to: 60 ms, atLeast: 100 V/s }]
    overCurrent: { above: 3 A, for: 20 ms }
    fuse: { i2t: 5 A^2 s }
    firmwareI2t: 2.5
    maxOnTime: 600 ms
  contactor: { makingCurrent: 250 A, loopResistance: 20 mohm, loopInductance: 2 uH }
`),
    );
    expect(p.circuit!.completion.protection).toEqual({
      busChecks: [{ atS: 0.05, minV: 11.3 }, { atS: 0.005, maxV: 6.6 }],
      riseChecks: [{ fromS: 0.01, toS: 0.06, minRateVPerS: 100 }],
      overCurrent: { currentA: 3, delayS: 0.02 },
      i2t: [{ limitA2s: 5, kind: "fuse" }, { limitA2s: 2.5, kind: "firmware" }],
      maxOnTimeS: 0.6,
    });
    expect(p.circuit!.contactor).toEqual({ makingCurrentA: 250, loopResistanceOhm: 0.02, loopInductanceH: 2e-6 });
  });

  test("bad keys are reported with the field and what was expected", () => {
    const problems = (extra: string): string[] => {
      try {
        load(base(extra));
      } catch (e) {
        if (e instanceof InputError) return e.problems.map((q) => `${q.field}: ${q.expected}`);
        throw e;
      }
      return [];
    };
    expect(problems("  protection: { busChecks: [{ at: 50 ms }] }\n")).toEqual([
      'circuit.protection.busChecks[0]: a "below" voltage (bus too slow) or an "above" voltage (bus too fast)',
    ]);
    expect(problems("  protection: { riseChecks: [{ from: 60 ms, to: 10 ms, atLeast: 100 V/s }] }\n")[0]).toContain("circuit.protection.riseChecks[0].to");
    expect(problems("  protection: { fuse: { i2t: 5 A } }\n")[0]).toContain("circuit.protection.fuse.i2t");
    expect(problems("  contactor: { makingCurrent: 250 A }\n")[0]).toContain("circuit.contactor.loopResistance");
  });

  // Into a short at 84 V through 47 Ω the resistor takes Vs²/R = 150.1 W (Joule heating, Hayt,
  // Kemmerly & Durbin, 8th ed. (2012), §2.4, from memory); the bus check ends the attempt at 50 ms.
  test("simulate ends the faulted attempt at the check, names it, and reports the contactor at the healthy close", () => {
    const p = load(base("  protection: { busChecks: [{ at: 50 ms, below: 11.3 V }] }\n  contactor: { makingCurrent: 100 A, loopResistance: 20 mohm }\n"));
    const events: { outcome: string; durationS: number; energyJ: readonly number[]; reason: string }[] = [];
    const result = simulateProfile(p, { models: defaultCircuitModels, onEvent: (e) => events.push(e) });
    expect(events[0]!.outcome).toBe("tripped");
    expect(events[0]!.durationS).toBe(0.05);
    expect(events[0]!.reason).toContain("bus check at 0.05 s");
    expect(events[0]!.energyJ[0]!).toBeCloseTo(((84 * 84) / 47) * 0.05, 9);
    expect(result.outcomes.tripped).toBe(1);
    // the healthy close: 8 % of 84 V across 20 mΩ, 336 A against 100 A: fail
    expect(result.contactor!.worst.peakCurrentA).toBeCloseTo((0.08 * 84) / 0.02, 6);
    expect(result.contactor!.verdict).toBe("fail");
  });
});
