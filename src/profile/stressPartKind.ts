import type { StressPartKind } from "../stress/resolveStressConfig.js";
import type { CircuitRole } from "./DutyProfile.js";

/**
 * The kind of part the stress layer sees for a circuit role: the pre-charge resistor and a linear
 * MOSFET's source resistor are resistors (Coffin-Manson with the user's own numbers is the only
 * cycling model they take), the linear-mode MOSFET is a MOSFET (SOA table, thermal-instability
 * caution), and a converter switch or a part heated only by power traces is "other".
 * Source: part kinds of our own (docs/stress.md).
 * Cost O(1).
 */
export function stressPartKind(role: CircuitRole | undefined): StressPartKind {
  if (role === "resistor" || role === "sourceResistor") return "resistor";
  if (role === "mosfet") return "mosfet";
  return "other";
}
