import type { Command } from "commander";
import type { CliRun } from "../main.js";
import { PATH_HELP, collect } from "./sweep.js";
import { STRICT_OPTION, verdictHelp } from "./verdictHelp.js";

/** What the flags of `heatledger compare` parse to. */
export interface CompareFlags {
  readonly set?: string[];
  readonly part?: string;
  readonly json?: boolean;
  readonly strict?: boolean;
}

/** `heatledger compare A [B]`: flags and help here; the run is loaded from compareAction.ts. */
export function registerCompare(program: Command, run: CliRun): void {
  program
    .command("compare")
    .argument("<a>", "duty profile A (YAML or JSON), or - for standard input")
    .argument("[b]", "duty profile B (default: A with the --set values)")
    .description("two designs side by side: peak, rise, margin, verdict, energy per event, damage, retry intervals and the differences")
    .option("--set <path=value>", "change a quantity of B (of A when B is not given); repeat", collect)
    .option("--part <id>", "the part to follow (default: A's part with the least margin)")
    .option("--json", "print one JSON object instead of the table")
    .option(STRICT_OPTION.flags, STRICT_OPTION.help)
    .addHelpText(
      "after",
      `
${PATH_HELP}
Energy per event: the part's energy per event of each profile entry that heats it (a power-up, every
attempt of a retry block), entries matched by their field (events[1].retry), with B − A.
${verdictHelp("Here each design's verdict is simulate's temperature verdict of its profile, and compare's verdict and exit status are the worse of the two: a comparison that shows a failing design never exits 0.")}
Examples:
  heatledger compare profiles/warehouse-robot-48v.yaml --set "circuit.resistance=47 ohm"
  heatledger compare design-a.yaml design-b.yaml --json`,
    )
    .action(async (a: string, b: string | undefined, options: CompareFlags) => {
      const { compareAction } = await import("./compareAction.js");
      compareAction(run, a, b, options);
    });
}
