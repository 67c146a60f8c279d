import type { ProfileCircuit } from "./DutyProfile.js";

/**
 * Whether a profile circuit's values follow its parts' temperatures during an event (a MOSFET
 * threshold with a nonzero temperature coefficient), so that each charge needs the parts' thermal
 * state and is solved together with it; a series resistor with a temperature curve likewise. Every other circuit keeps the exact closed forms and is
 * never handed a thermal context. Cost O(1).
 */
export function circuitReadsTemperature(circuit: ProfileCircuit | undefined): boolean {
  if (circuit === undefined) return false;
  if (circuit.topology === "series-resistor") return circuit.temperatureCurve !== undefined;
  return circuit.topology === "linear-mosfet" && circuit.thresholdTempcoVPerK !== undefined && circuit.thresholdTempcoVPerK !== 0;
}
