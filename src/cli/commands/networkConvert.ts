import type { Command } from "commander";
import type { CliRun } from "../main.js";
import { type OutputFlags, addOutputFlags } from "./networkBuildFlags.js";

/** The forms `network convert` writes. */
export const CONVERT_TARGETS = ["foster", "cauer"] as const;

/** What the flags of `heatledger network convert` parse to. */
export interface ConvertFlags extends OutputFlags {
  readonly to?: string;
  readonly source?: string;
  readonly observe?: string;
}

/** `heatledger network convert FILE --to cauer|foster`: flags and help here; the run is loaded from networkConvertAction.ts when it starts. */
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
  command.action(async (file: string, flags: ConvertFlags) => {
    const { networkConvertAction } = await import("./networkConvertAction.js");
    networkConvertAction(run, file, flags);
  });
}
