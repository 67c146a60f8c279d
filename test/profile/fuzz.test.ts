import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { stringify } from "yaml";
import { InputError, defaultCircuitModels, loadProfile, simulateProfile } from "../../src/internal.js";

// Fuzzing: thousands of random and garbled profiles, made by mutating valid ones (wrong
// types, huge and tiny numbers, missing keys, unknown keys, deep repeats with big counts, text
// noise), go through the loader and the simulator. Every one must end in a result whose numbers
// are all finite, or in an InputError with at least one problem; never another exception, a hang
// (the loader bounds the expanded event count and the profile's length) or NaN.

const base = (): Record<string, unknown> => ({
  name: "fuzz",
  ambient: "30 degC",
  parts: [
    { id: "r", role: "resistor", network: { form: "foster", stages: [{ r: "0.5 K/W", tau: "20 ms" }, { r: 2, tau: "3 s" }] }, limits: { maxTemperature: "150 degC", margin: "10 K" } },
    { id: "aux", network: { form: "cauer", stages: [{ r: 1, c: 0.5 }, { r: 2, c: 5 }] }, limits: { maxTemperature: 120 } },
  ],
  circuit: {
    topology: "series-resistor",
    busVoltage: "48 V",
    capacitance: "2 mF",
    resistance: "15 ohm",
    load: { kind: "none" },
    completion: { fraction: 0.95, timeout: "500 ms" },
    discharge: { kind: "bleeder", resistance: "2 kohm" },
  },
  events: [
    { "power-up": {} },
    { run: "10 s" },
    { "power-down": { off: "3 s" } },
    { retry: { attempts: 3, interval: "2 s", backoff: 2, maxInterval: "5 s", fault: { type: "shorted-output" }, faultyAttempts: 2, lockout: "30 s" } },
    { repeat: { count: 3, period: "20 s", events: [{ "power-trace": { part: "aux", points: [[0, 5], ["1 s", 8], [2, 0]] } }, { wait: 1 }] } },
    { fault: { type: "overloaded-bus", load: { kind: "resistive", resistance: "20 ohm" } } },
    { fault: { type: "trip-after-close", after: "200 ms" } },
  ],
});

const garbage = fc.oneof(
  fc.constantFrom<unknown>(null, true, "", "abc", "12 parsecs", "-5 s", "1e400 V", "NaN", [], {}, [1, 2], 0, -1, 1e300, -1e300, 1e-300, 5e-324, 2 ** 53, 1e9, 0.5),
  fc.double({ noNaN: false }),
  fc.string({ maxLength: 8 }),
  fc.integer(),
);

type Path = (string | number)[];

/** Every path to a value inside a plain data tree. */
function paths(value: unknown, prefix: Path = []): Path[] {
  if (value === null || typeof value !== "object") return [prefix];
  const keys: (string | number)[] = Array.isArray(value) ? value.map((_, i) => i) : Object.keys(value);
  return [prefix, ...keys.flatMap((k) => paths((value as Record<string | number, unknown>)[k], [...prefix, k]))];
}

function mutate(tree: Record<string, unknown>, path: Path, how: number, junk: unknown): void {
  if (path.length === 0) return;
  let parent: Record<string | number, unknown> = tree;
  for (const key of path.slice(0, -1)) parent = parent[key] as Record<string | number, unknown>;
  const key = path[path.length - 1]!;
  switch (how) {
    case 0: // replace with garbage
      parent[key] = junk;
      break;
    case 1: // delete (or empty an array slot)
      if (Array.isArray(parent)) parent.splice(Number(key), 1);
      else delete parent[key];
      break;
    case 2: // an unknown key beside it
      if (!Array.isArray(parent)) parent[`${String(key)}x`] = junk;
      break;
    case 3: // wrap it in a repeat with a big count (a deep cycle of repeats)
      parent[key] = { repeat: { count: 100_000, events: [{ repeat: { count: 100_000, events: [parent[key]] } }] } };
      break;
    default: // scale a number to an extreme
      if (typeof parent[key] === "number") parent[key] = (parent[key] as number) * (how === 4 ? 1e200 : 1e-200);
  }
}

function check(text: string): "result" | "input-error" {
  try {
    const profile = loadProfile(text, "fuzz.yaml");
    const events: number[] = [];
    const result = simulateProfile(profile, { models: defaultCircuitModels, onEvent: (e, t) => events.push(e.startS, e.durationS, ...e.energyJ, ...t.peakTemperatureC) });
    for (const p of result.parts) for (const v of [p.peakTemperatureC, p.peakTimeS, p.marginK, p.energyJ, p.endTemperatureC]) expect(Number.isFinite(v)).toBe(true);
    expect(events.every(Number.isFinite)).toBe(true);
    return "result";
  } catch (error) {
    if (error instanceof InputError) {
      expect(error.problems.length).toBeGreaterThan(0);
      for (const p of error.problems) {
        expect(p.expected).not.toMatch(/NaN|undefined|\[object/);
        // a NaN may only appear quoted, as the user's own text
        expect(p.found.replace(/"(?:[^"\\]|\\.)*"/g, "")).not.toMatch(/NaN|undefined|\[object/);
      }
      return "input-error";
    }
    throw error;
  }
}

describe("profile fuzzing", () => {
  test("the base profile itself simulates", () => {
    expect(check(stringify(base()))).toBe("result");
  });

  test("mutated profiles end in a result or an InputError", () => {
    const outcomes = { result: 0, "input-error": 0 };
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.nat(), fc.integer({ min: 0, max: 5 }), garbage), { minLength: 1, maxLength: 4 }),
        fc.boolean(),
        (mutations, asJson) => {
          const tree = base();
          for (const [pick, how, junk] of mutations) {
            const all = paths(tree);
            mutate(tree, all[pick % all.length]!, how, junk);
          }
          outcomes[check(asJson ? JSON.stringify(tree) : stringify(tree))]++;
        },
      ),
      { numRuns: 1500, seed: 20261202 },
    );
    // both kinds must really occur, or the property tested nothing
    expect(outcomes.result).toBeGreaterThan(50);
    expect(outcomes["input-error"]).toBeGreaterThan(50);
  });

  test("garbled text ends in a result or an InputError", () => {
    const text = stringify(base());
    fc.assert(
      fc.property(fc.nat({ max: text.length }), fc.string({ minLength: 1, maxLength: 6 }), (at, noise) => {
        check(text.slice(0, at) + noise + text.slice(at + noise.length));
      }),
      { numRuns: 600, seed: 7 },
    );
  });
});
