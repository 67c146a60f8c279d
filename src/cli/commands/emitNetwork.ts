import type { ThermalNetwork } from "../../thermal/ThermalNetwork.js";
import { formatNetworkFile } from "../../thermal/formatNetworkFile.js";
import type { CliRun } from "../main.js";
import { writeOutputFile } from "../readInputFile.js";
import type { OutputFlags } from "./networkBuildFlags.js";

/**
 * Write the network file when --out is given (refusing to overwrite without --force) and return
 * the text report's closing lines: where the file went, or the file's text to copy.
 */
export function emitNetwork(run: CliRun, network: ThermalNetwork, flags: OutputFlags): { written: string | null; text: string } {
  const format = flags.out?.toLowerCase().endsWith(".json") ? "json" : "yaml";
  const file = formatNetworkFile(network, format, flags.name);
  if (flags.out !== undefined) {
    writeOutputFile(run.io, flags.out, file, flags.force === true, "--out");
    return { written: flags.out, text: `Wrote ${flags.out}: reference it from a profile, or inspect it with \`heatledger network show ${flags.out}\`.\n` };
  }
  return { written: null, text: `Network file (no --out given; save this text or rerun with --out FILE):\n${file}` };
}
