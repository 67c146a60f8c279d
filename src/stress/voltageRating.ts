import { describeFound, inputError } from "../errors/InputError.js";
import type { RatingStatus } from "./pulseEnergyRating.js";

/**
 * The voltage ratings of a resistor: the limiting-element voltage (the highest continuous or
 * working voltage across the element, whatever its power) and, where the maker gives one, a
 * higher voltage allowed for short pulses.
 */
export interface VoltageRating {
  /** limiting-element (maximum working) voltage [V]; undefined: not given */
  readonly limitingElementV: number | undefined;
  /** maximum pulse voltage [V]; undefined: the limiting-element voltage holds for pulses too */
  readonly pulseV: number | undefined;
}

/**
 * The voltage a pre-charge pulse is held to: the pulse voltage when given, else the
 * limiting-element voltage. Source: IEC 60115-1 (2020), the generic specification of fixed
 * resistors, defines the limiting element voltage as the highest voltage that may be applied
 * continuously to the element (the rated voltage is the lower of √(P_r·R) and it); a pulse
 * voltage above it is the maker's to give (common practice). Cost O(1).
 * @throws InputError `out-of-range` when neither voltage is given
 * @example
 * pulseVoltageLimit({ limitingElementV: 300, pulseV: undefined }) // => { voltageV: 300, basis: "limiting-element voltage (IEC 60115-1)" }
 */
export function pulseVoltageLimit(rating: VoltageRating, field = "ratings.voltage"): { voltageV: number; basis: string } {
  if (rating.pulseV !== undefined) return { voltageV: rating.pulseV, basis: "maximum pulse voltage" };
  if (rating.limitingElementV !== undefined) return { voltageV: rating.limitingElementV, basis: "limiting-element voltage (IEC 60115-1)" };
  throw inputError("out-of-range", field, "a limitingElement voltage, a pulse voltage, or both", "neither");
}

/**
 * Peak voltage across a linear resistor from its peak power, V = √(P·R) (Joule heating
 * p = v²/R, Hayt, Kemmerly & Durbin, Engineering Circuit Analysis, 8th ed. (2012), §2.4). In a
 * hard short of the bus behind the resistor, the whole source voltage (less what the source
 * resistance takes) stands across it. Cost O(1).
 * @example
 * peakVoltageAcrossV(400 * 400 / 22, 22) // => 400
 */
export function peakVoltageAcrossV(peakPowerW: number, resistanceOhm: number): number {
  if (!(resistanceOhm > 0) || !Number.isFinite(resistanceOhm)) throw inputError("out-of-range", "resistance", "a resistance > 0 ohm", describeFound(resistanceOhm));
  return Math.sqrt(Math.max(0, peakPowerW) * resistanceOhm);
}

/**
 * Pass when the peak voltage is at or below the allowed voltage, fail above it. Cost O(1).
 * @example
 * voltageStatus(400, 300) // => "fail"
 */
export function voltageStatus(peakV: number, allowedV: number): RatingStatus {
  return peakV > allowedV ? "fail" : "pass";
}
