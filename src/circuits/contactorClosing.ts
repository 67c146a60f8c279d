import { describeFound, inputError } from "../errors/InputError.js";

/** The main contactor that closes across the pre-charge element, and the loop it closes. */
export interface ContactorSpec {
  /** the contactor's making-current rating: the highest current it may close onto [A] */
  readonly makingCurrentA: number;
  /** resistance of the loop the contactor closes (source, wiring, contacts, capacitor ESR) [Ω] */
  readonly loopResistanceOhm: number;
  /** inductance of that loop [H] (default 0: the peak is ΔV/R at the instant of closing) */
  readonly loopInductanceH?: number;
}

/** What closing the contactor onto a residual voltage difference does. */
export interface ContactorClosing {
  /** source voltage minus bus voltage at the moment of closing [V] */
  readonly deltaV: number;
  /** energy the loop dissipates while the capacitor takes the rest of its charge, C·ΔV²/2 [J] */
  readonly energyJ: number;
  /** the closing current's peak [A] */
  readonly peakCurrentA: number;
  /** when the peak occurs after closing [s] (0 for a loop without inductance) */
  readonly peakTimeS: number;
  /** "resistive" (no inductance), "underdamped", "critically damped" or "overdamped" */
  readonly loop: "resistive" | "underdamped" | "critically damped" | "overdamped";
  /** peak current over the making-current rating */
  readonly ratingRatio: number;
}

/**
 * The current pulse when the main contactor closes onto a bus still ΔV below the source: a series
 * R-L-C loop whose capacitor starts ΔV short of the source. With α = R/(2L), ω0 = 1/√(LC):
 * - L = 0: i = (ΔV/R)·e^(−t/RC), peak ΔV/R at once;
 * - underdamped (α < ω0): i = ΔV/(ωd·L)·e^(−αt)·sin(ωd·t), ωd = √(ω0² − α²), peak at
 *   tp = atan(ωd/α)/ωd, i(tp) = ΔV·√(C/L)·e^(−α·tp);
 * - critically damped: i = (ΔV/L)·t·e^(−αt), peak ΔV/(e·α·L) at 1/α;
 * - overdamped: i = ΔV/(L·(s1 − s2))·(e^(s1·t) − e^(s2·t)), s1,2 = −α ± √(α² − ω0²), peak at
 *   ln(s2/s1)/(s1 − s2).
 * The loop dissipates C·ΔV²/2 whatever R and L (the energy lost charging a capacitor through a
 * resistance from a constant source).
 * Source: Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §9.5 and §9.6
 * (source-free and complete response of the series RLC circuit) and §8.8 (driven RC circuit)
 * (section numbers from memory); cross-checked against ngspice in test/circuits.
 * Validity: lumped loop, contacts closing at once (no bounce, no arc), capacitor ideal.
 * Cost O(1).
 * @throws InputError for a rating or a resistance ≤ 0, an inductance < 0, a capacitance ≤ 0
 */
export function contactorClosing(spec: ContactorSpec, capacitanceF: number, deltaV: number): ContactorClosing {
  const check = (ok: boolean, field: string, expected: string, found: number): void => {
    if (!ok) throw inputError("out-of-range", field, expected, describeFound(found));
  };
  check(Number.isFinite(spec.makingCurrentA) && spec.makingCurrentA > 0, "contactor.makingCurrent", "a making-current rating > 0 A", spec.makingCurrentA);
  check(Number.isFinite(spec.loopResistanceOhm) && spec.loopResistanceOhm > 0, "contactor.loopResistance", "a loop resistance > 0 Ω", spec.loopResistanceOhm);
  const l = spec.loopInductanceH ?? 0;
  check(Number.isFinite(l) && l >= 0, "contactor.loopInductance", "a loop inductance ≥ 0 H", l);
  check(Number.isFinite(capacitanceF) && capacitanceF > 0, "capacitanceF", "a capacitance > 0 F", capacitanceF);
  const dv = Math.max(0, deltaV);
  const r = spec.loopResistanceOhm;
  const c = capacitanceF;
  const energyJ = 0.5 * c * dv * dv;
  const done = (peakCurrentA: number, peakTimeS: number, loop: ContactorClosing["loop"]): ContactorClosing => ({
    deltaV: dv,
    energyJ,
    peakCurrentA,
    peakTimeS,
    loop,
    ratingRatio: peakCurrentA / spec.makingCurrentA,
  });
  if (l === 0) return done(dv / r, 0, "resistive");
  const alpha = r / (2 * l);
  const w0 = 1 / Math.sqrt(l * c);
  if (alpha < w0 * (1 - 1e-9)) {
    const wd = Math.sqrt(w0 * w0 - alpha * alpha);
    const tp = Math.atan2(wd, alpha) / wd;
    return done(dv * Math.sqrt(c / l) * Math.exp(-alpha * tp), tp, "underdamped");
  }
  if (alpha <= w0 * (1 + 1e-9)) return done(dv / (Math.E * alpha * l), 1 / alpha, "critically damped");
  const root = Math.sqrt(alpha * alpha - w0 * w0);
  const s1 = -(w0 * w0) / (alpha + root); // −α + √(α² − ω0²) without cancellation
  const s2 = -alpha - root;
  const tp = Math.log(s2 / s1) / (s1 - s2);
  return done((dv / (l * (s1 - s2))) * (Math.exp(s1 * tp) - Math.exp(s2 * tp)), tp, "overdamped");
}
