import { describeFound, inputError } from "../errors/InputError.js";

/**
 * Equivalent rectangular duration of a non-rectangular pulse, for looking up a single-pulse
 * energy rating: the duration of the rectangular pulse with the same energy and the same peak
 * power,
 *   t_eq = E / P_peak.
 * For the exponentially decaying power of a resistor charging a capacitor from a fixed source,
 * P(t) = (V²/R)·e^(−2t/RC), it gives t_eq = RC/2, the usual rule for such pulses; for a
 * rectangular pulse it returns the pulse's own duration. Common practice (no single published
 * source); the thermal simulation on the part's Zth stays the primary verdict, the rating table
 * is a secondary check.
 *
 * Validity: any pulse of positive energy and peak power; it never exceeds the pulse's length.
 * Cost O(1).
 * @param energyJ pulse energy [J], > 0
 * @param peakPowerW peak power [W], > 0
 * @returns t_eq [s]
 * @throws InputError `out-of-range` for a non-positive or non-finite energy or power
 * @example
 * equivalentPulseDurationS(12, 400) // => 0.03
 */
export function equivalentPulseDurationS(energyJ: number, peakPowerW: number, field = "event"): number {
  if (!(energyJ > 0) || !Number.isFinite(energyJ)) throw inputError("out-of-range", `${field}.energyJ`, "an energy > 0 J", describeFound(energyJ));
  if (!(peakPowerW > 0) || !Number.isFinite(peakPowerW))
    throw inputError("out-of-range", `${field}.peakPowerW`, "a peak power > 0 W", describeFound(peakPowerW));
  return energyJ / peakPowerW;
}
