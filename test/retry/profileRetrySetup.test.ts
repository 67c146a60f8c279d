import { describe, expect, test } from "vitest";
import { InputError, defaultCircuitModels, loadProfile, profileRetrySetup, retryPolicyVerdict, simulateProfile } from "../../src/internal.js";
import type { TimelineEvent } from "../../src/profile/expandTimeline.js";
import { expectClose } from "../helpers/expectClose.js";

// The planner's reading of a profile's retry block against the profile layer's own expansion and
// simulation (an independent path: expandTimeline + simulateProfile). Invented profiles.
const PROFILE = (fault: string, discharge: string) => `name: retry cross-check
ambient: 30 degC
parts:
  - id: r
    role: resistor
    network: { form: foster, stages: [{ r: 0.5 K/W, tau: 1.5 s }, { r: 2 K/W, tau: 40 s }] }
    limits: { maxTemperature: 250 degC, margin: 20 K }
circuit:
  topology: series-resistor
  busVoltage: 120 V
  capacitance: 2 mF
  resistance: 15 ohm
  completion: { fraction: 0.9, timeout: 400 ms }
  discharge: ${discharge}
events:
  - retry:
      attempts: 7
      interval: 0.8 s
      backoff: 1.5
      maxInterval: 2 s
      fault: ${fault}
      lockout: 30 s
`;

describe("profileRetrySetup", () => {
  test.each([
    ["shorted bus", "{ type: shorted-output }", "{ kind: bleeder, resistance: 2 kohm }"],
    ["trip after each completed charge", "{ type: trip-after-close, after: 50 ms }", "{ kind: active, resistance: 100 ohm }"],
  ])("%s: the policy's burst matches the profile's own simulation attempt by attempt", (_name, fault, discharge) => {
    const profile = loadProfile(PROFILE(fault, discharge), "p.yaml");
    const attempts: { startS: number; peakC: number }[] = [];
    simulateProfile(profile, {
      models: defaultCircuitModels,
      onEvent: (event: TimelineEvent, temps) => {
        if (event.kind !== "lockout" && event.label.includes("attempt")) attempts.push({ startS: event.startS, peakC: temps.peakTemperatureC[0]! });
      },
    });
    const setup = profileRetrySetup(profile, defaultCircuitModels);
    const verdict = retryPolicyVerdict(setup.scenarios, setup.policy, setup.lockoutS);
    const records = verdict.perCorner[0]!.attempts;
    expect(records).toHaveLength(7);
    expect(attempts).toHaveLength(7);
    records.forEach((r, k) => {
      // same start times: the profile's start-to-start back-off min(0.8·1.5^(k−1), 2 s), overruns
      // starting at the previous end; rounding of sums of times only
      expectClose(r.startS, attempts[k]!.startS, { rel: 1e-12, abs: 1e-12 });
      // the resistor is the driving point and its power never rises within an attempt, so the
      // attempt's own peak is inside the attempt, where both paths integrate the same traces
      // exactly; the profile path finds interior maxima to 1e-12 of the step, hence 1e-9 K
      expectClose(r.peakC, attempts[k]!.peakC, { abs: 1e-9 });
    });
  });

  test("a profile without a retry block that meets a fault is refused", () => {
    const text = PROFILE("{ type: shorted-output }", "{ kind: none }").replace(/ {6}fault: .*\n/, "");
    expect(() => profileRetrySetup(loadProfile(text, "p.yaml"), defaultCircuitModels)).toThrow(InputError);
    expect(() => profileRetrySetup(loadProfile(text, "p.yaml"), defaultCircuitModels)).toThrow("events: expected a retry block with a fault (the fault the planner retries into), found none");
  });

  test("a lockout map whose longest interval is not above its shortest is refused when the profile loads, naming both and the line", () => {
    const text = `${PROFILE("{ type: shorted-output }", "{ kind: none }")}retryPlan:
  map: { from: 2 s, to: 1 s }
`;
    const line = text.split("\n").findIndex((l) => l.includes("map: { from")) + 1;
    expect(() => profileRetrySetup(loadProfile(text, "p.yaml"), defaultCircuitModels)).toThrow(`p.yaml:${line}: retryPlan.map.to: expected a longest interval above the shortest (retryPlan.map.from = 2 s), found 1 s`);
  });
});

describe("profileRetrySetup with two parts on one network", () => {
  test("a linear MOSFET and its source resistor on a shared heatsink: both parts match the profile's simulation", () => {
    // Invented graph network (die, case, resistor, sink) shared by both parts through one file.
    const network = `form: graph
nodes: [{ id: die, c: 0.012 J/K }, { id: case, c: 0.9 J/K }, { id: resistor, c: 0.6 J/K }, { id: sink, c: 85 J/K }]
links:
  - { from: die, to: case, r: 0.45 K/W }
  - { from: case, to: sink, r: 0.5 K/W }
  - { from: resistor, to: sink, r: 3.0 K/W }
  - { from: sink, to: ambient, r: 1.1 K/W }
sources: [die, resistor]
observed: [die, resistor, sink]
`;
    const text = `name: shared sink cross-check
ambient: 25 degC
parts:
  - { id: fet, role: mosfet, network: net.yaml, source: die, observe: die, limits: { maxTemperature: 175 degC, margin: 15 K } }
  - { id: rs, role: source-resistor, network: net.yaml, source: resistor, observe: resistor, limits: { maxTemperature: 200 degC, margin: 20 K } }
circuit:
  topology: linear-mosfet
  busVoltage: 48 V
  capacitance: 2 mF
  mosfet: { gateVoltage: 6 V, thresholdVoltage: 4 V, sourceResistor: 1 ohm, rdsOn: 10 mohm }
  completion: { fraction: 0.95, timeout: 300 ms }
  discharge: { kind: bleeder, resistance: 1 kohm }
events:
  - retry: { attempts: 4, interval: 1 s, fault: { type: shorted-output }, lockout: 30 s }
`;
    const profile = loadProfile(text, "p.yaml", () => network);
    const seen: number[][] = [];
    simulateProfile(profile, {
      models: defaultCircuitModels,
      onEvent: (event: TimelineEvent, temps) => {
        if (event.kind !== "lockout") seen.push([...temps.peakTemperatureC]);
      },
    });
    const setup = profileRetrySetup(profile, defaultCircuitModels);
    expect(setup.scenarios.map((s) => s.name)).toEqual(["nominal / fet", "nominal / rs"]);
    const verdict = retryPolicyVerdict(setup.scenarios, setup.policy, setup.lockoutS);
    verdict.perCorner.forEach((corner, part) => {
      corner.attempts.forEach((r, k) => {
        // the die peaks inside the attempt (driving point); the resistor node also peaks inside
        // it here; both paths integrate the same traces exactly: rounding only, plus the 1e-12
        // bracket of the interior peak search
        expectClose(r.peakC, seen[k]![part]!, { abs: 1e-9 });
      });
    });
  });
});
