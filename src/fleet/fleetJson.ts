import type { FleetSummary } from "./fleetSummary.js";
import { fleetCautions, fleetHeaderJson, fleetRowJson } from "./fleetNdjson.js";

/**
 * The `fleet --json` object: the header's fields (profile, digest, parts, rate), the worst
 * verdict of the replayed units, the counts by verdict, every unit's row in rank order (with its
 * rank) and the cautions.
 * Cost O(rows × parts).
 */
export function fleetJson(summary: FleetSummary): Record<string, unknown> {
  const { kind: _kind, cautions: _cautions, ...header } = fleetHeaderJson(summary.header);
  return {
    command: "fleet",
    ...header,
    verdict: summary.verdict,
    counts: summary.counts,
    units: summary.rows.map((row, i) => {
      const { kind: _unit, ...fields } = fleetRowJson(row);
      return { rank: i + 1, ...fields };
    }),
    cautions: fleetCautions(summary.header),
  };
}
