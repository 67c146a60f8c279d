import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { loadProfile } from "../../src/internal.js";
import { expectClose } from "../helpers/expectClose.js";

// A part names a series of a resistor family file; the loader reads it relative to the profile,
// checks it in its own file and lays the part's keys over it.

const PROFILES = join(import.meta.dirname, "..", "..", "profiles");
const read = (path: string): string => readFileSync(join(PROFILES, path), "utf8");

const PROFILE = (ratings: string) => `name: family test
ambient: 25 degC
parts:
  - id: r1
    role: resistor
    network: { form: foster, stages: [{ r: 0.1 K/W, tau: 0.5 s }] }
    limits: { maxTemperature: 300 degC }
    ratings:
${ratings}
circuit:
  topology: series-resistor
  busVoltage: 400 V
  capacitance: 1 mF
  resistance: 68 ohm
  completion: { fraction: 0.95, timeout: 1 s }
  discharge: { kind: bleeder, resistance: 100 kohm }
events:
  - power-up: {}
`;

describe("resistor families", () => {
  test("the bundled profile reads the wire-wound series at its 68 ohm", () => {
    const profile = loadProfile(read("storage-400v-resistor-family.yaml"), "profiles/storage-400v-resistor-family.yaml", read);
    const stress = profile.parts[0]!.stress!;
    expect(stress.pulseEnergyForm).toBe("energy-per-ohm");
    // 10 ms column between 10 ohm (110 J/ohm) and 100 ohm (7.2 J/ohm): 68·110·(7.2/110)^log10(6.8)
    // = 68·11.3672 = 772.97 J (log-log interpolation, common practice; arithmetic by hand)
    expectClose(stress.pulseEnergy![0]!.energyJ, 772.97, { rel: 1e-5 });
    expect(stress.voltage).toEqual({ limitingElementV: 600, pulseV: 1200 });
    expect(stress.adiabatic?.heatCapacityJPerK).toBeCloseTo(0.008 * 420, 12);
  });

  test("the part's own keys lie over the series'", () => {
    const text = PROFILE("      series: { file: parts/resistor-families.yaml, id: ww-housed-100w }\n      resistance: 68 ohm\n      voltage: { limitingElement: 300 V }");
    const stress = loadProfile(text, "profiles/t.yaml", read).parts[0]!.stress!;
    expect(stress.voltage).toEqual({ limitingElementV: 300, pulseV: undefined });
  });

  test("an unknown series id names the ids the file has", () => {
    const text = PROFILE("      series: { file: parts/resistor-families.yaml, id: ww-9 }\n      resistance: 68 ohm");
    expect(() => loadProfile(text, "profiles/t.yaml", read)).toThrow(/parts\[0\]\.ratings\.series\.id: expected the id of a series in parts\/resistor-families\.yaml: "ww-housed-100w", "smd-thick-film-2512", found "ww-9"/);
  });

  test("a bad value in the family file is reported in that file, at its line", () => {
    const family = read("parts/resistor-families.yaml").replace("{ duration: 1 ms, power: 250 W }", "{ duration: 1 ms, power: 2500 W }");
    const files = (path: string): string => (path === "parts/f.yaml" ? family : read(path));
    const text = PROFILE("      series: { file: parts/f.yaml, id: smd-thick-film-2512 }");
    const line = family.split("\n").findIndex((l) => l.includes("2500 W")) + 1;
    expect(() => loadProfile(text, "profiles/t.yaml", files)).toThrow(
      new RegExp(`parts/f\\.yaml:${line}: series\\[1\\]\\.ratings\\.pulsePower\\[1\\]\\.power: expected powers that do not rise with the duration`),
    );
  });

  test("a part rated in energy per ohm needs its resistance", () => {
    const text = PROFILE("      series: { file: parts/resistor-families.yaml, id: ww-housed-100w }");
    expect(() => loadProfile(text, "profiles/t.yaml", read)).toThrow(/parts\[0\]\.ratings\.resistance: expected the part's resistance value/);
  });
});
