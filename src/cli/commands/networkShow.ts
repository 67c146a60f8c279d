import type { Command } from "commander";
import type { CliRun } from "../main.js";

/** Default number of Zth table rows in `network show`. */
export const ZTH_TABLE_ROWS = 13;

/** What the flags of `heatledger network show` parse to. */
export interface NetworkShowFlags {
  readonly json?: boolean;
  readonly rows: string;
}

/** `heatledger network show FILE`: flags and help here; the run is loaded from networkShowAction.ts when it starts. */
export function registerNetworkShow(network: Command, run: CliRun): void {
  network
    .command("show")
    .argument("<file>", "network file (YAML or JSON)")
    .description("print a network's Foster (modal) form, total Rth and Zth(t) as a table and a chart")
    .option("--json", "print one JSON object instead of the text report")
    .option("--rows <n>", "rows of the Zth table", String(ZTH_TABLE_ROWS))
    .action(async (file: string, options: NetworkShowFlags) => {
      const { networkShowAction } = await import("./networkShowAction.js");
      networkShowAction(run, file, options);
    });
}
