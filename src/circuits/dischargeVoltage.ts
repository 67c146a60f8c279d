import { describeFound, inputError } from "../errors/InputError.js";
import { requirePositive } from "./requirePositive.js";

/**
 * What empties the link capacitor between two charging events.
 *
 * - `none`: nothing; the voltage is kept.
 * - `bleeder`: a resistor R across the bus: V(t) = V0·e^(−t/(R·C)).
 * - `constant-current`: a sink of I [A] down to 0 V: V(t) = max(0, V0 − I·t/C).
 * - `active`: a switched discharge resistor R, on until the bus falls to `untilV` (default 0 V),
 *   then off: V(t) = max(untilV, V0·e^(−t/(R·C))); nothing happens when V0 ≤ untilV.
 *
 * A bleeder that is always present can be combined with the other two through `bleederOhm`:
 * a constant-current sink with a bleeder Rb follows V(t) = (V0 + I·Rb)·e^(−t/(Rb·C)) − I·Rb down
 * to 0 V; an active discharge R with a bleeder Rb discharges through R ∥ Rb down to `untilV`
 * and through Rb alone below it.
 */
export type DischargePath =
  | { kind: "none" }
  | { kind: "bleeder"; resistanceOhm: number }
  | { kind: "constant-current"; currentA: number; bleederOhm?: number }
  | { kind: "active"; resistanceOhm: number; untilV?: number; bleederOhm?: number };

/** RC decay from v over t with time constant tau. */
function decay(v: number, t: number, tau: number): number {
  return v * Math.exp(-t / tau);
}

/**
 * Capacitor voltage after a pause between events: the starting voltage of the next attempt (a
 * quick retry starts from a partly charged capacitor).
 *
 * Formulas (see {@link DischargePath}): RC decay V0·e^(−t/(R·C)); constant-current ramp
 * V0 − I·t/C; with a bleeder, the driven first-order response (V0 + I·Rb)·e^(−t/τ) − I·Rb whose
 * zero crossing is at t0 = τ·ln((V0 + I·Rb)/(I·Rb)), τ = Rb·C; active discharge to `untilV`
 * reached at t1 = τ∥·ln(V0/untilV), τ∥ = (R∥Rb)·C, then bleeder decay from untilV.
 * Source: Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §8.3
 * (source-free RC) and §8.8 (driven RC) (section numbers from memory).
 * Validity: ideal linear parts; an initial voltage of any sign ≥ 0.
 * Cost O(1).
 * @param path the discharge path
 * @param capacitanceF link capacitance C [F]
 * @param initialVoltageV bus voltage when the pause starts [V]
 * @param durationS length of the pause [s]
 * @returns bus voltage at the end of the pause [V]
 * @throws InputError naming the field: `capacitanceF`, `initialVoltageV`, `durationS`,
 *   `path.resistanceOhm`, `path.currentA`, `path.untilV`, `path.bleederOhm`, `path.kind`
 * @example
 * dischargeVoltage({ kind: "bleeder", resistanceOhm: 1000 }, 0.002, 48, 2) // => 17.658
 */
export function dischargeVoltage(path: DischargePath, capacitanceF: number, initialVoltageV: number, durationS: number): number {
  requirePositive(capacitanceF, "capacitanceF", "a capacitance > 0 F");
  requirePositive(initialVoltageV, "initialVoltageV", "a bus voltage ≥ 0 V", true);
  requirePositive(durationS, "durationS", "a pause ≥ 0 s", true);
  const v0 = initialVoltageV;
  const t = durationS;
  const c = capacitanceF;
  switch (path.kind) {
    case "none":
      return v0;
    case "bleeder":
      requirePositive(path.resistanceOhm, "path.resistanceOhm", "a bleeder resistance > 0 Ω");
      return decay(v0, t, path.resistanceOhm * c);
    case "constant-current": {
      requirePositive(path.currentA, "path.currentA", "a discharge current > 0 A");
      if (path.bleederOhm === undefined) return Math.max(0, v0 - (path.currentA * t) / c);
      requirePositive(path.bleederOhm, "path.bleederOhm", "a bleeder resistance > 0 Ω");
      const iRb = path.currentA * path.bleederOhm;
      const tau = path.bleederOhm * c;
      const tZero = tau * Math.log((v0 + iRb) / iRb);
      // v0·e^(−t/τ) − I·Rb·(1 − e^(−t/τ)): the same response without cancellation for small v0
      return t >= tZero ? 0 : Math.max(0, v0 * Math.exp(-t / tau) + iRb * Math.expm1(-t / tau));
    }
    case "active": {
      requirePositive(path.resistanceOhm, "path.resistanceOhm", "an active discharge resistance > 0 Ω");
      const untilV = path.untilV ?? 0;
      requirePositive(untilV, "path.untilV", "a stop voltage ≥ 0 V", true);
      const rb = path.bleederOhm;
      if (rb !== undefined) requirePositive(rb, "path.bleederOhm", "a bleeder resistance > 0 Ω");
      const rPar = rb === undefined ? path.resistanceOhm : (path.resistanceOhm * rb) / (path.resistanceOhm + rb);
      if (v0 <= untilV) return rb === undefined ? v0 : decay(v0, t, rb * c);
      const tauPar = rPar * c;
      const tStop = untilV > 0 ? tauPar * Math.log(v0 / untilV) : Infinity;
      if (t <= tStop) return decay(v0, t, tauPar);
      return rb === undefined ? untilV : decay(untilV, t - tStop, rb * c);
    }
    default:
      throw inputError("out-of-range", "path.kind", 'one of "none", "bleeder", "constant-current", "active"', describeFound((path as { kind: unknown }).kind));
  }
}
