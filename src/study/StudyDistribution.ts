import { describeFound, inputError } from "../errors/InputError.js";
import { expectedWords } from "../units/dimensions.js";
import { parseQuantity } from "../units/parseQuantity.js";
import type { SeededRandom } from "./SeededRandom.js";
import type { StudyParameter, StudyProfile } from "./StudyProfile.js";
import { STUDY_DEFAULTS } from "./studyDefaults.js";
import { parseStudyValue, splitVariation } from "./sweepAxis.js";

/** How one parameter varies from unit to unit in a Monte Carlo run (values SI). */
export interface StudyDistribution {
  readonly parameter: StudyParameter;
  /** normal: mean the profile's value, standard deviation `spread`; uniform: from `low` to `high` */
  readonly kind: "normal" | "uniform";
  readonly spread: number;
  readonly low: number;
  readonly high: number;
  /** a normal draw outside [low, high] is drawn again (a truncated normal); ±Infinity when not truncated */
  readonly text: string;
}

/**
 * Parse one `--vary PATH=DISTRIBUTION` of a Monte Carlo run (syntax of our own, docs/studies.md):
 * - `normal S`: normal about the profile's value with standard deviation S, written in the
 *   quantity's unit ("0.1 mF") or relative to the value ("5 %");
 * - `normal S within T`: the same, truncated to value ± T (T absolute or in %), or
 *   `within A..B`: truncated to [A, B] (a draw outside is drawn again);
 * - `uniform A..B`: uniform between A and B;
 * - `tolerance T`: uniform over the tolerance band value ± T (a band with no more known about
 *   it is taken as rectangular: JCGM 100:2008 §4.3.7).
 * Cost O(length of the text).
 * @throws InputError `bad-option` for a bad path, a parameter the profile does not write, a
 *   value of the wrong dimension (naming the one expected), a spread ≤ 0, or an empty band
 */
export function parseStudyDistribution(study: StudyProfile, text: string, option: string): StudyDistribution {
  const [path, spec] = splitVariation(text, option, "circuit.capacitance=normal 5 %");
  const parameter = study.parameter(path, option);
  const field = `${option} ${parameter.path}`;
  const nominal = parameter.nominal;
  if (nominal === undefined) throw inputError("bad-option", field, "a quantity the profile writes (its value is the distribution's centre)", describeFound(path));
  const value = (v: string): number => parseStudyValue(v, parameter, field);
  const relative = (v: string): number => {
    const m = /^\s*([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*%\s*$/.exec(v);
    return m === null ? (parameter.dimension === "temperature" ? parseQuantity(v.trim(), "temperatureDifference", field) : value(v)) : (Math.abs(nominal) * Number(m[1])) / 100;
  };
  const band = (v: string): readonly [number, number] => {
    const r = /^(.+?)\.\.(.+)$/.exec(v);
    if (r !== null) return [value(r[1]!), value(r[2]!)];
    const t = relative(v);
    return [nominal - t, nominal + t];
  };
  const words = `a distribution such as "normal 5 %", "normal ${describeSpread(parameter)} within 10 %", "uniform A..B" or "tolerance 10 %" (${expectedWords(parameter.dimension)})`;
  const m = /^(normal|uniform|tolerance)\s+(.+?)(?:\s+within\s+(.+))?$/i.exec(spec);
  if (m === null) throw inputError("bad-option", field, words, describeFound(spec));
  const kind = m[1]!.toLowerCase();
  let result: StudyDistribution;
  if (kind === "normal") {
    const spread = relative(m[2]!);
    const [low, high] = m[3] === undefined ? [-Infinity, Infinity] : band(m[3]);
    result = { parameter, kind: "normal", spread, low, high, text: spec };
    if (!(spread > 0)) throw inputError("bad-option", field, `a standard deviation above 0 (${words})`, describeFound(m[2]));
    if (!(low <= nominal && nominal <= high)) throw inputError("bad-option", field, `a truncation band around the profile's value ${parameter.written}`, describeFound(m[3]));
  } else {
    if (m[3] !== undefined) throw inputError("bad-option", field, `"within" only after a normal distribution (${words})`, describeFound(spec));
    if (kind === "tolerance" && m[2]!.includes("..")) throw inputError("bad-option", field, 'a tolerance T ("10 %" or in the unit), not a range (write "uniform A..B")', describeFound(spec));
    const [low, high] = band(m[2]!);
    result = { parameter, kind: "uniform", spread: high - low, low, high, text: spec };
  }
  if (!(result.high > result.low)) throw inputError("bad-option", field, `a band whose upper end is above its lower end (${words})`, describeFound(spec));
  return result;
}

function describeSpread(p: StudyParameter): string {
  return p.dimension === "dimensionless" ? "0.02" : `0.1 ${p.written.replace(/^[-+\d.eE\s]+/, "") || "unit"}`;
}

/**
 * Draw one value of a distribution from a sample's stream.
 * @throws InputError `bad-option` when a truncated normal rejects STUDY_DEFAULTS.maxRejections draws in a row (a band far out in the tail)
 */
export function drawStudyValue(d: StudyDistribution, random: SeededRandom): number {
  if (d.kind === "uniform") return d.low + (d.high - d.low) * random.uniform();
  const centre = d.parameter.nominal!;
  for (let k = 0; k < STUDY_DEFAULTS.maxRejections; k++) {
    const v = centre + d.spread * random.normal();
    if (v >= d.low && v <= d.high) return v;
  }
  throw inputError("bad-option", `--vary ${d.parameter.path}`, "a truncation band that holds a fair share of the normal distribution", describeFound(d.text));
}
