import { describeFound, inputError } from "../errors/InputError.js";
import { DIMENSIONS, type Dimension, expectedWords } from "./dimensions.js";

/**
 * The magnitudes heatledger accepts per dimension, in its SI unit: the largest absolute value,
 * and the smallest nonzero one (zero stays allowed where a field allows it; each field checks its
 * own sign and bounds after this). They are wide — several decades beyond any pre-charge part
 * or duty profile — and exist so that a value such as `1e308 ohm` is refused where it is written
 * instead of overflowing to Infinity or NaN deep in a sum. docs/profile-format.md lists them.
 * Plain numbers (dimensionless) are left to their fields (counts, fractions, factors).
 */
export const QUANTITY_RANGES: Readonly<Record<Exclude<Dimension, "dimensionless">, { readonly max: number; readonly minNonZero: number }>> = {
  time: { max: 1e12, minNonZero: 1e-12 },
  frequency: { max: 1e12, minNonZero: 1e-12 },
  capacitance: { max: 1e6, minNonZero: 1e-15 },
  resistance: { max: 1e12, minNonZero: 1e-9 },
  voltage: { max: 1e7, minNonZero: 1e-9 },
  current: { max: 1e7, minNonZero: 1e-12 },
  power: { max: 1e12, minNonZero: 1e-12 },
  energy: { max: 1e15, minNonZero: 1e-15 },
  mass: { max: 1e6, minNonZero: 1e-12 },
  length: { max: 1e4, minNonZero: 1e-12 },
  temperature: { max: 1e5, minNonZero: 0 },
  temperatureDifference: { max: 1e5, minNonZero: 0 },
  thermalResistance: { max: 1e9, minNonZero: 1e-12 },
  heatCapacity: { max: 1e12, minNonZero: 1e-12 },
  specificHeat: { max: 1e9, minNonZero: 1e-9 },
  voltagePerKelvin: { max: 1e3, minNonZero: 0 },
  transconductanceParameter: { max: 1e6, minNonZero: 1e-9 },
  inductance: { max: 1e3, minNonZero: 1e-15 },
  voltageRate: { max: 1e12, minNonZero: 1e-12 },
  currentSquaredTime: { max: 1e15, minNonZero: 1e-15 },
  energyPerResistance: { max: 1e12, minNonZero: 1e-15 },
};

/** 1e12 rather than 1000000000000 in a message. */
function short(x: number): string {
  return x >= 1e5 || x < 1e-3 ? x.toExponential().replace("e+", "e") : String(x);
}

/** Absolute zero in °C: no absolute temperature lies below it. */
const ABSOLUTE_ZERO_C = -273.15;

/**
 * Check a parsed quantity against QUANTITY_RANGES (and absolute zero for temperatures).
 * @param si the value in the dimension's SI unit
 * @param raw the value as written, for the message
 * @throws InputError `out-of-range` naming the field, the range and the value as written
 */
export function checkQuantityRange(si: number, dimension: Dimension, field: string, raw: unknown): number {
  if (dimension === "dimensionless") return si;
  const { max, minNonZero } = QUANTITY_RANGES[dimension];
  const unit = DIMENSIONS[dimension].si;
  const magnitude = Math.abs(si);
  if (dimension === "temperature" && si < ABSOLUTE_ZERO_C)
    throw inputError("out-of-range", field, `${expectedWords(dimension)}, at or above absolute zero (${ABSOLUTE_ZERO_C} ${unit})`, describeFound(raw));
  if (magnitude > max || (magnitude > 0 && magnitude < minNonZero))
    throw inputError(
      "out-of-range",
      field,
      `${expectedWords(dimension)}, ${minNonZero > 0 ? `zero or between ${short(minNonZero)} and ${short(max)}` : `at most ${short(max)}`} ${unit} in size`,
      describeFound(raw),
    );
  return si;
}
