import type { ProfileCircuit } from "./DutyProfile.js";

/**
 * Whether a profile circuit's values follow its parts' temperatures during an event (a MOSFET
 * threshold with a nonzero temperature coefficient, or a square-law K with a mobility exponent), so that each charge needs the parts' thermal
 * state and is solved together with it; a series resistor with a temperature curve likewise. Every other circuit keeps the exact closed forms and is
 * never handed a thermal context. Cost O(1).
 */
export function circuitReadsTemperature(circuit: ProfileCircuit | undefined): boolean {
  if (circuit === undefined) return false;
  if (circuit.topology === "series-resistor") return circuit.temperatureCurve !== undefined;
  if (circuit.topology !== "linear-mosfet") return false;
  const mobility = circuit.transconductanceAPerV2 !== undefined && (circuit.transconductanceExponent ?? 0) !== 0;
  return (circuit.thresholdTempcoVPerK ?? 0) !== 0 || mobility;
}
