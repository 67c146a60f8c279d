import type { StressConfig } from "../stress/resolveStressConfig.js";
import type { ProfileCircuit, ProfilePart } from "./DutyProfile.js";

/**
 * The resistance a part's voltage limit is judged with: its ratings' own `resistance` when given,
 * else the circuit's value for its role (the series resistor's `resistance`, the linear MOSFET's
 * `sourceResistor`); undefined for any other part. A resistor with a temperature curve is taken
 * at its nominal value (the curve's reference), which the words say. Source: wiring of our own.
 * Cost O(1).
 */
export function partResistance(
  part: Pick<ProfilePart, "role">,
  config: Pick<StressConfig, "resistanceOhm">,
  circuit: ProfileCircuit | undefined,
): { resistanceOhm: number | undefined; resistanceFrom: string } {
  if (config.resistanceOhm !== undefined) return { resistanceOhm: config.resistanceOhm, resistanceFrom: "ratings.resistance" };
  if (part.role === "resistor" && circuit?.topology === "series-resistor")
    return {
      resistanceOhm: circuit.resistanceOhm,
      resistanceFrom: circuit.temperatureCurve === undefined ? "circuit.resistance" : "circuit.resistance, the nominal value of its temperature curve",
    };
  if (part.role === "sourceResistor" && circuit?.topology === "linear-mosfet" && circuit.sourceResistorOhm !== undefined)
    return { resistanceOhm: circuit.sourceResistorOhm, resistanceFrom: "circuit.mosfet.sourceResistor" };
  return { resistanceOhm: undefined, resistanceFrom: "not known" };
}
