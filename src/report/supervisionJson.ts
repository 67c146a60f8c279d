import type { SupervisionReport } from "../supervise/supervisePrecharge.js";
import { reportCautions } from "../text/cautions.js";

/**
 * The supervision report as plain JSON: every non-finite number (an unbounded timeout, a corner
 * that never completes) becomes null, so the output never holds NaN or Infinity; the envelope is
 * included for plotting elsewhere, and the cautions travel with the numbers (`cautions`, a list).
 * Cost O(size of the report).
 * @example
 * const report = supervisePrecharge(profile("electric-boat-72v-supervision.yaml"), defaultCircuitModels);
 * supervisionJson(report).verdict // => "pass"
 */
export function supervisionJson(report: SupervisionReport): unknown {
  const text = JSON.stringify({ ...report, cautions: reportCautions(report.linearMosfet) }, (_key, value: unknown) => (typeof value === "number" && !Number.isFinite(value) ? null : value));
  return JSON.parse(text) as unknown;
}
