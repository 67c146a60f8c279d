import { describeFound, inputError } from "../errors/InputError.js";

/** Zero of the Celsius scale in kelvin. Source: BIPM SI brochure, 9th ed. (2019), §2.3.1 (from memory). */
const KELVIN_AT_0C = 273.15;

/**
 * How a resistor's resistance follows its own temperature (temperatures in °C, resistances in Ω):
 * - `linear`: R(T) = R_ref·(1 + α·(T − T_ref)), α in 1/K (a wire-wound or film resistor's TCR);
 * - `ntc-beta`: R(T) = R_ref·exp(B·(1/T − 1/T_ref)), T in kelvin (an NTC inrush limiter);
 * - `steinhart-hart`: 1/T = a + b·ln R + c·(ln R)³, T in kelvin, R in Ω (an NTC by its three
 *   coefficients), solved for ln R by Cardano's formula;
 * - `table`: points (T_i, R_i), ln R interpolated linearly in T and held at the end values outside
 *   (a PTC, whose resistance rises by decades past its switching temperature).
 * R_ref is the circuit's resistance at T_ref for the first two; the last two give R(T) in full,
 * and are scaled so that R(25 °C) is the circuit's resistance (a profile checks that they agree
 * within 1 %, so the scale is only the corners' changes of resistance).
 * Source: linear TCR and the B-parameter equation as IEC 60539-1 (2016) defines the B value of an
 * NTC thermistor (clause numbers not given, from memory); J. S. Steinhart, S. R. Hart, "Calibration
 * curves for thermistors", Deep-Sea Research 15 (1968) 497-503; Cardano's formula for a
 * depressed cubic, Abramowitz & Stegun, Handbook of Mathematical Functions (1964), 3.8.2 (from
 * memory); the table's log interpolation is common practice (R-T curves are drawn on log axes).
 */
export type ResistanceCurve =
  | { readonly kind: "linear"; readonly coefficientPerK: number; readonly referenceC: number }
  | { readonly kind: "ntc-beta"; readonly betaK: number; readonly referenceC: number }
  | { readonly kind: "steinhart-hart"; readonly a: number; readonly b: number; readonly c: number }
  | { readonly kind: "table"; readonly temperatureC: readonly number[]; readonly resistanceOhm: readonly number[] };

/** Temperature at which a full curve is scaled to the circuit's resistance [°C]. */
export const FULL_CURVE_REFERENCE_C = 25;

/**
 * Resistance at a temperature [Ω] of a resistor whose resistance is `resistanceOhm` at the
 * curve's reference (25 °C for a full curve), floored at 1e-9 of it so that a linear coefficient
 * driven far below its range never gives R ≤ 0. Cost O(1), or O(log points) for a table.
 * @example
 * resistanceAt({ kind: "ntc-beta", betaK: 3000, referenceC: 25 }, 10, 150) // => 0.5118
 * resistanceAt({ kind: "linear", coefficientPerK: 0.004, referenceC: 25 }, 10, 125) // => 14
 */
export function resistanceAt(curve: ResistanceCurve, resistanceOhm: number, temperatureC: number): number {
  switch (curve.kind) {
    case "linear":
      return resistanceOhm * Math.max(1e-9, 1 + curve.coefficientPerK * (temperatureC - curve.referenceC));
    case "ntc-beta":
      return resistanceOhm * Math.exp(curve.betaK * (1 / (temperatureC + KELVIN_AT_0C) - 1 / (curve.referenceC + KELVIN_AT_0C)));
    default:
      return resistanceOhm * (curveResistance(curve, temperatureC) / curveResistance(curve, FULL_CURVE_REFERENCE_C));
  }
}

/**
 * Resistance a full curve (Steinhart-Hart coefficients, table) gives at a temperature by itself,
 * unscaled [Ω]. Cost O(1), or O(log points) for a table.
 * @example
 * curveResistance({ kind: "table", temperatureC: [25, 100, 150], resistanceOhm: [10, 20, 2000] }, 125) // => 200
 */
export function curveResistance(curve: Extract<ResistanceCurve, { kind: "steinhart-hart" | "table" }>, temperatureC: number): number {
  switch (curve.kind) {
    case "steinhart-hart": {
      // c·x³ + b·x + (a − 1/T) = 0 with x = ln R: one real root when b, c ≥ 0
      const d = curve.a - 1 / (temperatureC + KELVIN_AT_0C);
      if (curve.c === 0) return Math.exp(-d / curve.b);
      const p = curve.b / curve.c;
      const q = d / curve.c;
      const s = Math.sqrt((q * q) / 4 + (p * p * p) / 27);
      return Math.exp(Math.cbrt(-q / 2 + s) + Math.cbrt(-q / 2 - s));
    }
    case "table": {
      const ts = curve.temperatureC;
      const rs = curve.resistanceOhm;
      if (temperatureC <= ts[0]!) return rs[0]!;
      if (temperatureC >= ts[ts.length - 1]!) return rs[rs.length - 1]!;
      let lo = 0;
      let hi = ts.length - 1;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (ts[mid]! <= temperatureC) lo = mid;
        else hi = mid;
      }
      const f = (temperatureC - ts[lo]!) / (ts[hi]! - ts[lo]!);
      return Math.exp(Math.log(rs[lo]!) + f * (Math.log(rs[hi]!) - Math.log(rs[lo]!)));
    }
  }
}

/**
 * Check a curve's values: α finite, B > 0, Steinhart-Hart b > 0 and c ≥ 0, a table of at least
 * two points with rising temperatures and resistances > 0, reference temperatures above
 * absolute zero.
 * @throws InputError naming `field`.<key>
 * @example
 * validateResistanceCurve({ kind: "ntc-beta", betaK: 3000, referenceC: 25 }, "curve") // => undefined
 */
export function validateResistanceCurve(curve: ResistanceCurve, field: string): void {
  const fail = (key: string, expected: string, found: unknown): never => {
    throw inputError("out-of-range", `${field}.${key}`, expected, describeFound(found));
  };
  if ("referenceC" in curve && !(curve.referenceC > -KELVIN_AT_0C)) fail("reference", "a temperature above absolute zero", curve.referenceC);
  switch (curve.kind) {
    case "linear":
      if (!Number.isFinite(curve.coefficientPerK)) fail("coefficient", "a finite temperature coefficient in 1/K", curve.coefficientPerK);
      break;
    case "ntc-beta":
      if (!(curve.betaK > 0) || !Number.isFinite(curve.betaK)) fail("beta", 'a B value > 0 such as "3000 K"', curve.betaK);
      break;
    case "steinhart-hart":
      if (!Number.isFinite(curve.a)) fail("a", "a finite coefficient in 1/K", curve.a);
      if (!(curve.b > 0) || !Number.isFinite(curve.b)) fail("b", "a coefficient > 0 in 1/K", curve.b);
      if (!(curve.c >= 0) || !Number.isFinite(curve.c)) fail("c", "a coefficient ≥ 0 in 1/K", curve.c);
      break;
    case "table":
      if (curve.temperatureC.length < 2 || curve.temperatureC.length !== curve.resistanceOhm.length) fail("points", "at least two (temperature, resistance) points", curve.temperatureC.length);
      curve.temperatureC.forEach((t, i) => {
        if (!Number.isFinite(t) || (i > 0 && !(t > curve.temperatureC[i - 1]!))) fail(`points[${i}]`, "temperatures rising from point to point", t);
        const r = curve.resistanceOhm[i]!;
        if (!(r > 0) || !Number.isFinite(r)) fail(`points[${i}]`, "a resistance > 0", r);
      });
      break;
  }
}
