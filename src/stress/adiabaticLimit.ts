import { describeFound, inputError } from "../errors/InputError.js";
import type { RatingStatus } from "./pulseEnergyRating.js";

/**
 * A resistor element judged on its own heat capacity for the shortest pulses: energy absorbed
 * within the element's heat-spreading time cannot have left the element yet.
 */
export interface AdiabaticElement {
  /** heat-spreading time of the element, about d²/α [s] */
  readonly spreadingTimeS: number;
  /** heat capacity of the element alone [J/K] */
  readonly heatCapacityJPerK: number;
  /** how the spreading time and the capacity were obtained, in words (for the report) */
  readonly basis: string;
}

/**
 * Heat-spreading time of an element of thickness d and thermal diffusivity α = k/(ρ·c):
 *   t_s = d²/α.
 * Within a time shorter than t_s heat has not diffused across the element, so the element heats
 * as if insulated (adiabatically). Source: the diffusion time scale of transient conduction,
 * Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §5.2 (the Fourier
 * number Fo = α·t/L², order one when heat has crossed the length L). Cost O(1).
 * @throws InputError `out-of-range` for a non-positive thickness or diffusivity
 * @example
 * spreadingTimeS(100e-6, 12 / (8400 * 420)) // => 0.00294
 */
export function spreadingTimeS(thicknessM: number, diffusivityM2PerS: number, field = "ratings.adiabatic"): number {
  if (!(thicknessM > 0) || !Number.isFinite(thicknessM)) throw inputError("out-of-range", `${field}.thickness`, "a thickness > 0 m", describeFound(thicknessM));
  if (!(diffusivityM2PerS > 0) || !Number.isFinite(diffusivityM2PerS)) throw inputError("out-of-range", `${field}.material`, "a material of diffusivity > 0", describeFound(diffusivityM2PerS));
  return (thicknessM * thicknessM) / diffusivityM2PerS;
}

/** Result of {@link checkAdiabatic} for one event. */
export interface AdiabaticCheck {
  readonly status: RatingStatus;
  /** most energy absorbed within the spreading time [J] */
  readonly windowEnergyJ: number;
  /** rise that energy gives the element alone, E/C_el [K] */
  readonly riseK: number;
  /** rise allowed from the start temperature, T_max − T_start [K] (0 at or above T_max) */
  readonly allowedRiseK: number;
}

/**
 * The adiabatic limit of one pulse: the energy absorbed within the element's spreading time,
 * counted against the element's heat capacity alone, raises it by ΔT = E/C_el; pass when the
 * start temperature plus ΔT stays at or below T_max. Source: stored thermal energy Q = m·c·ΔT
 * with no heat leaving, Incropera et al., Fundamentals of Heat and Mass Transfer, 7th ed. (2011),
 * §1.3.1. Cost O(1).
 * @example
 * checkAdiabatic({ spreadingTimeS: 0.003, heatCapacityJPerK: 0.1, basis: "" }, 20, 25, 275).riseK // => 200
 */
export function checkAdiabatic(element: AdiabaticElement, windowEnergyJ: number, startC: number, maxC: number): AdiabaticCheck {
  const riseK = windowEnergyJ / element.heatCapacityJPerK;
  const allowedRiseK = Math.max(0, maxC - startC);
  return { status: riseK > allowedRiseK ? "fail" : "pass", windowEnergyJ, riseK, allowedRiseK };
}
