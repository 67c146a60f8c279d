import { describe, expect, test } from "vitest";
import { AttemptCursor, InputError, cornerScenarios, createModalState, fosterToModal, minForeverInterval, resolveScenario } from "../../src/internal.js";
import { rectangularFault } from "./scenarios.js";

describe("corner checks", () => {
  const model = fosterToModal({ kind: "foster", stages: [{ rKPerW: 2, tauS: 10 }] });

  test("a limit below ambient is bad input naming the corner's limit", () => {
    const corner = rectangularFault("cold store", model, 50, 1, { ambientC: 25, limitC: 20, marginK: 0 });
    expect(() => minForeverInterval([corner])).toThrow(InputError);
    expect(() => resolveScenario(corner, "corners[0]")).toThrow("corners[0].limitC: expected a temperature limit above ambient (25 °C) plus the margin (0 K), found 20 °C");
  });

  test("a margin that eats the whole headroom is bad input too", () => {
    const corner = rectangularFault("tight", model, 50, 1, { ambientC: 25, limitC: 40, marginK: 15 });
    expect(() => resolveScenario(corner, "c")).toThrow("c.limitC: expected a temperature limit above ambient (25 °C) plus the margin (15 K), found 40 °C");
  });

  test("a corner set with an unknown parameter is bad input naming it", () => {
    const build = (p: Readonly<Record<string, number>>, name: string) => rectangularFault(name, model, p["powerW"]!, 1, { ambientC: p["ambientC"]!, limitC: 90, marginK: 5 });
    const nominal = { powerW: 50, ambientC: 25 };
    expect(cornerScenarios(nominal, [{ name: "hot", values: { ambientC: 45 } }], build).map((c) => [c.name, c.ambientC])).toEqual([["hot", 45]]);
    expect(() => cornerScenarios(nominal, [{ name: "hot", values: { ambientC: 45 } }, { name: "odd", values: { humidity: 0.9 } }], build)).toThrow(
      'corners[1].humidity: expected one of the corner parameters powerW, ambientC, found "humidity"',
    );
    expect(() => cornerScenarios(nominal, [{ name: "a", values: {} }, { name: "a", values: {} }], build)).toThrow('corners[1].name: expected a corner name used once, found "a"');
  });

  test("a shortest wait that is negative is bad input naming it", () => {
    const corner = { ...rectangularFault("relay", model, 50, 1, { ambientC: 25, limitC: 90, marginK: 5 }), minWaitS: -0.01 };
    expect(() => resolveScenario(corner, "c")).toThrow("c.minWaitS: expected a finite shortest wait ≥ 0 s, found -0.01");
  });

  test("an attempt sooner than the shortest wait after the previous one cannot happen; the first attempt and a resumed start are free", () => {
    const corner = resolveScenario({ ...rectangularFault("relay", model, 50, 1, { ambientC: 25, limitC: 90, marginK: 5 }), minWaitS: 0.05 });
    const cursor = new AttemptCursor(corner);
    expect(cursor.earliestNextS).toBe(0);
    cursor.keep(cursor.tryAt(0)!);
    expect(cursor.earliestNextS).toBe(1.05);
    expect(cursor.tryAt(1.04)).toBeNull();
    expect(cursor.tryAt(1.05)).not.toBeNull();
    const resumed = AttemptCursor.resume(corner, { state: createModalState(model), endS: 0, endVoltageV: 0, attempts: 0 });
    expect(resumed.tryAt(0)).not.toBeNull();
  });

  test("an attempt model returning a bad trace is reported, not simulated", () => {
    const corner = { ...rectangularFault("bad", model, 50, 1, { ambientC: 25, limitC: 90, marginK: 5 }), attempt: () => ({ trace: [{ startS: 0, durationS: 2, terms: [] }], durationS: 1, endVoltageV: 0 }) };
    expect(() => minForeverInterval([corner])).toThrow("corners.bad.attempt[0].trace: expected power only within the attempt (0 to 1 s), found a segment ending at 2 s");
  });
});
