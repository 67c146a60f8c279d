import { describeFound, inputError } from "../errors/InputError.js";
import { expectedWords } from "../units/dimensions.js";
import { parseQuantity } from "../units/parseQuantity.js";
import type { StudyParameter, StudyProfile } from "./StudyProfile.js";
import { STUDY_DEFAULTS } from "./studyDefaults.js";

/** One axis of a sweep: a parameter and the values it takes (SI). */
export interface SweepAxis {
  readonly parameter: StudyParameter;
  readonly values: readonly number[];
  /** how the values were given */
  readonly spacing: "list" | "linear" | "log";
}

/** Split `PATH=SPEC` at its first "=". */
export function splitVariation(text: string, option: string, example: string): readonly [string, string] {
  const at = text.indexOf("=");
  if (at <= 0 || at === text.length - 1) throw inputError("bad-option", option, `PATH=VALUES such as "${example}"`, describeFound(text));
  return [text.slice(0, at).trim(), text.slice(at + 1).trim()];
}

/**
 * A value the user typed for a parameter: a plain number (SI) or a number with a unit of the
 * parameter's dimension.
 * @throws InputError naming `field` and the dimension expected
 */
export function parseStudyValue(text: string, parameter: StudyParameter, field: string): number {
  return parseQuantity(/^\s*[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?\s*$/.test(text) ? Number(text) : text.trim(), parameter.dimension, field);
}

/**
 * Parse one `--vary` of a sweep: `PATH=v1,v2,...` (a list), `PATH=A..B:N` (N values evenly
 * spaced from A to B, both ends included) or `PATH=A..B:N:log` (N values evenly spaced in
 * ln p: A·(B/A)^(k/(N−1)), A and B of one sign and not zero). Values take the unit of the
 * quantity (or a plain number in its SI unit).
 * Cost O(N).
 * @throws InputError `bad-option` for a bad path, a value of the wrong dimension, N < 1 or
 *   above STUDY_DEFAULTS.maxPoints, or a log range through zero
 */
export function parseSweepAxis(study: StudyProfile, text: string, option: string): SweepAxis {
  const example = "circuit.resistance=10 ohm..100 ohm:10:log";
  const [path, spec] = splitVariation(text, option, example);
  const parameter = study.parameter(path, option);
  const field = `${option} ${parameter.path}`;
  const value = (v: string): number => parseStudyValue(v, parameter, field);
  const range = /^(.+?)\.\.(.+?):\s*(\d+)\s*(?::\s*(lin|linear|log))?\s*$/i.exec(spec);
  if (range === null) {
    const values = spec.split(",").map(value);
    if (values.length > STUDY_DEFAULTS.maxPoints) throw inputError("bad-option", field, `at most ${STUDY_DEFAULTS.maxPoints} values`, String(values.length));
    return { parameter, values, spacing: "list" };
  }
  const from = value(range[1]!);
  const to = value(range[2]!);
  const count = Number(range[3]);
  const log = range[4]?.toLowerCase() === "log";
  if (!(count >= 1 && count <= STUDY_DEFAULTS.maxPoints))
    throw inputError("bad-option", field, `a number of values from 1 to ${STUDY_DEFAULTS.maxPoints} (A..B:N)`, describeFound(range[3]));
  if (log && !(from * to > 0)) throw inputError("bad-option", field, `a log range between two values of one sign, not zero (${expectedWords(parameter.dimension)})`, describeFound(spec));
  const values = Array.from({ length: count }, (_, k) => {
    const t = count === 1 ? 0 : k / (count - 1);
    if (k === count - 1 && count > 1) return to;
    return log ? from * Math.pow(to / from, t) : from + (to - from) * t;
  });
  return { parameter, values, spacing: log ? "log" : "linear" };
}
