/**
 * Share of a rating left to a part that starts at temperature T [°C], when the rating was stated
 * from a reference temperature T_ref and nothing is left at a maximum temperature T_max:
 *   k = (T_max − T) / (T_max − T_ref), capped to [0, 1]
 * The energy (or the power over a fixed time) a part can absorb before it reaches T_max is
 * proportional to its temperature headroom T_max − T when its thermal impedance does not depend
 * on temperature (superposition on a linear network); k = 0 at or above T_max, and no credit is
 * taken below T_ref (k ≤ 1: the rating is not extrapolated to a colder start). Used by the SOA
 * derating (k on the allowed current) and the single-pulse energy derating (k on the energy).
 * Source: linear derating with temperature headroom is common practice for power-limited SOA
 * and for resistor pulse ratings.
 * Validity: T_max > T_ref (the callers check it when they read the temperatures). Cost O(1).
 * @param referenceC T_ref [°C]
 * @param maxC T_max [°C], > T_ref
 * @param temperatureC T [°C]
 */
export function temperatureHeadroomFactor(referenceC: number, maxC: number, temperatureC: number): number {
  const k = (maxC - temperatureC) / (maxC - referenceC);
  return Math.min(1, Math.max(0, k));
}
