import { describe, expect, test } from "vitest";
import { InputError, MATERIALS, materialPreset } from "../../src/internal.js";

// The handbook values each preset must carry, written out again beside their table so a changed
// digit in src/ fails here. All from Incropera, DeWitt, Bergman & Lavine, Fundamentals of Heat and
// Mass Transfer, 7th ed. (2011), at 300 K; recalled, not re-read ("from memory"): check them
// against a printed copy when one is at hand. FR-4, steatite and a ceramic body have no handbook row: typical values,
// common practice, from memory. Exact equality: these are copied values, not computations.
describe("MATERIALS", () => {
  test.each([
    // id,               table,  rho [kg/m³], c_p [J/(kg K)], k [W/(m K)]
    ["copper", "A.1", 8933, 385, 401], // Table A.1 "Copper, pure" (from memory)
    ["aluminium", "A.1", 2702, 903, 237], // Table A.1 "Aluminum, pure" (from memory)
    ["aluminium-2024", "A.1", 2770, 875, 177], // Table A.1 "Aluminum alloy 2024-T6" (from memory)
    ["brass", "A.1", 8530, 380, 110], // Table A.1 "Brass, cartridge" (from memory)
    ["steel", "A.1", 7854, 434, 60.5], // Table A.1 "Carbon steel, plain" (from memory)
    ["stainless-304", "A.1", 7900, 477, 14.9], // Table A.1 "Stainless steel, AISI 304" (from memory)
    ["nichrome", "A.1", 8400, 420, 12], // Table A.1 "Nichrome (80% Ni, 20% Cr)" (from memory)
    ["constantan", "A.1", 8920, 384, 23], // Table A.1 "Constantan" (from memory)
    ["nickel", "A.1", 8900, 444, 90.7], // Table A.1 "Nickel, pure" (from memory)
    ["silicon", "A.1", 2330, 712, 148], // Table A.1 "Silicon" (from memory)
    ["alumina", "A.2", 3970, 765, 36], // Table A.2 "Aluminum oxide, polycrystalline" (from memory)
    ["silicon-carbide", "A.2", 3160, 675, 490], // Table A.2 "Silicon carbide" (from memory)
    ["steatite", "none", 2700, 900, 2.5], // typical steatite ceramic (common practice, from memory)
    ["ceramic", "none", 2500, 850, 1.5], // typical technical ceramic body (common practice, from memory)
    ["fr4", "none", 1850, 1100, 0.3], // typical FR-4 laminate (common practice, from memory)
  ] as const)("preset %s equals Incropera Table %s values", (id, table, density, specificHeat, conductivity) => {
    const m = materialPreset(id);
    expect([m.densityKgPerM3, m.specificHeatJPerKgK, m.conductivityWPerMK]).toEqual([density, specificHeat, conductivity]);
    expect(m.source).toContain(table === "none" ? "no handbook table" : `Table ${table}`);
    expect(m.provenance).toBe("from memory");
  });

  test("every preset is covered by the table above", () => {
    expect(MATERIALS.length).toBe(15);
  });

  test("materialPreset accepts the US spelling and any case", () => {
    expect(materialPreset("Aluminum").id).toBe("aluminium");
  });

  test("materialPreset names the known presets when the name is unknown", () => {
    expect(() => materialPreset("unobtainium")).toThrow(InputError);
    expect(() => materialPreset("unobtainium")).toThrow(/^material: expected one of the material presets copper, aluminium, .*, found "unobtainium"$/);
  });
});
