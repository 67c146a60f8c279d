import { adiabaticMass } from "../thermal/lumpedNetwork.js";
import { materialPreset } from "../thermal/materials.js";

/**
 * The element and body materials of a pre-charge resistor the quick adiabatic estimate is shown
 * for, declared once (the size report, its JSON and the docs read it): a ceramic body, an alumina
 * substrate or core, nichrome wire or film, a steatite core.
 */
export const ADIABATIC_ESTIMATE_MATERIALS = ["ceramic", "alumina", "nichrome", "steatite"] as const;

/** The quick adiabatic mass of one material. */
export interface AdiabaticMassEstimate {
  readonly materialId: string;
  /** specific heat used [J/(kg·K)] */
  readonly specificHeatJPerKgK: number;
  /** m = E/(c·ΔT) [kg] */
  readonly massKg: number;
  /** where the specific heat comes from */
  readonly source: string;
}

/**
 * The simple adiabatic estimate m = E/(c·ΔT) for each of {@link ADIABATIC_ESTIMATE_MATERIALS}: the
 * mass of that material that takes the energy E with a rise ΔT when no heat leaves it. It is the
 * quick answer engineers start from; the whole-profile sizing beside it shows how far the history
 * of earlier events and the part's build move the answer. Source: Q = m·c·ΔT, Incropera et al.,
 * Fundamentals of Heat and Mass Transfer, 7th ed. (2011), §1.3.1; specific heats from
 * src/thermal/materials.ts (each with its source, all from memory).
 * Cost O(materials).
 * @throws InputError for a non-positive energy or rise (adiabaticMass)
 * @example
 * adiabaticMassEstimates(7.35, 50)[2].massKg // => 3.5e-4
 */
export function adiabaticMassEstimates(energyJ: number, riseK: number): AdiabaticMassEstimate[] {
  return ADIABATIC_ESTIMATE_MATERIALS.map((id) => {
    const m = materialPreset(id);
    return { materialId: m.id, specificHeatJPerKgK: m.specificHeatJPerKgK, massKg: adiabaticMass(energyJ, m.specificHeatJPerKgK, riseK), source: m.source };
  });
}
