import { InputError, inputError } from "../../errors/InputError.js";
import { formatCautions, reportCautions } from "../../text/cautions.js";
import { networkToDocument } from "../../thermal/formatNetworkFile.js";
import { fosterToCauer } from "../../thermal/fosterToCauer.js";
import { modalToFoster } from "../../thermal/modalToFoster.js";
import { parseNetwork } from "../../thermal/parseNetwork.js";
import { type ThermalNetwork, networkToModal } from "../../thermal/ThermalNetwork.js";
import type { CliRun } from "../main.js";
import { readStructuredFile } from "../readInputFile.js";
import { emitNetwork } from "./emitNetwork.js";
import { CONVERT_TARGETS, type ConvertFlags } from "./networkConvert.js";

/**
 * The network in the target form: to Foster through the exact eigen route (modal form), to Cauer by
 * the exact continued-fraction expansion of that Foster form (fosterToCauer, with its round-trip
 * check). A graph is reduced to the driving-point or transfer impedance the user picks.
 */
function convert(network: ThermalNetwork, to: (typeof CONVERT_TARGETS)[number], observe?: string, source?: string): ThermalNetwork {
  if (network.kind === to) return network;
  // a ladder keeps the part it describes (its node names); a graph's part is not known
  const part = network.kind === "graph" || network.part === undefined ? {} : { part: network.part };
  const foster = network.kind === "foster" ? network : { ...modalToFoster(networkToModal(network), observe, source, "network"), ...part };
  return to === "foster" ? foster : fosterToCauer(foster);
}

/**
 * The run of `heatledger network convert FILE --to cauer|foster` (flags and help are in
 * networkConvert.ts, which loads this module only when the command runs): read the network,
 * convert it and print or write the result, with the cautions (`cautions` in the JSON).
 * @throws InputError for a bad --to / --observe, an invalid network file, or an --out file that exists without --force
 */
export function networkConvertAction(run: CliRun, file: string, flags: ConvertFlags): void {
  const to = flags.to;
  if (to === undefined || !(CONVERT_TARGETS as readonly string[]).includes(to)) {
    throw inputError("bad-option", "--to", `one of ${CONVERT_TARGETS.join(", ")}`, to === undefined ? "nothing" : JSON.stringify(to));
  }
  const parsed = readStructuredFile(run.io, file, "network file", (data) => parseNetwork(data, ""));
  const observe = flags.observe;
  if (parsed.kind === "graph" && observe === undefined && parsed.observed.length > 1) {
    // names the file: the nodes to choose from are the file's
    throw new InputError({ code: "bad-option", file, line: 0, field: "--observe", expected: `the node whose Zth to convert, one of ${parsed.observed.join(", ")}`, found: "nothing" });
  }
  const source = flags.source ?? observe;
  const converted = convert(parsed, to as (typeof CONVERT_TARGETS)[number], observe, source);
  const { written, text } = emitNetwork(run, converted, flags);
  if (flags.json === true) {
    run.io.out(`${JSON.stringify({ from: parsed.kind, to, written, network: networkToDocument(converted, flags.name), cautions: reportCautions(false) }, null, 2)}\n`);
    return;
  }
  run.io.out(`Converted ${file} from ${parsed.kind} to ${to} form (${"stages" in converted ? converted.stages.length : 0} stages).\n${text}\n${formatCautions(false, Math.min(run.io.columns, 100))}`);
}
