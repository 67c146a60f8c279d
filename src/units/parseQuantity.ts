import { describeFound, inputError } from "../errors/InputError.js";
import { DIMENSIONS, type Dimension, expectedWords } from "./dimensions.js";
import { loadMathjs } from "./loadMathjs.js";
import { checkQuantityRange } from "./quantityRanges.js";
import { quickSiValue } from "./quickSiValue.js";
import type { Unit } from "mathjs";

/** A number followed by a unit made only of unit characters: no expression is ever evaluated. */
const QUANTITY_PATTERN = /^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(%|[A-Za-z_][A-Za-z0-9_ ^/*().-]*)?\s*$/;

/** Spellings users type that mathjs does not know, mapped to the names it does. */
const SPELLINGS: ReadonlyArray<readonly [RegExp, string]> = [
  [/µ|μ/g, "u"],
  [/Ω|Ohm\b|Ohms\b|ohms\b/g, "ohm"],
  [/°C|℃|Celsius\b|celsius\b/g, "degC"],
  [/°F/g, "degF"],
  [/²/g, "^2"],
];

function normalise(text: string): string {
  return SPELLINGS.reduce((t, [pattern, replacement]) => t.replace(pattern, replacement), text);
}

/** Probe unit whose base the parsed unit must share, per dimension. */
const PROBE: Record<Exclude<Dimension, "dimensionless">, string> = {
  time: "s",
  frequency: "Hz",
  capacitance: "F",
  resistance: "ohm",
  voltage: "V",
  current: "A",
  power: "W",
  energy: "J",
  mass: "kg",
  length: "m",
  temperature: "K",
  temperatureDifference: "K",
  thermalResistance: "K/W",
  heatCapacity: "J/K",
  specificHeat: "J/(kg K)",
  voltagePerKelvin: "V/K",
  transconductanceParameter: "A/V^2",
  inductance: "H",
  voltageRate: "V/s",
  currentSquaredTime: "A^2 s",
  energyPerResistance: "J/ohm",
};

/** Names mathjs gives to base dimensions, turned into words for "found 4.7 mV (a voltage)". */
function dimensionOf(unit: { equalBase(other: unknown): boolean }, math: ReturnType<typeof loadMathjs>): string {
  for (const [name, probe] of Object.entries(PROBE)) {
    if (name === "temperatureDifference") continue;
    if (unit.equalBase(math.unit(probe))) return DIMENSIONS[name as Dimension].words;
  }
  return "another dimension";
}

/**
 * Parse a quantity from a profile or network file into a plain number in the SI unit of its
 * dimension (degrees Celsius for absolute temperatures, kelvin for differences).
 *
 * Accepts a finite number (already SI) or a string "number unit" such as "4.7 mF", "350 ms",
 * "2.5 K/W", "40 degC", "12 J/K", "10 kΩ", "2.2 µF". Strings are parsed with mathjs units only:
 * no expression is evaluated. A temperature difference must be written in K (or mK): "10 degC"
 * is an absolute temperature, and the message says so.
 *
 * Source: SI brochure, 9th ed. (BIPM 2019), §2.3 (base and coherent derived units) and §3,
 * Table 7 (prefixes) (section and table numbers from memory).
 * The units files use are read by quickSiValue, with mathjs' numbers and without loading it; any
 * other unit text (and every error message) goes through mathjs.
 * Cost: O(length of the string); the first string quickSiValue does not read loads mathjs (a few
 * tenths of a second).
 * @param value the raw value from the file
 * @param dimension the dimension the field expects
 * @param field dotted field path, used in the error message
 * @returns the value in the dimension's SI unit
 * Magnitudes outside QUANTITY_RANGES (a resistance of 1e308 ohm) are refused here, where the
 * line is known, rather than overflowing later.
 * @throws InputError with code `bad-quantity`, `wrong-dimension`, `unknown-unit`, `not-finite` or `out-of-range`
 * @example
 * parseQuantity("4.7 mF", "capacitance", "circuit.capacitance") // => 0.0047
 */
export function parseQuantity(value: unknown, dimension: Dimension, field: string): number {
  return checkQuantityRange(siValue(value, dimension, field), dimension, field, value);
}

/** parseQuantity without the range check. */
function siValue(value: unknown, dimension: Dimension, field: string): number {
  const expected = expectedWords(dimension);
  if (typeof value === "number") {
    if (!Number.isFinite(value)) throw inputError("not-finite", field, `${expected}, a finite number`, describeFound(value));
    return value;
  }
  if (typeof value !== "string") throw inputError("bad-quantity", field, expected, describeFound(value));
  const text = normalise(value);
  const match = QUANTITY_PATTERN.exec(text);
  if (match === null || value.trim() === "") throw inputError("bad-quantity", field, expected, describeFound(value));
  const magnitude = Number(match[1]);
  const unitText = (match[2] ?? "").trim();
  if (!Number.isFinite(magnitude)) throw inputError("not-finite", field, `${expected}, a finite number`, describeFound(value));
  if (unitText === "") return magnitude;
  if (dimension === "dimensionless") {
    if (unitText === "%") return magnitude / 100;
    throw inputError("wrong-dimension", field, expected, `${describeFound(value)} (a unit where none belongs)`);
  }
  const quick = quickSiValue(magnitude, unitText, dimension);
  if (quick !== undefined) {
    if (!Number.isFinite(quick)) throw inputError("not-finite", field, `${expected}, a finite number`, describeFound(value));
    return quick;
  }
  const math = loadMathjs();
  let unit: Unit;
  try {
    unit = math.unit(`${match[1]} ${unitText}`) as Unit;
  } catch {
    throw inputError("unknown-unit", field, expected, `${describeFound(value)} (unknown unit "${unitText}")`);
  }
  if (!unit.equalBase(math.unit(PROBE[dimension]))) {
    throw inputError("wrong-dimension", field, expected, `${describeFound(value)} (${dimensionOf(unit, math)})`);
  }
  if (dimension === "temperatureDifference" && /deg[CF]|degC|degF|fahrenheit/.test(unitText)) {
    throw inputError(
      "wrong-dimension",
      field,
      `${expected}; write differences in K`,
      `${describeFound(value)} (an absolute temperature)`,
    );
  }
  const si = unit.toNumber(DIMENSIONS[dimension].si);
  if (!Number.isFinite(si)) throw inputError("not-finite", field, `${expected}, a finite number`, describeFound(value));
  return si;
}
