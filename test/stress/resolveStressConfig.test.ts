import { readFileSync } from "node:fs";
import { describe, expect, test } from "vitest";
import { parse } from "yaml";
import { DEFAULT_CYCLE_HYSTERESIS_K, InputError, resolveStressConfig } from "../../src/internal.js";

function message(raw: unknown, options: Parameters<typeof resolveStressConfig>[1] = { field: "parts[0]" }): string {
  try {
    resolveStressConfig(raw, options);
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    return (error as Error).message;
  }
  throw new Error("expected an InputError");
}

describe("resolveStressConfig", () => {
  test("parses every quantity to SI and fills published defaults where the source is named", () => {
    const c = resolveStressConfig({
      id: "R1", // other part keys pass through untouched
      ratings: {
        pulseEnergy: [
          { duration: "1 ms", energy: "5 J" },
          { duration: "100 ms", energy: 40 },
        ],
        soa: [
          { duration: "100 us", points: [{ vds: "10 V", id: "100 A" }, { vds: "100 V", id: "20 A" }] },
          { duration: "dc", points: [{ vds: 10, id: 10 }] },
        ],
      },
      lifetime: { model: "lesit" },
      cycleHysteresis: "500 mK",
    });
    expect(c.pulseEnergy).toEqual([
      { durationS: 1e-3, energyJ: 5 },
      { durationS: 0.1, energyJ: 40 },
    ]);
    expect(c.soa![0]!.durationS).toBeCloseTo(1e-4, 15);
    expect(c.soa![1]!.durationS).toBe(Number.POSITIVE_INFINITY);
    expect(c.lifetime!.name).toBe("LESIT (Held et al., 1997)");
    expect(c.cycleHysteresisK).toBeCloseTo(0.5, 15);
  });

  test("defaults: no tables, no model, the default hysteresis", () => {
    expect(resolveStressConfig({})).toEqual({ pulseEnergy: undefined, soa: undefined, lifetime: undefined, cycleHysteresisK: DEFAULT_CYCLE_HYSTERESIS_K });
  });

  test("SOA derating temperatures are read in °C and must leave headroom", () => {
    const soa = [{ duration: "dc", points: [{ vds: 10, id: 10 }] }];
    expect(resolveStressConfig({ ratings: { soa, soaDerating: { reference: "25 degC", maxJunction: "448.15 K" } } }).soaDerating!.maxJunctionC).toBeCloseTo(175, 12);
    expect(message({ ratings: { soa, soaDerating: { reference: "25 degC", maxJunction: "20 degC" } } })).toBe(
      'parts[0].ratings.soaDerating.maxJunction: expected a temperature above the reference 25 °C, found "20 degC"',
    );
  });

  test("a pulse-energy table is derated from 25 °C by default to the part's limit, or as the rating says", () => {
    const pulseEnergy = [{ duration: "1 s", energy: "100 J" }];
    expect(resolveStressConfig({ ratings: { pulseEnergy } }, { limitC: 180 }).pulseEnergyDerating).toEqual({
      referenceC: 25,
      maxTemperatureC: 180,
      referenceFrom: "default",
      maxTemperatureFrom: "part limit",
    });
    const given = resolveStressConfig({ ratings: { pulseEnergy, pulseEnergyDerating: { reference: "70 degC", maxTemperature: "623.15 K" } } }, { limitC: 180 });
    expect(given.pulseEnergyDerating).toMatchObject({ referenceC: 70, referenceFrom: "profile", maxTemperatureFrom: "profile" });
    expect(given.pulseEnergyDerating!.maxTemperatureC).toBeCloseTo(350, 12);
    // no table: nothing to derate; no limit and no maxTemperature (a library call): not derated, and the note says so
    expect(resolveStressConfig({}, { limitC: 180 }).pulseEnergyDerating).toBeUndefined();
    const bare = resolveStressConfig({ ratings: { pulseEnergy } });
    expect(bare.pulseEnergyDerating).toBeUndefined();
  });

  test.each([
    [
      { pulseEnergyDerating: { maxTemperature: "20 degC" } },
      180,
      'parts[0].ratings.pulseEnergyDerating.maxTemperature: expected a temperature above the reference 25 °C, found "20 degC"',
    ],
    [
      {},
      20,
      "parts[0].ratings.pulseEnergyDerating.reference: expected a temperature below the part's limit 20 °C, where the allowance reaches zero (or a maxTemperature of the rating above it), found 25 °C (the default)",
    ],
    [
      { pulseEnergyDerating: { reference: "5 s" } },
      180,
      'parts[0].ratings.pulseEnergyDerating.reference: expected a temperature such as "40 degC" (or a number in degC), found "5 s" (a time)',
    ],
  ])("pulse-energy derating %j with a part limit of %d °C is refused: %s", (keys, limitC, expected) => {
    expect(message({ ratings: { pulseEnergy: [{ duration: "1 s", energy: "100 J" }], ...keys } }, { field: "parts[0]", limitC })).toBe(expected);
  });

  test("CIPS 2008 reads a wire diameter with a unit", () => {
    const c = resolveStressConfig({ lifetime: { model: "cips2008", currentPerWire: "10 A", voltageClass: "600 V", wireDiameter: "300 um" } });
    expect(c.lifetime!.parameterWarnings.some((w) => w.includes("from memory"))).toBe(true);
  });

  test.each([
    [
      "a non-monotonic energy table",
      { ratings: { pulseEnergy: [{ duration: "10 ms", energy: "5 J" }, { duration: "1 ms", energy: "8 J" }] } },
      "parts[0].ratings.pulseEnergy[1].duration: expected durations in increasing order (greater than 0.01 s of row 0), found 0.001 s",
    ],
    [
      "a wrong unit",
      { ratings: { pulseEnergy: [{ duration: "10 mJ", energy: "5 J" }] } },
      'parts[0].ratings.pulseEnergy[0].duration: expected a time such as "350 ms" (or a number in s), found "10 mJ" (an energy)',
    ],
    [
      "a negative Coffin-Manson exponent",
      { lifetime: { model: "coffin-manson", referenceCycles: 1e4, referenceRange: "100 K", exponent: -4 } },
      "parts[0].lifetime.exponent: expected an exponent n > 0 (life falls as the range grows), found -4",
    ],
    [
      "a missing parameter",
      { lifetime: { model: "coffin-manson", referenceCycles: 1e4, exponent: 4 } },
      'parts[0].lifetime.referenceRange: expected a number in SI units or a string with a unit (such as "10 ms"), found nothing',
    ],
    [
      "a missing CIPS part quantity",
      { lifetime: { model: "cips2008", currentPerWire: "10 A", voltageClass: "600 V" } },
      "parts[0].lifetime.wireDiameter: expected a number in SI units or a string with a unit",
    ],
    [
      "an unknown model",
      { lifetime: { model: "arrhenius" } },
      'parts[0].lifetime.model: expected a lifetime model: one of "coffin-manson", "norris-landzberg", "lesit", "cips2008" with its parameters, found "arrhenius"',
    ],
    [
      "an unknown key",
      { lifetime: { model: "lesit", coefficent: 640 } },
      'parts[0].lifetime: expected only the keys this object knows, found "coefficent"',
    ],
    [
      "a fitted range upside down",
      { lifetime: { model: "lesit", fittedRange: { range: ["80 K", "30 K"] } } },
      'parts[0].lifetime.fittedRange.range[1]: expected a highest value ≥ the lowest (80), found "30 K"',
    ],
    [
      "a negative hysteresis",
      { cycleHysteresis: "-1 K" },
      'parts[0].cycleHysteresis: expected a temperature difference ≥ 0 K, found "-1 K"',
    ],
  ])("%s gets a clear message", (_what, raw, expected) => {
    expect(message(raw)).toContain(expected);
  });

  test("a resistor may only use Coffin-Manson: no cycling model is published for resistors", () => {
    expect(message({ lifetime: { model: "lesit" } }, { field: "parts[2]", partKind: "resistor" })).toBe(
      'parts[2].lifetime.model: expected "coffin-manson" with your own parameters, or no lifetime key (no cycling model is published for resistors), found "lesit"',
    );
  });
});

describe("the stress keys example in docs/stress.md", () => {
  test("resolves without error, so the guide cannot rot", () => {
    const guide = readFileSync(new URL("../../docs/stress.md", import.meta.url), "utf8");
    const block = /```yaml\n(parts:[\s\S]*?)```/.exec(guide);
    expect(block).not.toBeNull();
    const doc = parse(block![1]!) as { parts: { id: string }[] };
    const kinds = { Q1: "mosfet", R1: "resistor" } as const;
    for (const part of doc.parts) {
      const config = resolveStressConfig(part, { field: part.id, partKind: kinds[part.id as keyof typeof kinds] });
      expect(config.lifetime).toBeDefined();
    }
  });
});
