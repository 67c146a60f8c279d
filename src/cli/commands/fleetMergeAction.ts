import { inputError } from "../../errors/InputError.js";
import { mergeFleetPartitions } from "../../fleet/mergeFleetPartitions.js";
import { parseFleetNdjson } from "../../fleet/parseFleetNdjson.js";
import type { CliRun } from "../main.js";
import { readTextFile } from "../readInputFile.js";
import { checkFleetOutputs, writeFleetSummary } from "../writeFleetSummary.js";
import type { FleetFlags } from "./fleet.js";

/**
 * The run of `heatledger fleet merge PARTS...` (flags and help in fleet.ts): read every partition
 * (parseFleetNdjson), merge them (mergeFleetPartitions) and write the summary as `fleet` does.
 * @throws InputError for an unreadable or malformed partition, partitions of different fleets, a
 *   unit in two partitions, a flag of `fleet` only, or an output file that exists without --force
 */
export async function fleetMergeAction(run: CliRun, files: readonly string[], options: FleetFlags): Promise<void> {
  for (const [flag, value] of [["--list", options.list], ["--workers", options.workers], ["--logs-per-year", options.logsPerYear]] as const)
    if (value !== undefined) throw inputError("bad-option", flag, "only output flags after fleet merge (the partitions keep the options they were replayed with)", JSON.stringify(value));
  const top = checkFleetOutputs(run, options);
  const partitions = files.map((file) => parseFleetNdjson(readTextFile(run.io, file, "fleet partition (NDJSON)"), file));
  await writeFleetSummary(run, mergeFleetPartitions(partitions), options, top);
}
