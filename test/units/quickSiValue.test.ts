import { readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { DIMENSIONS, type Dimension } from "../../src/units/dimensions.js";
import { loadMathjs } from "../../src/units/loadMathjs.js";
import { quickSiValue } from "../../src/units/quickSiValue.js";

// The quick unit reader must give exactly the number mathjs (npm, the reference library the
// project parses units with) gives, or defer to it. mathjs's own path, as parseQuantity took it
// before: the quantity string parsed with math.unit, the dimension checked against the SI unit
// with equalBase, the value read with toNumber(SI unit).
const math = loadMathjs();
const dimensions = (Object.keys(DIMENSIONS) as Dimension[]).filter((d) => d !== "dimensionless");

function byMathjs(magnitude: string, unitText: string, dimension: Dimension): number | undefined {
  let unit;
  try {
    unit = math.unit(`${magnitude} ${unitText}`);
  } catch {
    return undefined;
  }
  if (!unit.equalBase(math.unit(DIMENSIONS[dimension].si))) return undefined;
  return unit.toNumber(DIMENSIONS[dimension].si);
}

/** Every reading the quick reader gives for a unit text agrees with mathjs to the bit; returns how many it gave. */
function agrees(magnitude: string, unitText: string): number {
  let given = 0;
  for (const d of dimensions) {
    const quick = quickSiValue(Number(magnitude), unitText, d);
    if (quick === undefined) continue;
    given++;
    expect(quick, `${magnitude} ${unitText} as ${d}`).toBe(byMathjs(magnitude, unitText, d));
  }
  return given;
}

// Every unit name the quick table could know (and some it must leave to mathjs), bare and with
// every SI prefix, short and long: the quick reader's accepted names are a subset of these.
const NAMES = [
  "s", "second", "seconds", "min", "minute", "minutes", "h", "hour", "hours", "day", "days", "week", "weeks",
  "Hz", "hertz", "F", "farad", "ohm", "V", "volt", "volts", "A", "ampere", "amperes", "W", "watt", "watts",
  "J", "joule", "joules", "g", "gram", "grams", "m", "meter", "meters", "K", "kelvin", "degC", "celsius",
  "degF", "fahrenheit", "t", "tonne", "inch", "in", "ft", "mil", "year", "month", "Wh", "VA", "cal", "erg", "lb", "mile",
];
const PREFIXES = [
  "", "da", "h", "k", "M", "G", "T", "P", "E", "Z", "Y", "R", "Q", "d", "c", "m", "u", "n", "p", "f", "a", "z", "y", "r", "q",
  "deca", "hecto", "kilo", "mega", "giga", "tera", "peta", "exa", "zetta", "yotta", "ronna", "quetta",
  "deci", "centi", "milli", "micro", "nano", "pico", "femto", "atto", "zepto", "yocto", "ronto", "quecto",
];

describe("quickSiValue", () => {
  test("every unit name, bare and with every prefix, reads as mathjs reads it, or is left to mathjs", () => {
    let given = 0;
    for (const name of NAMES) for (const prefix of PREFIXES) given += agrees("1.2345", `${prefix}${name}`);
    // the table covers the project's units: seconds to weeks, the electrical units, mass, length, K and degC
    expect(given).toBeGreaterThan(500);
  });

  test.each([
    "K/W", "K / W", "mK/W", "K/mW", "J/(kg K)", "J/(kg*K)", "J/kg/K", "J kg^-1 K^-1", "kJ/(kg K)", "J/(g K)", "V/K", "mV/K",
    "W^1", "s^-1", "J/K", "kJ/K", "ohm", "kohm", "Mohm", "mohm", "kiloohm", "uF", "nF", "mF", "ms", "us", "kg", "mg", "um", "mm",
    "W*s", "V*A", "J/s", "A*s/V", "(J)/(K)", "J/(K)", "m^2", "J/kg K",
    "A/V^2", "mA/V^2", "A V^-2", "A/V/V", "A/(V V)",
  ])("the compound %j reads as mathjs reads it", (unitText) => {
    agrees("-4.7e-3", unitText);
    agrees("350", unitText);
  });

  test("absolute temperatures in K and degC convert with mathjs's offsets; differences in degC are left to mathjs", () => {
    expect(quickSiValue(313.15, "K", "temperature")).toBe(byMathjs("313.15", "K", "temperature"));
    expect(quickSiValue(40, "degC", "temperature")).toBe(40);
    expect(quickSiValue(5, "mK", "temperature")).toBe(byMathjs("5", "mK", "temperature"));
    // a difference written in degC gets parseQuantity's message from the mathjs path
    expect(quickSiValue(10, "degC", "temperatureDifference")).toBeUndefined();
    expect(quickSiValue(10, "K", "temperatureDifference")).toBe(10);
    expect(quickSiValue(2, "degC/W", "thermalResistance")).toBeUndefined();
  });

  test("anything else is left to mathjs: unknown names, wrong dimensions, broken grammar, fractional powers", () => {
    for (const [text, dimension] of [
      ["fortnight", "time"],
      ["mV", "current"],
      ["K/", "thermalResistance"],
      ["(K/W", "thermalResistance"],
      ["K/W)", "thermalResistance"],
      ["m^0.5", "length"],
      ["degF", "temperature"],
      ["kg m^2 s^-3", "power"],
    ] as const) {
      if (text === "kg m^2 s^-3") expect(quickSiValue(3, text, dimension)).toBe(byMathjs("3", text, dimension));
      else expect(quickSiValue(3, text, dimension), text).toBeUndefined();
    }
  });

  test("every quantity string of the bundled profiles and networks reads as mathjs reads it", () => {
    const root = join(__dirname, "..", "..", "profiles");
    const files = [...readdirSync(root).map((f) => join(root, f)), ...readdirSync(join(root, "networks")).map((f) => join(root, "networks", f))].filter((f) => f.endsWith(".yaml"));
    let checked = 0;
    for (const file of files) {
      for (const m of readFileSync(file, "utf8").matchAll(/(?<![\w.])([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s+([A-Za-z][A-Za-z0-9_^/*() ]*?)\s*(?=[,}\]\n#]|$)/gm)) {
        checked += agrees(m[1]!, m[2]!.trim()) > 0 ? 1 : 0;
      }
    }
    expect(checked).toBeGreaterThan(100);
  });
});
