// Small probes on a CircuitResult shared by the circuit-model tests (not a test file).
import { type CircuitResult, powerAt } from "../../src/internal.js";

/** Σ of every part's energy in the result's energy balance [J]. */
export const sumParts = (r: CircuitResult): number => Object.values(r.energy.partsJ).reduce((a, b) => a + b, 0);

/** Power of a role's trace at event time t [W] (0 outside every segment). */
export const traceAt = (r: CircuitResult, role: string, t: number): number => {
  const seg = (r.traces[role] ?? []).find((s) => t >= s.startS && t < s.startS + s.durationS);
  return seg === undefined ? 0 : powerAt(seg.terms, t - seg.startS);
};
