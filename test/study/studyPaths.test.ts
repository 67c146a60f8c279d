import { describe, expect, test } from "vitest";
import { runCli } from "../../src/cli/main.js";
import { InputError, StudyProfile, defaultCircuitModels, evaluateStudyAnswers, loadProfile } from "../../src/internal.js";
import { memoryIo } from "../helpers/memoryIo.js";

// Parameter paths against an invented two-part profile whose resistor network lives in a file.
const PROFILE = `name: paths
ambient: 30 degC
parts:
  - id: precharge-resistor
    role: resistor
    network: net.yaml   # stages in a file of their own
    limits: { maxTemperature: 180 degC, margin: 20 K }
  - id: shunt
    network: { form: foster, stages: [{ r: 2 K/W, tau: 1 s }] }
    limits: { maxTemperature: 120 degC }
circuit:
  topology: series-resistor
  busVoltage: 48 V
  capacitance: 2.2 mF
  resistance: 15 ohm
  completion: { fraction: 0.95, timeout: 400 ms }
  discharge: { kind: bleeder, resistance: 10 kohm }
events:
  - power-up: {}
  - run: 10 s
`;
const NET = "form: foster\nstages:\n  - { r: 0.5 K/W, tau: 50 ms }\n  - { r: 3 K/W, tau: 20 s }\n";
const files: Record<string, string> = { "net.yaml": NET };
const read = (p: string): string => files[p]!;
const study = (): StudyProfile => new StudyProfile(PROFILE, "p.yaml", read);
const message = (f: () => unknown): string => {
  try {
    f();
  } catch (error) {
    if (error instanceof InputError) return error.message;
    throw error;
  }
  throw new Error("no InputError");
};

describe("parameter paths", () => {
  test("keys, part ids, list indices and a network file resolve to canonical paths with the loader's dimension", () => {
    const s = study();
    expect(s.parameter("circuit.resistance", "--vary")).toMatchObject({ path: "circuit.resistance", dimension: "resistance", nominal: 15, file: "" });
    expect(s.parameter("parts.shunt.limits.maxTemperature", "--vary")).toMatchObject({ path: "parts[1].limits.maxTemperature", dimension: "temperature", nominal: 120 });
    expect(s.parameter("parts[1].network.stages[0].tau", "--vary")).toMatchObject({ dimension: "time", nominal: 1, file: "" });
    expect(s.parameter("parts.precharge-resistor.network.stages[1].r", "--vary")).toMatchObject({ path: "parts[0].network.stages[1].r", file: "net.yaml", dimension: "thermalResistance", nominal: 3 });
    expect(s.parameter("circuit.completion.fraction", "--vary")).toMatchObject({ dimension: "dimensionless", nominal: 0.95 });
    // a key the profile leaves out but the format has: margin of the shunt (default 10 K)
    expect(s.parameter("parts[1].limits.margin", "--vary")).toMatchObject({ dimension: "temperatureDifference", nominal: undefined });
  });

  test("an edit is exactly the profile written with that value, and an edit inside the network file reaches the part", () => {
    const s = study();
    const r = s.parameter("circuit.resistance", "--vary");
    const stage = s.parameter("parts[0].network.stages[1].r", "--vary");
    const byHand = loadProfile(PROFILE.replace("resistance: 15 ohm", "resistance: 33 ohm"), "p.yaml", read);
    const models = { models: defaultCircuitModels };
    expect(evaluateStudyAnswers(s.load([[r, 33]]), ["peak", "energy"], models)).toEqual(evaluateStudyAnswers(byHand, ["peak", "energy"], models));
    files["net2.yaml"] = NET.replace("r: 3 K/W", "r: 4.5 K/W");
    const netByHand = loadProfile(PROFILE.replace("network: net.yaml", "network: net2.yaml"), "p.yaml", read);
    expect(evaluateStudyAnswers(s.load([[stage, 4.5]]), ["peak"], models)).toEqual(evaluateStudyAnswers(netByHand, ["peak"], models));
    // the edit is held in memory: the nominal load is unchanged
    expect(evaluateStudyAnswers(s.load([]), ["peak"], models)).toEqual(evaluateStudyAnswers(loadProfile(PROFILE, "p.yaml", read), ["peak"], models));
  });

  test("unknown paths are refused with the nearest valid one", () => {
    const s = study();
    expect(message(() => s.parameter("circuit.resistanse", "--vary"))).toBe(
      '--vary: expected a parameter path of p.yaml: circuit.resistanse is not in it (did you mean "circuit.resistance"?), found "circuit.resistanse"',
    );
    expect(message(() => s.parameter("parts.shnut.limits.margin", "--vary"))).toContain('(did you mean "parts.shunt.limits.margin"?)');
    expect(message(() => s.parameter("circut.capacitance", "--vary"))).toContain('(did you mean "circuit.capacitance"?)');
    expect(message(() => s.parameter("parts[1].network.stages[3].r", "--vary"))).toContain("an index below 1 at parts[1].network.stages");
    expect(message(() => s.parameter("name", "--vary"))).toContain("a path to a quantity");
    expect(message(() => s.parameter("circuit.completion", "--vary"))).toContain("is a mapping");
  });

  test("CLI: a value of the wrong unit is refused with the dimension the path expects; N = 0 is refused", async () => {
    const io = memoryIo({ "d/p.yaml": PROFILE, "d/net.yaml": NET });
    expect(await runCli(["sweep", "d/p.yaml", "--vary", "circuit.resistance=10 mF,20 ohm"], io)).toBe(2);
    expect(io.stderr.join("")).toContain('--vary circuit.resistance: expected a resistance such as "47 ohm" (or a number in ohm), found "10 mF" (a capacitance)');
    const io2 = memoryIo({ "d/p.yaml": PROFILE, "d/net.yaml": NET });
    expect(await runCli(["montecarlo", "d/p.yaml", "--vary", "circuit.capacitance=normal 0.1 V"], io2)).toBe(2);
    expect(io2.stderr.join("")).toContain('--vary circuit.capacitance: expected a capacitance such as "4.7 mF"');
    const io3 = memoryIo({ "d/p.yaml": PROFILE, "d/net.yaml": NET });
    expect(await runCli(["montecarlo", "d/p.yaml", "--samples", "0", "--vary", "circuit.capacitance=normal 5 %"], io3)).toBe(2);
    expect(io3.stderr.join("")).toBe('heatledger: --samples: expected a whole number of samples ≥ 1, found "0"\n');
    const io4 = memoryIo({ "d/p.yaml": PROFILE, "d/net.yaml": NET });
    expect(await runCli(["sweep", "d/p.yaml", "--vary", "circuit.resistance=10 ohm..20 ohm:0"], io4)).toBe(2);
    expect(io4.stderr.join("")).toContain("a number of values from 1 to");
  });
});
