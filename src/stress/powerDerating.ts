import { describeFound, inputError } from "../errors/InputError.js";
import { temperatureHeadroomFactor } from "./temperatureHeadroomFactor.js";

/**
 * A continuous power rating with its derating curve against ambient: the rated power holds up to
 * `fullPowerUpToC`, then falls in a straight line to nothing at `zeroPowerAtC`.
 */
export interface PowerDerating {
  /** rated continuous power [W] */
  readonly ratedPowerW: number;
  /** ambient up to which the full rating holds [°C] */
  readonly fullPowerUpToC: number;
  /** ambient at which nothing is allowed [°C], > fullPowerUpToC */
  readonly zeroPowerAtC: number;
}

/**
 * Check a power derating curve: power > 0, zero-power temperature above the knee.
 * @throws InputError `out-of-range` naming the key
 * @example
 * validatePowerDerating({ ratedPowerW: 10, fullPowerUpToC: 70, zeroPowerAtC: 155 }) // => undefined
 */
export function validatePowerDerating(d: PowerDerating, field = "ratings.continuousPower"): void {
  if (!(d.ratedPowerW > 0) || !Number.isFinite(d.ratedPowerW)) throw inputError("out-of-range", `${field}.rated`, "a power > 0 W", describeFound(d.ratedPowerW));
  if (!(d.zeroPowerAtC > d.fullPowerUpToC))
    throw inputError("out-of-range", `${field}.zeroPowerAt`, `a temperature above fullPowerUpTo (${d.fullPowerUpToC} °C)`, `${d.zeroPowerAtC} °C`);
}

/**
 * Allowed continuous power at an ambient T, the two-point linear derating:
 *   P(T) = P_r                                   for T ≤ T_full
 *   P(T) = P_r·(T_zero − T)/(T_zero − T_full)    between
 *   P(T) = 0                                     for T ≥ T_zero
 * the same headroom rule as the pulse ratings (temperatureHeadroomFactor). Source: the two-point
 * linear derating curve is common practice for resistors (IEC 60115-1 (2020) names the rated
 * ambient temperature as the knee). Cost O(1).
 * @example
 * allowedContinuousPowerW({ ratedPowerW: 10, fullPowerUpToC: 70, zeroPowerAtC: 170 }, 120) // => 5
 */
export function allowedContinuousPowerW(d: PowerDerating, ambientC: number): number {
  return d.ratedPowerW * temperatureHeadroomFactor(d.fullPowerUpToC, d.zeroPowerAtC, ambientC);
}
