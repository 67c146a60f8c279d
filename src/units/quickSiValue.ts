import { DIMENSIONS, type Dimension } from "./dimensions.js";

/**
 * Exponents of the nine base dimensions, in mathjs' order: mass, length, time, current,
 * temperature, luminous intensity, amount of substance, angle, bit.
 */
type BaseDimensions = readonly number[];

/** A unit of the quick table: mathjs' value in SI, its offset (temperatures) and its prefix set. */
interface QuickUnit {
  readonly value: number;
  readonly offset: number;
  readonly dimensions: BaseDimensions;
  readonly prefixes: "none" | "short" | "long" | "short+long";
}

const TIME = [0, 0, 1, 0, 0, 0, 0, 0, 0];
const MASS = [1, 0, 0, 0, 0, 0, 0, 0, 0];
const LENGTH = [0, 1, 0, 0, 0, 0, 0, 0, 0];
const TEMPERATURE = [0, 0, 0, 0, 1, 0, 0, 0, 0];
const CURRENT = [0, 0, 0, 1, 0, 0, 0, 0, 0];
const FREQUENCY = [0, 0, -1, 0, 0, 0, 0, 0, 0];
const CAPACITANCE = [-1, -2, 4, 2, 0, 0, 0, 0, 0];
const RESISTANCE = [1, 2, -3, -2, 0, 0, 0, 0, 0];
const VOLTAGE = [1, 2, -3, -1, 0, 0, 0, 0, 0];
const POWER = [1, 2, -3, 0, 0, 0, 0, 0, 0];
const ENERGY = [1, 2, -2, 0, 0, 0, 0, 0, 0];

const unit = (value: number, dimensions: BaseDimensions, prefixes: QuickUnit["prefixes"], offset = 0): QuickUnit => ({ value, offset, dimensions, prefixes });

/**
 * The units heatledger's files use, with mathjs' definitions (names, values, offsets, prefix
 * sets) copied exactly, so that a quantity parsed here is the same number mathjs gives:
 * test/units/quickSiValue.test.ts checks every name and every prefixed name this table accepts
 * against mathjs itself.
 */
const UNITS: Readonly<Record<string, QuickUnit>> = {
  s: unit(1, TIME, "short"),
  second: unit(1, TIME, "long"),
  seconds: unit(1, TIME, "long"),
  min: unit(60, TIME, "none"),
  minute: unit(60, TIME, "none"),
  minutes: unit(60, TIME, "none"),
  h: unit(3600, TIME, "none"),
  hour: unit(3600, TIME, "none"),
  hours: unit(3600, TIME, "none"),
  day: unit(86400, TIME, "none"),
  days: unit(86400, TIME, "none"),
  week: unit(604800, TIME, "none"),
  weeks: unit(604800, TIME, "none"),
  Hz: unit(1, FREQUENCY, "short"),
  hertz: unit(1, FREQUENCY, "long"),
  F: unit(1, CAPACITANCE, "short"),
  farad: unit(1, CAPACITANCE, "long"),
  ohm: unit(1, RESISTANCE, "short+long"),
  V: unit(1, VOLTAGE, "short"),
  volt: unit(1, VOLTAGE, "long"),
  volts: unit(1, VOLTAGE, "long"),
  A: unit(1, CURRENT, "short"),
  ampere: unit(1, CURRENT, "long"),
  amperes: unit(1, CURRENT, "long"),
  W: unit(1, POWER, "short"),
  watt: unit(1, POWER, "long"),
  watts: unit(1, POWER, "long"),
  J: unit(1, ENERGY, "short"),
  joule: unit(1, ENERGY, "long"),
  joules: unit(1, ENERGY, "long"),
  g: unit(0.001, MASS, "short"),
  gram: unit(0.001, MASS, "long"),
  grams: unit(0.001, MASS, "long"),
  m: unit(1, LENGTH, "short"),
  meter: unit(1, LENGTH, "long"),
  meters: unit(1, LENGTH, "long"),
  K: unit(1, TEMPERATURE, "short"),
  kelvin: unit(1, TEMPERATURE, "long"),
  degC: unit(1, TEMPERATURE, "short", 273.15),
  celsius: unit(1, TEMPERATURE, "long", 273.15),
};

/** mathjs' SI prefixes, short and long, with its values. */
const SHORT_PREFIXES: Readonly<Record<string, number>> = {
  da: 10, h: 100, k: 1000, M: 1e6, G: 1e9, T: 1e12, P: 1e15, E: 1e18, Z: 1e21, Y: 1e24, R: 1e27, Q: 1e30,
  d: 0.1, c: 0.01, m: 0.001, u: 0.000001, n: 1e-9, p: 1e-12, f: 1e-15, a: 1e-18, z: 1e-21, y: 1e-24, r: 1e-27, q: 1e-30,
};
const LONG_PREFIXES: Readonly<Record<string, number>> = {
  deca: 10, hecto: 100, kilo: 1000, mega: 1e6, giga: 1e9, tera: 1e12, peta: 1e15, exa: 1e18, zetta: 1e21, yotta: 1e24, ronna: 1e27, quetta: 1e30,
  deci: 0.1, centi: 0.01, milli: 0.001, micro: 0.000001, nano: 1e-9, pico: 1e-12, femto: 1e-15, atto: 1e-18, zepto: 1e-21, yocto: 1e-24, ronto: 1e-27, quecto: 1e-30,
};

/** A name of the table, with or without a prefix its set allows; null when not exactly one reading exists. */
function findUnit(name: string): { unit: QuickUnit; prefix: number } | null {
  const exact = UNITS[name];
  if (exact !== undefined) return { unit: exact, prefix: 1 };
  let found: { unit: QuickUnit; prefix: number } | null = null;
  for (const [base, u] of Object.entries(UNITS)) {
    if (!name.endsWith(base) || name.length === base.length) continue;
    const prefixName = name.slice(0, name.length - base.length);
    const short = u.prefixes === "short" || u.prefixes === "short+long" ? SHORT_PREFIXES[prefixName] : undefined;
    const long = u.prefixes === "long" || u.prefixes === "short+long" ? LONG_PREFIXES[prefixName] : undefined;
    const prefix = short ?? long;
    if (prefix === undefined) continue;
    if (found !== null) return null; // two readings: leave it to mathjs
    found = { unit: u, prefix };
  }
  return found;
}

/** The parsed units of a unit text, in order, with their powers; null for anything beyond the simple grammar. */
function parseUnits(text: string): { unit: QuickUnit; prefix: number; power: number }[] | null {
  const units: { unit: QuickUnit; prefix: number; power: number }[] = [];
  const stack: number[] = [];
  let product = 1;
  let current = 1;
  let expecting = false;
  let i = 0;
  const skip = (): void => {
    while (text[i] === " ") i++;
  };
  skip();
  while (i < text.length) {
    while (text[i] === "(") {
      stack.push(current);
      product *= current;
      current = 1;
      i++;
      skip();
    }
    const name = /^[A-Za-z_][A-Za-z0-9_]*/.exec(text.slice(i))?.[0];
    if (name === undefined) return null;
    i += name.length;
    const found = findUnit(name);
    if (found === null) return null;
    let power = current * product;
    skip();
    if (text[i] === "^") {
      i++;
      skip();
      const p = /^[-+]?\d+(?![\d.eE])/.exec(text.slice(i))?.[0];
      if (p === undefined) return null;
      i += p.length;
      power *= Number(p);
    }
    units.push({ ...found, power });
    skip();
    while (text[i] === ")") {
      if (stack.length === 0) return null;
      product /= stack.pop()!;
      i++;
      skip();
    }
    expecting = text[i] === "*" || text[i] === "/";
    current = text[i] === "/" ? -1 : 1;
    if (expecting) i++;
    skip();
  }
  if (expecting || stack.length !== 0 || units.length === 0) return null;
  return units;
}

/** The base dimensions of a list of parsed units. */
function dimensionsOf(units: readonly { unit: QuickUnit; power: number }[]): number[] {
  const dims = new Array<number>(9).fill(0);
  for (const u of units) for (let d = 0; d < 9; d++) dims[d]! += u.unit.dimensions[d]! * u.power;
  return dims;
}

/** Base dimensions of each dimension's SI unit, parsed once with the same grammar (null: a unit not in the table, such as H: mathjs reads it). */
const TARGETS = new Map<Dimension, number[] | null>();
function targetDimensions(dimension: Dimension): number[] | null {
  let dims = TARGETS.get(dimension);
  if (dims === undefined) {
    const units = parseUnits(DIMENSIONS[dimension].si);
    dims = units === null ? null : dimensionsOf(units);
    TARGETS.set(dimension, dims);
  }
  return dims;
}

/**
 * The SI value of "magnitude unitText" for a dimension, without loading mathjs, for the units
 * heatledger's files use ("4.7 mF", "350 ms", "2.5 K/W", "40 degC", "900 J/(kg K)", "10 kohm",
 * "2 min"), or undefined when the text is anything else: an unknown or ambiguous name, a
 * grammar beyond units with integer powers, '*', '/' and parentheses, a temperature unit with an
 * offset where a difference or a compound is meant, or a dimension that does not match. The
 * caller then asks mathjs, which gives the same numbers and the error messages.
 * The arithmetic is mathjs' own: the magnitude times (unit value × prefix value)^power for each
 * unit in order (its normalisation), and for an absolute temperature in another unit than degC
 * the difference of the offsets times the unit values (its conversion). A first quantity string
 * no longer costs the load of mathjs (about a tenth of a second, and more for its first units).
 * Source: mathjs 15 Unit.parse, _normalize and to(); the units and prefixes are the SI
 * brochure's, 9th ed. (BIPM 2019), §2.3 and §3, Table 7 (section and table numbers from memory).
 * Cost O(length of the text × units in the table).
 */
export function quickSiValue(magnitude: number, unitText: string, dimension: Dimension): number | undefined {
  if (dimension === "dimensionless") return undefined;
  const units = parseUnits(unitText);
  if (units === null) return undefined;
  const dims = dimensionsOf(units);
  const target = targetDimensions(dimension);
  if (target === null) return undefined;
  for (let d = 0; d < 9; d++) if (Math.abs(dims[d]! - target[d]!) > 1e-12) return undefined;
  const offsets = units.some((u) => u.unit.offset !== 0);
  if (dimension === "temperature") {
    // an absolute temperature: one unit to the first power, converted to degC with mathjs' offsets
    if (units.length !== 1 || units[0]!.power !== 1) return undefined;
    const u = units[0]!;
    const value = magnitude * Math.pow(u.unit.value * u.prefix, 1);
    const degC = UNITS["degC"]!;
    return u.unit.offset === degC.offset ? value : value + (u.unit.value * u.unit.offset - degC.value * degC.offset);
  }
  if (offsets) return undefined;
  let value = magnitude;
  for (const u of units) value *= Math.pow(u.unit.value * u.prefix, u.power);
  return value;
}
