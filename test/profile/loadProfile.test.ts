import { describe, expect, test } from "vitest";
import { InputError, loadProfile } from "../../src/internal.js";

// Bad input: every broken profile gets one exact message per problem, naming file:line, the field
// path, what was expected and what was found (the bad-input rule of README and DEVELOPERS.md).
const BASE = `name: bad input base
ambient: 25 degC
parts:
  - id: r
    role: resistor
    network: { form: foster, stages: [{ r: 1 K/W, tau: 1 s }] }
    limits: { maxTemperature: 150 degC }
circuit:
  topology: series-resistor
  busVoltage: 48 V
  capacitance: 2 mF
  resistance: 10 ohm
  completion: { fraction: 0.95, timeout: 1 s }
  discharge: { kind: bleeder, resistance: 5 kohm }
events:
  - power-up: {}
  - run: 10 s
`;

const NO_CIRCUIT = `name: no circuit
ambient: 25 degC
parts:
  - id: r
    network: { form: foster, stages: [{ r: 1 K/W, tau: 1 s }] }
    limits: { maxTemperature: 150 degC }
events:
  - power-up: {}
`;

function files(path: string): string {
  if (path === "bad.csv") return "time,power\n0,1\n1,x\n";
  if (path === "net.yaml") return "form: foster\nstages:\n  - { r: 1 K/W, tua: 1 s }\n";
  throw Object.assign(new Error("ENOENT: no such file"), { code: "ENOENT" });
}

function messageOf(text: string): string {
  try {
    loadProfile(text, "p.yaml", files);
  } catch (error) {
    if (error instanceof InputError) return error.message;
    throw error;
  }
  return "no error";
}

const edit = (from: string, to: string): string => {
  if (!BASE.includes(from)) throw new Error(`test setup: "${from}" not in the base profile`);
  return BASE.replace(from, to);
};

describe("loadProfile: bad input, exact messages", () => {
  test.each([
    ["wrong unit", edit("capacitance: 2 mF", "capacitance: 2 mV"), 'p.yaml:11: circuit.capacitance: expected a capacitance such as "4.7 mF" (or a number in F), found "2 mV" (a voltage)'],
    ["unknown unit", edit("capacitance: 2 mF", "capacitance: 2 mFoo"), 'p.yaml:11: circuit.capacitance: expected a capacitance such as "4.7 mF" (or a number in F), found "2 mFoo" (unknown unit "mFoo")'],
    [
      "unknown key, with the nearest valid key",
      edit("resistance: 10 ohm", "resistence: 10 ohm"),
      'p.yaml:12: circuit.resistence: expected one of the keys topology, busVoltage, capacitance, resistance, sourceResistance, resistorTemperature, peakCurrentRating, mosfet, converter, load, completion, discharge, relay, protection, contactor (did you mean "resistance"?), found an unknown key',
    ],
    ["missing key", edit("  busVoltage: 48 V\n", ""), 'p.yaml:9: circuit.busVoltage: expected a voltage such as "48 V" (or a number in V) (required), found nothing'],
    ["negative time", edit("run: 10 s", "run: -3 s"), 'p.yaml:17: events[1].run: expected a run time ≥ 0 such as "10 s", found "-3 s"'],
    [
      "unknown event kind",
      edit("run: 10 s", "rnu: 10 s"),
      'p.yaml:17: events[1].rnu: expected one of the keys power-up, fault, run, wait, power-down, lockout, retry, repeat, power-trace (did you mean "run"?), found an unknown key',
    ],
    [
      "two event keys in one item",
      edit("- run: 10 s", "- run: 10 s\n    wait: 2 s"),
      "p.yaml:17: events[1]: expected exactly one event key (power-up, fault, run, wait, power-down, lockout, retry, repeat, power-trace), found run, wait",
    ],
    ["missing part", edit("- run: 10 s", "- power-trace: { part: fet, points: [[0, 1], [1, 1]] }"), 'p.yaml:17: events[1].power-trace.part: expected the id of a part: r, found "fet"'],
    [
      "retry interval shorter than the attempt",
      edit("- run: 10 s", "- retry: { attempts: 3, interval: 0.5 s, lockout: 1 min }"),
      "p.yaml:17: events[1].retry.interval: expected an interval (start to start) at least as long as an attempt can last plus the relay's release and operate times (1.03 s: the completion timeout and 0.03 s for the relay), found 0.5 s",
    ],
    [
      // the default relay (20 ms operate + 10 ms release) cannot open and close again between
      // attempts 1.02 s apart that each last up to the 1 s timeout
      "retry interval with no time left for the relay",
      edit("- run: 10 s", "- retry: { attempts: 3, interval: 1.02 s, lockout: 1 min }"),
      "p.yaml:17: events[1].retry.interval: expected an interval (start to start) at least as long as an attempt can last plus the relay's release and operate times (1.03 s: the completion timeout and 0.03 s for the relay), found 1.02 s",
    ],
    [
      "the profile's own slower relay and a trip delay",
      edit("discharge: { kind: bleeder, resistance: 5 kohm }", "discharge: { kind: bleeder, resistance: 5 kohm }\n  relay: { operate: 45 ms, release: 25 ms }").replace(
        "- run: 10 s",
        "- retry: { attempts: 3, interval: 1.2 s, fault: { type: trip-after-close, after: 150 ms }, lockout: 1 min }",
      ),
      "p.yaml:18: events[1].retry.interval: expected an interval (start to start) at least as long as an attempt can last plus the relay's release and operate times (1.22 s: the completion timeout, the trip delay and 0.07 s for the relay), found 1.2 s",
    ],
    ["negative relay time", edit("discharge: { kind: bleeder, resistance: 5 kohm }", "discharge: { kind: bleeder, resistance: 5 kohm }\n  relay: { operate: -5 ms }"), 'p.yaml:15: circuit.relay.operate: expected an operate time ≥ 0 such as "15 ms", found "-5 ms"'],
    ["timer resolution not a time", edit("events:", "firmware: { timerResolution: 10 V }\nevents:"), 'p.yaml:15: firmware.timerResolution: expected a time such as "350 ms" (or a number in s), found "10 V" (a voltage)'],
    ["role not in the topology", edit("role: resistor", "role: mosfet"), 'p.yaml:5: parts[0].role: expected a role of a series-resistor circuit (resistor), found "mosfet"'],
    ["misspelt topology", edit("topology: series-resistor", "topology: series-resistr"), 'p.yaml:9: circuit.topology: expected one of series-resistor, linear-mosfet, converter (did you mean "series-resistor"?), found "series-resistr"'],
    ["fractional attempts", edit("- run: 10 s", "- retry: { attempts: 2.5, interval: 2 s, lockout: 1 min }"), "p.yaml:17: events[1].retry.attempts: expected a whole number of attempts ≥ 1, at most 10000 (set HEATLEDGER_MAX_PLAN_ATTEMPTS to raise it), found 2.5"],
    ["YAML syntax", edit("ambient: 25 degC", "ambient: [25 degC"), "p.yaml:3: expected valid YAML or JSON, found Flow sequence in block collection must be sufficiently indented and end with a ]"],
    ["duplicate key", edit("ambient: 25 degC", "ambient: 25 degC\nambient: 30 degC"), "p.yaml:3: expected valid YAML or JSON, found Map keys must be unique"],
    ["unreadable CSV", edit("- run: 10 s", "- power-trace: { part: r, file: nothere.csv }"), 'p.yaml:17: events[1].power-trace.file: expected a readable CSV file of time, power, found "nothere.csv" (ENOENT: no such file)'],
    ["CSV with a bad row", edit("- run: 10 s", "- power-trace: { part: r, file: bad.csv }"), 'bad.csv:3: events[1].power-trace.file: expected two plain numbers (time in s, power in W), found "1,x"'],
    ["negative thermal resistance", edit("r: 1 K/W, tau", "r: -1 K/W, tau"), 'p.yaml:6: parts[0].network.stages[0].r: expected a value > 0, found "-1 K/W"'],
    [
      "margin written as an absolute temperature",
      edit("maxTemperature: 150 degC", "maxTemperature: 150 degC, margin: 10 degC"),
      'p.yaml:7: parts[0].limits.margin: expected a temperature difference such as "10 K" (or a number in K); write differences in K, found "10 degC" (an absolute temperature)',
    ],
    ["limit below the ambient", edit("maxTemperature: 150 degC", "maxTemperature: 20 degC"), "p.yaml:7: parts[0].limits.maxTemperature: expected a limit above the ambient (25 °C), found 20 °C"],
    ["discharge without its resistance", edit("discharge: { kind: bleeder, resistance: 5 kohm }", "discharge: { kind: bleeder }"), "p.yaml:14: circuit.discharge.resistance: expected this value (required for a bleeder discharge), found nothing"],
    [
      "no completion rule",
      edit("completion: { fraction: 0.95, timeout: 1 s }", "completion: { timeout: 1 s }"),
      "p.yaml:13: circuit.completion: expected at least one of fraction, within or dwell (when the charge counts as done), found only a timeout",
    ],
    [
      "overload without a load",
      edit("- run: 10 s", "- fault: { type: overloaded-bus }"),
      "p.yaml:17: events[1].fault.load: expected the overload (a load mapping such as { kind: resistive, resistance: 2 ohm }), found nothing",
    ],
    [
      "runaway repeat counts",
      edit("- run: 10 s", "- repeat: { count: 100000, events: [{ repeat: { count: 100000, events: [{ run: 1 s }] } }] }"),
      "p.yaml:16: events: expected a profile that expands to at most 50000000 events, found up to 1.00e+10 events",
    ],
    ["trace points out of order", edit("- run: 10 s", "- power-trace: { part: r, points: [[0, 1], [2 s, 1], [1 s, 0]] }"), "p.yaml:17: events[1].power-trace.points[2]: expected a time after the previous point's 2 s, found 1 s"],
    ["not a mapping at all", "just text", 'p.yaml:1: expected a mapping, found "just text"'],
    ["a word for a number", edit("resistance: 10 ohm", "resistance: ten ohm"), 'p.yaml:12: circuit.resistance: expected a resistance such as "47 ohm" (or a number in ohm), found "ten ohm"'],
    ["power-up without a circuit", NO_CIRCUIT, "p.yaml:8: events[0].power-up: expected a `circuit` section (a power-up runs the pre-charge circuit), found a profile without one"],
    [
      "a network file with a bad key",
      edit("network: { form: foster, stages: [{ r: 1 K/W, tau: 1 s }] }", "network: net.yaml"),
      'net.yaml:3: stages[0].tua: expected one of the keys r, tau, c (did you mean "tau"?), found an unknown key\n' +
        "net.yaml:3: stages[0]: expected exactly one of tau (time constant) or c (heat capacity), found neither",
    ],
  ])("%s", (_name, text, message) => {
    expect(messageOf(text)).toBe(message);
  });

  test("every problem is reported at once", () => {
    const text = edit("capacitance: 2 mF", "capacitance: 2 mV").replace("run: 10 s", "run: -1 s").replace("ambient: 25 degC", "ambient: 25 degC\ncolour: blue");
    const error = (() => {
      try {
        loadProfile(text, "p.yaml", files);
      } catch (e) {
        return e as InputError;
      }
      throw new Error("no error");
    })();
    expect(error.problems.map((p) => `${p.line}:${p.field}`).sort()).toEqual(["12:circuit.capacitance", "18:events[1].run", "3:colour"]);
  });
});

describe("loadProfile: the documented example", () => {
  test("the complete example in docs/profile-format.md loads and simulates", async () => {
    const { readFileSync } = await import("node:fs");
    const { defaultCircuitModels, simulateProfile } = await import("../../src/internal.js");
    const doc = readFileSync(new URL("../../docs/profile-format.md", import.meta.url), "utf8");
    const yaml = doc.slice(doc.indexOf("```yaml\n") + 8, doc.indexOf("```\n", doc.indexOf("```yaml\n") + 8));
    const named: Record<string, string> = {
      "networks/shunt.yaml": "form: foster\nstages:\n  - { r: 5 K/W, tau: 2 s }\n",
      "traces/inrush.csv": "time_s,power_W\n0,0\n0.01,30\n0.5,0\n",
    };
    const profile = loadProfile(yaml, "docs/profile-format.md", (p) => named[p] ?? files(p));
    const result = simulateProfile(profile, { models: defaultCircuitModels });
    expect(result.parts.map((p) => p.id)).toEqual(["precharge-resistor", "logger-shunt"]);
    expect(result.eventCount).toBeGreaterThan(1000);
  });
});
