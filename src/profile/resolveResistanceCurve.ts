import { InputError, describeFound } from "../errors/InputError.js";
import { FieldReader, join } from "../format/FieldReader.js";
import { FULL_CURVE_REFERENCE_C, type ResistanceCurve, curveResistance, validateResistanceCurve } from "../circuits/ResistanceCurve.js";
import type { CircuitInput } from "./profileSchema.js";

/** Reference temperature of a resistance curve when the profile gives none [°C] (the usual datasheet value). */
export const RESISTANCE_REFERENCE_C = 25;

/** How far a full curve (Steinhart-Hart, table) may sit from `circuit.resistance` at 25 °C, as a fraction. */
export const RESISTANCE_CURVE_MISMATCH = 0.01;

/**
 * `circuit.resistorTemperature` in SI: the keys its kind needs and no others, the curve's own
 * checks (validateResistanceCurve), and, for a curve given in full (Steinhart-Hart, table), its
 * resistance at 25 °C within 1 % of `circuit.resistance` (the value the planners and reports
 * quote). Problems are recorded on the reader (undefined when any was found).
 * Source: profile keys of our own (docs/profile-format.md).
 */
export function resolveResistanceCurve(reader: FieldReader, c: CircuitInput, field: string): ResistanceCurve | undefined {
  const t = c.resistorTemperature;
  if (t === undefined || c.resistance === undefined) return undefined;
  const needs: Record<typeof t.kind, readonly string[]> = { linear: ["ppmPerK"], "ntc-beta": ["beta"], "steinhart-hart": ["a", "b", "c"], table: ["points"] };
  const may: Record<typeof t.kind, readonly string[]> = { linear: ["ppmPerK", "reference"], "ntc-beta": ["beta", "reference"], "steinhart-hart": ["a", "b", "c"], table: ["points"] };
  let ok = true;
  for (const key of ["ppmPerK", "beta", "reference", "a", "b", "c", "points"] as const) {
    const present = t[key] !== undefined;
    if (present && !may[t.kind].includes(key)) {
      reader.fail("bad-profile", join(field, key), `no "${key}" for a ${t.kind} curve (keys: ${may[t.kind].join(", ")})`, "a value");
      ok = false;
    } else if (!present && needs[t.kind].includes(key)) {
      reader.fail("bad-profile", join(field, key), `this value (required for a ${t.kind} curve)`, "nothing");
      ok = false;
    }
  }
  if (!ok) return undefined;
  const referenceC = t.reference ?? RESISTANCE_REFERENCE_C;
  const curve: ResistanceCurve =
    t.kind === "linear"
      ? { kind: "linear", coefficientPerK: t.ppmPerK! * 1e-6, referenceC }
      : t.kind === "ntc-beta"
        ? { kind: "ntc-beta", betaK: t.beta!, referenceC }
        : t.kind === "steinhart-hart"
          ? { kind: "steinhart-hart", a: t.a!, b: t.b!, c: t.c! }
          : { kind: "table", temperatureC: t.points!.map((p) => p[0]), resistanceOhm: t.points!.map((p) => p[1]) };
  try {
    validateResistanceCurve(curve, field);
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    reader.absorb(error);
    return undefined;
  }
  if (curve.kind === "steinhart-hart" || curve.kind === "table") {
    const at25 = curveResistance(curve, FULL_CURVE_REFERENCE_C);
    if (!(Math.abs(at25 - c.resistance) <= RESISTANCE_CURVE_MISMATCH * c.resistance)) {
      reader.fail("out-of-range", join(field, "kind"), `a curve whose resistance at 25 °C is within 1 % of circuit.resistance (${c.resistance} ohm)`, `${describeFound(Number(at25.toPrecision(6)))} ohm at 25 °C`);
      return undefined;
    }
  }
  return curve;
}
