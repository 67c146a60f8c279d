import { InputError } from "../errors/InputError.js";
import { fleetHeaderJson } from "./fleetNdjson.js";
import type { FleetRowSource } from "./fleetSummary.js";
import { type FleetSummary, fleetSummary } from "./fleetSummary.js";
import type { FleetPartition } from "./parseFleetNdjson.js";

/**
 * Merge partition outputs of one fleet (parseFleetNdjson) into its summary: the union of their
 * rows, ranked by the total risk order. Rows depend only on their own log and every partition's
 * header must be equal (same profile texts, parts, limits and rate), so the merge is associative
 * and independent of the order and grouping of the partitions, and equals one run over all the
 * logs bit for bit. A merged summary printed as NDJSON is itself a partition output.
 * Source: merge rule of our own (docs/fleet.md).
 * Cost O(rows × log rows × parts).
 * @throws InputError for no partition, a header that differs from the first partition's (naming
 *   both files and the field), or a unit found in two partitions (naming both lines)
 */
export function mergeFleetPartitions(partitions: readonly FleetPartition[]): FleetSummary {
  const first = partitions[0];
  if (first === undefined) throw new InputError({ code: "bad-option", file: "", line: 0, field: "partitions", expected: "one or more fleet partition files", found: "none" });
  const reference = fleetHeaderJson(first.header);
  for (const p of partitions.slice(1)) {
    const here = fleetHeaderJson(p.header);
    const key = Object.keys(reference).find((k) => JSON.stringify(reference[k]) !== JSON.stringify(here[k]));
    if (key !== undefined)
      throw new InputError({
        code: "bad-file",
        file: p.file,
        line: p.headerLine,
        field: key,
        expected: `the same ${key} as ${first.file} (partitions of one fleet: same profile, parts and options): ${JSON.stringify(reference[key])}`,
        found: JSON.stringify(here[key]),
      });
  }
  const sources: FleetRowSource[] = partitions.flatMap((p) => p.sources);
  return fleetSummary(first.header, partitions.flatMap((p) => p.rows), sources);
}
