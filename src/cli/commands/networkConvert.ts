import type { Command } from "commander";
import { type ThermalNetwork, fosterToCauer, inputError, modalToFoster, networkToDocument, networkToModal, parseNetwork } from "../../index.js";
import type { CliRun } from "../main.js";
import { readStructuredFile } from "../readInputFile.js";
import { type OutputFlags, addOutputFlags, emitNetwork } from "./networkBuildFlags.js";

/** The forms `network convert` writes. */
export const CONVERT_TARGETS = ["foster", "cauer"] as const;

interface ConvertFlags extends OutputFlags {
  to?: string;
  source?: string;
  observe?: string;
}

/**
 * The network in the target form: to Foster through the exact eigen route (modal form), to Cauer by
 * the exact continued-fraction expansion of that Foster form (fosterToCauer, with its round-trip
 * check). A graph is reduced to the driving-point or transfer impedance the user picks.
 */
function convert(network: ThermalNetwork, to: (typeof CONVERT_TARGETS)[number], observe?: string, source?: string): ThermalNetwork {
  if (network.kind === to) return network;
  const foster = network.kind === "foster" ? network : modalToFoster(networkToModal(network), observe, source, "network");
  return to === "foster" ? foster : fosterToCauer(foster);
}

/** `heatledger network convert FILE --to cauer|foster`. */
export function registerNetworkConvert(network: Command, run: CliRun): void {
  const command = network
    .command("convert")
    .argument("<file>", "network file (YAML or JSON)")
    .description("convert a network between Foster and Cauer forms (exact), and print or write the result")
    .option("--to <form>", `target form: ${CONVERT_TARGETS.join(" or ")}`)
    .option("--observe <node>", "for a graph: the observed node whose Zth is converted")
    .option("--source <node>", "for a graph: the heated node (default: the observed node, a driving-point impedance)");
  addOutputFlags(command);
  command.addHelpText(
    "after",
    `
Foster -> Cauer is the continued-fraction expansion of the network's admittance in exact rational
arithmetic, checked by converting back (Zth equal at 50 log-spaced times). Cauer or graph -> Foster
is the exact eigen-decomposition. Only a Cauer ladder has physical nodes: chain a device with an
interface and a heatsink in Cauer or graph form, never by adding Foster stages.

Examples:
  heatledger network convert profiles/networks/wirewound-resistor-foster.yaml --to cauer
  heatledger network convert my-ladder.yaml --to foster --out my-foster.yaml`,
  );
  command.action((file: string, flags: ConvertFlags) => {
    const to = flags.to;
    if (to === undefined || !(CONVERT_TARGETS as readonly string[]).includes(to)) {
      throw inputError("bad-option", "--to", `one of ${CONVERT_TARGETS.join(", ")}`, to === undefined ? "nothing" : JSON.stringify(to));
    }
    const parsed = readStructuredFile(run.io, file, "network file", (data) => parseNetwork(data, ""));
    const observe = flags.observe;
    if (parsed.kind === "graph" && observe === undefined && parsed.observed.length > 1) {
      throw inputError("bad-option", "--observe", `the node whose Zth to convert, one of ${parsed.observed.join(", ")}`, "nothing");
    }
    const source = flags.source ?? observe;
    const converted = convert(parsed, to as (typeof CONVERT_TARGETS)[number], observe, source);
    if (flags.json === true) {
      const { written } = emitNetwork(run, converted, flags);
      run.io.out(`${JSON.stringify({ from: parsed.kind, to, written, network: networkToDocument(converted, flags.name) }, null, 2)}\n`);
      return;
    }
    const { text } = emitNetwork(run, converted, flags);
    run.io.out(`Converted ${file} from ${parsed.kind} to ${to} form (${"stages" in converted ? converted.stages.length : 0} stages).\n${text}`);
  });
}
